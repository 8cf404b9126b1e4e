import { useMutation } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

/** Sets the new password with the token from the e-mailed link; the token works once. */
export function resetPassword({ token, newPassword }: { token: string; newPassword: string }) {
  return api.post<{ status: boolean }>("/api/auth/reset-password", { token, newPassword });
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
