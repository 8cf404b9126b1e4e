import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SetFinderSearchSummary } from "@shared/schemas/set-finder";
import { api } from "@/lib/api-client";

/** The teacher's recent searches (kept on the server, newest first), without their result sets. */
export function listSearches() {
  return api.get<SetFinderSearchSummary[]>("/api/set-finder/searches");
}

export function recentSearchesQueryOptions() {
  return queryOptions({ queryKey: ["set-finder-searches", "recent"], queryFn: listSearches, staleTime: 5_000 });
}

export function useRecentSearches() {
  return useQuery(recentSearchesQueryOptions());
}
