import { useMutation } from "@tanstack/react-query";
import type { PasswordResetRequestInput } from "@shared/schemas/password-reset";
import { api } from "@/lib/api-client";

/** Asks for a reset link by e-mail; the answer is the same whether or not the address has an account. */
export function requestPasswordReset(input: PasswordResetRequestInput) {
  return api.post<{ status: boolean }>("/api/auth/request-password-reset", input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
