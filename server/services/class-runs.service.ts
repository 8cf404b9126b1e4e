import { assignedMatchup } from "@shared/class-results/assigned-matchups";
import type { BoardPools, BoardPoolSettings } from "@shared/class-results/board-pool";
import { simulatedMatchupRolls, winnerSeatOf } from "@shared/class-results/virtual-class";
import type { TieRule } from "@shared/probability/index";
import {
  type BoardGroup,
  type BoardSnapshot,
  type ClassRun,
  type ClassRunSummary,
  type PadRunPreview,
  type RunnableLesson,
  type RunPhase,
  type RunPhaseChange,
  type RunStatus,
  type RunTally,
  type SimulatedGroupsInput,
} from "@shared/schemas/class-runs";
import { lessonPlanSchema, type LessonPlan } from "@shared/schemas/lessons";
import { db, type Executor } from "../db/client";
import {
  bumpBoardVersion,
  countGroupKeptRolls,
  countUndoneRolls,
  findClassRun,
  findGroup,
  findLessonForRun,
  findRunByJoinCode,
  insertClassRun,
  insertGroups,
  insertRolls,
  leftOutRollCounts,
  listClassRunsForOwner,
  listGroups,
  listLessonsForRuns,
  listVotes,
  lockClassRun,
  markGroupRemoved,
  openRunsByLesson,
  renameGroup,
  runRollsForPooling,
  setGroupLeftOut,
  setGroupMatchup,
  setGroupMatchups,
  setJoiningLocked,
  updateRunPhase,
  updateRunStatus,
  type ClassRunRecord,
  type ClassRunRow,
  type LessonForRun,
  type NewRoll,
  type RunGroupRow,
} from "../db/queries/class-runs";
import type { ClassRunTally } from "../db/schema/class-runs";
import { env } from "../env";
import { HttpError, notFound } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";
import { notifyRunChanged } from "../run-notifier";
import { logger } from "../logger";
import { poolRowsJson } from "../pooling/pool-rows-wire";
import { NeedsResetError, poolBoardOffThread, poolKeptBoardOffThread } from "../pooling/pooling-pool";
import { generateJoinCode, isUniqueViolation } from "./join-code";
import type { BoardUpdateMessage } from "@shared/events";
import { GROUP_CAP_DEFAULT } from "@shared/schemas/class-runs";
import { codeGuessingWait, countWrongCode } from "../limits/room-limits";

const JOIN_CODE_ATTEMPTS = 8;

/** The tallies of a run, with the first one filled in for runs stored before tallies were kept. */
export function talliesOf(run: Pick<ClassRunRow, "tallies" | "dicePerPlayer" | "players" | "createdAt">): RunTally[] {
  if (run.tallies.length > 0) return run.tallies;
  return [{ tally: 1, dicePerPlayer: run.dicePerPlayer, players: run.players, startedAt: run.createdAt.toISOString() }];
}

/** The API shape of a run for the teacher `viewerId`. */
export function classRunView(run: ClassRunRecord, viewerId: string | null): ClassRun {
  return {
    id: run.id,
    title: run.title,
    classGroup: run.classGroup,
    lessonId: run.lessonId,
    diceSetName: run.diceSetName,
    dice: run.dice,
    dicePerPlayer: run.dicePerPlayer,
    players: run.players,
    tieRule: run.tieRule as TieRule,
    matchupChoice: run.matchupChoice,
    phases: run.phases as RunPhase[],
    phase: run.phase as RunPhase,
    status: run.status,
    joinCode: run.joinCode,
    joinPath: `/pad/${run.joinCode}`,
    configuredOrigin: env.APP_ORIGIN ?? null,
    currentTally: run.currentTally,
    tallies: talliesOf(run),
    hideExactUntilProve: run.hideExactUntilProve,
    discussionPrompts: run.discussionPrompts,
    exitTicket: run.exitTicket,
    boardVersion: run.boardVersion,
    joiningLocked: run.joiningLocked,
    groupCap: run.groupCap,
    rollCeiling: env.ROLL_CEILING_PER_RUN,
    rollCeilingReachedAt: run.rollCeilingReachedAt?.toISOString() ?? null,
    ownerId: run.ownerId,
    isOwner: run.ownerId === viewerId,
    ownerName: run.ownerName,
    createdAt: run.createdAt.toISOString(),
    closedAt: run.closedAt?.toISOString() ?? null,
  };
}

/** A group as the Run board lists it, with its kept rolls and Guess vote. */
export function boardGroupView(group: RunGroupRow, rolls: number, vote: number | null): BoardGroup {
  return {
    id: group.id,
    nickname: group.nickname,
    source: group.source,
    matchup: group.matchup,
    rolls,
    vote,
    createdAt: group.createdAt.toISOString(),
    leftOut: group.leftOutAt !== null,
    floodedAt: group.floodedAt?.toISOString() ?? null,
  };
}

/**
 * A run the teacher may see ("view": its owner, or the head of its department) or change ("manage": its owner only).
 * Runs of another department answer 404, so their existence is not revealed.
 */
export async function runForTeacher(
  teacher: TeacherContext,
  runId: string,
  access: "view" | "manage",
  executor: Executor = db,
): Promise<ClassRunRecord> {
  const run = await findClassRun(executor, runId);
  if (!run) throw notFound("The class run");
  if (run.ownerId === teacher.user.id) return run;
  const sameDepartment = run.departmentId !== null && run.departmentId === teacher.department?.id;
  if (!sameDepartment) throw notFound("The class run");
  if (access === "view" && teacher.role === "head") return run;
  throw new HttpError(
    403,
    "forbidden",
    access === "view" ? "This class run belongs to another teacher." : "Only the teacher who opened this class run can change it.",
  );
}

function planProblem(lesson: LessonForRun): { plan: LessonPlan | null; problem: string | null } {
  const parsed = lessonPlanSchema.safeParse(lesson.plan);
  if (!parsed.success) return { plan: null, problem: "The lesson plan does not check: open it in Lessons and save it again." };
  if (!lesson.diceSet) return { plan: parsed.data, problem: "Choose a dice set for the lesson first." };
  if (parsed.data.mode.players > lesson.diceSet.dice.length)
    return { plan: parsed.data, problem: "The lesson has more players than its set has dice." };
  return { plan: parsed.data, problem: null };
}

/** The teacher's lessons, each saying whether it can be run now and which run of it is still open. */
export async function listRunnableLessons(teacher: TeacherContext): Promise<{ lessons: RunnableLesson[] }> {
  const [lessons, open] = await Promise.all([listLessonsForRuns(db, teacher.user.id), openRunsByLesson(db, teacher.user.id)]);
  return {
    lessons: lessons.map((lesson) => ({
      id: lesson.id,
      title: lesson.title,
      classGroup: lesson.classGroup,
      diceSetName: lesson.diceSet?.name ?? null,
      problem: planProblem(lesson).problem,
      openRunId: open.get(lesson.id) ?? null,
    })),
  };
}

export async function listClassRuns(teacher: TeacherContext): Promise<{ runs: ClassRunSummary[] }> {
  const rows = await listClassRunsForOwner(db, teacher.user.id);
  return {
    runs: rows.map((row) => ({
      ...row,
      phase: row.phase as RunPhase,
      createdAt: row.createdAt.toISOString(),
      closedAt: row.closedAt?.toISOString() ?? null,
    })),
  };
}

/** The included phases of a lesson plan, in order (Roll alone when a plan skips them all). */
function includedPhases(plan: LessonPlan): RunPhase[] {
  const phases = plan.phases.filter((entry) => entry.included).map((entry) => entry.phase);
  return phases.length > 0 ? phases : ["Roll"];
}

/** The values a run copies from a lesson and its set (used by the route and by the demo seed). */
export function runValuesFromLesson(lesson: LessonForRun, plan: LessonPlan, ownerId: string, departmentId: string | null) {
  const diceSet = lesson.diceSet!;
  const phases = includedPhases(plan);
  const tallies: ClassRunTally[] = [
    { tally: 1, dicePerPlayer: plan.mode.dicePerPlayer, players: plan.mode.players, startedAt: new Date().toISOString() },
  ];
  return {
    ownerId,
    departmentId,
    lessonId: lesson.id,
    title: lesson.title,
    classGroup: lesson.classGroup,
    diceSetName: diceSet.name,
    dice: diceSet.dice,
    dicePerPlayer: plan.mode.dicePerPlayer,
    players: plan.mode.players,
    tieRule: plan.tieRule,
    matchupChoice: plan.matchupChoice,
    phases,
    phase: phases[0],
    status: "open" as const,
    currentTally: 1,
    tallies,
    hideExactUntilProve: plan.hideExactUntilProve,
    discussionPrompts: plan.discussionPrompts,
    exitTicket: plan.exitTicket,
  };
}

/** Inserts a run with a fresh join code, drawing again when the code is taken by another run that is not closed. */
export async function insertRunWithJoinCode(
  executor: Executor,
  values: Omit<Parameters<typeof insertClassRun>[1], "joinCode">,
): Promise<ClassRunRow> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await executor.transaction((tx) => insertClassRun(tx, { ...values, joinCode: generateJoinCode() }));
    } catch (error) {
      if (!isUniqueViolation(error, "class_run_open_join_code_idx") || attempt >= JOIN_CODE_ATTEMPTS) throw error;
    }
  }
}

/** Opens a class run of the teacher's own lesson: copies its set, mode, tie rule and phases, and gives it a join code. */
export async function openClassRun(teacher: TeacherContext, lessonId: string, groupCap = GROUP_CAP_DEFAULT): Promise<ClassRun> {
  const lesson = await findLessonForRun(db, lessonId);
  if (!lesson) throw notFound("The lesson");
  if (lesson.ownerId !== teacher.user.id) {
    if (lesson.departmentId && lesson.departmentId === teacher.department?.id) {
      throw new HttpError(
        403,
        "forbidden",
        "Only the teacher who owns a lesson can open a class run of it. Duplicate the lesson to run it yourself.",
      );
    }
    throw notFound("The lesson");
  }
  if (lesson.archivedAt) throw new HttpError(409, "lesson_archived", "The lesson is archived: restore it in Lessons before running it.");
  const { plan, problem } = planProblem(lesson);
  if (!plan || problem) throw new HttpError(422, "lesson_not_ready", problem ?? "The lesson cannot be run yet.");
  const row = await insertRunWithJoinCode(db, {
    ...runValuesFromLesson(lesson, plan, teacher.user.id, teacher.department?.id ?? null),
    groupCap,
  });
  return classRunView({ ...row, ownerName: teacher.user.name }, teacher.user.id);
}

export async function getClassRun(teacher: TeacherContext, runId: string): Promise<ClassRun> {
  return classRunView(await runForTeacher(teacher, runId, "view"), teacher.user.id);
}

const allowedStatusChanges: Record<RunStatus, RunStatus[]> = { open: ["paused", "closed"], paused: ["open", "closed"], closed: [] };

/** Pauses, resumes or closes a run; a closed run stays closed and takes no more rolls. */
export async function changeRunStatus(teacher: TeacherContext, runId: string, status: RunStatus): Promise<ClassRun> {
  const updated = await db.transaction(async (tx) => {
    const run = await runForTeacher(teacher, runId, "manage", tx);
    const locked = (await lockClassRun(tx, run.id))!;
    if (locked.status === status) return { ...locked, ownerName: run.ownerName };
    if (!allowedStatusChanges[locked.status].includes(status)) {
      throw new HttpError(409, "run_closed", "This class run is closed. Open a new run of the lesson to record more rolls.");
    }
    return { ...(await updateRunStatus(tx, run.id, status)), ownerName: run.ownerName };
  });
  notifyRunChanged({ runId, kind: "status" });
  return classRunView(updated, teacher.user.id);
}

/** The mode a Twist plays: two dice each, or three players (the set needs three dice). */
function twistTally(run: ClassRunRow, change: RunPhaseChange): ClassRunTally {
  const base = talliesOf(run)[0];
  const twist = change.twist ?? (base.dicePerPlayer === 1 ? "two-dice-each" : "three-players");
  if (twist === "three-players") {
    if (run.dice.length < 3) throw new HttpError(422, "twist_not_possible", "Three players need a set of at least three dice.");
    if (base.players === 3)
      throw new HttpError(422, "twist_not_possible", "This run already plays with three players; choose two dice each.");
    return { tally: run.currentTally + 1, dicePerPlayer: base.dicePerPlayer, players: 3, startedAt: new Date().toISOString() };
  }
  if (base.dicePerPlayer === 2)
    throw new HttpError(422, "twist_not_possible", "This run already plays two dice each; choose three players.");
  return { tally: run.currentTally + 1, dicePerPlayer: 2, players: base.players, startedAt: new Date().toISOString() };
}

/**
 * Moves the run to one of the lesson's phases. The first move to Twist starts a fresh tally in the twisted mode:
 * assigned groups get new matchups, groups that choose their own choose again.
 */
export async function changeRunPhase(teacher: TeacherContext, runId: string, change: RunPhaseChange): Promise<ClassRun> {
  const updated = await db.transaction(async (tx) => {
    const run = await runForTeacher(teacher, runId, "manage", tx);
    const locked = (await lockClassRun(tx, run.id))!;
    if (locked.status === "closed") throw new HttpError(409, "run_closed", "This class run is closed; its phase can no longer change.");
    if (!locked.phases.includes(change.phase)) {
      throw new HttpError(422, "phase_skipped", `This lesson skips the ${change.phase} phase.`);
    }
    const tallies = talliesOf(locked);
    if (change.phase === "Twist" && tallies.length === 1) {
      const tally = twistTally(locked, change);
      const groups = await listGroups(tx, run.id);
      await setGroupMatchups(
        tx,
        groups.map((group, index) => ({
          groupId: group.id,
          matchup:
            locked.matchupChoice === "assigned" || group.source !== "phone"
              ? assignedMatchup(locked.dice.length, tally.players, index)
              : null,
        })),
      );
      return {
        ...(await updateRunPhase(tx, run.id, {
          phase: change.phase,
          currentTally: tally.tally,
          tallies: [...tallies, tally],
          dicePerPlayer: tally.dicePerPlayer,
          players: tally.players,
        })),
        ownerName: run.ownerName,
      };
    }
    return { ...(await updateRunPhase(tx, run.id, { phase: change.phase, tallies })), ownerName: run.ownerName };
  });
  notifyRunChanged({ runId, kind: "phase" });
  return classRunView(updated, teacher.user.id);
}

function checkMatchupFits(run: ClassRunRow, matchup: number[]) {
  if (matchup.length !== run.players) {
    throw new HttpError(422, "wrong_mode", `This part of the run is played by ${run.players} players: choose ${run.players} dice.`);
  }
  if (matchup.some((index) => index >= run.dice.length)) {
    throw new HttpError(422, "invalid_input", `The set has ${run.dice.length} dice; choose among them.`);
  }
}

/** The teacher sets a group's matchup for the current tally. */
export async function assignGroupMatchup(teacher: TeacherContext, runId: string, groupId: string, matchup: number[]): Promise<BoardGroup> {
  const group = await db.transaction(async (tx) => {
    const run = await runForTeacher(teacher, runId, "manage", tx);
    if (run.status === "closed") throw new HttpError(409, "run_closed", "This class run is closed.");
    const existing = await findGroup(tx, groupId);
    if (!existing || existing.runId !== run.id || existing.removedAt) throw notFound("The group");
    checkMatchupFits(run, matchup);
    return setGroupMatchup(tx, groupId, matchup);
  });
  notifyRunChanged({ runId, kind: "group", groupId });
  return boardGroupView(group, 0, null);
}

/** The run (managed by its owner, not closed) and one of its groups that is not removed, read in `tx`. */
async function groupToModerate(teacher: TeacherContext, runId: string, groupId: string, tx: Executor) {
  const run = await runForTeacher(teacher, runId, "manage", tx);
  const locked = (await lockClassRun(tx, run.id))!;
  if (locked.status === "closed") throw new HttpError(409, "run_closed", "This class run is closed: its groups can no longer change.");
  const group = await findGroup(tx, groupId);
  if (!group || group.runId !== run.id || group.removedAt) throw notFound("The group");
  return { run, group };
}

/** The teacher renames a group (a nickname that breaks the rules or looks like another group's is refused); the pad learns it. */
export async function renameRunGroup(teacher: TeacherContext, runId: string, groupId: string, nickname: string): Promise<BoardGroup> {
  const group = await db.transaction(async (tx) => {
    const { run } = await groupToModerate(teacher, runId, groupId, tx);
    try {
      // A savepoint, so a refused name leaves the transaction usable and the error is ours.
      const renamed = await tx.transaction((inner) => renameGroup(inner, groupId, nickname));
      await bumpBoardVersion(tx, run.id);
      return renamed;
    } catch (error) {
      if (isUniqueViolation(error, "run_group_run_nickname_idx") || isUniqueViolation(error, "run_group_run_nickname_key_idx")) {
        throw new HttpError(
          409,
          "nickname_taken",
          `Another group in this run is already called “${nickname}” or something that looks just like it.`,
        );
      }
      throw error;
    }
  });
  notifyRunChanged({ runId, kind: "group", groupId });
  return boardGroupView(group, 0, null);
}

/**
 * The teacher removes a group: it leaves the board and every figure, its token is dead, and its phone is told. Its
 * rows stay (marked), so nothing is lost. The board version rises by the group's kept rolls and one, so it still grows.
 */
export async function removeRunGroup(teacher: TeacherContext, runId: string, groupId: string): Promise<{ id: string; removedAt: string }> {
  const group = await db.transaction(async (tx) => {
    const { run, group } = await groupToModerate(teacher, runId, groupId, tx);
    const counted = group.leftOutAt ? 0 : await countGroupKeptRolls(tx, group.id);
    const removed = await markGroupRemoved(tx, group.id);
    await bumpBoardVersion(tx, run.id, counted + 1);
    return removed;
  });
  notifyRunChanged({ runId, kind: "removed", groupId });
  return { id: group.id, removedAt: group.removedAt!.toISOString() };
}

/** The teacher leaves a group's rolls out of every figure and export (the group stays, marked), or counts them again. */
export async function setRunGroupLeftOut(teacher: TeacherContext, runId: string, groupId: string, leftOut: boolean): Promise<BoardGroup> {
  const group = await db.transaction(async (tx) => {
    const { run, group } = await groupToModerate(teacher, runId, groupId, tx);
    if ((group.leftOutAt !== null) === leftOut) return group;
    const kept = await countGroupKeptRolls(tx, group.id);
    const changed = await setGroupLeftOut(tx, group.id, leftOut);
    // Leaving out takes the group's rolls off the board's count, so the version makes up for them to keep growing.
    await bumpBoardVersion(tx, run.id, leftOut ? kept + 1 : 1);
    return changed;
  });
  notifyRunChanged({ runId, kind: "group", groupId });
  return boardGroupView(group, 0, null);
}

/** The teacher locks joining (no new group joins; groups in the run carry on) or unlocks it. */
export async function setRunJoiningLocked(teacher: TeacherContext, runId: string, locked: boolean): Promise<ClassRun> {
  const updated = await db.transaction(async (tx) => {
    const run = await runForTeacher(teacher, runId, "manage", tx);
    const current = (await lockClassRun(tx, run.id))!;
    if (current.status === "closed") throw new HttpError(409, "run_closed", "This class run is closed: nobody can join it.");
    return { ...(await setJoiningLocked(tx, run.id, locked)), ownerName: run.ownerName };
  });
  notifyRunChanged({ runId, kind: "run" });
  return classRunView(updated, teacher.user.id);
}

/**
 * Adds the virtual class: simulated groups (marked simulated) whose rolls come from the engine's seeded simulation,
 * in the current tally and mode, so a class without dice still sees thousands of rolls converge.
 */
export async function addSimulatedGroups(teacher: TeacherContext, runId: string, input: SimulatedGroupsInput) {
  const seed = input.seed ?? Math.floor(Math.random() * 2 ** 32);
  const result = await db.transaction(async (tx) => {
    const run = await runForTeacher(teacher, runId, "manage", tx);
    const locked = (await lockClassRun(tx, run.id))!;
    if (locked.status === "closed") throw new HttpError(409, "run_closed", "This class run is closed: it takes no more rolls.");
    const existing = await listGroups(tx, run.id, { withRemoved: true });
    const simulatedSoFar = existing.filter((group) => group.source === "simulated").length;
    const groups = await insertGroups(
      tx,
      Array.from({ length: input.groups }, (_, index) => ({
        runId: run.id,
        nickname: `Virtual group ${simulatedSoFar + index + 1}`,
        source: "simulated" as const,
        matchup: assignedMatchup(locked.dice.length, locked.players, existing.length + index),
      })),
    );
    const start = Date.now();
    const rolls: NewRoll[] = groups.flatMap((group, groupIndex) =>
      simulatedMatchupRolls({
        dice: group.matchup!.map((index) => locked.dice[index].faces),
        dicePerPlayer: locked.dicePerPlayer,
        rolls: input.rollsPerGroup,
        seed: (seed + groupIndex * 7919) >>> 0,
      }).map((entry, rollIndex) => ({
        id: crypto.randomUUID(),
        runId: run.id,
        groupId: group.id,
        tally: locked.currentTally,
        dicePerPlayer: locked.dicePerPlayer,
        matchup: group.matchup!,
        faces: entry.faces,
        totals: entry.totals,
        winnerSeat: winnerSeatOf(entry.totals),
        source: "simulated" as const,
        // Interleaves the groups' rolls a millisecond apart, so the convergence chart mixes them as a real class would.
        recordedAt: new Date(start + rollIndex * input.groups + groupIndex),
      })),
    );
    const stored = await insertRolls(tx, rolls);
    await bumpBoardVersion(tx, run.id);
    return { groups, stored };
  });
  notifyRunChanged({ runId, kind: "rolls" });
  return {
    seed,
    rolls: result.stored,
    groups: result.groups.map((group) => boardGroupView(group, input.rollsPerGroup, null)),
  };
}

/**
 * What a Run board broadcaster remembers of a run between refreshes: the last update and what it was read from (the
 * rolls themselves stay in the pooling worker's running pool, under `generation`).
 */
export type BoardRunState = {
  generation: number;
  boardVersion: number;
  settings: BoardPoolSettings;
  nicknames: Record<string, string>;
  update: BoardUpdateMessage;
};
export type BoardRollCache = Map<string, BoardRunState>;

let nextGeneration = 1;

type BoardParts = Omit<BoardSnapshot, "version" | "tallies" | "generatedAt">;

/**
 * Everything the Run board shows, read from the database in one repeatable-read transaction so the version matches
 * the figures; the rolls are pooled afterwards, so no database connection waits on the arithmetic.
 */
async function readBoardState(runId: string, viewerId: string | null) {
  const read = await db.transaction(
    async (tx) => {
      const run = await findClassRun(tx, runId);
      if (!run) return null;
      // One transaction is one connection: its queries run one after another.
      const groups = await listGroups(tx, runId);
      const votes = await listVotes(tx, runId);
      const undoneRolls = await countUndoneRolls(tx, runId);
      const leftOutRolls = await leftOutRollCounts(tx, runId);
      const rows = await runRollsForPooling(tx, run.id);
      return { run, groups, votes, undoneRolls, leftOutRolls, rows };
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
  if (!read) return null;
  const { run, groups, votes, rows, undoneRolls, leftOutRolls } = read;
  const settings: BoardPoolSettings = {
    dice: run.dice.map((die) => ({ name: die.name, faces: die.faces })),
    tieRule: run.tieRule as TieRule,
    tallies: talliesOf(run),
  };
  const nicknames = Object.fromEntries(groups.map((group) => [group.id, group.nickname]));
  const voteByGroup = new Map(votes.map((vote) => [vote.groupId, vote.dieIndex]));
  const voteCounts = run.dice.map(() => 0);
  for (const vote of votes) if (vote.dieIndex < voteCounts.length) voteCounts[vote.dieIndex] += 1;
  const parts: BoardParts = {
    runId,
    run: classRunView(run, viewerId),
    groups: groups.map((group) => boardGroupView(group, leftOutRolls.get(group.id) ?? 0, voteByGroup.get(group.id) ?? null)),
    votes: voteCounts,
    undoneRolls,
  };
  return { boardVersion: run.boardVersion, settings, nicknames, rows, parts };
}

/** The snapshot's figures from pooled rolls: each group's count, and a version that only grows. */
function withPools<Tallies>(boardVersion: number, parts: BoardParts, pools: BoardPools<Tallies>) {
  return {
    ...parts,
    // Every change the board shows bumps board_version, except a new roll, which adds a row; the sum only grows.
    version: boardVersion + pools.kept + parts.undoneRolls,
    // A left-out group's rolls are in no pool; it keeps the count read with the board.
    groups: parts.groups.map((group) => (group.leftOut ? group : { ...group, rolls: pools.rollsByGroup[group.id] ?? 0 })),
    tallies: pools.tallies,
    generatedAt: new Date().toISOString(),
  };
}

/** The Run board's snapshot (the first thing a board loads, and GET …/board), pooled on the worker thread. */
export async function readBoardSnapshot(runId: string, viewerId: string | null): Promise<BoardSnapshot | null> {
  const state = await readBoardState(runId, viewerId);
  if (!state) return null;
  return withPools(
    state.boardVersion,
    state.parts,
    await poolBoardOffThread({ ...state.settings, nicknames: state.nicknames, rows: state.rows }),
  );
}

/**
 * A watched run's board:update read in full from the database; the worker starts a running pool of its rolls for
 * later `refreshBoardWithRolls` calls, remembered in `cache`.
 */
export async function readBoardUpdate(runId: string, cache: BoardRollCache): Promise<BoardUpdateMessage | null> {
  const state = await readBoardState(runId, null);
  if (!state) {
    cache.delete(runId);
    return null;
  }
  const generation = nextGeneration++;
  const { settings, nicknames } = state;
  const pools = await poolKeptBoardOffThread({ ...settings, nicknames, rows: state.rows, keep: { runId, generation, reset: true } });
  const update = withPools(state.boardVersion, state.parts, pools);
  cache.set(runId, { generation, boardVersion: state.boardVersion, settings, nicknames, update });
  return update;
}

/**
 * A watched run's board:update after new rolls only, without reading the database: the rolls the batcher has committed
 * since the last refresh go to the worker's running pool for the run, and the rest of the last update stands (every
 * other change bumps board_version, and the broadcaster answers those with `readBoardUpdate`). Null when nothing is
 * kept for the run (no earlier full read, or the worker lost it): the caller reads in full.
 */
export async function refreshBoardWithRolls(
  runId: string,
  rolls: readonly NewRoll[],
  cache: BoardRollCache,
): Promise<BoardUpdateMessage | null> {
  const state = cache.get(runId);
  if (!state) return null;
  let pools: BoardPools<Uint8Array>;
  try {
    pools = await poolKeptBoardOffThread({
      ...state.settings,
      nicknames: state.nicknames,
      rows: poolRowsJson(rolls),
      keep: { runId, generation: state.generation, reset: false },
    });
  } catch (error) {
    cache.delete(runId);
    if (!(error instanceof NeedsResetError)) logger.warn({ err: error }, "board pooling failed; the refresh reads the run in full");
    return null;
  }
  const { version: _version, tallies: _tallies, generatedAt: _generatedAt, ...parts } = state.update;
  state.update = withPools(state.boardVersion, parts, pools);
  return state.update;
}

export async function getBoardSnapshot(teacher: TeacherContext, runId: string): Promise<BoardSnapshot> {
  await runForTeacher(teacher, runId, "view");
  const snapshot = await readBoardSnapshot(runId, teacher.user.id);
  if (!snapshot) throw notFound("The class run");
  return snapshot;
}

/**
 * What the Roll pad's code box shows before a group joins; closed runs and unknown codes are one 404. Wrong codes
 * count against the address's guessing limit, as they do over the socket (429 `rate_limited` once it is spent).
 */
export async function previewRunByCode(code: string, address: string): Promise<PadRunPreview> {
  const wait = await codeGuessingWait(address, null);
  if (wait !== null) {
    throw new HttpError(
      429,
      "rate_limited",
      `Too many wrong join codes from here. Wait ${Math.max(1, Math.ceil(wait / 1000))} seconds and try again.`,
    );
  }
  const run = await findRunByJoinCode(db, code);
  if (!run) {
    await countWrongCode(address, null);
    throw new HttpError(404, "unknown_code", "No open class run has that code. Check the code on the board and try again.");
  }
  return {
    runId: run.id,
    title: run.title,
    classGroup: run.classGroup,
    status: run.status,
    phase: run.phase as RunPhase,
    joinCode: run.joinCode,
  };
}
