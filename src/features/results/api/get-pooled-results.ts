import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { PooledAcrossRuns, ResultsScope } from "@shared/schemas/results";
import { api } from "@/lib/api-client";

export type PooledRequest = { scope: ResultsScope; dicePerPlayer: number; runIds?: string[]; setKey?: string; includeSimulated: boolean };

/** Several runs of one set and mode pooled on the server, with each run's share. */
export function getPooledResults(request: PooledRequest) {
  const params = new URLSearchParams({
    scope: request.scope,
    dicePerPlayer: String(request.dicePerPlayer),
    includeSimulated: String(request.includeSimulated),
  });
  if (request.runIds && request.runIds.length > 0) params.set("runIds", request.runIds.join(","));
  if (request.setKey) params.set("setKey", request.setKey);
  return api.get<PooledAcrossRuns>(`/api/results/pooled?${params}`);
}

export const pooledResultsKey = ["results", "pooled"] as const;

export const pooledResultsQueryOptions = (request: PooledRequest) =>
  queryOptions({ queryKey: [...pooledResultsKey, request], queryFn: () => getPooledResults(request), placeholderData: keepPreviousData });

export function usePooledResults(request: PooledRequest, enabled = true) {
  return useQuery({ ...pooledResultsQueryOptions(request), enabled });
}
