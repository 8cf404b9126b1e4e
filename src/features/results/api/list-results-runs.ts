import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ResultsRunList, ResultsScope } from "@shared/schemas/results";
import { api } from "@/lib/api-client";

/** Closed class runs: the teacher's own, or the department's for the head (sorting and filtering run in the table). */
export function listResultsRuns(scope: ResultsScope) {
  return api.get<ResultsRunList>(`/api/results/runs?scope=${scope}`);
}

/** Every archive query shares this prefix, so imports and deletions can refresh all of them at once. */
export const resultsRunListsKey = ["results", "runs", "list"] as const;

export const resultsRunsQueryOptions = (scope: ResultsScope) =>
  queryOptions({ queryKey: [...resultsRunListsKey, { scope }], queryFn: () => listResultsRuns(scope) });

export function useResultsRuns(scope: ResultsScope) {
  return useQuery(resultsRunsQueryOptions(scope));
}
