import { and, asc, desc, eq, getTableColumns, gte, ilike, inArray, isNull, lt, sql, type SQL } from "drizzle-orm";
import type { ResultsListQuery } from "@shared/schemas/results";
import type { SetDie } from "@shared/schemas/dice-sets";
import type { RollSource } from "@shared/class-results/pooled-results";
import { pool, type Executor } from "../client";
import { classRun, diceSet, guessVote, lesson, paperCount, paperImport, roll, runGroup, user } from "../schema/index";
import { setAsideGroups } from "./class-runs";

export type ClassRunRow = typeof classRun.$inferSelect;

/** A class run with its owner's name, as the Results area reads it. */
export type ResultsRunRecord = ClassRunRow & { ownerName: string };

/** A run in the archive list with its counts (undone rolls left out of every count). */
export type ResultsRunListRecord = ResultsRunRecord & {
  rollCount: number;
  simulatedRollCount: number;
  paperRollCount: number;
  /** Of rollCount (and paperRollCount), the rolls typed into the tally grid as win/tie/loss counts. */
  countedRollCount: number;
  groupCount: number;
};

/** Who is asking for the archive: a teacher sees their own runs, a head may ask for the department's. */
export type ArchiveViewer = { userId: string; departmentId: string | null; wholeDepartment: boolean };

const columnsOfRun = getTableColumns(classRun);

// Rolls that count: not undone, and not of a removed or left-out group.
const liveRoll = (runId: SQL | typeof classRun.id) =>
  and(eq(roll.runId, runId), isNull(roll.undoneAt), sql`${roll.groupId} not in (${setAsideGroups(runId)})`);

const countOf = (condition: SQL | undefined) => sql<number>`(select count(*)::int from ${roll} where ${condition})`;

// Rolls typed into the tally grid as win/tie/loss counts: they count as paper rolls, though no roll row stands for them.
const countedRollCount = sql<number>`(select coalesce(sum(${paperCount.firstWins} + ${paperCount.ties} + ${paperCount.secondWins}), 0)::int from ${paperCount} where ${paperCount.runId} = ${classRun.id} and ${paperCount.groupId} not in (${setAsideGroups(classRun.id)}))`;
const rollCount = sql<number>`(${countOf(liveRoll(classRun.id))} + ${countedRollCount})`;
const groupCount = sql<number>`(select count(*)::int from ${runGroup} where ${runGroup.runId} = ${classRun.id} and ${runGroup.removedAt} is null)`;
const columnsWithCounts = {
  ...columnsOfRun,
  ownerName: user.name,
  rollCount,
  simulatedRollCount: countOf(and(liveRoll(classRun.id), eq(roll.source, "simulated"))),
  paperRollCount: sql<number>`(${countOf(and(liveRoll(classRun.id), eq(roll.source, "paper")))} + ${countedRollCount})`,
  countedRollCount,
  groupCount,
};

/** Closed class runs the viewer may see, filtered and ordered as asked, with their roll and group counts (at most 500). */
export async function listClosedRuns(executor: Executor, viewer: ArchiveViewer, query: ResultsListQuery): Promise<ResultsRunListRecord[]> {
  const conditions: (SQL | undefined)[] = [eq(classRun.status, "closed")];
  if (viewer.wholeDepartment && viewer.departmentId) conditions.push(eq(classRun.departmentId, viewer.departmentId));
  else conditions.push(eq(classRun.ownerId, viewer.userId));
  const escape = (text: string) => text.replace(/[\\%_]/g, (match) => `\\${match}`);
  if (query.lesson) conditions.push(ilike(classRun.title, `%${escape(query.lesson)}%`));
  if (query.set) conditions.push(ilike(classRun.diceSetName, `%${escape(query.set)}%`));
  if (query.classGroup) conditions.push(ilike(classRun.classGroup, escape(query.classGroup)));
  if (query.from) conditions.push(gte(classRun.createdAt, new Date(`${query.from}T00:00:00Z`)));
  if (query.to) conditions.push(lt(classRun.createdAt, new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000)));
  const sortColumns = {
    date: classRun.createdAt,
    lesson: sql`lower(${classRun.title})`,
    set: sql`lower(${classRun.diceSetName})`,
    class: sql`lower(${classRun.classGroup})`,
    rolls: rollCount,
    groups: groupCount,
  } as const;
  const direction = query.order === "asc" ? asc : desc;
  return executor
    .select(columnsWithCounts)
    .from(classRun)
    .innerJoin(user, eq(user.id, classRun.ownerId))
    .where(and(...conditions))
    .orderBy(direction(sortColumns[query.sort]), desc(classRun.createdAt), asc(classRun.id))
    .limit(500);
}

/** One class run (any status) with its owner's name and counts, or null. */
export async function findRunWithCounts(executor: Executor, runId: string): Promise<ResultsRunListRecord | null> {
  const [row] = await executor
    .select(columnsWithCounts)
    .from(classRun)
    .innerJoin(user, eq(user.id, classRun.ownerId))
    .where(eq(classRun.id, runId))
    .limit(1);
  return row ?? null;
}

/** One class run with its owner's name, or null. */
export async function findResultsRun(executor: Executor, runId: string): Promise<ResultsRunRecord | null> {
  const [row] = await executor
    .select({ ...columnsOfRun, ownerName: user.name })
    .from(classRun)
    .innerJoin(user, eq(user.id, classRun.ownerId))
    .where(eq(classRun.id, runId))
    .limit(1);
  return row ?? null;
}

export type RunGroupRow = {
  id: string;
  nickname: string;
  source: RollSource;
  matchup: number[] | null;
  createdAt: Date;
  leftOutAt: Date | null;
};

/** Every group of a run the teacher did not remove (removed ones too when asked), in the order they joined. */
export async function listRunGroups(executor: Executor, runId: string, options: { withRemoved?: boolean } = {}): Promise<RunGroupRow[]> {
  return executor
    .select({
      id: runGroup.id,
      nickname: runGroup.nickname,
      source: runGroup.source,
      matchup: runGroup.matchup,
      createdAt: runGroup.createdAt,
      leftOutAt: runGroup.leftOutAt,
    })
    .from(runGroup)
    .where(and(eq(runGroup.runId, runId), options.withRemoved ? undefined : isNull(runGroup.removedAt)))
    .orderBy(asc(runGroup.createdAt), asc(runGroup.id));
}

/** Guess-phase votes of a run: how many groups voted for each die. */
export async function countGuessVotes(executor: Executor, runId: string): Promise<{ dieIndex: number; votes: number }[]> {
  return executor
    .select({ dieIndex: guessVote.dieIndex, votes: sql<number>`count(*)::int` })
    .from(guessVote)
    .innerJoin(runGroup, eq(runGroup.id, guessVote.groupId))
    .where(and(eq(guessVote.runId, runId), isNull(runGroup.removedAt)))
    .groupBy(guessVote.dieIndex)
    .orderBy(asc(guessVote.dieIndex));
}

/** Rolls of a run that count (not undone), optionally without simulated ones. */
export async function countRunRolls(executor: Executor, runId: string, includeSimulated = true): Promise<number> {
  const [row] = await executor
    .select({ rolls: sql<number>`count(*)::int` })
    .from(roll)
    .where(and(liveRoll(sql`${runId}::uuid`), includeSimulated ? undefined : sql`${roll.source} <> 'simulated'`));
  return row.rolls;
}

/** One stored roll as the exports and pooling read it from the cursor. */
export type StreamedRoll = {
  id: string;
  groupId: string;
  tally: number;
  dicePerPlayer: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  winnerSeat: number | null;
  source: RollSource;
  recordedAt: Date;
};

/**
 * Streams a run's rolls that count (undone rolls and removed groups' rolls left out; left-out groups' rolls only with
 * `includeLeftOut`) in recorded order, `batchSize` at a time, through a
 * PostgreSQL cursor in a read-only transaction on one pooled connection, so no export ever holds every row.
 * Stopping the loop early (a closed download) closes the cursor and returns the connection.
 */
export async function* streamRunRolls(
  runId: string,
  options: { includeSimulated: boolean; includeLeftOut?: boolean; batchSize?: number },
): AsyncGenerator<StreamedRoll[]> {
  const batchSize = options.batchSize ?? 2000;
  const client = await pool.connect();
  let finished = false;
  let broken = false;
  try {
    await client.query("begin transaction isolation level repeatable read read only");
    await client.query(
      `declare results_rolls no scroll cursor for
         select id, group_id as "groupId", tally, dice_per_player as "dicePerPlayer", matchup, faces, totals,
                winner_seat as "winnerSeat", source, recorded_at as "recordedAt"
           from roll
          where run_id = $1 and undone_at is null ${options.includeSimulated ? "" : "and source <> 'simulated'"}
            and group_id not in (select id from run_group where run_id = $1 and (removed_at is not null${options.includeLeftOut ? "" : " or left_out_at is not null"}))
          order by recorded_at, id`,
      [runId],
    );
    for (;;) {
      const batch = await client.query<StreamedRoll>(`fetch forward ${batchSize} from results_rolls`);
      if (batch.rows.length > 0) yield batch.rows;
      if (batch.rows.length < batchSize) break;
    }
    await client.query("commit");
    finished = true;
  } catch (error) {
    broken = true;
    throw error;
  } finally {
    // An early stop (a closed download) or an error lands here with the transaction still open.
    if (!finished) await client.query("rollback").catch(() => undefined);
    client.release(broken);
  }
}

/** Deletes a run with its rolls, votes, groups and Paper imports in one transaction, answering how many of each went. */
export async function deleteRunWithEverything(executor: Executor, runId: string) {
  return executor.transaction(async (tx) => {
    const rolls = await tx.delete(roll).where(eq(roll.runId, runId)).returning({ id: roll.id });
    const votes = await tx.delete(guessVote).where(eq(guessVote.runId, runId)).returning({ id: guessVote.groupId });
    const groups = await tx.delete(runGroup).where(eq(runGroup.runId, runId)).returning({ id: runGroup.id });
    const imports = await tx.delete(paperImport).where(eq(paperImport.runId, runId)).returning({ id: paperImport.id });
    const runs = await tx.delete(classRun).where(eq(classRun.id, runId)).returning({ id: classRun.id });
    return { deletedRun: runs.length === 1, rolls: rolls.length, votes: votes.length, groups: groups.length, imports: imports.length };
  });
}

/** A lesson of the teacher with its dice set's name and dice, for making a paper run; null if not theirs. */
export async function findOwnLessonWithSet(executor: Executor, ownerId: string, lessonId: string) {
  const [row] = await executor
    .select({
      id: lesson.id,
      title: lesson.title,
      classGroup: lesson.classGroup,
      plan: lesson.plan,
      departmentId: lesson.departmentId,
      diceSetName: diceSet.name,
      dice: diceSet.dice,
    })
    .from(lesson)
    .leftJoin(diceSet, eq(diceSet.id, lesson.diceSetId))
    .where(and(eq(lesson.id, lessonId), eq(lesson.ownerId, ownerId)))
    .limit(1);
  return row ?? null;
}

/** The teacher's lessons that are not archived, with their set names and plans, for the paper run picker. */
export async function listOwnLessonsWithSets(executor: Executor, ownerId: string) {
  return executor
    .select({
      id: lesson.id,
      title: lesson.title,
      classGroup: lesson.classGroup,
      plan: lesson.plan,
      diceSetName: diceSet.name,
      dice: diceSet.dice,
    })
    .from(lesson)
    .leftJoin(diceSet, eq(diceSet.id, lesson.diceSetId))
    .where(and(eq(lesson.ownerId, ownerId), isNull(lesson.archivedAt)))
    .orderBy(desc(lesson.updatedAt))
    .limit(200);
}

export type NewPaperRun = {
  ownerId: string;
  departmentId: string | null;
  lessonId: string;
  title: string;
  classGroup: string;
  diceSetName: string;
  dice: SetDie[];
  dicePerPlayer: number;
  players: number;
  tieRule: string;
  matchupChoice: "assigned" | "group-choice";
  phases: string[];
  joinCode: string;
  taughtAt: Date;
};

/** Inserts a closed class run that will hold rolls recorded on paper only. */
export async function insertPaperRun(executor: Executor, values: NewPaperRun): Promise<ClassRunRow> {
  const [row] = await executor
    .insert(classRun)
    .values({
      ownerId: values.ownerId,
      departmentId: values.departmentId,
      lessonId: values.lessonId,
      title: values.title,
      classGroup: values.classGroup,
      diceSetName: values.diceSetName,
      dice: values.dice,
      dicePerPlayer: values.dicePerPlayer,
      players: values.players,
      tieRule: values.tieRule,
      matchupChoice: values.matchupChoice,
      phases: values.phases,
      phase: values.phases[values.phases.length - 1] ?? "Pool",
      status: "closed",
      joinCode: values.joinCode,
      tallies: [{ tally: 1, dicePerPlayer: values.dicePerPlayer, players: values.players, startedAt: values.taughtAt.toISOString() }],
      createdAt: values.taughtAt,
      closedAt: values.taughtAt,
    })
    .returning();
  return row;
}

/** An earlier upload of the same file into the same run, or null. */
export async function findPaperImportByHash(executor: Executor, runId: string, fileHash: string) {
  const [row] = await executor
    .select({ id: paperImport.id, createdAt: paperImport.createdAt })
    .from(paperImport)
    .where(and(eq(paperImport.runId, runId), eq(paperImport.fileHash, fileHash)))
    .limit(1);
  return row ?? null;
}

/** The stored rolls among `ids` (deterministic Paper import ids), with their faces and matchup to compare. */
export async function findRollsByIds(executor: Executor, ids: string[]) {
  if (ids.length === 0) return [];
  const found: { id: string; matchup: number[]; faces: number[][]; undoneAt: Date | null }[] = [];
  for (let start = 0; start < ids.length; start += 1000) {
    const slice = ids.slice(start, start + 1000);
    found.push(
      ...(await executor
        .select({ id: roll.id, matchup: roll.matchup, faces: roll.faces, undoneAt: roll.undoneAt })
        .from(roll)
        .where(inArray(roll.id, slice))),
    );
  }
  return found;
}

export type NewPaperRoll = {
  id: string;
  groupId: string;
  tally: number;
  dicePerPlayer: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  winnerSeat: number | null;
  recordedAt: Date;
};

/**
 * Stores a Paper import in one transaction: the upload record (its file hash unique per run), the groups it creates
 * and its rolls, each roll keyed by a deterministic id so rows already stored are skipped (ON CONFLICT DO NOTHING).
 * Answers how many rolls were new, or `duplicateFile` when the same file was already imported.
 */
export async function insertPaperImport(
  executor: Executor,
  values: {
    runId: string;
    fileHash: string;
    fileName: string;
    rowCount: number;
    importedById: string;
    newGroups: string[];
    rollsFor: (groupIds: Map<string, string>) => NewPaperRoll[];
  },
): Promise<{ duplicateFile: boolean; inserted: number }> {
  return executor.transaction(async (tx) => {
    const [upload] = await tx
      .insert(paperImport)
      .values({
        runId: values.runId,
        fileHash: values.fileHash,
        fileName: values.fileName,
        rowCount: values.rowCount,
        importedById: values.importedById,
      })
      .onConflictDoNothing({ target: [paperImport.runId, paperImport.fileHash] })
      .returning({ id: paperImport.id });
    if (!upload) return { duplicateFile: true, inserted: 0 };
    const groupIds = new Map<string, string>();
    if (values.newGroups.length > 0) {
      const created = await tx
        .insert(runGroup)
        .values(values.newGroups.map((nickname) => ({ runId: values.runId, nickname, source: "paper" as const })))
        .returning({ id: runGroup.id, nickname: runGroup.nickname });
      for (const group of created) groupIds.set(group.nickname.toLowerCase(), group.id);
    }
    const rolls = values.rollsFor(groupIds);
    let inserted = 0;
    for (let start = 0; start < rolls.length; start += 1000) {
      const slice = rolls.slice(start, start + 1000).map((entry) => ({
        ...entry,
        runId: values.runId,
        source: "paper" as const,
        paperImportId: upload.id,
      }));
      const stored = await tx.insert(roll).values(slice).onConflictDoNothing({ target: roll.id }).returning({ id: roll.id });
      inserted += stored.length;
    }
    await tx
      .update(classRun)
      .set({ boardVersion: sql`${classRun.boardVersion} + 1` })
      .where(eq(classRun.id, values.runId));
    return { duplicateFile: false, inserted };
  });
}
