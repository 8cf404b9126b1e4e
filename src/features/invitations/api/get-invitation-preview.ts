import { queryOptions, useQuery } from "@tanstack/react-query";
import type { InvitationPreview } from "@shared/schemas/invitations";
import { api } from "@/lib/api-client";

/** What the /join page shows before anyone signs in. */
export function getInvitationPreview(invitationId: string) {
  return api.get<InvitationPreview>(`/api/invitations/${encodeURIComponent(invitationId)}/preview`);
}

export const invitationPreviewQueryOptions = (invitationId: string) =>
  queryOptions({
    queryKey: ["invitations", invitationId, "preview"],
    queryFn: () => getInvitationPreview(invitationId),
  });

export function useInvitationPreview(invitationId: string) {
  return useQuery(invitationPreviewQueryOptions(invitationId));
}
