import { and, asc, count, desc, eq, ilike, inArray, isNotNull, isNull, or, sql, type SQL } from "drizzle-orm";
import {
  lessonPlanFromInput,
  lessonPlanSchema,
  type AttachmentType,
  type Lesson,
  type LessonAttachment,
  type LessonInput,
  type LessonListQuery,
  type LessonSnapshot,
  type LessonSummary,
} from "@shared/schemas/lessons";
import type { SetDie } from "@shared/schemas/dice-sets";
import type { Executor } from "../client";
import { diceSet, lesson, lessonAttachment, shelfProposal, user } from "../schema/index";

export type LessonRow = typeof lesson.$inferSelect;
export type LessonAttachmentRow = typeof lessonAttachment.$inferSelect;

/** A lesson row with the names the API shows beside it. */
export type LessonRecord = LessonRow & { ownerName: string; diceSetName: string | null };

/** A dice set as a lesson needs it: enough to name it, analyse it and freeze it in a snapshot. */
export type LessonDiceSet = { id: string; name: string; description: string; dice: SetDie[] };

/** What `insertLesson` writes: a full lesson input, its owner and department, and the template it came from, if any. */
export type NewLesson = {
  ownerId: string;
  departmentId: string | null;
  input: LessonInput;
  fromTemplateId?: string | null;
  fromTemplateVersion?: number | null;
};

/** The full lesson input held by a stored row (columns plus the plan document, checked by lessonPlanSchema). */
export function lessonInputFromRow(row: LessonRow): LessonInput {
  const plan = lessonPlanSchema.parse(row.plan);
  return { title: row.title, classGroup: row.classGroup, diceSetId: row.diceSetId, status: row.status, ...plan };
}

/** The API shape of a stored lesson, for the teacher `viewerId`. */
export function lessonFromRecord(record: LessonRecord, viewerId: string): Lesson {
  return {
    ...lessonInputFromRow(record),
    id: record.id,
    version: record.version,
    ownerId: record.ownerId,
    ownerName: record.ownerName,
    departmentId: record.departmentId,
    isOwner: record.ownerId === viewerId,
    diceSetName: record.diceSetName,
    fromTemplateId: record.fromTemplateId,
    fromTemplateVersion: record.fromTemplateVersion,
    archivedAt: record.archivedAt?.toISOString() ?? null,
    createdAt: record.createdAt.toISOString(),
    updatedAt: record.updatedAt.toISOString(),
  };
}

/** Inserts a lesson (e.g. a new one, a duplicate, or a copy of a Department shelf template) and returns its row. */
export async function insertLesson(executor: Executor, values: NewLesson): Promise<LessonRow> {
  const [row] = await executor
    .insert(lesson)
    .values({
      ownerId: values.ownerId,
      departmentId: values.departmentId,
      title: values.input.title,
      classGroup: values.input.classGroup,
      status: values.input.status,
      diceSetId: values.input.diceSetId,
      plan: lessonPlanFromInput(values.input),
      fromTemplateId: values.fromTemplateId ?? null,
      fromTemplateVersion: values.fromTemplateVersion ?? null,
    })
    .returning();
  return row;
}

/** One lesson with its owner's name and its dice set's name, or null. */
export async function findLessonById(executor: Executor, id: string): Promise<LessonRecord | null> {
  const [row] = await executor
    .select({ lesson, ownerName: user.name, diceSetName: diceSet.name })
    .from(lesson)
    .innerJoin(user, eq(lesson.ownerId, user.id))
    .leftJoin(diceSet, eq(lesson.diceSetId, diceSet.id))
    .where(eq(lesson.id, id))
    .limit(1);
  return row ? { ...row.lesson, ownerName: row.ownerName, diceSetName: row.diceSetName } : null;
}

/** The same lesson locked for the rest of the transaction (FOR UPDATE), so concurrent writes queue behind it. */
export async function lockLesson(executor: Executor, id: string): Promise<LessonRow | null> {
  const [row] = await executor.select().from(lesson).where(eq(lesson.id, id)).for("update").limit(1);
  return row ?? null;
}

/** Escapes LIKE wildcards so a teacher's search text matches literally. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`;
}

/** The Lessons list of one owner, newest first, filtered by the list query (archived lessons only on request). */
export async function listLessonsForOwner(executor: Executor, ownerId: string, query: LessonListQuery): Promise<LessonSummary[]> {
  const conditions: SQL[] = [eq(lesson.ownerId, ownerId)];
  if (!query.includeArchived) conditions.push(isNull(lesson.archivedAt));
  if (query.status) conditions.push(eq(lesson.status, query.status));
  if (query.diceSetId) conditions.push(eq(lesson.diceSetId, query.diceSetId));
  if (query.classGroup) conditions.push(eq(sql`lower(${lesson.classGroup})`, query.classGroup.toLowerCase()));
  if (query.search) {
    const pattern = likePattern(query.search);
    conditions.push(or(ilike(lesson.title, pattern), ilike(lesson.classGroup, pattern), ilike(diceSet.name, pattern))!);
  }
  const attachmentCounts = executor
    .select({ lessonId: lessonAttachment.lessonId, total: count().as("total") })
    .from(lessonAttachment)
    .groupBy(lessonAttachment.lessonId)
    .as("attachment_counts");
  const rows = await executor
    .select({ lesson, diceSetName: diceSet.name, attachmentCount: attachmentCounts.total })
    .from(lesson)
    .leftJoin(diceSet, eq(lesson.diceSetId, diceSet.id))
    .leftJoin(attachmentCounts, eq(attachmentCounts.lessonId, lesson.id))
    .where(and(...conditions))
    .orderBy(desc(lesson.updatedAt), asc(lesson.title));
  return rows.map(({ lesson: row, diceSetName, attachmentCount }) => {
    const plan = lessonPlanSchema.parse(row.plan);
    return {
      id: row.id,
      title: row.title,
      classGroup: row.classGroup,
      status: row.status,
      diceSetId: row.diceSetId,
      diceSetName,
      durationMinutes: plan.durationMinutes,
      groups: plan.groups,
      rollsPerGroup: plan.rollsPerGroup,
      attachmentCount: Number(attachmentCount ?? 0),
      fromTemplateId: row.fromTemplateId,
      fromTemplateVersion: row.fromTemplateVersion,
      archivedAt: row.archivedAt?.toISOString() ?? null,
      updatedAt: row.updatedAt.toISOString(),
    };
  });
}

/** Writes a new lesson input when the stored version is still `expectedVersion`; null when it has moved on. */
export async function updateLessonIfVersion(
  executor: Executor,
  id: string,
  expectedVersion: number,
  input: LessonInput,
): Promise<LessonRow | null> {
  const [row] = await executor
    .update(lesson)
    .set({
      title: input.title,
      classGroup: input.classGroup,
      status: input.status,
      diceSetId: input.diceSetId,
      plan: lessonPlanFromInput(input),
      version: sql`${lesson.version} + 1`,
      updatedAt: new Date(),
    })
    .where(and(eq(lesson.id, id), eq(lesson.version, expectedVersion)))
    .returning();
  return row ?? null;
}

/** Archives or unarchives a lesson (archiving is not an edit of the plan, so the version stays). */
export async function setLessonArchived(executor: Executor, id: string, archived: boolean): Promise<LessonRow | null> {
  const [row] = await executor
    .update(lesson)
    .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
    .where(eq(lesson.id, id))
    .returning();
  return row ?? null;
}

/** Deletes a lesson, its attachment rows and its pending shelf proposals; returns the storage keys whose files the caller removes after commit. */
export async function deleteLessonWithAttachments(executor: Executor, id: string): Promise<string[]> {
  const removed = await executor
    .delete(lessonAttachment)
    .where(eq(lessonAttachment.lessonId, id))
    .returning({ storageKey: lessonAttachment.storageKey });
  // A pending proposal of a deleted lesson would wait in the head's queue with nothing to show; decided ones stay as history.
  await executor.delete(shelfProposal).where(and(eq(shelfProposal.lessonId, id), eq(shelfProposal.status, "pending")));
  await executor.delete(lesson).where(eq(lesson.id, id));
  return removed.map((row) => row.storageKey);
}

/**
 * A dice set the teacher may use in a lesson: their own, or one shared with their department
 * (visibility "department" and the same department). Null when it does not exist or is not readable.
 */
export async function findDiceSetReadableBy(
  executor: Executor,
  diceSetId: string,
  reader: { userId: string; departmentId: string | null },
): Promise<LessonDiceSet | null> {
  const sharedWithReader =
    reader.departmentId === null
      ? sql`false`
      : and(eq(diceSet.visibility, "department"), isNotNull(diceSet.departmentId), eq(diceSet.departmentId, reader.departmentId));
  const [row] = await executor
    .select({ id: diceSet.id, name: diceSet.name, description: diceSet.description, dice: diceSet.dice })
    .from(diceSet)
    .where(and(eq(diceSet.id, diceSetId), or(eq(diceSet.ownerId, reader.userId), sharedWithReader)))
    .limit(1);
  return row ?? null;
}

/** A dice set by id with no reader check: for a lesson's own set, which its readers see through the lesson. */
export async function findDiceSetForLesson(executor: Executor, diceSetId: string): Promise<LessonDiceSet | null> {
  const [row] = await executor
    .select({ id: diceSet.id, name: diceSet.name, description: diceSet.description, dice: diceSet.dice })
    .from(diceSet)
    .where(eq(diceSet.id, diceSetId))
    .limit(1);
  return row ?? null;
}

/**
 * A lesson frozen in full with its dice set's dice, for a Department shelf template version; null for an unknown lesson.
 * The snapshot's lesson keeps the stored status; a copy made from it usually sets status "draft" before `insertLesson`.
 */
export async function buildLessonSnapshot(executor: Executor, lessonId: string): Promise<LessonSnapshot | null> {
  const [row] = await executor.select().from(lesson).where(eq(lesson.id, lessonId)).limit(1);
  if (!row) return null;
  const set = row.diceSetId ? await findDiceSetForLesson(executor, row.diceSetId) : null;
  return {
    lesson: lessonInputFromRow(row),
    diceSet: set ? { id: set.id, name: set.name, description: set.description, dice: set.dice } : null,
  };
}

/** The API shape of an attachment row. */
export function attachmentFromRow(row: LessonAttachmentRow & { uploadedByName: string }): LessonAttachment {
  return {
    id: row.id,
    lessonId: row.lessonId,
    fileName: row.fileName,
    mimeType: row.mimeType as AttachmentType,
    sizeBytes: row.sizeBytes,
    uploadedByName: row.uploadedByName,
    createdAt: row.createdAt.toISOString(),
  };
}

/** A lesson's attachments, oldest first, with the uploader's name. */
export async function listLessonAttachments(executor: Executor, lessonId: string) {
  const rows = await executor
    .select({ attachment: lessonAttachment, uploadedByName: user.name })
    .from(lessonAttachment)
    .innerJoin(user, eq(lessonAttachment.uploadedById, user.id))
    .where(eq(lessonAttachment.lessonId, lessonId))
    .orderBy(asc(lessonAttachment.createdAt));
  return rows.map((row) => ({ ...row.attachment, uploadedByName: row.uploadedByName }));
}

/** Attachment storage keys of several lessons, e.g. before deleting lessons in bulk. */
export async function attachmentStorageKeysOf(executor: Executor, lessonIds: string[]): Promise<string[]> {
  if (lessonIds.length === 0) return [];
  const rows = await executor
    .select({ storageKey: lessonAttachment.storageKey })
    .from(lessonAttachment)
    .where(inArray(lessonAttachment.lessonId, lessonIds));
  return rows.map((row) => row.storageKey);
}

export async function insertLessonAttachment(
  executor: Executor,
  values: Pick<LessonAttachmentRow, "lessonId" | "fileName" | "mimeType" | "sizeBytes" | "storageKey" | "uploadedById">,
): Promise<LessonAttachmentRow> {
  const [row] = await executor.insert(lessonAttachment).values(values).returning();
  return row;
}

/** One attachment of one lesson, or null (an attachment id under another lesson is not found). */
export async function findLessonAttachment(executor: Executor, lessonId: string, attachmentId: string) {
  const [row] = await executor
    .select({ attachment: lessonAttachment, uploadedByName: user.name })
    .from(lessonAttachment)
    .innerJoin(user, eq(lessonAttachment.uploadedById, user.id))
    .where(and(eq(lessonAttachment.id, attachmentId), eq(lessonAttachment.lessonId, lessonId)))
    .limit(1);
  return row ? { ...row.attachment, uploadedByName: row.uploadedByName } : null;
}

/** Deletes one attachment row; returns its storage key for the caller to remove the file after commit, or null. */
export async function deleteLessonAttachment(executor: Executor, lessonId: string, attachmentId: string): Promise<string | null> {
  const [row] = await executor
    .delete(lessonAttachment)
    .where(and(eq(lessonAttachment.id, attachmentId), eq(lessonAttachment.lessonId, lessonId)))
    .returning({ storageKey: lessonAttachment.storageKey });
  return row?.storageKey ?? null;
}

/** An owner's lesson with exactly this title, or null (the demo seed looks before it inserts). */
export async function findLessonByOwnerAndTitle(executor: Executor, ownerId: string, title: string): Promise<LessonRow | null> {
  const [row] = await executor
    .select()
    .from(lesson)
    .where(and(eq(lesson.ownerId, ownerId), eq(lesson.title, title)))
    .limit(1);
  return row ?? null;
}
