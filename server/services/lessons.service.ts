import { randomUUID } from "node:crypto";
import { mkdir, readFile, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import { fileTypeFromBuffer } from "file-type";
import {
  ATTACHMENT_BYTES_MAX,
  ATTACHMENT_TYPES,
  type AttachmentType,
  type Lesson,
  type LessonAttachment,
  type LessonInput,
  type LessonListQuery,
  type LessonSummary,
  type LessonUpdate,
} from "@shared/schemas/lessons";
import { db, type Executor } from "../db/client";
import {
  attachmentFromRow,
  deleteLessonAttachment,
  deleteLessonWithAttachments,
  findDiceSetForLesson,
  findDiceSetReadableBy,
  findLessonAttachment,
  findLessonById,
  insertLesson,
  insertLessonAttachment,
  lessonFromRecord,
  lessonInputFromRow,
  listLessonAttachments,
  listLessonsForOwner,
  lockLesson,
  setLessonArchived,
  updateLessonIfVersion,
  type LessonDiceSet,
  type LessonRecord,
  type LessonRow,
} from "../db/queries/lessons";
import { env } from "../env";
import { HttpError, notFound } from "../http-error";
import { logger } from "../logger";
import type { TeacherContext } from "../middleware/require-teacher";

/** What GET /api/lessons/:id answers: the lesson, its dice set (for analysis and print) and its attachments. */
export type LessonDetail = { lesson: Lesson; diceSet: LessonDiceSet | null; attachments: LessonAttachment[] };

/** Where attachment files live: `${DATA_DIR}/uploads/`, one file per storage key. */
export function uploadsDirectory(): string {
  return path.join(env.DATA_DIR, "uploads");
}

function uploadPath(storageKey: string): string {
  // Storage keys are ours (uuid + extension), never a client's file name, so they cannot climb out of the folder.
  return path.join(uploadsDirectory(), path.basename(storageKey));
}

function departmentOf(teacher: TeacherContext): string | null {
  return teacher.department?.id ?? null;
}

const lessonNotFound = () => notFound("That lesson");

/** Owner, or head of the lesson's department (read-only); anyone else is told the lesson does not exist. */
function canRead(teacher: TeacherContext, lesson: LessonRow): boolean {
  if (lesson.ownerId === teacher.user.id) return true;
  return teacher.role === "head" && lesson.departmentId !== null && lesson.departmentId === departmentOf(teacher);
}

/** Members of the lesson's department (and its owner) may fetch its attachments. */
function canFetchAttachments(teacher: TeacherContext, lesson: LessonRow): boolean {
  if (lesson.ownerId === teacher.user.id) return true;
  return lesson.departmentId !== null && lesson.departmentId === departmentOf(teacher);
}

/** Throws 404 when the teacher may not see the lesson and 403 when they may see but not change it. */
function assertOwner(teacher: TeacherContext, lesson: LessonRow | null): asserts lesson is LessonRow {
  if (!lesson || !canRead(teacher, lesson)) throw lessonNotFound();
  if (lesson.ownerId !== teacher.user.id) throw new HttpError(403, "forbidden", "Only the teacher who owns this lesson may change it.");
}

/** A chosen dice set must be one the teacher may read: their own, or one shared with their department. */
async function assertDiceSetUsable(executor: Executor, teacher: TeacherContext, diceSetId: string | null) {
  if (diceSetId === null) return;
  const set = await findDiceSetReadableBy(executor, diceSetId, { userId: teacher.user.id, departmentId: departmentOf(teacher) });
  if (!set) {
    throw new HttpError(400, "invalid_input", "Pick one of your own dice sets or one shared with your department.", {
      diceSetId: ["That dice set is not one you can use."],
    });
  }
}

async function recordOrThrow(executor: Executor, id: string): Promise<LessonRecord> {
  const record = await findLessonById(executor, id);
  if (!record) throw lessonNotFound();
  return record;
}

/** The teacher's own lessons, filtered as the Lessons list asks. */
export async function listLessons(teacher: TeacherContext, query: LessonListQuery): Promise<LessonSummary[]> {
  return listLessonsForOwner(db, teacher.user.id, query);
}

/** One lesson with its dice set and attachments, for its owner or the head of its department. */
export async function readLesson(teacher: TeacherContext, id: string): Promise<LessonDetail> {
  const record = await findLessonById(db, id);
  if (!record || !canRead(teacher, record)) throw lessonNotFound();
  const diceSet = record.diceSetId ? await findDiceSetForLesson(db, record.diceSetId) : null;
  const attachments = (await listLessonAttachments(db, id)).map(attachmentFromRow);
  return { lesson: lessonFromRecord(record, teacher.user.id), diceSet, attachments };
}

export async function createLesson(teacher: TeacherContext, input: LessonInput): Promise<Lesson> {
  return db.transaction(async (tx) => {
    await assertDiceSetUsable(tx, teacher, input.diceSetId);
    const row = await insertLesson(tx, { ownerId: teacher.user.id, departmentId: departmentOf(teacher), input });
    return lessonFromRecord(await recordOrThrow(tx, row.id), teacher.user.id);
  });
}

/** Saves a new version when the teacher started from the stored one; otherwise 409 stale_version and nothing changes. */
export async function updateLesson(teacher: TeacherContext, id: string, update: LessonUpdate): Promise<Lesson> {
  return db.transaction(async (tx) => {
    const current = await lockLesson(tx, id);
    assertOwner(teacher, current);
    if (current.version !== update.version) {
      throw new HttpError(
        409,
        "stale_version",
        `This lesson was saved elsewhere since you opened it (it is now version ${current.version}). Reload it, then make your change again.`,
      );
    }
    // Keep a set the lesson already uses even if it is no longer shared; a newly chosen one must be readable.
    if (update.diceSetId !== current.diceSetId) await assertDiceSetUsable(tx, teacher, update.diceSetId);
    const { version, ...input } = update;
    const row = await updateLessonIfVersion(tx, id, version, input);
    if (!row)
      throw new HttpError(
        409,
        "stale_version",
        "This lesson was saved elsewhere since you opened it. Reload it, then make your change again.",
      );
    return lessonFromRecord(await recordOrThrow(tx, id), teacher.user.id);
  });
}

/** A new draft copy of the teacher's lesson, titled as a copy; attachments stay with the original. */
export async function duplicateLesson(teacher: TeacherContext, id: string): Promise<Lesson> {
  return db.transaction(async (tx) => {
    const source = await lockLesson(tx, id);
    assertOwner(teacher, source);
    const input = lessonInputFromRow(source);
    const title = `${input.title} (copy)`.slice(0, 120);
    const row = await insertLesson(tx, {
      ownerId: teacher.user.id,
      departmentId: source.departmentId,
      input: { ...input, title, status: "draft" },
      fromTemplateId: source.fromTemplateId,
      fromTemplateVersion: source.fromTemplateVersion,
    });
    return lessonFromRecord(await recordOrThrow(tx, row.id), teacher.user.id);
  });
}

export async function archiveLesson(teacher: TeacherContext, id: string, archived: boolean): Promise<Lesson> {
  return db.transaction(async (tx) => {
    assertOwner(teacher, await lockLesson(tx, id));
    await setLessonArchived(tx, id, archived);
    return lessonFromRecord(await recordOrThrow(tx, id), teacher.user.id);
  });
}

/** Removes stored files after their rows are gone; a missing file is already the wanted state. */
async function removeFiles(storageKeys: string[]) {
  for (const key of storageKeys) {
    try {
      await rm(uploadPath(key), { force: true });
    } catch (error) {
      logger.warn({ err: error, storageKey: key }, "could not remove an attachment file");
    }
  }
}

/** Deletes the lesson and its attachment rows in one transaction, then their files. */
export async function deleteLesson(teacher: TeacherContext, id: string): Promise<void> {
  const storageKeys = await db.transaction(async (tx) => {
    assertOwner(teacher, await lockLesson(tx, id));
    return deleteLessonWithAttachments(tx, id);
  });
  await removeFiles(storageKeys);
}

/** Refuses an upload before its body is read unless the teacher owns the lesson. */
export async function assertMayAttach(teacher: TeacherContext, id: string): Promise<void> {
  assertOwner(teacher, await findLessonById(db, id));
}

const extensionOf: Record<AttachmentType, string> = { "application/pdf": "pdf", "image/png": "png", "image/jpeg": "jpg" };

/** A file name safe to store and send back: no folders, no control characters, at most 200 characters. */
function cleanFileName(name: string, type: AttachmentType): string {
  // Control characters are exactly what is taken out of the name.
  // eslint-disable-next-line no-control-regex
  const unsafe = /[\u0000-\u001f\u007f"]/g;
  const base = path.basename(name.replace(/\\/g, "/")).replace(unsafe, "").trim();
  return (base || `attachment.${extensionOf[type]}`).slice(0, 200);
}

/** An uploaded file as the route hands it over (multer memory storage). */
export type UploadedFile = { originalName: string; bytes: Buffer };

/**
 * Stores an attachment: the type comes from the file's content (file-type), never its name or the browser's claim.
 * The row and the file are written in one transaction; a failure removes both, so nothing half-stored remains.
 */
export async function addAttachment(teacher: TeacherContext, id: string, file: UploadedFile | undefined): Promise<LessonAttachment> {
  if (!file) throw new HttpError(400, "no_file", "Choose a file to attach (PDF, PNG or JPEG, up to 10 MB).");
  if (file.bytes.length === 0) throw new HttpError(400, "unsupported_file_type", "That file is empty. Attach a PDF, PNG or JPEG.");
  if (file.bytes.length > ATTACHMENT_BYTES_MAX)
    throw new HttpError(413, "too_large", "That file is larger than 10 MB; attach a smaller one.");
  const detected = await fileTypeFromBuffer(file.bytes);
  const type = ATTACHMENT_TYPES.find((allowed) => allowed === detected?.mime);
  if (!type) {
    throw new HttpError(
      400,
      "unsupported_file_type",
      `Only PDF, PNG and JPEG files can be attached; this file's content is ${detected ? `${detected.ext.toUpperCase()} (${detected.mime})` : "not one of them"}, whatever its name says.`,
    );
  }
  const storageKey = `${randomUUID()}.${extensionOf[type]}`;
  const target = uploadPath(storageKey);
  try {
    return await db.transaction(async (tx) => {
      assertOwner(teacher, await lockLesson(tx, id));
      const row = await insertLessonAttachment(tx, {
        lessonId: id,
        fileName: cleanFileName(file.originalName, type),
        mimeType: type,
        sizeBytes: file.bytes.length,
        storageKey,
        uploadedById: teacher.user.id,
      });
      await mkdir(uploadsDirectory(), { recursive: true });
      await writeFile(target, file.bytes, { flag: "wx" });
      return attachmentFromRow({ ...row, uploadedByName: teacher.user.name });
    });
  } catch (error) {
    await removeFiles([storageKey]);
    throw error;
  }
}

export async function listAttachments(teacher: TeacherContext, id: string): Promise<LessonAttachment[]> {
  const lesson = await findLessonById(db, id);
  if (!lesson || !canRead(teacher, lesson)) throw lessonNotFound();
  return (await listLessonAttachments(db, id)).map(attachmentFromRow);
}

/** An attachment's bytes for a member of the lesson's department. */
export async function readAttachment(teacher: TeacherContext, id: string, attachmentId: string) {
  const lesson = await findLessonById(db, id);
  if (!lesson || !canFetchAttachments(teacher, lesson)) throw lessonNotFound();
  const attachment = await findLessonAttachment(db, id, attachmentId);
  if (!attachment) throw notFound("That attachment");
  let bytes: Buffer;
  try {
    bytes = await readFile(uploadPath(attachment.storageKey));
  } catch {
    throw new HttpError(410, "file_missing", "The file of this attachment is missing on the server; upload it again.");
  }
  return { attachment: attachmentFromRow(attachment), bytes };
}

export async function removeAttachment(teacher: TeacherContext, id: string, attachmentId: string): Promise<void> {
  const storageKey = await db.transaction(async (tx) => {
    assertOwner(teacher, await lockLesson(tx, id));
    return deleteLessonAttachment(tx, id, attachmentId);
  });
  if (storageKey === null) throw notFound("That attachment");
  await removeFiles([storageKey]);
}
