import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { TallyGridRollsInput, TallyRollsResult } from "@shared/schemas/tally-grid";
import { api } from "@/lib/api-client";
import { pooledResultsKey } from "./get-pooled-results";
import { runResultsKey } from "./get-run-results";
import { tallyGridKey } from "./get-tally-grid";
import { resultsRunListsKey } from "./list-results-runs";

export type SaveTallyRollsRequest = { runId: string; input: TallyGridRollsInput };

/** Stores rolls typed into the tally grid, all or none, with the Paper import's checks. */
export function saveTallyRolls({ runId, input }: SaveTallyRollsRequest) {
  return api.post<TallyRollsResult>(`/api/results/runs/${encodeURIComponent(runId)}/tally-grid/rolls`, input);
}

export function useSaveTallyRolls() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveTallyRolls,
    onSuccess: (_result, request) => {
      void queryClient.invalidateQueries({ queryKey: pooledResultsKey });
      void queryClient.invalidateQueries({ queryKey: resultsRunListsKey });
      void queryClient.invalidateQueries({ queryKey: tallyGridKey(request.runId) });
      return queryClient.invalidateQueries({ queryKey: runResultsKey(request.runId) });
    },
  });
}
