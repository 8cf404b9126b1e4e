import { db } from "../db/client";
import { claimDigestDay, lastDigestSentAt, listHeadsWithWaitingProposals, listWaitingProposals } from "../db/queries/proposal-digests";
import { env } from "../env";
import { logger } from "../logger";
import { sendMail } from "../mail/mailer";
import { proposalDigestMail } from "../mail/templates";

/** What one digest round did: who was mailed (and how many proposals each digest listed), who was not and why. */
export type DigestRound = {
  day: string;
  sent: { to: string; departmentId: string; proposals: number }[];
  alreadySent: { to: string; departmentId: string }[];
  failed: { to: string; departmentId: string; message: string }[];
};

/** The UTC calendar day of a moment, as PostgreSQL's `date` reads it (YYYY-MM-DD). */
function utcDay(moment: Date) {
  return moment.toISOString().slice(0, 10);
}

/**
 * Sends each head of department whose department has proposals waiting one e-mail listing them, at most once per
 * UTC day (`now` decides the day). Any scheduler may call it, as often as it likes and from several processes: the
 * day is claimed in the same transaction that sends, so a second call that day sends nothing, and a failed send is
 * rolled back and tried again by the next call.
 */
export async function sendProposalDigests(now: Date): Promise<DigestRound> {
  const day = utcDay(now);
  const round: DigestRound = { day, sent: [], alreadySent: [], failed: [] };
  const heads = await listHeadsWithWaitingProposals(db);
  for (const head of heads) {
    const who = { to: head.headEmail, departmentId: head.departmentId };
    try {
      const outcome = await db.transaction(async (tx) => {
        const lastSentAt = await lastDigestSentAt(tx, head.headId, head.departmentId);
        const proposals = await listWaitingProposals(tx, head.departmentId);
        if (proposals.length === 0) return null;
        const claimed = await claimDigestDay(tx, {
          departmentId: head.departmentId,
          headId: head.headId,
          digestDay: day,
          proposalCount: proposals.length,
          sentAt: now,
        });
        if (!claimed) return "already-sent" as const;
        await sendMail(
          proposalDigestMail({
            to: head.headEmail,
            headName: head.headName,
            departmentName: head.departmentName,
            proposals: proposals.map((proposal) => ({ ...proposal, isNew: !lastSentAt || proposal.createdAt > lastSentAt })),
            proposalsUrl: `${env.appOrigin}/app/shelf/proposals`,
          }),
        );
        return proposals.length;
      });
      if (outcome === "already-sent") round.alreadySent.push(who);
      else if (typeof outcome === "number") round.sent.push({ ...who, proposals: outcome });
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      logger.warn({ departmentId: head.departmentId, err: error }, "proposal digest not sent; the next round tries again");
      round.failed.push({ ...who, message });
    }
  }
  return round;
}

/**
 * The start-up hook: checks every ten minutes and, from `PROPOSAL_DIGEST_HOUR_UTC` on, sends the day's digests
 * (the first check runs a minute after start). Returns a stop function; does nothing when the setting is "off".
 */
export function scheduleProposalDigests(hourUtc = env.PROPOSAL_DIGEST_HOUR_UTC): () => void {
  if (hourUtc === "off") return () => undefined;
  const check = () => {
    const now = new Date();
    if (now.getUTCHours() < hourUtc) return;
    sendProposalDigests(now)
      .then((round) => {
        if (round.sent.length || round.failed.length) {
          logger.info({ day: round.day, sent: round.sent.length, failed: round.failed.length }, "proposal digests");
        }
      })
      .catch((error: unknown) => logger.warn({ err: error }, "proposal digest round failed"));
  };
  const first = setTimeout(check, 60_000);
  const every = setInterval(check, 10 * 60_000);
  first.unref();
  every.unref();
  return () => {
    clearTimeout(first);
    clearInterval(every);
  };
}
