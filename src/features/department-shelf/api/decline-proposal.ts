import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DeclineProposalInput, ShelfProposal } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { proposalsQueryOptions } from "./list-proposals";

/** The head declines a proposal with a note for the teacher. */
export function declineProposal({ proposalId, input }: { proposalId: string; input: DeclineProposalInput }) {
  return api.post<ShelfProposal>(`/api/shelf/proposals/${encodeURIComponent(proposalId)}/decline`, input);
}

export function useDeclineProposal() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: declineProposal,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: proposalsQueryOptions.queryKey }),
  });
}
