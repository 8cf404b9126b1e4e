import { and, asc, desc, eq, ne, or, sql } from "drizzle-orm";
import type { DiceSetVisibility, SetDie } from "@shared/schemas/dice-sets";
import { db, type Executor } from "../client";
import { diceSet, lesson, user } from "../schema/index";

/** A stored dice set row with its owner's name. */
export type DiceSetRow = {
  id: string;
  ownerId: string;
  ownerName: string;
  departmentId: string | null;
  name: string;
  description: string;
  visibility: DiceSetVisibility;
  dice: SetDie[];
  version: number;
  duplicatedFromId: string | null;
  createdAt: Date;
  updatedAt: Date;
};

const columns = {
  id: diceSet.id,
  ownerId: diceSet.ownerId,
  ownerName: user.name,
  departmentId: diceSet.departmentId,
  name: diceSet.name,
  description: diceSet.description,
  visibility: diceSet.visibility,
  dice: diceSet.dice,
  version: diceSet.version,
  duplicatedFromId: diceSet.duplicatedFromId,
  createdAt: diceSet.createdAt,
  updatedAt: diceSet.updatedAt,
};

/** Sets a teacher may read: their own, and those shared with their department. */
function readableBy(userId: string, departmentId: string | null) {
  const own = eq(diceSet.ownerId, userId);
  if (departmentId === null) return own;
  return or(own, and(eq(diceSet.visibility, "department"), eq(diceSet.departmentId, departmentId)));
}

/** The teacher's own sets first (newest edit first), then department-shared sets by name. */
export async function listReadableDiceSets(userId: string, departmentId: string | null, executor: Executor = db): Promise<DiceSetRow[]> {
  return executor
    .select(columns)
    .from(diceSet)
    .innerJoin(user, eq(diceSet.ownerId, user.id))
    .where(readableBy(userId, departmentId))
    .orderBy(sql`(${diceSet.ownerId} = ${userId}) desc`, desc(diceSet.updatedAt), asc(diceSet.name));
}

/** One set if the teacher may read it, otherwise null. */
export async function findReadableDiceSet(
  id: string,
  userId: string,
  departmentId: string | null,
  executor: Executor = db,
): Promise<DiceSetRow | null> {
  const rows = await executor
    .select(columns)
    .from(diceSet)
    .innerJoin(user, eq(diceSet.ownerId, user.id))
    .where(and(eq(diceSet.id, id), readableBy(userId, departmentId)))
    .limit(1);
  return rows[0] ?? null;
}

/** One set by id whoever owns it (for messages after a refused update), or null. */
export async function findDiceSetById(id: string, executor: Executor = db): Promise<DiceSetRow | null> {
  const rows = await executor
    .select(columns)
    .from(diceSet)
    .innerJoin(user, eq(diceSet.ownerId, user.id))
    .where(eq(diceSet.id, id))
    .limit(1);
  return rows[0] ?? null;
}

export type DiceSetValues = {
  name: string;
  description: string;
  visibility: DiceSetVisibility;
  dice: SetDie[];
  departmentId: string | null;
};

/** Inserts a set and returns its id. */
export async function insertDiceSet(
  values: DiceSetValues & { ownerId: string; duplicatedFromId?: string | null },
  executor: Executor = db,
): Promise<string> {
  const [row] = await executor
    .insert(diceSet)
    .values({ ...values, duplicatedFromId: values.duplicatedFromId ?? null })
    .returning({ id: diceSet.id });
  return row.id;
}

/** One UPDATE guarded by owner and version: answers the new version, or null when the row was not at `version` (or not the owner's). */
export async function updateDiceSetAtVersion(
  id: string,
  ownerId: string,
  version: number,
  values: DiceSetValues,
  executor: Executor = db,
): Promise<number | null> {
  const rows = await executor
    .update(diceSet)
    .set({ ...values, version: sql`${diceSet.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(diceSet.id, id), eq(diceSet.ownerId, ownerId), eq(diceSet.version, version)))
    .returning({ version: diceSet.version });
  return rows[0]?.version ?? null;
}

/** Deletes the owner's set; answers whether a row went. */
export async function deleteOwnedDiceSet(id: string, ownerId: string, executor: Executor = db): Promise<boolean> {
  const rows = await executor
    .delete(diceSet)
    .where(and(eq(diceSet.id, id), eq(diceSet.ownerId, ownerId)))
    .returning({ id: diceSet.id });
  return rows.length > 0;
}

/** A set with this name owned by this teacher, or null (the seed looks before it inserts). */
export async function findOwnedDiceSetByName(ownerId: string, name: string, executor: Executor = db): Promise<{ id: string } | null> {
  const rows = await executor
    .select({ id: diceSet.id })
    .from(diceSet)
    .where(and(eq(diceSet.ownerId, ownerId), eq(diceSet.name, name)))
    .limit(1);
  return rows[0] ?? null;
}

/** Locks a set's row for the rest of the transaction: a lesson taking it up meanwhile waits (its foreign key needs the row). */
export async function lockDiceSet(id: string, executor: Executor): Promise<void> {
  await executor.select({ id: diceSet.id }).from(diceSet).where(eq(diceSet.id, id)).for("update");
}

/** Lessons of other teachers than the set's owner that use the set, with their owners' names. */
export async function listColleagueLessonsUsingSet(
  id: string,
  ownerId: string,
  executor: Executor = db,
): Promise<{ title: string; ownerName: string }[]> {
  return executor
    .select({ title: lesson.title, ownerName: user.name })
    .from(lesson)
    .innerJoin(user, eq(user.id, lesson.ownerId))
    .where(and(eq(lesson.diceSetId, id), ne(lesson.ownerId, ownerId)))
    .orderBy(asc(user.name), asc(lesson.title));
}
