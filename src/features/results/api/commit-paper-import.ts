import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PaperImportResult } from "@shared/schemas/results";
import { api } from "@/lib/api-client";
import { pooledResultsKey } from "./get-pooled-results";
import { runResultsKey } from "./get-run-results";
import { resultsRunListsKey } from "./list-results-runs";
import { paperImportForm, type PaperImportRequest } from "./preview-paper-import";

/** Imports every row of the file in one transaction, or none. */
export function commitPaperImport(request: PaperImportRequest) {
  return api.post<PaperImportResult>(`/api/results/runs/${encodeURIComponent(request.runId)}/paper-import`, paperImportForm(request));
}

export function useCommitPaperImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: commitPaperImport,
    onSuccess: (_result, request) => {
      void queryClient.invalidateQueries({ queryKey: pooledResultsKey });
      void queryClient.invalidateQueries({ queryKey: resultsRunListsKey });
      return queryClient.invalidateQueries({ queryKey: runResultsKey(request.runId) });
    },
  });
}
