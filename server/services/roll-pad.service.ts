import { assignedMatchup } from "@shared/class-results/assigned-matchups";
import { winnerSeatOf } from "@shared/class-results/virtual-class";
import type { EventError, PadRoll, PadRun, PadState, RollPayload } from "@shared/events";
import type { RunPhase } from "@shared/schemas/class-runs";
import { db } from "../db/client";
import {
  bumpBoardVersion,
  countGroups,
  findClassRun,
  findGroup,
  findGroupByJoinAttempt,
  findRunByJoinCode,
  findVote,
  groupRollsInTally,
  insertGroups,
  lockClassRun,
  markRollUndone,
  setGroupMatchup,
  upsertVote,
  type ClassRunRow,
  type NewRoll,
  type RunGroupRow,
} from "../db/queries/class-runs";
import { notifyRunChanged, onRunChanged } from "../run-notifier";
import { talliesOf } from "./class-runs.service";
import { signGuestToken, verifyGuestToken } from "./guest-token";
import { isUniqueViolation } from "./join-code";

const RECENT_ROLLS = 20;
// Rolls validate against cached run and group rows; every change made through this process clears them at once, and the
// batch re-reads each run's status under a share lock, so the TTL only bounds how stale a matchup change from elsewhere can be.
const CACHE_MILLISECONDS = 30_000;

/** A refusal the socket layer sends back as `{ ok: false, error }`. */
export class PadError extends Error {
  constructor(
    readonly code: EventError["code"],
    message: string,
    readonly retryAfterMs?: number,
  ) {
    super(message);
    this.name = "PadError";
  }
  toEventError(): EventError {
    return this.retryAfterMs === undefined
      ? { code: this.code, message: this.message }
      : { code: this.code, message: this.message, retryAfterMs: this.retryAfterMs };
  }
}

const runCache = new Map<string, { run: ClassRunRow; until: number }>();
const groupCache = new Map<string, { group: RunGroupRow; until: number }>();

onRunChanged((change) => {
  runCache.delete(change.runId);
  if (change.kind === "group" || change.kind === "removed") groupCache.delete(change.groupId);
  if (change.kind === "phase" || change.kind === "groups") {
    for (const [id, entry] of groupCache) if (entry.group.runId === change.runId) groupCache.delete(id);
  }
});

function freshFromCache<T>(cache: Map<string, { until: number } & T>, id: string, now: number): T | undefined {
  const hit = cache.get(id);
  return hit && hit.until > now ? hit : undefined;
}

async function cachedRun(runId: string): Promise<ClassRunRow | null> {
  const hit = freshFromCache(runCache, runId, Date.now());
  if (hit) return hit.run;
  const run = await findClassRun(db, runId);
  if (run) runCache.set(runId, { run, until: Date.now() + CACHE_MILLISECONDS });
  return run;
}

async function cachedGroup(groupId: string): Promise<RunGroupRow | null> {
  const hit = freshFromCache(groupCache, groupId, Date.now());
  if (hit) return hit.group;
  const group = await findGroup(db, groupId);
  if (group) groupCache.set(groupId, { group, until: Date.now() + CACHE_MILLISECONDS });
  return group;
}

type TokenOwner = { run: ClassRunRow; group: RunGroupRow };

function badToken(): PadError {
  return new PadError("bad_token", "This phone's group pass is not valid. Join the run again with the code on the board.");
}

function groupRemoved(): PadError {
  return new PadError("group_removed", "Your teacher has taken this group out of the run. Ask your teacher before joining again.");
}

function ownerOf(run: ClassRunRow | null, group: RunGroupRow | null): TokenOwner {
  if (!run || !group || group.runId !== run.id) {
    throw new PadError("bad_token", "This phone's group pass does not belong to an open class run. Join again with the code on the board.");
  }
  if (group.removedAt) throw groupRemoved();
  return { run, group };
}

/** The run and group a token names, both existing and belonging together. */
async function tokenOwner(token: string): Promise<TokenOwner> {
  const claims = verifyGuestToken(token);
  if (!claims) throw badToken();
  const [run, group] = await Promise.all([cachedRun(claims.runId), cachedGroup(claims.groupId)]);
  return ownerOf(run, group);
}

/** tokenOwner without waiting, when both rows are cached (as they are for every roll after a group's first); else undefined. */
function cachedTokenOwner(token: string): TokenOwner | undefined {
  const claims = verifyGuestToken(token);
  if (!claims) throw badToken();
  const now = Date.now();
  const run = freshFromCache(runCache, claims.runId, now);
  const group = freshFromCache(groupCache, claims.groupId, now);
  return run && group ? ownerOf(run.run, group.group) : undefined;
}

function padRun(run: ClassRunRow): PadRun {
  return {
    id: run.id,
    title: run.title,
    classGroup: run.classGroup,
    status: run.status,
    phase: run.phase as RunPhase,
    phases: run.phases as RunPhase[],
    tally: run.currentTally,
    tallies: talliesOf(run),
    dicePerPlayer: run.dicePerPlayer,
    players: run.players,
    tieRule: run.tieRule as PadRun["tieRule"],
    matchupChoice: run.matchupChoice,
    dice: run.dice,
  };
}

async function padState(run: ClassRunRow, group: RunGroupRow): Promise<PadState> {
  const [vote, rolls] = await Promise.all([findVote(db, group.id), groupRollsInTally(db, group.id, run.currentTally, RECENT_ROLLS)]);
  const recentRolls: PadRoll[] = rolls.recent.map((entry) => ({ ...entry, recordedAt: entry.recordedAt.toISOString() }));
  return {
    run: padRun(run),
    group: { id: group.id, nickname: group.nickname, matchup: group.matchup },
    vote,
    savedRolls: rolls.saved,
    recentRolls,
  };
}

function refuseClosed(run: ClassRunRow) {
  if (run.status === "closed") throw new PadError("run_closed", "This class run is closed: it takes no more rolls. Thank you for playing!");
}

/** The run that is not closed with this join code, or `unknown_code`. */
export async function runForJoinCode(code: string): Promise<ClassRunRow> {
  const found = await findRunByJoinCode(db, code);
  if (!found) throw new PadError("unknown_code", "No open class run has that code. Check the code on the board and try again.");
  return found;
}

/**
 * A group joins a run by its code with a new nickname; it gets a signed token and, where the teacher assigns, a
 * matchup. A join that repeats an earlier `attemptId` (the phone's retry after a lost acknowledgement) answers the
 * group that attempt made, whatever the lock, the cap or the nickname, so a retry never leaves a ghost group.
 */
export async function joinRun(runId: string, nickname: string, attemptId?: string): Promise<{ token: string; state: PadState }> {
  const { group, created } = await db.transaction(async (tx) => {
    // Locking the run keeps the group count (and so the cap and the next assigned matchup) right when groups join at once.
    const run = await lockClassRun(tx, runId);
    if (!run || run.status === "closed")
      throw new PadError("unknown_code", "No open class run has that code. Check the code on the board and try again.");
    if (attemptId) {
      const earlier = await findGroupByJoinAttempt(tx, run.id, attemptId);
      if (earlier?.removedAt) throw groupRemoved();
      if (earlier) return { group: earlier, created: false };
    }
    if (run.joiningLocked)
      throw new PadError(
        "joining_locked",
        "Your teacher has closed joining for this run. Ask your teacher, or join another group's phone.",
      );
    const groups = await countGroups(tx, run.id);
    if (groups.phones >= run.groupCap) {
      throw new PadError(
        "run_full",
        `This run already has ${run.groupCap} groups, the most your teacher allowed. Join another group's phone.`,
      );
    }
    const matchup = run.matchupChoice === "assigned" ? assignedMatchup(run.dice.length, run.players, groups.present) : null;
    try {
      const [inserted] = await insertGroups(tx, [{ runId: run.id, nickname, matchup, source: "phone", joinAttemptId: attemptId ?? null }]);
      await bumpBoardVersion(tx, run.id);
      return { group: inserted, created: true };
    } catch (error) {
      if (isUniqueViolation(error, "run_group_run_nickname_idx")) {
        throw new PadError("nickname_taken", `Another group in this run is already called “${nickname}”. Choose another nickname.`);
      }
      if (isUniqueViolation(error, "run_group_run_nickname_key_idx")) {
        throw new PadError(
          "nickname_taken",
          `“${nickname}” looks just like another group's nickname on the board. Choose one that looks different.`,
        );
      }
      throw error;
    }
  });
  if (created) notifyRunChanged({ runId: group.runId, kind: "groups" });
  const run = (await findClassRun(db, group.runId))!;
  return { token: signGuestToken({ runId: run.id, groupId: group.id }), state: await padState(run, group) };
}

/** A phone rejoins its group with the token it kept. */
export async function resumeGroup(token: string): Promise<PadState> {
  const claims = verifyGuestToken(token);
  if (!claims) throw new PadError("bad_token", "This phone's group pass is not valid. Join the run again with the code on the board.");
  const [run, group] = await Promise.all([findClassRun(db, claims.runId), findGroup(db, claims.groupId)]);
  if (!run || !group || group.runId !== run.id)
    throw new PadError("bad_token", "This phone's group pass does not belong to a class run any more. Join again.");
  if (group.removedAt) throw groupRemoved();
  return padState(run, group);
}

/** The group's Guess vote; only while the run is in its Guess phase. */
export async function castVote(token: string, dieIndex: number): Promise<{ runId: string; dieIndex: number }> {
  const { run, group } = await tokenOwner(token);
  refuseClosed(run);
  if (run.phase !== "Guess") throw new PadError("voting_closed", "Voting is over: the class has moved on from the Guess phase.");
  if (dieIndex >= run.dice.length) throw new PadError("invalid_input", `Vote for one of the ${run.dice.length} dice in the set.`);
  await db.transaction(async (tx) => {
    await upsertVote(tx, run.id, group.id, dieIndex);
    await bumpBoardVersion(tx, run.id);
  });
  notifyRunChanged({ runId: run.id, kind: "vote" });
  return { runId: run.id, dieIndex };
}

/** A group picks its own matchup, where the lesson lets groups choose. */
export async function chooseMatchup(token: string, matchup: number[]): Promise<{ runId: string; matchup: number[] }> {
  const { run, group } = await tokenOwner(token);
  refuseClosed(run);
  if (run.matchupChoice !== "group-choice") throw new PadError("matchup_assigned", "Your teacher assigns the matchups in this run.");
  if (matchup.length !== run.players)
    throw new PadError("wrong_mode", `Choose ${run.players} dice: this part of the run is played by ${run.players} players.`);
  if (matchup.some((index) => index >= run.dice.length))
    throw new PadError("invalid_input", `Choose among the ${run.dice.length} dice in the set.`);
  await db.transaction(async (tx) => {
    await setGroupMatchup(tx, group.id, matchup);
    await bumpBoardVersion(tx, run.id);
  });
  notifyRunChanged({ runId: run.id, kind: "group", groupId: group.id });
  return { runId: run.id, matchup };
}

const dieList = (faces: number[]) => faces.join(", ");

/**
 * Checks a roll against its run and group before it is written: the run open, the tally's mode, the group's matchup
 * in the current tally, and every face one the die actually has. Answers the row to insert.
 */
export async function checkedRoll(token: string, roll: RollPayload): Promise<NewRoll> {
  return rowForRoll(await tokenOwner(token), roll);
}

/**
 * checkedRoll at once, when the token's run and group are cached, so the busiest event costs no promise before the
 * batcher; undefined when they must be read first. Throws the same refusals.
 */
export function checkedRollFromCache(token: string, roll: RollPayload): NewRoll | undefined {
  const owner = cachedTokenOwner(token);
  return owner && rowForRoll(owner, roll);
}

/** The phases in which pupils record rolls; each takes rolls only in the run's current tally. */
export const ROLL_PHASES: readonly RunPhase[] = ["Roll", "Twist"];

function rowForRoll({ run, group }: TokenOwner, roll: RollPayload): NewRoll {
  refuseClosed(run);
  if (run.status === "paused") {
    throw new PadError(
      "run_paused",
      "Your teacher has paused the run. This roll is kept on the phone and sent when the run goes on.",
      3_000,
    );
  }
  if (!ROLL_PHASES.includes(run.phase as RunPhase) || roll.tally !== run.currentTally) {
    throw new PadError(
      "not_roll_phase",
      `The class is in the ${run.phase} phase, which takes no rolls for this game. The roll waits on the phone.`,
      3_000,
    );
  }
  if (run.rollCeilingReachedAt) throw rollCeilingReached();
  const tally = talliesOf(run).find((entry) => entry.tally === roll.tally);
  if (!tally) throw new PadError("wrong_mode", "This roll belongs to a part of the run that does not exist. Reload the page.");
  if (roll.matchup.length !== tally.players || roll.faces.length !== tally.players) {
    throw new PadError("wrong_mode", `This part of the run is played by ${tally.players} players; the roll has ${roll.faces.length}.`);
  }
  if (roll.matchup.some((index) => index >= run.dice.length))
    throw new PadError("bad_faces", `The set has ${run.dice.length} dice; this roll names another.`);
  if (roll.tally === run.currentTally) {
    if (!group.matchup)
      throw new PadError("no_matchup", "Your group has no matchup yet: choose one, or wait for your teacher to give you one.");
    if (group.matchup.length !== roll.matchup.length || group.matchup.some((dieIndex, seat) => dieIndex !== roll.matchup[seat])) {
      const names = group.matchup.map((index) => run.dice[index].name).join(" v ");
      throw new PadError("wrong_matchup", `Your group's matchup is ${names} now; this roll was for another. Record it again.`);
    }
  }
  roll.faces.forEach((seatFaces, seat) => {
    const die = run.dice[roll.matchup[seat]];
    if (seatFaces.length !== tally.dicePerPlayer) {
      throw new PadError(
        "wrong_mode",
        `Each player rolls ${tally.dicePerPlayer === 1 ? "one die" : "two dice"} here; ${die.name}'s player sent ${seatFaces.length}.`,
      );
    }
    const missing = seatFaces.find((face) => !die.faces.includes(face));
    if (missing !== undefined)
      throw new PadError("bad_faces", `${missing} is not a face of ${die.name}: its faces are ${dieList(die.faces)}.`);
  });
  const totals = roll.faces.map((seatFaces) => seatFaces.reduce((sum, face) => sum + face, 0));
  const now = Date.now();
  const recorded = Date.parse(roll.recordedAt);
  // A phone's clock may be off: keep its time unless it is before the run or in the future.
  const recordedAt = new Date(recorded < run.createdAt.getTime() || recorded > now + 60_000 ? now : recorded);
  return {
    id: roll.id,
    runId: run.id,
    groupId: group.id,
    tally: roll.tally,
    dicePerPlayer: tally.dicePerPlayer,
    matchup: roll.matchup,
    faces: roll.faces,
    totals,
    winnerSeat: winnerSeatOf(totals),
    source: "phone",
    recordedAt,
    ...(group.leftOutAt ? { leftOut: true } : {}),
  };
}

/** The refusal once a run has taken its roll ceiling of phone rolls. */
export function rollCeilingReached(): PadError {
  return new PadError(
    "run_roll_ceiling",
    "This run has taken all the rolls it can. Your teacher can see this on the board; thank you for playing!",
  );
}

/** Undoes one of the group's rolls: the row stays with undone_at, so a late resend of the same id stays undone. */
export async function undoRoll(token: string, rollId: string): Promise<{ runId: string; id: string }> {
  const { run, group } = await tokenOwner(token);
  refuseClosed(run);
  if (run.status === "paused")
    throw new PadError(
      "run_paused",
      "Your teacher has paused the run. The undo is kept on the phone and sent when the run goes on.",
      3_000,
    );
  const undone = await db.transaction(async (tx) => {
    const row = await markRollUndone(tx, group.id, rollId);
    if (row) await bumpBoardVersion(tx, run.id);
    return row;
  });
  if (!undone) throw new PadError("not_found", "That roll is not saved for your group, so there is nothing to undo.");
  notifyRunChanged({ runId: run.id, kind: "rolls" });
  return { runId: run.id, id: undone.id };
}
