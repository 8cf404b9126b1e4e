import { and, asc, count, desc, eq, inArray, isNotNull, isNull, ne, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { SetDie } from "@shared/schemas/dice-sets";
import type { RunStatus } from "@shared/schemas/class-runs";
import type { Executor } from "../client";
import { classRun, diceSet, guessVote, lesson, roll, runGroup, user } from "../schema/index";
import type { ClassRunTally } from "../schema/class-runs";
import { nicknameKey } from "@shared/class-runs/nickname-rules";

export type ClassRunRow = typeof classRun.$inferSelect;
export type RunGroupRow = typeof runGroup.$inferSelect;
export type ClassRunRecord = ClassRunRow & { ownerName: string };

/** A lesson with its dice set, read to open a class run (the run copies both). */
export type LessonForRun = {
  id: string;
  ownerId: string;
  departmentId: string | null;
  title: string;
  classGroup: string;
  archivedAt: Date | null;
  plan: Record<string, unknown>;
  diceSet: { id: string; name: string; dice: SetDie[] } | null;
};

const lessonForRunColumns = {
  id: lesson.id,
  ownerId: lesson.ownerId,
  departmentId: lesson.departmentId,
  title: lesson.title,
  classGroup: lesson.classGroup,
  archivedAt: lesson.archivedAt,
  plan: lesson.plan,
  diceSetId: diceSet.id,
  diceSetName: diceSet.name,
  dice: diceSet.dice,
};

type DiceSetColumns = { diceSetId: string | null; diceSetName: string | null; dice: SetDie[] | null };

/** Folds the left-joined dice set columns into one `diceSet`, null when the lesson has none. */
function lessonForRunFromRow<Row extends DiceSetColumns>({ diceSetId, diceSetName, dice, ...rest }: Row) {
  return { ...rest, diceSet: diceSetId && diceSetName && dice ? { id: diceSetId, name: diceSetName, dice } : null };
}

export async function findLessonForRun(executor: Executor, lessonId: string): Promise<LessonForRun | null> {
  const [row] = await executor
    .select(lessonForRunColumns)
    .from(lesson)
    .leftJoin(diceSet, eq(lesson.diceSetId, diceSet.id))
    .where(eq(lesson.id, lessonId))
    .limit(1);
  return row ? lessonForRunFromRow(row) : null;
}

/** The teacher's lessons that are not archived, with their dice sets, newest first. */
export async function listLessonsForRuns(executor: Executor, ownerId: string): Promise<LessonForRun[]> {
  const rows = await executor
    .select(lessonForRunColumns)
    .from(lesson)
    .leftJoin(diceSet, eq(lesson.diceSetId, diceSet.id))
    .where(and(eq(lesson.ownerId, ownerId), isNull(lesson.archivedAt)))
    .orderBy(desc(lesson.updatedAt));
  return rows.map(lessonForRunFromRow);
}

/** Lesson id → the id of its newest run that is not closed, for the teacher's lessons. */
export async function openRunsByLesson(executor: Executor, ownerId: string): Promise<Map<string, string>> {
  const rows = await executor
    .select({ id: classRun.id, lessonId: classRun.lessonId })
    .from(classRun)
    .where(and(eq(classRun.ownerId, ownerId), ne(classRun.status, "closed"), isNotNull(classRun.lessonId)))
    .orderBy(asc(classRun.createdAt));
  return new Map(rows.map((row) => [row.lessonId!, row.id]));
}

export type NewClassRun = Omit<typeof classRun.$inferInsert, "id" | "boardVersion">;

/** Inserts a run; a join code already used by another run that is not closed raises PostgreSQL's 23505. */
export async function insertClassRun(executor: Executor, values: NewClassRun): Promise<ClassRunRow> {
  const [row] = await executor.insert(classRun).values(values).returning();
  return row;
}

export async function findClassRun(executor: Executor, id: string): Promise<ClassRunRecord | null> {
  const [row] = await executor
    .select({ run: classRun, ownerName: user.name })
    .from(classRun)
    .innerJoin(user, eq(classRun.ownerId, user.id))
    .where(eq(classRun.id, id))
    .limit(1);
  return row ? { ...row.run, ownerName: row.ownerName } : null;
}

/** Locks a run's row for the rest of the transaction (status and phase changes go one at a time). */
export async function lockClassRun(executor: Executor, id: string): Promise<ClassRunRow | null> {
  const [row] = await executor.select().from(classRun).where(eq(classRun.id, id)).for("update").limit(1);
  return row ?? null;
}

/** The run that is not closed with this join code, if any (the partial unique index makes it one at most). */
export async function findRunByJoinCode(executor: Executor, joinCode: string): Promise<ClassRunRow | null> {
  const [row] = await executor
    .select()
    .from(classRun)
    .where(and(eq(classRun.joinCode, joinCode), ne(classRun.status, "closed")))
    .limit(1);
  return row ?? null;
}

/**
 * Ids of a run's groups whose rolls count in no figure: removed ones, and (unless `includeLeftOut`) left-out ones.
 * Every query that reads rolls for a figure leaves these out.
 */
export function setAsideGroups(runId: SQL | AnyPgColumn | string, includeLeftOut = false): SQL {
  const run = typeof runId === "string" ? sql`${runId}::uuid` : runId;
  return sql`select ${runGroup.id} from ${runGroup} where ${runGroup.runId} = ${run} and (${runGroup.removedAt} is not null${includeLeftOut ? sql`` : sql` or ${runGroup.leftOutAt} is not null`})`;
}

/** The teacher's runs, newest first, with how many groups and kept rolls each has. */
export async function listClassRunsForOwner(executor: Executor, ownerId: string) {
  const groupCounts = executor
    .select({ runId: runGroup.runId, groups: count().as("groups") })
    .from(runGroup)
    .where(isNull(runGroup.removedAt))
    .groupBy(runGroup.runId)
    .as("group_counts");
  const rollCounts = executor
    .select({ runId: roll.runId, rolls: count().as("rolls") })
    .from(roll)
    .where(and(isNull(roll.undoneAt), sql`${roll.groupId} not in (${setAsideGroups(roll.runId)})`))
    .groupBy(roll.runId)
    .as("roll_counts");
  return executor
    .select({
      id: classRun.id,
      title: classRun.title,
      classGroup: classRun.classGroup,
      diceSetName: classRun.diceSetName,
      phase: classRun.phase,
      status: classRun.status,
      joinCode: classRun.joinCode,
      createdAt: classRun.createdAt,
      closedAt: classRun.closedAt,
      groupCount: sql<number>`coalesce(${groupCounts.groups}, 0)::int`,
      rollCount: sql<number>`coalesce(${rollCounts.rolls}, 0)::int`,
    })
    .from(classRun)
    .leftJoin(groupCounts, eq(groupCounts.runId, classRun.id))
    .leftJoin(rollCounts, eq(rollCounts.runId, classRun.id))
    .where(eq(classRun.ownerId, ownerId))
    .orderBy(desc(classRun.createdAt));
}

/** Changes a run's status (and closedAt when closing), bumping its board version. */
export async function updateRunStatus(executor: Executor, id: string, status: RunStatus): Promise<ClassRunRow> {
  const [row] = await executor
    .update(classRun)
    .set({
      status,
      closedAt: status === "closed" ? sql`now()` : null,
      boardVersion: sql`${classRun.boardVersion} + 1`,
      lastChangeAt: sql`now()`,
    })
    .where(eq(classRun.id, id))
    .returning();
  return row;
}

/** Moves a run to a phase; a Twist passes the new tally and mode. */
export async function updateRunPhase(
  executor: Executor,
  id: string,
  values: { phase: string; currentTally?: number; tallies?: ClassRunTally[]; dicePerPlayer?: number; players?: number },
): Promise<ClassRunRow> {
  const [row] = await executor
    .update(classRun)
    .set({ ...values, boardVersion: sql`${classRun.boardVersion} + 1`, lastChangeAt: sql`now()` })
    .where(eq(classRun.id, id))
    .returning();
  return row;
}

/** Bumps the board version (and the run's last change, which the idle sweep reads). */
export async function bumpBoardVersion(executor: Executor, runId: string, by = 1): Promise<void> {
  await executor
    .update(classRun)
    .set({ boardVersion: sql`${classRun.boardVersion} + ${by}`, lastChangeAt: sql`now()` })
    .where(eq(classRun.id, runId));
}

/** A run's groups in the order they joined; removed ones only when asked for. */
export async function listGroups(executor: Executor, runId: string, options: { withRemoved?: boolean } = {}): Promise<RunGroupRow[]> {
  return executor
    .select()
    .from(runGroup)
    .where(and(eq(runGroup.runId, runId), options.withRemoved ? undefined : isNull(runGroup.removedAt)))
    .orderBy(asc(runGroup.createdAt), asc(runGroup.nickname));
}

/** A run's groups that are not removed: all of them, and those that joined from a phone (the group cap counts these). */
export async function countGroups(executor: Executor, runId: string): Promise<{ present: number; phones: number }> {
  const [row] = await executor
    .select({ present: count(), phones: sql<number>`count(*) filter (where ${runGroup.source} = 'phone')::int` })
    .from(runGroup)
    .where(and(eq(runGroup.runId, runId), isNull(runGroup.removedAt)));
  return row;
}

/** The group a phone's join attempt made in this run, if any (a retried join answers it again). */
export async function findGroupByJoinAttempt(executor: Executor, runId: string, attemptId: string): Promise<RunGroupRow | null> {
  const [row] = await executor
    .select()
    .from(runGroup)
    .where(and(eq(runGroup.runId, runId), eq(runGroup.joinAttemptId, attemptId)))
    .limit(1);
  return row ?? null;
}

/** Renames a group; a nickname or look-alike key already in the run raises PostgreSQL's 23505. */
export async function renameGroup(executor: Executor, groupId: string, nickname: string): Promise<RunGroupRow> {
  const [row] = await executor
    .update(runGroup)
    .set({ nickname, nicknameKey: nicknameKey(nickname) })
    .where(eq(runGroup.id, groupId))
    .returning();
  return row;
}

/** Marks a group removed (its rows stay, so nothing it recorded is lost). */
export async function markGroupRemoved(executor: Executor, groupId: string): Promise<RunGroupRow> {
  const [row] = await executor
    .update(runGroup)
    .set({ removedAt: sql`coalesce(${runGroup.removedAt}, now())` })
    .where(eq(runGroup.id, groupId))
    .returning();
  return row;
}

/** Leaves a group's rolls out of every figure, or counts them again. */
export async function setGroupLeftOut(executor: Executor, groupId: string, leftOut: boolean): Promise<RunGroupRow> {
  const [row] = await executor
    .update(runGroup)
    .set({ leftOutAt: leftOut ? sql`coalesce(${runGroup.leftOutAt}, now())` : null })
    .where(eq(runGroup.id, groupId))
    .returning();
  return row;
}

/** Marks a group's phone as having sent rolls too fast (the board's flood flag); true when the flag was not already recent. */
export async function markGroupFlooded(executor: Executor, groupId: string): Promise<boolean> {
  const rows = await executor
    .update(runGroup)
    .set({ floodedAt: sql`now()` })
    .where(and(eq(runGroup.id, groupId), sql`(${runGroup.floodedAt} is null or ${runGroup.floodedAt} < now() - interval '1 minute')`))
    .returning({ id: runGroup.id });
  return rows.length > 0;
}

/** Kept rolls of one group (not undone), the figure a removal or leaving out takes off the board. */
export async function countGroupKeptRolls(executor: Executor, groupId: string): Promise<number> {
  const [row] = await executor
    .select({ rolls: count() })
    .from(roll)
    .where(and(eq(roll.groupId, groupId), isNull(roll.undoneAt)));
  return row.rolls;
}

/** Kept rolls per left-out group of a run (the board shows them beside the group, outside every figure). */
export async function leftOutRollCounts(executor: Executor, runId: string): Promise<Map<string, number>> {
  const rows = await executor
    .select({ groupId: roll.groupId, rolls: count() })
    .from(roll)
    .innerJoin(runGroup, eq(runGroup.id, roll.groupId))
    .where(and(eq(roll.runId, runId), isNull(roll.undoneAt), isNotNull(runGroup.leftOutAt), isNull(runGroup.removedAt)))
    .groupBy(roll.groupId);
  return new Map(rows.map((row) => [row.groupId, row.rolls]));
}

/** Phone rolls a run has stored (undone ones too: the roll ceiling counts what phones sent). */
export async function countPhoneRolls(executor: Executor, runId: string): Promise<number> {
  const [row] = await executor
    .select({ rolls: count() })
    .from(roll)
    .where(and(eq(roll.runId, runId), eq(roll.source, "phone")));
  return row.rolls;
}

/** Marks the run as having reached its roll ceiling, once; true when this call set it. */
export async function markRollCeilingReached(executor: Executor, runId: string): Promise<boolean> {
  const rows = await executor
    .update(classRun)
    .set({ rollCeilingReachedAt: sql`now()`, boardVersion: sql`${classRun.boardVersion} + 1` })
    .where(and(eq(classRun.id, runId), isNull(classRun.rollCeilingReachedAt)))
    .returning({ id: classRun.id });
  return rows.length > 0;
}

/** Locks or unlocks joining. */
export async function setJoiningLocked(executor: Executor, runId: string, locked: boolean): Promise<ClassRunRow> {
  const [row] = await executor
    .update(classRun)
    .set({ joiningLocked: locked, boardVersion: sql`${classRun.boardVersion} + 1`, lastChangeAt: sql`now()` })
    .where(eq(classRun.id, runId))
    .returning();
  return row;
}

/**
 * Closes every run that is not closed and has had no change and no roll for `idleMinutes`, in one statement, so
 * several server processes may sweep at once: a run is closed by whichever gets there first, and once. Answers the
 * ids closed.
 */
export async function closeIdleRuns(executor: Executor, idleMinutes: number): Promise<string[]> {
  const result = await executor.execute<{ id: string }>(sql`
    update class_run set status = 'closed', closed_at = now(), board_version = board_version + 1, last_change_at = now()
    where status <> 'closed'
      and last_change_at < now() - make_interval(secs => ${idleMinutes * 60})
      and not exists (select 1 from roll where roll.run_id = class_run.id and roll.received_at >= now() - make_interval(secs => ${idleMinutes * 60}))
    returning id`);
  return result.rows.map((row) => row.id);
}

export async function findGroup(executor: Executor, groupId: string): Promise<RunGroupRow | null> {
  const [row] = await executor.select().from(runGroup).where(eq(runGroup.id, groupId)).limit(1);
  return row ?? null;
}

/** Inserts groups with their look-alike keys; a nickname already in the run (any case, or a look-alike) raises PostgreSQL's 23505. */
export async function insertGroups(executor: Executor, values: (typeof runGroup.$inferInsert)[]): Promise<RunGroupRow[]> {
  if (values.length === 0) return [];
  return executor
    .insert(runGroup)
    .values(values.map((value) => ({ ...value, nicknameKey: nicknameKey(value.nickname) })))
    .returning();
}

export async function setGroupMatchup(executor: Executor, groupId: string, matchup: number[] | null): Promise<RunGroupRow> {
  const [row] = await executor.update(runGroup).set({ matchup }).where(eq(runGroup.id, groupId)).returning();
  return row;
}

/** Sets a matchup on many groups at once (the Twist re-assigns every group). */
export async function setGroupMatchups(executor: Executor, changes: { groupId: string; matchup: number[] | null }[]): Promise<void> {
  for (const change of changes) await executor.update(runGroup).set({ matchup: change.matchup }).where(eq(runGroup.id, change.groupId));
}

/** One vote per group: a new vote replaces the old. */
export async function upsertVote(executor: Executor, runId: string, groupId: string, dieIndex: number): Promise<void> {
  await executor
    .insert(guessVote)
    .values({ runId, groupId, dieIndex })
    .onConflictDoUpdate({ target: [guessVote.runId, guessVote.groupId], set: { dieIndex, votedAt: sql`now()` } });
}

export async function findVote(executor: Executor, groupId: string): Promise<number | null> {
  const [row] = await executor.select({ dieIndex: guessVote.dieIndex }).from(guessVote).where(eq(guessVote.groupId, groupId)).limit(1);
  return row?.dieIndex ?? null;
}

/** The Guess votes of a run's groups that are not removed. */
export async function listVotes(executor: Executor, runId: string) {
  return executor
    .select({ groupId: guessVote.groupId, dieIndex: guessVote.dieIndex })
    .from(guessVote)
    .innerJoin(runGroup, eq(runGroup.id, guessVote.groupId))
    .where(and(eq(guessVote.runId, runId), isNull(runGroup.removedAt)));
}

/** A roll ready to insert. */
export type NewRoll = {
  id: string;
  runId: string;
  groupId: string;
  tally: number;
  dicePerPlayer: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  winnerSeat: number | null;
  source: "phone" | "simulated" | "paper";
  recordedAt: Date;
  /** The group's rolls are left out of every figure: stored, but not added to a Run board's pools. */
  leftOut?: boolean;
};

/** What became of one roll in a batch. */
export type RollWriteOutcome = "stored" | "duplicate" | "run_closed" | "run_paused" | "id_taken";

/**
 * Writes a batch of rolls in one statement (one round trip, its own transaction): a CTE reads the rolls' runs under a
 * share lock (so closing a run waits for the batch, and batches do not wait for each other), inserts the rolls of open
 * runs with one INSERT … SELECT FROM unnest(…) ON CONFLICT (id) DO NOTHING, and returns the inserted ids beside each
 * run's status. Only when some roll was not inserted does a second query tell a duplicate (the same id already stored
 * for the same group, acknowledged as saved) from an id taken by another group or a closed or paused run. The Run
 * board's version counts roll rows, so no run row is updated here and concurrent batches never queue on one hot row.
 */
export async function writeRollBatch(executor: Executor, rolls: NewRoll[]): Promise<Map<string, RollWriteOutcome>> {
  const outcomes = new Map<string, RollWriteOutcome>();
  const runIds = [...new Set(rolls.map((entry) => entry.runId))];
  // sql.param keeps each array one parameter (a bare array would be spread into a list), so the statement has 12 parameters at any batch size.
  const column = <T>(pick: (entry: NewRoll) => T) => sql.param(rolls.map(pick));
  const written = await executor.execute<{ id: string; status: RunStatus | null }>(sql`
    with runs as (
      select id, status from class_run where id = any(${sql.param(runIds)}::uuid[]) for share
    ), inserted as (
      insert into roll (id, run_id, group_id, tally, dice_per_player, matchup, faces, totals, winner_seat, source, recorded_at)
      select v.id, v.run_id, v.group_id, v.tally, v.dice_per_player, v.matchup::jsonb, v.faces::jsonb, v.totals::jsonb, v.winner_seat, v.source, v.recorded_at
      from unnest(
        ${column((entry) => entry.id)}::uuid[], ${column((entry) => entry.runId)}::uuid[], ${column((entry) => entry.groupId)}::uuid[],
        ${column((entry) => entry.tally)}::int[], ${column((entry) => entry.dicePerPlayer)}::int[],
        ${column((entry) => JSON.stringify(entry.matchup))}::text[], ${column((entry) => JSON.stringify(entry.faces))}::text[],
        ${column((entry) => JSON.stringify(entry.totals))}::text[], ${column((entry) => entry.winnerSeat)}::int[],
        ${column((entry) => entry.source)}::text[], ${column((entry) => entry.recordedAt.toISOString())}::timestamptz[]
      ) as v(id, run_id, group_id, tally, dice_per_player, matchup, faces, totals, winner_seat, source, recorded_at)
      where v.run_id in (select id from runs where status = 'open')
      on conflict (id) do nothing
      returning id
    )
    select id, null as status from inserted
    union all
    select id, status from runs`);
  const status = new Map<string, RunStatus>();
  for (const row of written.rows) {
    if (row.status === null) outcomes.set(row.id, "stored");
    else status.set(row.id, row.status);
  }
  const rest = rolls.filter((entry) => !outcomes.has(entry.id));
  if (rest.length === 0) return outcomes;
  const existing = await executor
    .select({ id: roll.id, groupId: roll.groupId })
    .from(roll)
    .where(
      inArray(
        roll.id,
        rest.map((entry) => entry.id),
      ),
    );
  const owner = new Map(existing.map((row) => [row.id, row.groupId]));
  for (const entry of rest) {
    const storedFor = owner.get(entry.id);
    if (storedFor !== undefined) outcomes.set(entry.id, storedFor === entry.groupId ? "duplicate" : "id_taken");
    else outcomes.set(entry.id, status.get(entry.runId) === "paused" ? "run_paused" : "run_closed");
  }
  return outcomes;
}

/** Inserts rolls in chunks (the virtual class and the demo data), ignoring ids already stored. */
export async function insertRolls(executor: Executor, rolls: NewRoll[]): Promise<number> {
  let stored = 0;
  for (let start = 0; start < rolls.length; start += 1000) {
    const chunk = rolls.slice(start, start + 1000);
    const rows = await executor.insert(roll).values(chunk).onConflictDoNothing({ target: roll.id }).returning({ id: roll.id });
    stored += rows.length;
  }
  return stored;
}

/** Marks one of a group's rolls undone (its row stays); null when the group has no such roll. */
export async function markRollUndone(
  executor: Executor,
  groupId: string,
  rollId: string,
): Promise<{ id: string; runId: string; undoneAt: Date } | null> {
  const [row] = await executor
    .update(roll)
    .set({ undoneAt: sql`coalesce(${roll.undoneAt}, now())` })
    .where(and(eq(roll.id, rollId), eq(roll.groupId, groupId)))
    .returning({ id: roll.id, runId: roll.runId, undoneAt: roll.undoneAt });
  return row ? { id: row.id, runId: row.runId, undoneAt: row.undoneAt! } : null;
}

/** How many kept rolls a group has in a tally, and its latest few. */
export async function groupRollsInTally(executor: Executor, groupId: string, tally: number, latest: number) {
  const where = and(eq(roll.groupId, groupId), eq(roll.tally, tally), isNull(roll.undoneAt));
  const [{ saved }] = await executor.select({ saved: count() }).from(roll).where(where);
  const recent = await executor
    .select({
      id: roll.id,
      tally: roll.tally,
      matchup: roll.matchup,
      faces: roll.faces,
      totals: roll.totals,
      winnerSeat: roll.winnerSeat,
      recordedAt: roll.recordedAt,
    })
    .from(roll)
    .where(where)
    .orderBy(desc(roll.recordedAt), desc(roll.receivedAt))
    .limit(latest);
  return { saved, recent };
}

/** A kept roll as pooling needs it, with its id and when the server stored it (for reading only what is new). */
export type PoolRow = {
  id: string;
  groupId: string;
  groupNickname?: string;
  tally: number;
  dicePerPlayer: number;
  matchup: number[];
  totals: number[];
  winnerSeat: number | null;
  source: "phone" | "simulated" | "paper";
  recordedAt: string;
};

/** Rolls of a run that count (not undone, not of a removed or left-out group) in the order recorded (a Run board reads them when it connects). */
export async function runRollsForPooling(executor: Executor, runId: string): Promise<PoolRow[]> {
  const result = await executor.execute<PoolRow>(sql`
    select id, group_id as "groupId", tally, dice_per_player as "dicePerPlayer", matchup, totals, winner_seat as "winnerSeat", source,
      to_json(recorded_at) #>> '{}' as "recordedAt"
    from roll
    where run_id = ${runId} and undone_at is null and group_id not in (${setAsideGroups(runId)})
    order by recorded_at, received_at, id`);
  return result.rows;
}

export async function countUndoneRolls(executor: Executor, runId: string): Promise<number> {
  const [row] = await executor
    .select({ undone: count() })
    .from(roll)
    .where(and(eq(roll.runId, runId), isNotNull(roll.undoneAt)));
  return row.undone;
}

/** Finds the demo run of a lesson by its title (the seed looks before it inserts). */
export async function findRunOfLesson(executor: Executor, lessonId: string, title: string): Promise<ClassRunRow | null> {
  const [row] = await executor
    .select()
    .from(classRun)
    .where(and(eq(classRun.lessonId, lessonId), eq(classRun.title, title)))
    .limit(1);
  return row ?? null;
}
