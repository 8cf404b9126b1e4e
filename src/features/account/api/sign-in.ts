import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SignInInput } from "@shared/schemas/account";
import { api } from "@/lib/api-client";
import { currentTeacherQueryOptions } from "./get-current-teacher";

export function signIn(input: SignInInput) {
  return api.post<{ user: { id: string } }>("/api/auth/sign-in/email", input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    // Wait for the fresh session, so the app shell never sees the signed-out answer cached earlier.
    onSuccess: () => queryClient.fetchQuery({ ...currentTeacherQueryOptions, staleTime: 0 }),
  });
}
