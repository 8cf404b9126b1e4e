import { proposalStatusLabels, type ProposalStatus } from "@shared/schemas/shelf";

const looks: Record<ProposalStatus, { mark: string; box: string }> = {
  pending: { mark: "…", box: "border-beacon bg-beacon-light" },
  approved: { mark: "✓", box: "border-tide bg-tide-light" },
  declined: { mark: "✗", box: "border-alarm bg-alarm-light" },
};

/** A proposal's state in words with its own mark, never by colour alone. */
export function ProposalStatusBadge({ status }: { status: ProposalStatus }) {
  const look = looks[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold text-ink ${look.box}`}>
      <span aria-hidden="true">{look.mark}</span>
      {proposalStatusLabels[status]}
    </span>
  );
}
