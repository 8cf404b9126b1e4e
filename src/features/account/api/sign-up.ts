import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SignUpInput } from "@shared/schemas/account";
import { api, ApiRequestError } from "@/lib/api-client";
import { currentTeacherQueryOptions } from "./get-current-teacher";

/**
 * Creates the account (signing in), then the department the new teacher heads. The server answers a sign-up with an
 * address that already has an account exactly as a new one, without signing in, and e-mails that address instead.
 */
export async function signUp({ departmentName, ...account }: SignUpInput) {
  await api.post("/api/auth/sign-up/email", account);
  try {
    return await api.post<{ id: string; name: string }>("/api/departments", { name: departmentName });
  } catch (error) {
    if (error instanceof ApiRequestError && error.status === 401) {
      throw new ApiRequestError(
        401,
        "check_your_email",
        `No new account was made: ${account.email} may already have one, and if so we have e-mailed it. Sign in with it instead, or choose a new password with “Forgot your password?”.`,
      );
    }
    throw error;
  }
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSettled: () => queryClient.fetchQuery({ ...currentTeacherQueryOptions, staleTime: 0 }),
  });
}
