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
  type GroupUpdateBroadcast,
  type RunPhaseBroadcast,
  type RunStatusBroadcast,
} from "@shared/events";
import { hasNulCharacter, NUL_CHARACTER_MESSAGE } from "@shared/schemas/nul-character";
import { auth } from "../auth";
import { findClassRun, writeRollBatch, type NewRoll, type RollWriteOutcome } from "../db/queries/class-runs";
import { db } from "../db/client";
import { findMembershipForUser } from "../db/queries/memberships";
import { env } from "../env";
import { HttpError } from "../http-error";
import { logger } from "../logger";
import { isUnstorableText } from "../db/postgres-errors";
import type { TeacherContext } from "../middleware/require-teacher";
import { readBoardSnapshot, runForTeacher } from "../services/class-runs.service";
import { castVote, checkedRoll, checkedRollFromCache, chooseMatchup, GroupRateLimiter, joinRun, PadError, resumeGroup, undoRoll } from "../services/roll-pad.service";
import { verifyGuestToken } from "../services/guest-token";
import { BoardBroadcaster, boardRoom } from "./board-broadcaster";
import { RollBatcher } from "./roll-batcher";
import { onRunChanged } from "./run-notifier";

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
  // Text PostgreSQL cannot store is refused for good (invalid_input is not retryable), so the phone stops resending it.
  if (isUnstorableText(error)) return { code: "invalid_input", message: NUL_CHARACTER_MESSAGE };
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
 * Class run events on the shared socket.io server: pupils' groups join, vote and record rolls with their signed token;
 * rolls go through the batcher and are acknowledged after commit; Run boards get a snapshot, then throttled updates.
 */
export function registerClassRunEvents(io: Server) {
  const limiter = new GroupRateLimiter(env.ROLL_RATE_PER_GROUP, env.ROLL_BURST_PER_GROUP);
  const broadcaster = new BoardBroadcaster(io, env.BOARD_UPDATE_MS);
  const batcher = new RollBatcher((rolls) => writeRollBatch(db, rolls), {
    windowMs: env.ROLL_BATCH_MS,
    maxBatch: 500,
    concurrency: 3,
    onWritten: (rolls, outcomes) => {
      const stored = new Map<string, NewRoll[]>();
      for (const entry of rolls) {
        if (outcomes.get(entry.id) !== "stored") continue;
        const ofRun = stored.get(entry.runId);
        if (ofRun) ofRun.push(entry);
        else stored.set(entry.runId, [entry]);
      }
      for (const [runId, ofRun] of stored) broadcaster.addRolls(runId, ofRun);
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
  // Tests start and stop many servers in one process; each stops listening when its HTTP server closes.
  io.httpServer?.once("close", () => {
    stopListening();
    broadcaster.close();
  });

  io.on("connection", (socket: Socket) => {
    const joinPads = (runId: string) => void socket.join(padsRoom(runId));

    socket.on(
      EVENTS.groupJoin,
      handle(groupJoinPayloadSchema, async ({ code, nickname }) => {
        const joined = await joinRun(code, nickname);
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
          const allowed = limiter.take(claims.groupId);
          if (!allowed.allowed) {
            throw new PadError("rate_limited", "Rolls are coming in faster than a group can play. Wait a moment; the phone sends them again.", allowed.retryAfterMs);
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
