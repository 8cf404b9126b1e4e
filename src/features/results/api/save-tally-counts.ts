import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { TallyCountsResult, TallyGridCountsInput } from "@shared/schemas/tally-grid";
import { api } from "@/lib/api-client";
import { pooledResultsKey } from "./get-pooled-results";
import { runResultsKey } from "./get-run-results";
import { tallyGridKey } from "./get-tally-grid";
import { resultsRunListsKey } from "./list-results-runs";

export type SaveTallyCountsRequest = { runId: string; input: TallyGridCountsInput };

/** Replaces one tally's win/tie/loss counts with the grid's rows, all or none. */
export function saveTallyCounts({ runId, input }: SaveTallyCountsRequest) {
  return api.put<TallyCountsResult>(`/api/results/runs/${encodeURIComponent(runId)}/tally-grid/counts`, input);
}

export function useSaveTallyCounts() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveTallyCounts,
    onSuccess: (_result, request) => {
      void queryClient.invalidateQueries({ queryKey: pooledResultsKey });
      void queryClient.invalidateQueries({ queryKey: resultsRunListsKey });
      void queryClient.invalidateQueries({ queryKey: tallyGridKey(request.runId) });
      return queryClient.invalidateQueries({ queryKey: runResultsKey(request.runId) });
    },
  });
}
