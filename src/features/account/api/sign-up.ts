import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SignUpInput } from "@shared/schemas/account";
import { api } from "@/lib/api-client";
import { currentTeacherQueryOptions } from "./get-current-teacher";

/** Creates the account (signing in), then the department the new teacher heads. */
export async function signUp({ departmentName, ...account }: SignUpInput) {
  await api.post("/api/auth/sign-up/email", account);
  return api.post<{ id: string; name: string }>("/api/departments", { name: departmentName });
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSettled: () => queryClient.fetchQuery({ ...currentTeacherQueryOptions, staleTime: 0 }),
  });
}
