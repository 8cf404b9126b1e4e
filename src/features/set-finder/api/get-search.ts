import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SetFinderJob } from "@shared/schemas/set-finder";
import { api } from "@/lib/api-client";

/** How often a running search is asked for its progress, in milliseconds. */
export const SEARCH_POLL_MS = 500;

/** Whether a search has yet to end (waiting for a slot or running): its Cancel button stays until it ends. */
export function searchIsActive(job: Pick<SetFinderJob, "status">): boolean {
  return job.status === "queued" || job.status === "running";
}

export function getSearch(id: string) {
  return api.get<SetFinderJob>(`/api/set-finder/searches/${encodeURIComponent(id)}`);
}

export function searchQueryOptions(id: string) {
  return queryOptions({
    queryKey: ["set-finder-searches", id],
    queryFn: () => getSearch(id),
    staleTime: 0,
    // Poll only while the search waits or runs; a finished, cancelled or failed search no longer changes.
    refetchInterval: (query) => (query.state.data === undefined || searchIsActive(query.state.data) ? SEARCH_POLL_MS : false),
    refetchOnWindowFocus: false,
  });
}

export function useSearch(id: string | null) {
  return useQuery({ ...searchQueryOptions(id ?? ""), enabled: id !== null });
}
