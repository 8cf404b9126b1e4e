import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { proposalsQueryOptions } from "./list-proposals";

/** The proposing teacher takes back a proposal that is still waiting. */
export function withdrawProposal(proposalId: string) {
  return api.delete<void>(`/api/shelf/proposals/${encodeURIComponent(proposalId)}`);
}

export function useWithdrawProposal() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawProposal,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: proposalsQueryOptions.queryKey }),
  });
}
