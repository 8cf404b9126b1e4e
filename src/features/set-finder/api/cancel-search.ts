import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { searchQueryOptions } from "./get-search";
import { recentSearchesQueryOptions } from "./list-searches";

/** Cancels a running search; the sets it found so far stay readable. */
export function cancelSearch(id: string) {
  return api.delete<void>(`/api/set-finder/searches/${encodeURIComponent(id)}`);
}

export function useCancelSearch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelSearch,
    onSettled: async (_result, _error, id) => {
      await queryClient.invalidateQueries({ queryKey: searchQueryOptions(id).queryKey });
      await queryClient.invalidateQueries({ queryKey: recentSearchesQueryOptions().queryKey });
    },
  });
}
