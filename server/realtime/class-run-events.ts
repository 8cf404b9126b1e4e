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
import { auth } from "../auth";
import { closeIdleRuns, countPhoneRolls, findClassRun, markGroupFlooded, markRollCeilingReached, writeRollBatch, type NewRoll, type RollWriteOutcome } from "../db/queries/class-runs";
import { db } from "../db/client";
import { findMembershipForUser } from "../db/queries/memberships";
import { env } from "../env";
import { HttpError } from "../http-error";
import { logger } from "../logger";
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
import { codeGuessingWait, countWrongCode, joinWait, rollsPerConnection, rollsPerGroup, runRollCeiling } from "./room-limits";
import { notifyRunChanged, onRunChanged } from "./run-notifier";

export const padsRoom = (runId: string) => `pads:${runId}`;

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

/** The `{ ok: false, error }` answer for anything a handler threw. */
function refusalFor(error: unknown): EventError {
  if (error instanceof PadError) return error.toEventError();
  if (error instanceof HttpError) {
    const code = error.status === 401 ? "unauthenticated" : error.status === 404 ? "not_found" : "forbidden";
    return { code, message: error.message };
  }
  logger.error({ err: error }, "class run event failed");
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
          (error: unknown) => answer({ ok: false, error: refusalFor(error) }),
        );
      } else answer({ ok: true, ...result });
    } catch (error) {
      answer({ ok: false, error: refusalFor(error) });
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

/**
 * The address a socket connected from: the X-Forwarded-For client when the connection comes through a proxy on this
 * machine (as Express's "trust proxy: loopback" reads it), else the peer address.
 */
export function socketAddress(socket: Socket): string {
  const peer = socket.handshake.address;
  const forwarded = socket.handshake.headers["x-forwarded-for"];
  const loopback = peer === "127.0.0.1" || peer === "::1" || peer === "::ffff:127.0.0.1";
  if (loopback && typeof forwarded === "string" && forwarded.trim()) return forwarded.split(",").at(-1)!.trim();
  return peer;
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
  const broadcaster = new BoardBroadcaster(io, env.BOARD_UPDATE_MS);
  const batcher = new RollBatcher((rolls) => writeRollBatch(db, rolls), {
    windowMs: env.ROLL_BATCH_MS,
    maxBatch: 500,
    concurrency: 3,
    onWritten: (rolls, outcomes) => {
      const stored = new Map<string, NewRoll[]>();
      const phoneRolls = new Map<string, number>();
      for (const entry of rolls) {
        if (outcomes.get(entry.id) !== "stored") continue;
        if (entry.source === "phone") phoneRolls.set(entry.runId, (phoneRolls.get(entry.runId) ?? 0) + 1);
        // A left-out group's rolls are stored but kept out of the board's figures.
        if (entry.leftOut) continue;
        const ofRun = stored.get(entry.runId);
        if (ofRun) ofRun.push(entry);
        else stored.set(entry.runId, [entry]);
      }
      for (const [runId, ofRun] of stored) broadcaster.addRolls(runId, ofRun);
      for (const [runId, count] of phoneRolls) if (runRollCeiling.add(runId, count)) ceilingReached(runId);
    },
  });

  /** Queues a checked roll for the next batch; settles once that batch has committed. */
  const writeRoll = (row: NewRoll) =>
    batcher.submit(row).then((outcome) => {
      const refusal = outcomeErrors[outcome];
      if (refusal) throw new PadError(refusal.code, refusal.message, refusal.retryAfterMs);
      return { id: row.id, duplicate: outcome === "duplicate" };
    });

  const stopListening = onRunChanged(async (change) => {
    broadcaster.markDirty(change.runId);
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
      const message: RunPhaseBroadcast = { runId: run.id, phase: run.phase as RunPhaseBroadcast["phase"], tally: run.currentTally, dicePerPlayer: run.dicePerPlayer, players: run.players };
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
  });

  io.on("connection", (socket: Socket) => {
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
        if (busy) throw waitRefusal(busy.waitMs, busy.busy === "connection" ? "This phone is joining too often." : "Groups are joining this run very fast.");
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
        const claims = verifyGuestToken(token);
        if (claims) {
          if (runRollCeiling.reached(claims.runId)) throw rollCeilingReached();
          startCountingRolls(claims.runId);
          const allowed = rollsPerGroup.take(claims.groupId);
          const fromConnection = allowed.allowed ? rollsPerConnection.take(socket.id) : allowed;
          if (!fromConnection.allowed) {
            flagFlood(claims.runId, claims.groupId);
            throw new PadError("rate_limited", "Rolls are coming in faster than a group can play. Wait a moment; the phone sends them again.", fromConnection.retryAfterMs);
          }
        }
        // Only a group's first roll (or one after a change to its run) waits for the database before the batcher.
        const row = checkedRollFromCache(token, roll);
        return row ? writeRoll(row) : checkedRoll(token, roll).then(writeRoll);
      }),
    );

    socket.on(EVENTS.rollUndo, handle(rollUndoPayloadSchema, async ({ token, rollId }) => ({ id: (await undoRoll(token, rollId)).id })));

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
