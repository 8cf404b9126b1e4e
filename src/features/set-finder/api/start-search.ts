import { useMutation } from "@tanstack/react-query";
import type { SetFinderRequest } from "@shared/schemas/set-finder";
import { api } from "@/lib/api-client";

/** Starts a search on the server (it runs off the request thread); answers its id at once. */
export function startSearch(request: SetFinderRequest) {
  return api.post<{ id: string }>("/api/set-finder/searches", request);
}

export function useStartSearch() {
  return useMutation({ mutationFn: startSearch });
}
