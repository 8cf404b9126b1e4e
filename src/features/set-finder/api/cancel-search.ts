import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { searchQueryOptions } from "./get-search";

/** Cancels a running search; the sets it found so far stay readable. */
export function cancelSearch(id: string) {
  return api.delete<void>(`/api/set-finder/searches/${encodeURIComponent(id)}`);
}

export function useCancelSearch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelSearch,
    onSettled: (_result, _error, id) => queryClient.invalidateQueries({ queryKey: searchQueryOptions(id).queryKey }),
  });
}
