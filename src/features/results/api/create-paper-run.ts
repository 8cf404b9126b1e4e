import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PaperRunInput, ResultsRunSummary } from "@shared/schemas/results";
import { api } from "@/lib/api-client";
import { resultsRunListsKey } from "./list-results-runs";

/** Makes a closed class run from a lesson, to hold rolls recorded on paper. */
export function createPaperRun(input: PaperRunInput) {
  return api.post<ResultsRunSummary>("/api/results/paper-runs", input);
}

export function useCreatePaperRun() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPaperRun, onSuccess: () => queryClient.invalidateQueries({ queryKey: resultsRunListsKey }) });
}
