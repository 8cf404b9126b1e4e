import type { IncomingHttpHeaders } from "node:http";
import { fromNodeHeaders } from "better-auth/node";
import type { Server, Socket } from "socket.io";
import type { z } from "zod";
import {
  boardSnapshotPayloadSchema,
  EVENTS,
  groupJoinPayloadSchema,
  groupResumePayloadSchema,
  matchupChoosePayloadSchema,
  payloadProblem,
  rollRecordPayloadSchema,
  rollUndoPayloadSchema,
  voteCastPayloadSchema,
  type Ack,
  type EventError,
  type GroupRemovedBroadcast,
  type GroupUpdateBroadcast,
  type RunPhaseBroadcast,
  type RunStatusBroadcast,
} from "@shared/events";
import { hasNulCharacter, NUL_CHARACTER_MESSAGE } from "@shared/schemas/nul-character";
import { auth } from "../auth";
import {
  closeIdleRuns,
  countPhoneRolls,
  findClassRun,
  markGroupFlooded,
  markRollCeilingReached,
  writeRollBatch,
  type NewRoll,
  type RollWriteOutcome,
} from "../db/queries/class-runs";
import { db } from "../db/client";
import { findMembershipForUser } from "../db/queries/memberships";
import { env } from "../env";
import { HttpError } from "../http-error";
import { logger } from "../logger";
import { isUnstorableText } from "../db/postgres-errors";
import type { TeacherContext } from "../middleware/require-teacher";
import { readBoardSnapshot, runForTeacher } from "../services/class-runs.service";
import {
  castVote,
  checkedRoll,
  checkedRollFromCache,
  chooseMatchup,
  joinRun,
  PadError,
  resumeGroup,
  rollCeilingReached,
  runForJoinCode,
  undoRoll,
} from "../services/roll-pad.service";
import { verifyGuestToken } from "../services/guest-token";
import { BoardBroadcaster, boardRoom } from "./board-broadcaster";
import { RollBatcher } from "./roll-batcher";
import { codeGuessingWait, countWrongCode, joinWait, rollsPerConnection, runRollCeiling } from "../limits/room-limits";
import { RollAllowance } from "../limits/roll-allowance";
import { sharedLimiter } from "../limits/shared-limiter";
import { batcherQueueDepth, connectedPhones, rollAckSeconds, rollBatchFailures, rollsAcknowledged } from "../metrics";
import { notifyRunChanged, onRunChanged, type RunChange } from "../run-notifier";

export const padsRoom = (runId: string) => `pads:${runId}`;

/** Server-to-server events over the PostgreSQL adapter (io.serverSideEmit): other processes' changes and committed rolls. */
const RUN_CHANGED_ELSEWHERE = "run:changed-elsewhere";
const RUN_ROLLS_ELSEWHERE = "run:rolls-elsewhere";
/** How often at most a process tells the others that rolls were committed to one run. */
const ROLLS_NOTICE_MS = 250;

/** Changes this process received from another one: they refresh boards and caches here but are not broadcast again. */
const remoteChanges = new WeakSet<RunChange>();

const outcomeErrors: Partial<Record<RollWriteOutcome, EventError>> = {
  run_closed: { code: "run_closed", message: "This class run is closed: it takes no more rolls. Thank you for playing!" },
  run_paused: {
    code: "run_paused",
    message: "Your teacher has paused the run. This roll is kept on the phone and sent when the run goes on.",
    retryAfterMs: 3_000,
  },
  id_taken: { code: "id_taken", message: "Another roll already has this roll's id. Record the roll again." },
};

type Acknowledge<T extends object> = (answer: Ack<T>) => void;

/** The run an event is about, for the logs: from a pupil's signed token or a board's runId. */
function runIdOf(payload: unknown): string | undefined {
  if (!payload || typeof payload !== "object") return undefined;
  const fields = payload as { token?: unknown; runId?: unknown };
  if (typeof fields.runId === "string") return fields.runId;
  return typeof fields.token === "string" ? verifyGuestToken(fields.token)?.runId : undefined;
}

/** The `{ ok: false, error }` answer for anything a handler threw. */
function refusalFor(error: unknown, payload?: unknown): EventError {
  if (error instanceof PadError) return error.toEventError();
  // Text PostgreSQL cannot store is refused for good (invalid_input is not retryable), so the phone stops resending it.
  if (isUnstorableText(error)) return { code: "invalid_input", message: NUL_CHARACTER_MESSAGE };
  if (error instanceof HttpError) {
    const code = error.status === 401 ? "unauthenticated" : error.status === 404 ? "not_found" : "forbidden";
    return { code, message: error.message };
  }
  logger.error({ err: error, runId: runIdOf(payload) }, "class run event failed");
  return { code: "server_error", message: "The server could not save this just now; the phone will try again." };
}

/**
 * Wraps a handler: checks the payload with its zod schema, answers every refusal as `{ ok: false, error }`, never throws.
 * A handler may return its answer itself or a promise of it; roll:record makes no promise of its own before the batcher's.
 */
function handle<S extends z.ZodType, T extends object>(schema: S, run: (payload: z.infer<S>) => T | Promise<T>) {
  return (payload: unknown, acknowledge?: unknown) => {
    if (typeof acknowledge !== "function") return;
    const answer = acknowledge as Acknowledge<T>;
    if (hasNulCharacter(payload)) {
      answer({ ok: false, error: { code: "invalid_input", message: NUL_CHARACTER_MESSAGE } });
      return;
    }
    const parsed = schema.safeParse(payload);
    if (!parsed.success) {
      answer({ ok: false, error: { code: "invalid_input", message: payloadProblem(parsed.error) } });
      return;
    }
    try {
      const result = run(parsed.data);
      if (result instanceof Promise) {
        result.then(
          (settled: T) => answer({ ok: true, ...settled }),
          (error: unknown) => answer({ ok: false, error: refusalFor(error, payload) }),
        );
      } else answer({ ok: true, ...result });
    } catch (error) {
      answer({ ok: false, error: refusalFor(error, payload) });
    }
  };
}

/** The signed-in teacher behind a socket's handshake cookies, or null. */
async function teacherFromHeaders(headers: IncomingHttpHeaders): Promise<TeacherContext | null> {
  const current = await auth.api.getSession({ headers: fromNodeHeaders(headers) });
  if (!current) return null;
  const membership = await findMembershipForUser(current.user.id);
  return {
    user: { id: current.user.id, name: current.user.name, email: current.user.email },
    department: membership ? { id: membership.departmentId, name: membership.departmentName } : null,
    role: membership?.role ?? null,
  };
}

/** Each socket.io server's "write every queued roll now" (graceful shutdown calls it before closing connections). */
const drainers = new WeakMap<Server, () => Promise<void>>();

/** Writes every roll the server has queued and waits for the batches to commit (acknowledgements then go out). */
export async function drainRolls(io: Server): Promise<void> {
  await drainers.get(io)?.();
}

/** The address a socket connected from, as the app's "trust proxy" rule (TRUST_PROXY) reads it (see http-server.ts). */
export function socketAddress(socket: Socket): string {
  return typeof socket.data.address === "string" ? socket.data.address : socket.handshake.address;
}

/** `rate_limited` with the wait, in words and in `retryAfterMs`. */
function waitRefusal(retryAfterMs: number, what: string): PadError {
  const seconds = Math.max(1, Math.ceil(retryAfterMs / 1000));
  return new PadError("rate_limited", `${what} Wait ${seconds} second${seconds === 1 ? "" : "s"} and try again.`, retryAfterMs);
}

const FLOOD_FLAG_MS = 60_000;
const recentlyFlagged = new Map<string, number>();

/** Raises a group's flood flag on the board, at most once a minute per group from this process. */
function flagFlood(runId: string, groupId: string) {
  const now = Date.now();
  if ((recentlyFlagged.get(groupId) ?? 0) > now) return;
  recentlyFlagged.set(groupId, now + FLOOD_FLAG_MS);
  if (recentlyFlagged.size > 10_000) for (const [id, until] of recentlyFlagged) if (until <= now) recentlyFlagged.delete(id);
  markGroupFlooded(db, groupId).then(
    (changed) => changed && notifyRunChanged({ runId, kind: "groups" }),
    (error: unknown) => logger.warn({ err: error }, "could not raise a flood flag"),
  );
}

/** Counts a run's stored phone rolls from the database the first time this process sees it (the roll ceiling). */
function startCountingRolls(runId: string) {
  if (runRollCeiling.knows(runId)) return;
  runRollCeiling.start(runId, 0);
  countPhoneRolls(db, runId).then(
    (stored) => {
      if (runRollCeiling.add(runId, stored)) ceilingReached(runId);
    },
    (error: unknown) => logger.warn({ err: error }, "could not count a run's rolls"),
  );
}

function ceilingReached(runId: string) {
  markRollCeilingReached(db, runId).then(
    (changed) => changed && notifyRunChanged({ runId, kind: "run" }),
    (error: unknown) => logger.warn({ err: error }, "could not mark a run's roll ceiling"),
  );
}

/** Closes runs left idle for RUN_IDLE_CLOSE_MINUTES; several processes may sweep at once (one idempotent UPDATE). */
export async function sweepIdleRuns(idleMinutes = env.RUN_IDLE_CLOSE_MINUTES): Promise<string[]> {
  if (idleMinutes <= 0) return [];
  const closed = await closeIdleRuns(db, idleMinutes);
  for (const runId of closed) notifyRunChanged({ runId, kind: "status" });
  if (closed.length > 0) logger.info({ runs: closed.length }, "closed idle class runs");
  return closed;
}

/**
 * Class run events on the shared socket.io server: pupils' groups join, vote and record rolls with their signed token;
 * rolls go through the batcher and are acknowledged after commit; Run boards get a snapshot, then throttled updates.
 */
export function registerClassRunEvents(io: Server) {
  // A group's rolls are counted in PostgreSQL, so a group whose phones use two processes still gets one limit:
  // ROLL_BURST_PER_GROUP rolls per window of burst / rate seconds, leased a twelfth of the burst at a time (5 of the
  // default 60; see roll-allowance.ts), so at most one roll in five waits for the database.
  const allowance = new RollAllowance(
    sharedLimiter({
      keyPrefix: "group-rolls",
      points: env.ROLL_BURST_PER_GROUP,
      duration: Math.max(1, Math.round(env.ROLL_BURST_PER_GROUP / env.ROLL_RATE_PER_GROUP)),
    }),
    Math.max(1, Math.ceil(env.ROLL_BURST_PER_GROUP / 12)),
  );
  const broadcaster = new BoardBroadcaster(io, env.BOARD_UPDATE_MS);
  const lastRollsNotice = new Map<string, number>();
  const pendingRollsNotice = new Map<string, NodeJS.Timeout>();
  /** Tells the other processes that rolls were committed to a run, at most once per ROLLS_NOTICE_MS per run. */
  const announceRolls = (runId: string) => {
    if (pendingRollsNotice.has(runId)) return;
    const wait = Math.max(0, (lastRollsNotice.get(runId) ?? 0) + ROLLS_NOTICE_MS - Date.now());
    const timer = setTimeout(() => {
      pendingRollsNotice.delete(runId);
      lastRollsNotice.set(runId, Date.now());
      if (lastRollsNotice.size > 5_000) lastRollsNotice.clear();
      io.serverSideEmit(RUN_ROLLS_ELSEWHERE, runId);
    }, wait);
    pendingRollsNotice.set(runId, timer);
  };
  const batcher = new RollBatcher((rolls) => writeRollBatch(db, rolls), {
    windowMs: env.ROLL_BATCH_MS,
    maxBatch: 500,
    concurrency: 3,
    retryDelayMs: 500,
    onWriteFailed: (error, attempt, rolls) => {
      rollBatchFailures.inc();
      logger.warn(
        { err: error, attempt, runIds: [...new Set(rolls.map((entry) => entry.runId))] },
        attempt === 1 ? "a roll batch failed; trying it once more" : "a roll batch failed twice; phones will send its rolls again",
      );
    },
    onWritten: (rolls, outcomes) => {
      const stored = new Map<string, NewRoll[]>();
      const phoneRolls = new Map<string, number>();
      for (const entry of rolls) {
        const outcome = outcomes.get(entry.id);
        // A duplicate here may be a roll whose first write committed before its answer was lost: read that run afresh.
        if (outcome === "duplicate") broadcaster.markDirty(entry.runId);
        if (outcome !== "stored") continue;
        if (entry.source === "phone") phoneRolls.set(entry.runId, (phoneRolls.get(entry.runId) ?? 0) + 1);
        // A left-out group's rolls are stored but kept out of the board's figures.
        if (entry.leftOut) continue;
        const ofRun = stored.get(entry.runId);
        if (ofRun) ofRun.push(entry);
        else stored.set(entry.runId, [entry]);
      }
      for (const [runId, ofRun] of stored) {
        broadcaster.addRolls(runId, ofRun);
        announceRolls(runId);
      }
      for (const [runId, count] of phoneRolls) if (runRollCeiling.add(runId, count)) ceilingReached(runId);
    },
  });
  const depthTimer = setInterval(() => batcherQueueDepth.set(batcher.depth()), 1_000);
  depthTimer.unref();

  /** Queues a checked roll for the next batch; settles once that batch has committed. */
  const writeRoll = (row: NewRoll) =>
    batcher.submit(row).then((outcome) => {
      const refusal = outcomeErrors[outcome];
      if (refusal) throw new PadError(refusal.code, refusal.message, refusal.retryAfterMs);
      rollsAcknowledged.inc({ outcome });
      return { id: row.id, duplicate: outcome === "duplicate" };
    });

  // Another process committed rolls to a run: a board watching it here reads it in full at its next refresh.
  io.on(RUN_ROLLS_ELSEWHERE, (runId: unknown) => {
    if (typeof runId === "string") broadcaster.markDirty(runId);
  });
  // Another process changed a run (status, phase, groups, an undo…): clear this process's caches and refresh its boards.
  io.on(RUN_CHANGED_ELSEWHERE, (change: RunChange) => {
    if (!change || typeof change.runId !== "string") return;
    remoteChanges.add(change);
    notifyRunChanged(change);
  });

  const stopListening = onRunChanged(async (change) => {
    broadcaster.markDirty(change.runId);
    // Pads and boards on every process hear a change once: from the process where it happened, through the adapter.
    if (remoteChanges.has(change)) return;
    io.serverSideEmit(RUN_CHANGED_ELSEWHERE, change);
    if (change.kind === "group") {
      const message: GroupUpdateBroadcast = { runId: change.runId, groupId: change.groupId };
      io.to(padsRoom(change.runId)).emit(EVENTS.groupUpdate, message);
    }
    if (change.kind === "removed") {
      const message: GroupRemovedBroadcast = { runId: change.runId, groupId: change.groupId };
      io.to(padsRoom(change.runId)).emit(EVENTS.groupRemoved, message);
    }
    if (change.kind !== "status" && change.kind !== "phase") return;
    const run = await findClassRun(db, change.runId).catch(() => null);
    if (!run) return;
    if (change.kind === "status") {
      const message: RunStatusBroadcast = { runId: run.id, status: run.status };
      io.to([padsRoom(run.id), boardRoom(run.id)]).emit(EVENTS.runStatus, message);
    } else {
      const message: RunPhaseBroadcast = {
        runId: run.id,
        phase: run.phase as RunPhaseBroadcast["phase"],
        tally: run.currentTally,
        dicePerPlayer: run.dicePerPlayer,
        players: run.players,
      };
      io.to([padsRoom(run.id), boardRoom(run.id)]).emit(EVENTS.runPhase, message);
    }
  });
  const idleSweep = setInterval(() => {
    sweepIdleRuns().catch((error: unknown) => logger.warn({ err: error }, "the idle run sweep failed"));
  }, env.RUN_IDLE_SWEEP_SECONDS * 1000);
  idleSweep.unref();
  // Tests start and stop many servers in one process; each stops listening when its HTTP server closes.
  io.httpServer?.once("close", () => {
    stopListening();
    broadcaster.close();
    clearInterval(idleSweep);
    clearInterval(depthTimer);
    for (const timer of pendingRollsNotice.values()) clearTimeout(timer);
  });
  // Rolls still being checked (a group's first roll reads the database, a lease may be taken) reach the batcher later.
  let rollsBeforeBatcher = 0;
  drainers.set(io, async () => {
    for (;;) {
      await batcher.drain();
      if (rollsBeforeBatcher === 0 && batcher.depth() === 0) break;
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
    // Let every acknowledgement callback run before the connections close.
    await new Promise((resolve) => setImmediate(resolve));
  });

  io.on("connection", (socket: Socket) => {
    connectedPhones.inc();
    socket.once("disconnect", () => connectedPhones.dec());
    const joinPads = (runId: string) => void socket.join(padsRoom(runId));

    const address = socketAddress(socket);

    socket.on(
      EVENTS.groupJoin,
      handle(groupJoinPayloadSchema, async ({ code, nickname, attemptId }) => {
        const guessingWait = await codeGuessingWait(address, socket.id);
        if (guessingWait !== null) throw waitRefusal(guessingWait, "Too many wrong join codes from here.");
        const run = await runForJoinCode(code).catch(async (error: unknown) => {
          if (error instanceof PadError && error.code === "unknown_code") await countWrongCode(address, socket.id);
          throw error;
        });
        const busy = await joinWait(socket.id, run.id);
        if (busy)
          throw waitRefusal(
            busy.waitMs,
            busy.busy === "connection" ? "This phone is joining too often." : "Groups are joining this run very fast.",
          );
        const joined = await joinRun(run.id, nickname, attemptId);
        joinPads(joined.state.run.id);
        return joined;
      }),
    );

    socket.on(
      EVENTS.groupResume,
      handle(groupResumePayloadSchema, async ({ token }) => {
        const state = await resumeGroup(token);
        joinPads(state.run.id);
        return { state };
      }),
    );

    socket.on(
      EVENTS.voteCast,
      handle(voteCastPayloadSchema, async ({ token, dieIndex }) => ({ dieIndex: (await castVote(token, dieIndex)).dieIndex })),
    );

    socket.on(
      EVENTS.matchupChoose,
      handle(matchupChoosePayloadSchema, async ({ token, matchup }) => ({ matchup: (await chooseMatchup(token, matchup)).matchup })),
    );

    socket.on(
      EVENTS.rollRecord,
      handle(rollRecordPayloadSchema, ({ token, roll }) => {
        const arrived = performance.now();
        const timed = <T>(answer: Promise<T>) => {
          answer.then(
            () => rollAckSeconds.observe((performance.now() - arrived) / 1000),
            () => undefined,
          );
          return answer;
        };
        const claims = verifyGuestToken(token);
        const refuse = (retryAfterMs: number): never => {
          if (claims) flagFlood(claims.runId, claims.groupId);
          throw new PadError(
            "rate_limited",
            "Rolls are coming in faster than a group can play. Wait a moment; the phone sends them again.",
            retryAfterMs,
          );
        };
        const record = () => {
          // Only a group's first roll (or one after a change to its run) waits for the database before the batcher.
          const row = checkedRollFromCache(token, roll);
          if (row) return timed(writeRoll(row));
          rollsBeforeBatcher += 1;
          const checked = checkedRoll(token, roll).finally(() => (rollsBeforeBatcher -= 1));
          return timed(checked.then(writeRoll));
        };
        if (!claims) return record();
        if (runRollCeiling.reached(claims.runId)) throw rollCeilingReached();
        startCountingRolls(claims.runId);
        const fromConnection = rollsPerConnection.take(socket.id);
        if (!fromConnection.allowed) return refuse(fromConnection.retryAfterMs);
        // Most rolls are allowed from this process's lease without waiting; the last of a lease takes a new one from PostgreSQL.
        const local = allowance.takeLocally(claims.groupId);
        if (local) return local.allowed ? record() : refuse(local.retryAfterMs);
        rollsBeforeBatcher += 1;
        return allowance
          .take(claims.groupId)
          .finally(() => (rollsBeforeBatcher -= 1))
          .then((answer) => (answer.allowed ? record() : refuse(answer.retryAfterMs)));
      }),
    );

    socket.on(
      EVENTS.rollUndo,
      handle(rollUndoPayloadSchema, async ({ token, rollId }) => ({ id: (await undoRoll(token, rollId)).id })),
    );

    socket.on(
      EVENTS.boardSnapshot,
      handle(boardSnapshotPayloadSchema, async ({ runId }) => {
        const teacher = await teacherFromHeaders(socket.request.headers);
        if (!teacher) throw new HttpError(401, "unauthenticated", "Sign in to watch a class run.");
        await runForTeacher(teacher, runId, "view");
        // Join before reading, so no update committed after the snapshot's read can be missed.
        await socket.join(boardRoom(runId));
        const snapshot = await readBoardSnapshot(runId, teacher.user.id);
        if (!snapshot) throw new HttpError(404, "not_found", "The class run was not found.");
        return { snapshot };
      }),
    );
  });
}
