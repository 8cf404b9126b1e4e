import { randomInt } from "node:crypto";
import { RollPool, type PoolableCounts, type PoolableRoll } from "@shared/class-results/pooled-results";
import { lessonPlanSchema } from "@shared/schemas/lessons";
import { setDiceSchema } from "@shared/schemas/dice-sets";
import type { TieRule } from "@shared/probability/index";
import { canonicalDiePositions, diceSetKey } from "@shared/results/dice-set-key";
import { classFindings, mainMatchup } from "@shared/results/class-findings";
import {
  resultsListQuerySchema,
  type DeletedRun,
  type PaperRunInput,
  type PaperRunLesson,
  type PooledAcrossRuns,
  type PooledQuery,
  type RecordedOn,
  type ResultsListQuery,
  type ResultsRunList,
  type ResultsRunSummary,
  type ResultsTally,
  type RunResults,
} from "@shared/schemas/results";
import { db } from "../db/client";
import { listPaperCounts } from "../db/queries/paper-counts";
import {
  countGuessVotes,
  deleteRunWithEverything,
  findOwnLessonWithSet,
  findRunWithCounts,
  insertPaperRun,
  listClosedRuns,
  listOwnLessonsWithSets,
  listRunGroups,
  streamRunRolls,
  type ArchiveViewer,
  type ResultsRunListRecord,
  type StreamedRoll,
} from "../db/queries/results";
import { HttpError } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";

const runNotFound = () => new HttpError(404, "not_found", "That class run was not found among the runs you can see.");

function isHeadOfRunDepartment(teacher: TeacherContext, run: { departmentId: string | null }): boolean {
  return teacher.role === "head" && teacher.department !== null && run.departmentId === teacher.department.id;
}

/** A run's owner may do everything with it; the head of its department may read it; anyone else is told it is not there. */
export function assertCanSeeRun(teacher: TeacherContext, run: { ownerId: string; departmentId: string | null }): void {
  if (run.ownerId !== teacher.user.id && !isHeadOfRunDepartment(teacher, run)) throw runNotFound();
}

/** Changes (Paper import, deletion) are the owner's alone; a head who can read the run is told so with 403. */
export function assertOwnsRun(teacher: TeacherContext, run: { ownerId: string; departmentId: string | null }, action: string): void {
  assertCanSeeRun(teacher, run);
  if (run.ownerId !== teacher.user.id) throw new HttpError(403, "forbidden", `Only the teacher who ran this class may ${action}.`);
}

/** The viewer for a scope: `department` is for the head of department only. */
function archiveViewer(teacher: TeacherContext, scope: "mine" | "department"): ArchiveViewer {
  if (scope === "department") {
    if (teacher.role !== "head" || !teacher.department) {
      throw new HttpError(403, "forbidden", "Only a head of department may see every teacher's runs in the department.");
    }
    return { userId: teacher.user.id, departmentId: teacher.department.id, wholeDepartment: true };
  }
  return { userId: teacher.user.id, departmentId: teacher.department?.id ?? null, wholeDepartment: false };
}

function recordedOn(record: ResultsRunListRecord): RecordedOn {
  const live = record.rollCount - record.paperRollCount;
  if (record.rollCount === 0) return "no rolls yet";
  if (record.paperRollCount === 0) return "phones";
  return live === 0 ? "paper" : "phones and paper";
}

/** A run as the archive lists it: labelled by its main mode (the first tally's), with a Twist as a second tally. */
export function runSummary(record: ResultsRunListRecord, viewerId: string): ResultsRunSummary {
  const [main, twist] = runTallies(record);
  return {
    id: record.id,
    title: record.title,
    lessonId: record.lessonId,
    classGroup: record.classGroup,
    diceSetName: record.diceSetName,
    setKey: diceSetKey(record.dice),
    dieNames: record.dice.map((die) => die.name),
    dicePerPlayer: main.dicePerPlayer,
    players: main.players,
    twist: twist ?? null,
    tieRule: record.tieRule,
    taughtAt: record.createdAt.toISOString(),
    closedAt: record.closedAt?.toISOString() ?? null,
    rollCount: record.rollCount,
    simulatedRollCount: record.simulatedRollCount,
    paperRollCount: record.paperRollCount,
    countedRollCount: record.countedRollCount,
    groupCount: record.groupCount,
    recordedOn: recordedOn(record),
    ownerName: record.ownerName,
    isOwner: record.ownerId === viewerId,
  };
}

/** The Results archive: the teacher's closed runs, or (for the head) the department's. */
export async function listResultsRuns(teacher: TeacherContext, query: ResultsListQuery): Promise<ResultsRunList> {
  const rows = await listClosedRuns(db, archiveViewer(teacher, query.scope), query);
  return { runs: rows.map((row) => runSummary(row, teacher.user.id)) };
}

/** The tallies of a run and their modes; runs stored before tallies were kept have one, in the run's own mode. */
export function runTallies(run: Pick<ResultsRunListRecord, "tallies" | "dicePerPlayer" | "players">): ResultsTally[] {
  if (run.tallies.length > 0) return run.tallies.map(({ tally, dicePerPlayer, players }) => ({ tally, dicePerPlayer, players }));
  return [{ tally: 1, dicePerPlayer: run.dicePerPlayer, players: run.players }];
}

/** A run's main mode: its first tally's (a Twist changes the run's current mode, never its main one). */
export function mainMode(run: Pick<ResultsRunListRecord, "tallies" | "dicePerPlayer" | "players">): ResultsTally {
  return runTallies(run)[0];
}

/** A run the teacher may read, with its counts; 404 otherwise. */
export async function visibleRun(teacher: TeacherContext, runId: string): Promise<ResultsRunListRecord> {
  const run = await findRunWithCounts(db, runId);
  if (!run) throw runNotFound();
  assertCanSeeRun(teacher, run);
  return run;
}

/** A streamed roll as a RollPool takes it; `mapMatchup` re-indexes dice for pooling across runs. */
export function poolableRoll(
  stored: StreamedRoll,
  nicknames: Map<string, string>,
  mapMatchup?: (matchup: number[]) => number[],
): PoolableRoll {
  return {
    groupId: stored.groupId,
    groupNickname: nicknames.get(stored.groupId),
    tally: stored.tally,
    dicePerPlayer: stored.dicePerPlayer,
    matchup: mapMatchup ? mapMatchup(stored.matchup) : stored.matchup,
    totals: stored.totals,
    winnerSeat: stored.winnerSeat,
    source: stored.source,
    recordedAt: stored.recordedAt.toISOString(),
  };
}

/**
 * Streams a run's rolls that count (undone rolls never) from the cursor into `pools`, keeping no roll once it is
 * counted; answers how many rolls each group has among them.
 */
export async function poolRunRolls(
  runId: string,
  pools: RollPool[],
  options: {
    includeSimulated: boolean;
    includeLeftOut?: boolean;
    nicknames: Map<string, string>;
    dicePerPlayer?: number;
    players?: number;
    mapMatchup?: (matchup: number[]) => number[];
    /** A pool per tally number: each roll is also counted into its own tally's pool. */
    byTally?: Map<number, RollPool>;
  },
): Promise<Map<string, number>> {
  const perGroup = new Map<string, number>();
  for await (const batch of streamRunRolls(runId, { includeSimulated: options.includeSimulated, includeLeftOut: options.includeLeftOut })) {
    for (const stored of batch) {
      if (options.dicePerPlayer !== undefined && stored.dicePerPlayer !== options.dicePerPlayer) continue;
      if (options.players !== undefined && stored.matchup.length !== options.players) continue;
      const entry = poolableRoll(stored, options.nicknames, options.mapMatchup);
      for (const pool of pools) pool.addOne(entry);
      options.byTally?.get(stored.tally)?.addOne(entry);
      perGroup.set(stored.groupId, (perGroup.get(stored.groupId) ?? 0) + 1);
    }
  }
  await poolRunCounts(runId, pools, options, perGroup);
  return perGroup;
}

/**
 * Adds a run's tally-grid counts to `pools` (they are paper, never simulated): into every count, frequency, interval
 * and test, never into a convergence series; adds each group's counted rolls to `perGroup`.
 */
export async function poolRunCounts(
  runId: string,
  pools: RollPool[],
  options: {
    nicknames: Map<string, string>;
    includeLeftOut?: boolean;
    dicePerPlayer?: number;
    mapMatchup?: (matchup: number[]) => number[];
  },
  perGroup = new Map<string, number>(),
): Promise<Map<string, number>> {
  for (const row of await listPaperCounts(db, runId, { includeLeftOut: options.includeLeftOut })) {
    if (options.dicePerPlayer !== undefined && row.dicePerPlayer !== options.dicePerPlayer) continue;
    const entry: PoolableCounts = {
      groupId: row.groupId,
      groupNickname: options.nicknames.get(row.groupId),
      tally: row.tally,
      dicePerPlayer: row.dicePerPlayer,
      matchup: options.mapMatchup ? options.mapMatchup(row.matchup) : row.matchup,
      firstWins: row.firstWins,
      ties: row.ties,
      secondWins: row.secondWins,
      source: "paper",
    };
    for (const pool of pools) pool.addCounts(entry);
    perGroup.set(row.groupId, (perGroup.get(row.groupId) ?? 0) + row.firstWins + row.ties + row.secondWins);
  }
  return perGroup;
}

/** A run's results page: pooled figures, convergence, per-group table, Guess votes and findings, from stored rolls. */
export async function getRunResults(
  teacher: TeacherContext,
  runId: string,
  includeSimulated: boolean,
  includeLeftOut = false,
): Promise<RunResults> {
  const run = await visibleRun(teacher, runId);
  const groups = await listRunGroups(db, runId);
  const nicknames = new Map(groups.map((group) => [group.id, group.nickname]));
  const pool = new RollPool(run.dice, run.tieRule as TieRule);
  const tallies = runTallies(run);
  const byTally = new Map(tallies.map((tally) => [tally.tally, new RollPool(run.dice, run.tieRule as TieRule)]));
  const rollsPerGroup = await poolRunRolls(runId, [pool], { includeSimulated, includeLeftOut, nicknames, byTally });
  const pooled = pool.result();
  const pooledByTally = tallies.map((tally) => ({ tally, pooled: byTally.get(tally.tally)!.result() }));
  // The report's main matchup and findings come from the main tally; a Twist is reported beside it, not in its place.
  const mainPooled = pooledByTally[0].pooled;
  const votes = await countGuessVotes(db, runId);
  const dieNames = run.dice.map((die) => die.name);
  return {
    run: { ...runSummary(run, teacher.user.id), status: run.status, phases: run.phases, dice: run.dice, tallies },
    includeSimulated,
    pooled,
    tallies: pooledByTally,
    mainMatchupKey: mainMatchup(mainPooled)?.key ?? null,
    groups: groups.map((group) => ({
      id: group.id,
      nickname: group.nickname,
      source: group.source,
      rolls: rollsPerGroup.get(group.id) ?? 0,
      leftOut: group.leftOutAt !== null,
    })),
    guessVotes: dieNames.map((dieName, dieIndex) => ({
      dieIndex,
      dieName,
      votes: votes.find((vote) => vote.dieIndex === dieIndex)?.votes ?? 0,
    })),
    findings: classFindings(mainPooled, dieNames),
  };
}

/** Deletes a closed run the teacher owns, with its rolls, groups, votes and Paper imports, in one transaction. */
export async function deleteResultsRun(teacher: TeacherContext, runId: string): Promise<DeletedRun> {
  const run = await visibleRun(teacher, runId);
  assertOwnsRun(teacher, run, "delete it");
  if (run.status !== "closed") {
    throw new HttpError(409, "run_not_closed", "This class run is still going; close it on the Run board before deleting it.");
  }
  const deleted = await deleteRunWithEverything(db, runId);
  if (!deleted.deletedRun) throw runNotFound();
  return { id: runId, rolls: deleted.rolls, groups: deleted.groups, votes: deleted.votes, imports: deleted.imports };
}

/**
 * Pools several closed runs of the same set (equal `diceSetKey`: the same dice faces, whatever their names or order),
 * the same number of players and tie rule, keeping rolls with `dicePerPlayer` dice each. Each run's die indexes are
 * mapped onto the oldest run's dice; a teacher pools their own runs, the head any run of the department.
 */
export async function pooledAcrossRuns(
  teacher: TeacherContext,
  query: PooledQuery & { includeSimulated: boolean },
): Promise<PooledAcrossRuns> {
  const viewer = archiveViewer(teacher, query.scope);
  const visible = await listClosedRuns(db, viewer, resultsListQuerySchema.parse({ sort: "date", order: "asc" }));
  let chosen: ResultsRunListRecord[];
  if (query.runIds) {
    const byId = new Map(visible.map((run) => [run.id, run]));
    chosen = [...new Set(query.runIds)].map((id) => {
      const run = byId.get(id);
      if (!run) throw new HttpError(404, "not_found", `Run ${id} is not among the closed runs you can pool.`);
      return run;
    });
    chosen.sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id.localeCompare(b.id));
  } else {
    const ofSet = visible.filter((run) => diceSetKey(run.dice) === query.setKey);
    if (ofSet.length === 0) throw new HttpError(404, "not_found", "None of the closed runs you can see used that set.");
    // With only a set named, pool the runs that share the newest run's main number of players and tie rule.
    const newest = ofSet[ofSet.length - 1];
    chosen = ofSet.filter((run) => mainMode(run).players === mainMode(newest).players && run.tieRule === newest.tieRule);
  }
  const [reference] = chosen;
  const setKey = diceSetKey(reference.dice);
  for (const run of chosen) {
    if (query.setKey && diceSetKey(run.dice) !== query.setKey)
      throw new HttpError(400, "not_same_set", `“${run.title}” (${run.classGroup || "no class"}) used a different set.`);
    if (diceSetKey(run.dice) !== setKey) {
      throw new HttpError(
        400,
        "not_same_set",
        `“${run.title}” (${run.classGroup || "no class"}) used different dice from “${reference.title}”; only runs of the same set can be pooled.`,
      );
    }
    if (mainMode(run).players !== mainMode(reference).players) {
      throw new HttpError(
        400,
        "not_same_mode",
        `“${run.title}” was played with ${mainMode(run).players} players and “${reference.title}” with ${mainMode(reference).players}; pool runs of one mode.`,
      );
    }
    if (run.tieRule !== reference.tieRule) {
      throw new HttpError(
        400,
        "not_same_tie_rule",
        `“${run.title}” and “${reference.title}” used different tie rules; pool runs with the same tie rule.`,
      );
    }
  }
  const referencePositions = canonicalDiePositions(reference.dice);
  const referenceIndexAt = new Map(referencePositions.map((position, index) => [position, index]));
  const tieRule = reference.tieRule as TieRule;
  const everyRun = new RollPool(reference.dice, tieRule);
  const contributions: PooledAcrossRuns["contributions"] = [];
  for (const run of chosen) {
    const positions = canonicalDiePositions(run.dice);
    const groups = await listRunGroups(db, run.id);
    const nicknames = new Map(groups.map((group) => [group.id, `${group.nickname} (${run.classGroup || run.title})`]));
    const ownPool = new RollPool(reference.dice, tieRule);
    await poolRunRolls(run.id, [ownPool, everyRun], {
      includeSimulated: query.includeSimulated,
      nicknames,
      dicePerPlayer: query.dicePerPlayer,
      players: mainMode(reference).players,
      mapMatchup: (matchup) => matchup.map((index) => referenceIndexAt.get(positions[index])!),
    });
    const own = ownPool.result();
    contributions.push({
      run: runSummary(run, teacher.user.id),
      matchups: own.matchups.map((entry) => ({
        key: entry.key,
        rolls: entry.rolls,
        firstSeatWins: entry.seats[0].wins,
        ties: entry.seats[0].ties,
        frequencyUnderTieRule: entry.frequencyUnderTieRule,
      })),
    });
  }
  const candidates = visible
    .filter(
      (run) =>
        diceSetKey(run.dice) === setKey && mainMode(run).players === mainMode(reference).players && run.tieRule === reference.tieRule,
    )
    .map((run) => runSummary(run, teacher.user.id));
  return {
    setKey,
    dicePerPlayer: query.dicePerPlayer,
    players: mainMode(reference).players,
    tieRule,
    dice: reference.dice,
    pooled: everyRun.result(),
    contributions,
    candidates,
  };
}

/** Why a lesson cannot start a paper run, or null when it can. */
function paperRunProblem(lesson: { plan: unknown; dice: unknown }): string | null {
  if (lesson.dice === null) return "The lesson has no dice set yet; choose one in Lessons first.";
  if (!setDiceSchema.safeParse(lesson.dice).success)
    return "The lesson's dice set is not valid; open it on the Dice bench and save it again.";
  if (!lessonPlanSchema.safeParse(lesson.plan).success) return "The lesson plan is incomplete; open it in Lessons and save it again.";
  return null;
}

/** The teacher's lessons, each saying whether a paper run can be made from it. */
export async function listPaperRunLessons(teacher: TeacherContext): Promise<{ lessons: PaperRunLesson[] }> {
  const lessons = await listOwnLessonsWithSets(db, teacher.user.id);
  return {
    lessons: lessons.map((lesson) => {
      const reason = paperRunProblem(lesson);
      return {
        id: lesson.id,
        title: lesson.title,
        classGroup: lesson.classGroup,
        diceSetName: lesson.diceSetName,
        ready: reason === null,
        reason,
      };
    }),
  };
}

/** A join code for a closed paper run; closed runs are outside the open-run uniqueness index, so no retry is needed. */
function paperJoinCode(): string {
  const letters = "ABCDEFGHJKLMNPQRSTUVWXYZ23456789";
  return Array.from({ length: 6 }, () => letters[randomInt(letters.length)]).join("");
}

/**
 * Makes a closed class run from one of the teacher's lessons, to hold rolls recorded on paper: it copies the lesson's
 * dice, mode, tie rule and phases, as a live run does when it opens.
 */
export async function createPaperRun(teacher: TeacherContext, input: PaperRunInput): Promise<ResultsRunSummary> {
  const lesson = await findOwnLessonWithSet(db, teacher.user.id, input.lessonId);
  if (!lesson) throw new HttpError(404, "not_found", "That lesson was not found among your lessons.");
  const problem = paperRunProblem(lesson);
  if (problem) throw new HttpError(409, "lesson_not_ready", problem);
  const plan = lessonPlanSchema.parse(lesson.plan);
  const dice = setDiceSchema.parse(lesson.dice);
  const taughtAt = input.taughtOn ? new Date(`${input.taughtOn}T12:00:00Z`) : new Date();
  const run = await insertPaperRun(db, {
    ownerId: teacher.user.id,
    departmentId: teacher.department?.id ?? lesson.departmentId,
    lessonId: lesson.id,
    title: lesson.title,
    classGroup: input.classGroup || lesson.classGroup,
    diceSetName: lesson.diceSetName ?? "Dice set",
    dice,
    dicePerPlayer: plan.mode.dicePerPlayer,
    players: plan.mode.players,
    tieRule: plan.tieRule,
    matchupChoice: plan.matchupChoice,
    phases: plan.phases.filter((phase) => phase.included).map((phase) => phase.phase),
    joinCode: paperJoinCode(),
    taughtAt,
  });
  const record = await findRunWithCounts(db, run.id);
  return runSummary(record!, teacher.user.id);
}
