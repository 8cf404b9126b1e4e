import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { AcceptedInvitation, JoinSignInInput, JoinSignUpInput } from "@shared/schemas/invitations";
import { api } from "@/lib/api-client";

/** Accepts the invitation as the signed-in colleague. */
export function acceptInvitation(invitationId: string) {
  return api.post<AcceptedInvitation>(`/api/invitations/${encodeURIComponent(invitationId)}/accept`);
}

export type JoinRequest =
  | { kind: "signed-in"; invitationId: string }
  | { kind: "sign-up"; invitationId: string; email: string; values: JoinSignUpInput }
  | { kind: "sign-in"; invitationId: string; email: string; values: JoinSignInInput };

/** Joins the department: creates the account or signs in with the invited address first, when needed. */
export async function joinDepartment(request: JoinRequest) {
  if (request.kind === "sign-up") {
    await api.post("/api/auth/sign-up/email", { ...request.values, email: request.email });
  } else if (request.kind === "sign-in") {
    await api.post("/api/auth/sign-in/email", { email: request.email, password: request.values.password });
  }
  return acceptInvitation(request.invitationId);
}

export function useJoinDepartment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: joinDepartment,
    // Who is signed in and which department they belong to both change, so every cached answer is stale; awaited, so the
    // page the caller opens next already knows the new department.
    onSettled: () => queryClient.invalidateQueries(),
  });
}
