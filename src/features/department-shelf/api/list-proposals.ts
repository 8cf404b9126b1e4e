import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ShelfProposal } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** The head sees the department's proposals; a teacher sees their own. */
export function listProposals() {
  return api.get<{ proposals: ShelfProposal[] }>("/api/shelf/proposals");
}

export const proposalsQueryOptions = queryOptions({
  queryKey: [...shelfKey, "proposals"],
  queryFn: listProposals,
});

export function useProposals() {
  return useQuery(proposalsQueryOptions);
}
