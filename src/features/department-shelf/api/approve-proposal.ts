import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ApproveProposalInput, ShelfProposal, TemplateDetail } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** The head approves a proposal: a new template, or the next version of one. */
export function approveProposal({ proposalId, input }: { proposalId: string; input: ApproveProposalInput }) {
  return api.post<{ proposal: ShelfProposal; template: TemplateDetail }>(
    `/api/shelf/proposals/${encodeURIComponent(proposalId)}/approve`,
    input,
  );
}

export function useApproveProposal() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveProposal,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shelfKey }),
  });
}
