import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SentInvitation } from "@shared/schemas/invitations";
import { api } from "@/lib/api-client";
import { invitationsQueryOptions } from "./list-invitations";

/** Sends an invitation again (an expired one gets a new link). */
export function resendInvitation(invitationId: string) {
  return api.post<SentInvitation>(`/api/invitations/${encodeURIComponent(invitationId)}/resend`);
}

export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions.queryKey }),
  });
}
