import { and, asc, desc, eq, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { LessonSnapshot } from "@shared/schemas/lessons";
import type { ProposalStatus, TemplateStatus } from "@shared/schemas/shelf";
import type { Executor } from "../client";
import { lesson, lessonTemplate, lessonTemplateVersion, shelfProposal, user } from "../schema/index";

export type TemplateRow = typeof lessonTemplate.$inferSelect;
export type TemplateVersionRow = typeof lessonTemplateVersion.$inferSelect;
export type ProposalRow = typeof shelfProposal.$inferSelect;

/** A template with its current version's row, who published that version and whose proposal it was (if any). */
export type TemplateWithCurrentVersion = {
  template: TemplateRow;
  current: TemplateVersionRow;
  publishedByName: string;
  proposedByName: string | null;
};

export async function insertTemplate(
  executor: Executor,
  values: { departmentId: string; title: string; sourceLessonId: string; createdById: string },
): Promise<TemplateRow> {
  const [row] = await executor
    .insert(lessonTemplate)
    .values({ ...values, status: "published", currentVersion: 1 })
    .returning();
  return row;
}

export async function insertTemplateVersion(
  executor: Executor,
  values: {
    templateId: string;
    version: number;
    changeNote: string;
    snapshot: LessonSnapshot;
    publishedById: string;
    /** The teacher whose approved proposal this version is, when it came from one. */
    proposedById?: string | null;
  },
): Promise<TemplateVersionRow> {
  const [row] = await executor
    .insert(lessonTemplateVersion)
    .values({ ...values, snapshot: values.snapshot as unknown as Record<string, unknown> })
    .returning();
  return row;
}

/** One template of one department, locked for the rest of the transaction; null when it is not that department's. */
export async function lockTemplate(executor: Executor, id: string, departmentId: string): Promise<TemplateRow | null> {
  const [row] = await executor
    .select()
    .from(lessonTemplate)
    .where(and(eq(lessonTemplate.id, id), eq(lessonTemplate.departmentId, departmentId)))
    .for("update")
    .limit(1);
  return row ?? null;
}

/** Moves a template to its new current version (and the title of that version's lesson). */
export async function setTemplateCurrentVersion(executor: Executor, id: string, version: number, title: string) {
  await executor.update(lessonTemplate).set({ currentVersion: version, title, updatedAt: new Date() }).where(eq(lessonTemplate.id, id));
}

export async function setTemplateStatus(executor: Executor, id: string, status: TemplateStatus) {
  await executor.update(lessonTemplate).set({ status, updatedAt: new Date() }).where(eq(lessonTemplate.id, id));
}

const publisher = alias(user, "publisher");
const versionProposer = alias(user, "version_proposer");

/** A department's templates in one status, each with its current version, newest change first. */
export async function listTemplates(
  executor: Executor,
  departmentId: string,
  status: TemplateStatus,
): Promise<TemplateWithCurrentVersion[]> {
  return executor
    .select({
      template: lessonTemplate,
      current: lessonTemplateVersion,
      publishedByName: publisher.name,
      proposedByName: versionProposer.name,
    })
    .from(lessonTemplate)
    .innerJoin(
      lessonTemplateVersion,
      and(eq(lessonTemplateVersion.templateId, lessonTemplate.id), eq(lessonTemplateVersion.version, lessonTemplate.currentVersion)),
    )
    .innerJoin(publisher, eq(lessonTemplateVersion.publishedById, publisher.id))
    .leftJoin(versionProposer, eq(lessonTemplateVersion.proposedById, versionProposer.id))
    .where(and(eq(lessonTemplate.departmentId, departmentId), eq(lessonTemplate.status, status)))
    .orderBy(desc(lessonTemplateVersion.publishedAt), asc(lessonTemplate.title));
}

/** One template of one department with its current version, or null. */
export async function findTemplate(executor: Executor, id: string, departmentId: string): Promise<TemplateWithCurrentVersion | null> {
  const [row] = await executor
    .select({
      template: lessonTemplate,
      current: lessonTemplateVersion,
      publishedByName: publisher.name,
      proposedByName: versionProposer.name,
    })
    .from(lessonTemplate)
    .innerJoin(
      lessonTemplateVersion,
      and(eq(lessonTemplateVersion.templateId, lessonTemplate.id), eq(lessonTemplateVersion.version, lessonTemplate.currentVersion)),
    )
    .innerJoin(publisher, eq(lessonTemplateVersion.publishedById, publisher.id))
    .leftJoin(versionProposer, eq(lessonTemplateVersion.proposedById, versionProposer.id))
    .where(and(eq(lessonTemplate.id, id), eq(lessonTemplate.departmentId, departmentId)))
    .limit(1);
  return row ?? null;
}

/** A template's whole history, newest version first, without the snapshots. */
export async function listTemplateVersions(executor: Executor, templateId: string) {
  return executor
    .select({
      version: lessonTemplateVersion.version,
      changeNote: lessonTemplateVersion.changeNote,
      publishedAt: lessonTemplateVersion.publishedAt,
      publishedByName: publisher.name,
      proposedByName: versionProposer.name,
    })
    .from(lessonTemplateVersion)
    .innerJoin(publisher, eq(lessonTemplateVersion.publishedById, publisher.id))
    .leftJoin(versionProposer, eq(lessonTemplateVersion.proposedById, versionProposer.id))
    .where(eq(lessonTemplateVersion.templateId, templateId))
    .orderBy(desc(lessonTemplateVersion.version));
}

/** One version of a template with its snapshot and publisher's name, or null. */
export async function findTemplateVersion(executor: Executor, templateId: string, version: number) {
  const [row] = await executor
    .select({ version: lessonTemplateVersion, publishedByName: publisher.name, proposedByName: versionProposer.name })
    .from(lessonTemplateVersion)
    .innerJoin(publisher, eq(lessonTemplateVersion.publishedById, publisher.id))
    .leftJoin(versionProposer, eq(lessonTemplateVersion.proposedById, versionProposer.id))
    .where(and(eq(lessonTemplateVersion.templateId, templateId), eq(lessonTemplateVersion.version, version)))
    .limit(1);
  return row ?? null;
}

/** A department's template with this exact title, or null (the demo seed looks before it publishes). */
export async function findTemplateByTitle(executor: Executor, departmentId: string, title: string): Promise<TemplateRow | null> {
  const [row] = await executor
    .select()
    .from(lessonTemplate)
    .where(and(eq(lessonTemplate.departmentId, departmentId), eq(lessonTemplate.title, title)))
    .limit(1);
  return row ?? null;
}

export async function insertProposal(
  executor: Executor,
  values: { departmentId: string; lessonId: string; proposedById: string; note: string },
): Promise<ProposalRow> {
  const [row] = await executor.insert(shelfProposal).values(values).returning();
  return row;
}

/** The pending proposal of a lesson, if there is one. */
export async function findPendingProposalForLesson(executor: Executor, lessonId: string): Promise<ProposalRow | null> {
  const [row] = await executor
    .select()
    .from(shelfProposal)
    .where(and(eq(shelfProposal.lessonId, lessonId), eq(shelfProposal.status, "pending")))
    .limit(1);
  return row ?? null;
}

/** One proposal of one department, locked for the rest of the transaction; null when it is not that department's. */
export async function lockProposal(executor: Executor, id: string, departmentId: string): Promise<ProposalRow | null> {
  const [row] = await executor
    .select()
    .from(shelfProposal)
    .where(and(eq(shelfProposal.id, id), eq(shelfProposal.departmentId, departmentId)))
    .for("update")
    .limit(1);
  return row ?? null;
}

export async function decideProposal(
  executor: Executor,
  id: string,
  decision: { status: Exclude<ProposalStatus, "pending">; decidedById: string; decisionNote: string },
) {
  await executor
    .update(shelfProposal)
    .set({ ...decision, decidedAt: new Date() })
    .where(and(eq(shelfProposal.id, id), eq(shelfProposal.status, "pending")));
}

export async function deleteProposal(executor: Executor, id: string) {
  await executor.delete(shelfProposal).where(eq(shelfProposal.id, id));
}

const proposer = alias(user, "proposer");
const decider = alias(user, "decider");

/**
 * A department's proposals (or only one teacher's), pending first, then the newest decisions; the lesson's
 * title is read beside each one (null once the lesson was deleted).
 */
export async function listProposals(executor: Executor, departmentId: string, filter: { proposedById?: string; proposalId?: string } = {}) {
  const conditions = [eq(shelfProposal.departmentId, departmentId)];
  if (filter.proposedById) conditions.push(eq(shelfProposal.proposedById, filter.proposedById));
  if (filter.proposalId) conditions.push(eq(shelfProposal.id, filter.proposalId));
  return executor
    .select({
      proposal: shelfProposal,
      lessonTitle: lesson.title,
      proposedByName: proposer.name,
      decidedByName: decider.name,
    })
    .from(shelfProposal)
    .innerJoin(proposer, eq(shelfProposal.proposedById, proposer.id))
    .leftJoin(decider, eq(shelfProposal.decidedById, decider.id))
    .leftJoin(lesson, eq(shelfProposal.lessonId, lesson.id))
    .where(and(...conditions))
    .orderBy(sql`(${shelfProposal.status} = 'pending') desc`, desc(sql`coalesce(${shelfProposal.decidedAt}, ${shelfProposal.createdAt})`))
    .limit(100);
}

/** How many proposals wait for a decision in a department (or, with `proposedById`, how many of one teacher's). */
export async function countPendingProposals(executor: Executor, departmentId: string, filter: { proposedById?: string } = {}) {
  const conditions = [eq(shelfProposal.departmentId, departmentId), eq(shelfProposal.status, "pending")];
  if (filter.proposedById) conditions.push(eq(shelfProposal.proposedById, filter.proposedById));
  const [row] = await executor
    .select({ waiting: sql<number>`count(*)::int` })
    .from(shelfProposal)
    .where(and(...conditions));
  return row?.waiting ?? 0;
}
