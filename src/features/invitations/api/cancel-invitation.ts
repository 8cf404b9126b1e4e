import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { invitationsQueryOptions } from "./list-invitations";

/** Cancels an invitation; its link stops working. */
export function cancelInvitation(invitationId: string) {
  return api.delete<void>(`/api/invitations/${encodeURIComponent(invitationId)}`);
}

export function useCancelInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions.queryKey }),
  });
}
