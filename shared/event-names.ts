// The events' names and error codes without their zod schemas, so the Roll pad knows them without loading zod.

/**
 * Every socket.io event of a class run, named resource:verb. Pupils' events carry the group's signed guest token,
 * so each one is checked on its own and a reconnect needs no server-side session.
 */
export const EVENTS = {
  /** pad → server: join a run by its code with a new group nickname; answers the guest token. */
  groupJoin: "group:join",
  /** pad → server: rejoin with a stored token after a reload or a dropped connection; answers the pad's state. */
  groupResume: "group:resume",
  /** pad → server: the group's Guess vote (one per group; a new vote replaces the old). */
  voteCast: "vote:cast",
  /** pad → server: the group chooses its matchup, where the lesson lets groups choose. */
  matchupChoose: "matchup:choose",
  /** pad → server: one roll, with the id the phone gave it; acknowledged only once committed (a resend is acknowledged too). */
  rollRecord: "roll:record",
  /** pad → server: undo one of the group's rolls (the row stays, marked undone). */
  rollUndo: "roll:undo",
  /** board → server: start watching a run; answers the versioned snapshot read from the database. */
  boardSnapshot: "board:snapshot",
  /** server → board: the aggregates again, at most a few times a second, each with a newer version. */
  boardUpdate: "board:update",
  /** server → pads and boards: the teacher moved the run to another phase (a Twist starts a fresh tally). */
  runPhase: "run:phase",
  /** server → pads and boards: the run was opened, paused or closed. */
  runStatus: "run:status",
  /** server → pads: the teacher changed a group (its matchup or its nickname); the pad refreshes its state. */
  groupUpdate: "group:update",
  /** server → pads: the teacher removed a group from the run; its token is dead for every event. */
  groupRemoved: "group:removed",
} as const;

/** Error codes an acknowledgement may carry. Retryable ones leave the roll in the phone's outbox. */
export const eventErrorCodes = [
  "invalid_input",
  "unknown_code",
  "nickname_taken",
  "bad_token",
  "run_closed",
  "run_paused",
  "voting_closed",
  "not_roll_phase",
  "group_removed",
  "joining_locked",
  "run_full",
  "run_roll_ceiling",
  "matchup_assigned",
  "no_matchup",
  "wrong_matchup",
  "wrong_mode",
  "bad_faces",
  "id_taken",
  "not_found",
  "rate_limited",
  "unauthenticated",
  "forbidden",
  "server_error",
] as const;
export type EventErrorCode = (typeof eventErrorCodes)[number];

/** Codes after which the same event may succeed later unchanged, so the outbox keeps it and tries again. */
// not_roll_phase: a roll made in one phase and sent in another waits on the phone until the run is in a roll phase again.
export const RETRYABLE_ERROR_CODES: readonly EventErrorCode[] = ["run_paused", "not_roll_phase", "rate_limited", "server_error"];

export type EventError = { code: EventErrorCode; message: string; retryAfterMs?: number };
/** Every acknowledgement: `{ ok: true, … }` or `{ ok: false, error: { code, message } }`. */
export type Ack<T extends object = object> = ({ ok: true } & T) | { ok: false; error: EventError };
