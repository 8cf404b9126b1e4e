import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PendingInvitation } from "@shared/schemas/invitations";
import { api } from "@/lib/api-client";

/** The department's invitations not yet used or cancelled (head of department only). */
export function listInvitations() {
  return api.get<{ invitations: PendingInvitation[] }>("/api/invitations");
}

export const invitationsQueryOptions = queryOptions({
  queryKey: ["invitations"],
  queryFn: listInvitations,
});

export function useInvitations(enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions, enabled });
}
