import { diceSetFileName, diceSetInputFromFile, diceSetToFile, checkDiceSetFile, type DiceSetFile } from "@shared/schemas/dice-set-file";
import type { DiceSet, DiceSetInput, DiceSetUpdate } from "@shared/schemas/dice-sets";
import { db, type Executor } from "../db/client";
import {
  deleteOwnedDiceSet,
  type DiceSetRow,
  findDiceSetById,
  findReadableDiceSet,
  insertDiceSet,
  listColleagueLessonsUsingSet,
  listReadableDiceSets,
  lockDiceSet,
  updateDiceSetAtVersion,
} from "../db/queries/dice-sets";
import { HttpError, notFound } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";

const NAME_MAX = 80;

function toDiceSet(row: DiceSetRow, teacher: TeacherContext): DiceSet {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    visibility: row.visibility,
    dice: row.dice,
    version: row.version,
    ownerId: row.ownerId,
    ownerName: row.ownerName,
    departmentId: row.departmentId,
    isOwner: row.ownerId === teacher.user.id,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The department a set's visibility needs: none for private, the teacher's own for department sharing. */
function departmentFor(teacher: TeacherContext, visibility: DiceSetInput["visibility"]): string | null {
  if (visibility === "private") return teacher.department?.id ?? null;
  if (!teacher.department) {
    const message = "Join or create a department before sharing a dice set with it; you can keep the set private for now.";
    throw new HttpError(400, "no_department", message, { visibility: [message] });
  }
  return teacher.department.id;
}

async function readable(teacher: TeacherContext, id: string): Promise<DiceSetRow> {
  const row = await findReadableDiceSet(id, teacher.user.id, teacher.department?.id ?? null);
  if (!row) throw notFound("That dice set");
  return row;
}

function requireOwner(row: DiceSetRow, teacher: TeacherContext, doing: string) {
  if (row.ownerId !== teacher.user.id) {
    throw new HttpError(
      403,
      "not_owner",
      `Only ${row.ownerName}, who owns this dice set, may ${doing} it. Duplicate it to make a copy of your own.`,
    );
  }
}

/** The teacher's own sets plus the sets shared with their department. */
export async function listDiceSets(teacher: TeacherContext): Promise<DiceSet[]> {
  const rows = await listReadableDiceSets(teacher.user.id, teacher.department?.id ?? null);
  return rows.map((row) => toDiceSet(row, teacher));
}

/** One set the teacher owns or that is shared with their department (404 otherwise, so other departments' ids reveal nothing). */
export async function getDiceSet(teacher: TeacherContext, id: string): Promise<DiceSet> {
  return toDiceSet(await readable(teacher, id), teacher);
}

/** Stores a new set owned by the teacher. */
export async function createDiceSet(
  teacher: TeacherContext,
  input: DiceSetInput,
  duplicatedFromId: string | null = null,
): Promise<DiceSet> {
  const departmentId = departmentFor(teacher, input.visibility);
  const id = await db.transaction(async (tx) =>
    insertDiceSet(
      {
        ownerId: teacher.user.id,
        name: input.name,
        description: input.description,
        visibility: input.visibility,
        dice: input.dice,
        departmentId,
        duplicatedFromId,
      },
      tx,
    ),
  );
  return getDiceSet(teacher, id);
}

/** Saves the owner's edit if nobody saved the set since `input.version`; a stale edit is refused with 409 and nothing changes. */
export async function updateDiceSet(teacher: TeacherContext, id: string, input: DiceSetUpdate): Promise<DiceSet> {
  const departmentId = departmentFor(teacher, input.visibility);
  await db.transaction(async (tx) => {
    const row = await findReadableDiceSet(id, teacher.user.id, teacher.department?.id ?? null, tx);
    if (!row) throw notFound("That dice set");
    requireOwner(row, teacher, "edit");
    if (input.visibility === "private" && row.visibility === "department") {
      await lockDiceSet(id, tx);
      await refuseWhileColleaguesUse(tx, id, teacher.user.id, "made private");
    }
    const values = { name: input.name, description: input.description, visibility: input.visibility, dice: input.dice, departmentId };
    const saved = await updateDiceSetAtVersion(id, teacher.user.id, input.version, values, tx);
    if (saved === null) {
      const current = (await findDiceSetById(id, tx)) ?? row;
      throw new HttpError(
        409,
        "stale_version",
        `Someone saved this dice set after you opened it: ${current.ownerName} saved version ${current.version} at ${savedAtText(current.updatedAt)} ` +
          `(you started from version ${input.version}). Nothing of yours was saved; reload the set and make your change again.`,
      );
    }
  });
  return getDiceSet(teacher, id);
}

function savedAtText(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** A private copy, owned by the teacher, of a set they may read. */
export async function duplicateDiceSet(teacher: TeacherContext, id: string): Promise<DiceSet> {
  const source = await readable(teacher, id);
  const suffix = " (copy)";
  const name = `${source.name.slice(0, NAME_MAX - suffix.length)}${suffix}`;
  return createDiceSet(teacher, { name, description: source.description, visibility: "private", dice: source.dice }, source.id);
}

/**
 * 409 `set_in_use`, naming them, while colleagues' lessons use the set: deleting it or taking it private would leave
 * those lessons without dice, and their owners would not know. Call with the set's row locked.
 */
async function refuseWhileColleaguesUse(tx: Executor, id: string, ownerId: string, change: "deleted" | "made private") {
  const lessons = await listColleagueLessonsUsingSet(id, ownerId, tx);
  if (lessons.length === 0) return;
  const named = lessons.map((entry) => `${entry.ownerName}’s “${entry.title}”`).join(", ");
  throw new HttpError(
    409,
    "set_in_use",
    `Colleagues' lessons use this set, so it was not ${change}: ${named}. Ask them to choose another set or to duplicate this one first.`,
  );
}

/** Deletes the owner's set (the owner's own lessons keep their plan and lose the link); refused while colleagues' lessons use it. */
export async function deleteDiceSet(teacher: TeacherContext, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await findReadableDiceSet(id, teacher.user.id, teacher.department?.id ?? null, tx);
    if (!row) throw notFound("That dice set");
    requireOwner(row, teacher, "delete");
    await lockDiceSet(id, tx);
    await refuseWhileColleaguesUse(tx, id, teacher.user.id, "deleted");
    await deleteOwnedDiceSet(id, teacher.user.id, tx);
  });
}

/** The set as a dice set file, with the download's file name. */
export async function exportDiceSet(teacher: TeacherContext, id: string): Promise<{ file: DiceSetFile; fileName: string }> {
  const row = await readable(teacher, id);
  return { file: diceSetToFile(row), fileName: diceSetFileName(row.name) };
}

/** Checks an uploaded dice set file and stores it as a private set; a malformed file stores nothing and lists each problem. */
export async function importDiceSet(teacher: TeacherContext, content: unknown): Promise<DiceSet> {
  const checked = checkDiceSetFile(content);
  if (!checked.ok) {
    const count = checked.issues.length;
    throw new ImportError(
      `The file is not a dice set Outroll can read (${count} ${count === 1 ? "problem" : "problems"}); nothing was saved.`,
      checked.issues,
    );
  }
  return createDiceSet(teacher, diceSetInputFromFile(checked.file));
}

/** A refused import: its body carries `issues`, one plain message per problem, beside the usual code and message. */
export class ImportError extends HttpError {
  constructor(
    message: string,
    readonly issues: string[],
  ) {
    super(400, "invalid_file", message, issuesAsFields(issues));
  }
}

function issuesAsFields(issues: string[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of issues) {
    const split = issue.indexOf(": ");
    const key = split > 0 && /^[\w[\].]+$/.test(issue.slice(0, split)) ? issue.slice(0, split) : "_";
    (fields[key] ??= []).push(split > 0 && key !== "_" ? issue.slice(split + 2) : issue);
  }
  return fields;
}
