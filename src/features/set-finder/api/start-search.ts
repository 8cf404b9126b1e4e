import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SetFinderRequest } from "@shared/schemas/set-finder";
import { api } from "@/lib/api-client";
import { recentSearchesQueryOptions } from "./list-searches";

/** Starts a search on the server (it runs off the request thread); answers its id at once. */
export function startSearch(request: SetFinderRequest) {
  return api.post<{ id: string }>("/api/set-finder/searches", request);
}

export function useStartSearch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startSearch,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recentSearchesQueryOptions().queryKey }),
  });
}
