import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RunResults } from "@shared/schemas/results";
import { api } from "@/lib/api-client";

/** One run's pooled figures, convergence, groups, Guess votes and findings, computed on the server. */
export function getRunResults(runId: string, includeSimulated: boolean) {
  return api.get<RunResults>(`/api/results/runs/${encodeURIComponent(runId)}?includeSimulated=${includeSimulated}`);
}

/** Both variants of one run (with and without simulated rolls) share this prefix. */
export const runResultsKey = (runId: string) => ["results", "runs", runId] as const;

export const runResultsQueryOptions = (runId: string, includeSimulated: boolean) =>
  queryOptions({ queryKey: [...runResultsKey(runId), { includeSimulated }], queryFn: () => getRunResults(runId, includeSimulated) });

export function useRunResults(runId: string, includeSimulated: boolean) {
  return useQuery(runResultsQueryOptions(runId, includeSimulated));
}
