import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { ShelfProposal } from "@shared/schemas/shelf";
import { useProposals } from "../api/list-proposals";
import { useWithdrawProposal } from "../api/withdraw-proposal";
import { LessonSnapshotView } from "./lesson-snapshot-view";
import { ProposalDecision } from "./proposal-decision";
import { ProposalStatusBadge } from "./proposal-status-badge";
import { ProposeLessonForm } from "./propose-lesson-form";
import { shelfDate } from "./shelf-dates";

function ProposalCard({ proposal, isHead }: { proposal: ShelfProposal; isHead: boolean }) {
  const withdraw = useWithdrawProposal();
  const pending = proposal.status === "pending";
  return (
    <li className="flex flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-5">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-xl">{proposal.lessonTitle ?? "A lesson that was since deleted"}</h3>
        <ProposalStatusBadge status={proposal.status} />
      </div>
      <p className="text-sm text-ink-soft">
        Proposed by {proposal.isMine ? "you" : proposal.proposedByName} on {shelfDate(proposal.createdAt)}
      </p>
      {proposal.note && (
        <p className="rounded-xl bg-sand px-3 py-2">
          <span className="font-bold">Note:</span> {proposal.note}
        </p>
      )}
      {proposal.decisionNote && (
        <p className="rounded-xl border-l-8 border-ink/30 bg-white px-3 py-2">
          <span className="font-bold">
            {proposal.status === "approved" ? "Published with the note" : "Reason"} ({proposal.decidedByName}
            {proposal.decidedAt ? `, ${shelfDate(proposal.decidedAt)}` : ""}):
          </span>{" "}
          {proposal.decisionNote}
        </p>
      )}
      {pending && isHead && proposal.preview && (
        <details className="rounded-xl border-2 border-line bg-white p-3">
          <summary className="cursor-pointer font-bold text-tide">Read the lesson as it stands</summary>
          <div className="mt-3">
            <LessonSnapshotView snapshot={proposal.preview} />
          </div>
        </details>
      )}
      {pending && isHead && <ProposalDecision proposal={proposal} />}
      {pending && proposal.isMine && (
        <div className="flex flex-col gap-2">
          {withdraw.error && (
            <Alert tone="error" title="Not withdrawn">
              {withdraw.error.message}
            </Alert>
          )}
          <div>
            <Button variant="secondary" busy={withdraw.isPending} onClick={() => withdraw.mutate(proposal.id)}>
              Withdraw proposal
            </Button>
          </div>
        </div>
      )}
    </li>
  );
}

/** Proposals: the head of department's queue, or a teacher's own proposals with the "Propose for the shelf" form. */
export function ProposalsPanel({ isHead }: { isHead: boolean }) {
  const proposals = useProposals();
  const all = proposals.data?.proposals ?? [];
  const waiting = all.filter((proposal) => proposal.status === "pending");
  const decided = all.filter((proposal) => proposal.status !== "pending");
  return (
    <div className="flex flex-col gap-8">
      {!isHead && (
        <section aria-labelledby="propose-heading" className="max-w-2xl rounded-2xl border-2 border-line bg-shell p-5">
          <h2 id="propose-heading" className="mb-4 text-2xl">
            Propose one of your lessons
          </h2>
          <ProposeLessonForm />
        </section>
      )}
      {proposals.isPending && <p role="status">Loading proposals…</p>}
      {proposals.isError && (
        <Alert tone="error" title="Proposals could not be loaded">
          {proposals.error.message}
        </Alert>
      )}
      {proposals.data && (
        <>
          <section aria-labelledby="waiting-heading">
            <h2 id="waiting-heading" className="mb-3 text-2xl">
              {isHead ? "Waiting for your decision" : "Your proposals waiting"} ({waiting.length})
            </h2>
            {waiting.length === 0 ? (
              <p className="text-ink-soft">{isHead ? "No proposals are waiting." : "None waiting."}</p>
            ) : (
              <ul className="flex flex-col gap-4">
                {waiting.map((proposal) => (
                  <ProposalCard key={proposal.id} proposal={proposal} isHead={isHead} />
                ))}
              </ul>
            )}
          </section>
          {decided.length > 0 && (
            <section aria-labelledby="decided-heading">
              <h2 id="decided-heading" className="mb-3 text-2xl">
                Decided
              </h2>
              <ul className="grid gap-4 md:grid-cols-2">
                {decided.map((proposal) => (
                  <ProposalCard key={proposal.id} proposal={proposal} isHead={isHead} />
                ))}
              </ul>
            </section>
          )}
        </>
      )}
    </div>
  );
}
