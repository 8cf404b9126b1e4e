import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { clearAllDrafts } from "@/lib/browser-draft";

export function signOut() {
  return api.post("/api/auth/sign-out");
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
      clearAllDrafts();
    },
  });
}
