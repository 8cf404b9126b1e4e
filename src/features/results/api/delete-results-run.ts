import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DeletedRun } from "@shared/schemas/results";
import { api } from "@/lib/api-client";
import { runResultsKey } from "./get-run-results";
import { resultsRunListsKey } from "./list-results-runs";
import { pooledResultsKey } from "./get-pooled-results";

/** Deletes a run with its rolls, groups, votes and Paper imports, for good. */
export function deleteResultsRun(runId: string) {
  return api.delete<DeletedRun>(`/api/results/runs/${encodeURIComponent(runId)}`);
}

export function useDeleteResultsRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteResultsRun,
    onSuccess: (_deleted, runId) => {
      queryClient.removeQueries({ queryKey: runResultsKey(runId) });
      void queryClient.invalidateQueries({ queryKey: pooledResultsKey });
      return queryClient.invalidateQueries({ queryKey: resultsRunListsKey });
    },
  });
}
