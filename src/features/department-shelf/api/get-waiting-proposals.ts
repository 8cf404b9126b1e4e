import { queryOptions, useQuery } from "@tanstack/react-query";
import type { WaitingProposals } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { proposalsQueryOptions } from "./list-proposals";

/** How many proposals wait: the department's queue for the head of department, a teacher's own otherwise. */
export function getWaitingProposals() {
  return api.get<WaitingProposals>("/api/shelf/proposals/waiting");
}

// Under the proposals key, so every proposal mutation (which invalidates that key) refreshes the count as well.
export const waitingProposalsQueryOptions = queryOptions({
  queryKey: [...proposalsQueryOptions.queryKey, "waiting"],
  queryFn: getWaitingProposals,
  refetchInterval: 60_000,
});

/** The waiting count, polled each minute; pass `enabled: false` for a teacher with no department. */
export function useWaitingProposals(enabled: boolean) {
  return useQuery({ ...waitingProposalsQueryOptions, enabled });
}
