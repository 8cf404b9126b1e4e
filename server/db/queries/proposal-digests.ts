import { and, asc, desc, eq, exists, sql } from "drizzle-orm";
import type { Executor } from "../client";
import { lesson, member, organization, proposalDigest, shelfProposal, user } from "../schema/index";

/** Every head of department whose department has at least one proposal waiting, with their address. */
export async function listHeadsWithWaitingProposals(executor: Executor) {
  return executor
    .select({
      departmentId: organization.id,
      departmentName: organization.name,
      headId: user.id,
      headName: user.name,
      headEmail: user.email,
    })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(
      and(
        eq(member.role, "head"),
        exists(
          executor
            .select({ one: sql`1` })
            .from(shelfProposal)
            .where(and(eq(shelfProposal.departmentId, member.organizationId), eq(shelfProposal.status, "pending"))),
        ),
      ),
    )
    .orderBy(asc(organization.id), asc(user.id));
}

/** A department's waiting proposals, oldest first, with the lesson's title and the proposing teacher's name. */
export async function listWaitingProposals(executor: Executor, departmentId: string) {
  return executor
    .select({
      id: shelfProposal.id,
      lessonTitle: lesson.title,
      proposedByName: user.name,
      note: shelfProposal.note,
      createdAt: shelfProposal.createdAt,
    })
    .from(shelfProposal)
    .innerJoin(user, eq(shelfProposal.proposedById, user.id))
    .leftJoin(lesson, eq(shelfProposal.lessonId, lesson.id))
    .where(and(eq(shelfProposal.departmentId, departmentId), eq(shelfProposal.status, "pending")))
    .orderBy(asc(shelfProposal.createdAt));
}

/** When the head last got a digest for this department, or null. */
export async function lastDigestSentAt(executor: Executor, headId: string, departmentId: string): Promise<Date | null> {
  const [row] = await executor
    .select({ sentAt: proposalDigest.sentAt })
    .from(proposalDigest)
    .where(and(eq(proposalDigest.headId, headId), eq(proposalDigest.departmentId, departmentId)))
    .orderBy(desc(proposalDigest.sentAt))
    .limit(1);
  return row?.sentAt ?? null;
}

/**
 * Records today's digest for a head; false when one is already recorded for that day (another call or process got
 * there first), so the caller sends nothing.
 */
export async function claimDigestDay(
  executor: Executor,
  values: { departmentId: string; headId: string; digestDay: string; proposalCount: number; sentAt: Date },
): Promise<boolean> {
  const rows = await executor
    .insert(proposalDigest)
    .values(values)
    .onConflictDoNothing({ target: [proposalDigest.headId, proposalDigest.departmentId, proposalDigest.digestDay] })
    .returning({ id: proposalDigest.id });
  return rows.length === 1;
}
