import { z } from "zod";
import { faceValueSchema } from "./probability/die";
import type { SetDie } from "./schemas/dice-sets";
import type { Ack } from "./event-names";
import {
  joinCodeSchema,
  matchupSchema,
  nicknameSchema,
  type BoardSnapshot,
  type RunPhase,
  type RunStatus,
  type RunTally,
} from "./schemas/class-runs";

export { EVENTS, eventErrorCodes, RETRYABLE_ERROR_CODES, type Ack, type EventError, type EventErrorCode } from "./event-names";

const token = z.string({ error: "This phone has no group token: join the run again." }).min(20).max(600);
const uuid = (what: string) => z.uuid({ error: `That is not a ${what} id.` });

/**
 * A join. `attemptId` is a uuid v4 the phone makes per join attempt and sends again on a retry, so a join whose
 * acknowledgement was lost answers the same group and a fresh token instead of `nickname_taken`.
 */
export const groupJoinPayloadSchema = z.object({
  code: joinCodeSchema,
  nickname: nicknameSchema,
  attemptId: uuid("join attempt").optional(),
});
export type GroupJoinPayload = z.input<typeof groupJoinPayloadSchema>;

export const groupResumePayloadSchema = z.object({ token });
export type GroupResumePayload = z.infer<typeof groupResumePayloadSchema>;

export const voteCastPayloadSchema = z.object({
  token,
  dieIndex: z.number({ error: "Vote for one of the dice." }).int().min(0, { error: "Vote for one of the dice." }),
});
export type VoteCastPayload = z.infer<typeof voteCastPayloadSchema>;

export const matchupChoosePayloadSchema = z.object({ token, matchup: matchupSchema });
export type MatchupChoosePayload = z.infer<typeof matchupChoosePayloadSchema>;

/** Faces rolled: one list per player (2 or 3), each of dicePerPlayer faces (1 or 2). */
export const rolledFacesSchema = z
  .array(z.array(faceValueSchema, { error: "Faces are numbers." }).min(1).max(2, { error: "Each player rolls one or two dice." }), {
    error: "Send the faces rolled, one list per player.",
  })
  .min(2, { error: "A roll has two or three players." })
  .max(3, { error: "A roll has two or three players." });

/** One roll as the phone sends it. The id comes from the phone (uuid v4), so a resend is stored once. */
export const rollPayloadSchema = z.object({
  id: uuid("roll"),
  tally: z.number().int().min(1).max(50),
  matchup: matchupSchema,
  faces: rolledFacesSchema,
  recordedAt: z.iso.datetime({ offset: true, error: "recordedAt must be an ISO date and time." }),
});
export type RollPayload = z.infer<typeof rollPayloadSchema>;

export const rollRecordPayloadSchema = z.object({ token, roll: rollPayloadSchema });
export type RollRecordPayload = z.infer<typeof rollRecordPayloadSchema>;

export const rollUndoPayloadSchema = z.object({ token, rollId: uuid("roll") });
export type RollUndoPayload = z.infer<typeof rollUndoPayloadSchema>;

export const boardSnapshotPayloadSchema = z.object({ runId: uuid("class run") });
export type BoardSnapshotPayload = z.infer<typeof boardSnapshotPayloadSchema>;

/** The run as a group's phone sees it. */
export type PadRun = {
  id: string;
  title: string;
  classGroup: string;
  status: RunStatus;
  phase: RunPhase;
  phases: RunPhase[];
  tally: number;
  tallies: RunTally[];
  dicePerPlayer: number;
  players: number;
  tieRule: "re-roll-ties" | "ties-score-half" | "ties-score-nothing";
  matchupChoice: "assigned" | "group-choice";
  dice: SetDie[];
};

/** A stored roll as the pad lists it. */
export type PadRoll = {
  id: string;
  tally: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  winnerSeat: number | null;
  recordedAt: string;
};

/** What group:join and group:resume answer: everything the Roll pad shows. */
export type PadState = {
  run: PadRun;
  group: { id: string; nickname: string; matchup: number[] | null };
  vote: number | null;
  /** The group's rolls kept on the server in the current tally (undone ones left out). */
  savedRolls: number;
  /** The group's latest saved rolls in the current tally, newest first (at most 20). */
  recentRolls: PadRoll[];
};

export type GroupJoinAck = Ack<{ token: string; state: PadState }>;
export type GroupResumeAck = Ack<{ state: PadState }>;
export type VoteCastAck = Ack<{ dieIndex: number }>;
export type MatchupChooseAck = Ack<{ matchup: number[] }>;
/** `duplicate` is true when the id was already stored (a resend): the roll is saved once either way. */
export type RollRecordAck = Ack<{ id: string; duplicate: boolean }>;
export type RollUndoAck = Ack<{ id: string }>;
export type BoardSnapshotAck = Ack<{ snapshot: BoardSnapshot }>;

/**
 * A board:update as sent: the snapshot with its pooled tallies as UTF-8 JSON bytes, which socket.io carries as a binary
 * attachment, so the server passes on the pools its worker thread encoded without walking or re-encoding them.
 * Browsers receive the bytes as an ArrayBuffer, Node as a Buffer; `decodeBoardUpdate` turns either into the snapshot.
 */
export type BoardUpdateMessage = Omit<BoardSnapshot, "tallies"> & { tallies: Uint8Array | ArrayBuffer };

export function encodeBoardTallies(tallies: BoardSnapshot["tallies"]): Uint8Array {
  return new TextEncoder().encode(JSON.stringify(tallies));
}

export function decodeBoardUpdate(message: BoardUpdateMessage): BoardSnapshot {
  const bytes = message.tallies instanceof ArrayBuffer ? new Uint8Array(message.tallies) : message.tallies;
  return { ...message, tallies: JSON.parse(new TextDecoder().decode(bytes)) as BoardSnapshot["tallies"] };
}

export type RunPhaseBroadcast = { runId: string; phase: RunPhase; tally: number; dicePerPlayer: number; players: number };
export type RunStatusBroadcast = { runId: string; status: RunStatus };
export type GroupUpdateBroadcast = { runId: string; groupId: string };
export type GroupRemovedBroadcast = { runId: string; groupId: string };

/** A readable message for a zod error on a socket payload: the first issue, with its path. */
export function payloadProblem(error: z.ZodError): string {
  const issue = error.issues[0];
  return issue ? issue.message : "The message was not understood.";
}
