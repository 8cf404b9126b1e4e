import { v4 as uuidv4 } from "uuid";
import { EVENTS } from "@shared/event-names";
import type { GroupJoinAck } from "@shared/events";
import type { PadSession } from "../delivery/pad-connection";

/** A refusal from the server when joining, with its code (e.g. nickname_taken), plain message and any wait. */
export class JoinRefusedError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly retryAfterMs?: number,
  ) {
    super(message);
    this.name = "JoinRefusedError";
  }
}

const ATTEMPT_KEY = "outroll.pad.join-attempt";
const JOIN_TIMEOUT_MS = 10_000;
const JOIN_TRIES = 3;

type JoinAttempt = { code: string; nickname: string; attemptId: string };

/**
 * The id of this join attempt: the same code and nickname as an attempt that never got its answer reuse that attempt's
 * id (kept in sessionStorage, so a reload in the middle still retries it), so the server answers the group it made.
 */
export function joinAttemptId(code: string, nickname: string, storage: Pick<Storage, "getItem" | "setItem"> = sessionStorage): string {
  try {
    const kept = JSON.parse(storage.getItem(ATTEMPT_KEY) ?? "null") as JoinAttempt | null;
    if (kept && kept.code === code && kept.nickname === nickname) return kept.attemptId;
  } catch {
    // A damaged entry is replaced below.
  }
  const attempt: JoinAttempt = { code, nickname, attemptId: uuidv4() };
  storage.setItem(ATTEMPT_KEY, JSON.stringify(attempt));
  return attempt.attemptId;
}

const wait = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Joins a run with a new group nickname over socket.io and answers the session the phone keeps. An answer lost on the
 * way is retried with the same attempt id, which the server treats as the same join.
 */
export async function joinGroup({ code, nickname }: { code: string; nickname: string }): Promise<PadSession> {
  const attemptId = joinAttemptId(code, nickname);
  const { openAppSocket } = await import("@/lib/socket");
  const socket = openAppSocket();
  try {
    for (let attempt = 1; ; attempt += 1) {
      let ack: GroupJoinAck;
      try {
        ack = await socket.timeout(JOIN_TIMEOUT_MS).emitWithAck(EVENTS.groupJoin, { code, nickname, attemptId });
      } catch {
        if (attempt < JOIN_TRIES) {
          await wait(1_000 * attempt);
          continue;
        }
        throw new JoinRefusedError(
          "offline",
          "The phone could not reach the class run. Check the Wi-Fi and try again: your group is not lost.",
        );
      }
      if (!ack.ok)
        throw new JoinRefusedError(
          ack.error.code,
          joinRefusalText(ack.error.code, ack.error.message, ack.error.retryAfterMs),
          ack.error.retryAfterMs,
        );
      sessionStorage.removeItem(ATTEMPT_KEY);
      return { token: ack.token, runId: ack.state.run.id, groupId: ack.state.group.id, nickname: ack.state.group.nickname, code };
    }
  } finally {
    socket.disconnect();
  }
}

/** Plain words for the refusals a pupil can do something about; anything else keeps the server's message. */
export function joinRefusalText(code: string, message: string, retryAfterMs?: number): string {
  switch (code) {
    case "joining_locked":
      return "Your teacher has closed joining for this class run. Ask your teacher if your group still needs to join.";
    case "run_full":
      return "This class run already has as many groups as your teacher allowed. Join another group, or ask your teacher.";
    case "rate_limited":
      return `Too many tries in a short time. Wait ${waitText(retryAfterMs)}, then try again.`;
    case "run_closed":
      return "This class run is closed, so it takes no more groups.";
    default:
      return message;
  }
}

/** "about 20 seconds", "a minute", "2 minutes". */
export function waitText(ms: number | undefined): string {
  const seconds = Math.max(1, Math.ceil((ms ?? 30_000) / 1000));
  if (seconds < 60) return seconds === 1 ? "a second" : `${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? "a minute" : `${minutes} minutes`;
}
