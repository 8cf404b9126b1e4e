import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { InviteTeacherInput, SentInvitation } from "@shared/schemas/invitations";
import { api } from "@/lib/api-client";
import { invitationsQueryOptions } from "./list-invitations";

/** The head invites a colleague by e-mail. */
export function inviteTeacher(input: InviteTeacherInput) {
  return api.post<SentInvitation>("/api/invitations", input);
}

export function useInviteTeacher() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteTeacher,
    // A failed e-mail still leaves the invitation saved, so the list is refreshed either way.
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions.queryKey }),
  });
}
