import type { Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import { winnerSeatOf } from "@shared/class-results/winner-seat";
import { EVENTS, type EventError } from "@shared/event-names";
import type { GroupResumeAck, MatchupChooseAck, PadState, VoteCastAck } from "@shared/events";
import { keyValueOutboxStore, recordOperation, RollOutbox, undoOperation } from "./roll-outbox";
import { ACK_TIMEOUT_MS, socketOutboxTransport } from "./socket-transport";

/** What a phone keeps to rejoin its group: the signed token and enough to show who it is. */
export type PadSession = { token: string; runId: string; groupId: string; nickname: string; code: string };

/** A roll as this phone remembers it, with where it stands. */
export type LocalRoll = {
  id: string;
  tally: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  winnerSeat: number | null;
  recordedAt: string;
  state: "waiting" | "saved" | "undoing" | "undone" | "refused";
  message?: string;
};

export type PadSnapshot = {
  connected: boolean;
  /** Rolls stored on this phone and not yet acknowledged by the server. */
  waiting: number;
  log: LocalRoll[];
  notice: string | null;
  /** The group's state as last read from the server (kept on the phone, so a reload offline shows it too). */
  state: PadState | null;
  /** Why the group could not be rejoined (a token the server no longer knows), or null. */
  problem: string | null;
  /** The teacher removed the group: its token is dead and the phone has forgotten it. */
  removed: boolean;
};

const SESSION_KEY = "outroll.pad.session";
const LOG_LIMIT = 400;
const stateKey = (groupId: string) => `outroll.pad.state.${groupId}`;
const logKey = (groupId: string) => `outroll.pad.log.${groupId}`;
const outboxKey = (groupId: string) => `outroll.pad.outbox.${groupId}`;

function readJson<T>(key: string, fallback: T): T {
  try {
    const text = localStorage.getItem(key);
    return text ? (JSON.parse(text) as T) : fallback;
  } catch {
    return fallback;
  }
}

/** The group this phone joined last, if any (kept in localStorage, so a reload rejoins it). */
export function storedPadSession(): PadSession | null {
  return readJson<PadSession | null>(SESSION_KEY, null);
}

export function storePadSession(session: PadSession | null) {
  if (session) localStorage.setItem(SESSION_KEY, JSON.stringify(session));
  else localStorage.removeItem(SESSION_KEY);
}

/** The pad state last seen for a group, so a phone reloaded without a connection can still record into its outbox. */
export function storedPadState(groupId: string): PadState | null {
  return readJson<PadState | null>(stateKey(groupId), null);
}

/** How many rolls a group's outbox on this phone holds, read straight from storage (before any connection opens). */
export function storedWaitingCount(groupId: string): number {
  return readJson<{ kind: string }[]>(outboxKey(groupId), []).filter((entry) => entry.kind === "record").length;
}

/** Error codes after which a group's token is no use any more. */
const DEAD_TOKEN_CODES: readonly string[] = ["group_removed"];

/**
 * One phone's live link to its group: the socket, the outbox that survives reloads, the log of this phone's rolls and
 * the group's state from the server. The Roll pad talks to the server over socket.io only, so this class keeps that
 * state itself (read with useSyncExternalStore) rather than in a query cache; server events make it ask again.
 */
export class PadConnection {
  readonly socket: Socket;
  private readonly outbox: RollOutbox;
  private log: LocalRoll[];
  private notice: string | null = null;
  private state: PadState | null;
  private problem: string | null = null;
  private removed = false;
  private refreshing = false;
  private refreshAgain = false;
  private snapshot: PadSnapshot;
  private readonly listeners = new Set<() => void>();
  private readonly cleanups: (() => void)[] = [];

  constructor(
    private session: PadSession,
    socket: Socket,
  ) {
    this.log = readJson<LocalRoll[]>(logKey(session.groupId), []);
    this.state = storedPadState(session.groupId);
    this.socket = socket;
    this.outbox = new RollOutbox(
      keyValueOutboxStore(localStorage, outboxKey(session.groupId)),
      socketOutboxTransport(this.socket, () => session.token),
      {
        maxInFlight: 6,
        retryDelayMs: 2_000,
      },
    );
    this.snapshot = this.buildSnapshot();
    this.cleanups.push(
      this.outbox.subscribe((event) => {
        if (event.type === "refused" && DEAD_TOKEN_CODES.includes(event.error.code)) {
          this.forgetGroup();
          return;
        }
        if (event.type === "saved" && event.operation.kind === "record")
          this.updateRoll(event.operation.key, { state: "saved", message: undefined });
        if (event.type === "saved" && event.operation.kind === "undo") this.updateRoll(event.operation.rollId, { state: "undone" });
        if (event.type === "refused" && event.operation.kind === "record")
          this.updateRoll(event.operation.key, { state: "refused", message: event.error.message });
        if (event.type === "refused" && event.operation.kind === "undo") {
          this.updateRoll(event.operation.rollId, { state: "saved" });
          this.notice = event.error.message;
        }
        if (event.type === "waiting") this.notice = waitingNotice(event.reason, event.code);
        if (event.type === "saved" && this.outbox.pending().length === 0) this.notice = null;
        this.changed();
      }),
    );
    this.socket.on("connect", () => {
      void this.refresh();
      this.outbox.flush();
      this.changed();
    });
    this.socket.on("disconnect", () => this.changed());
    this.socket.on(EVENTS.runPhase, () => {
      void this.refresh();
      // Rolls kept back for a phase reason go as soon as the class is rolling again.
      this.outbox.flush();
    });
    this.socket.on(EVENTS.runStatus, () => {
      void this.refresh();
      this.outbox.flush();
    });
    this.socket.on(EVENTS.groupUpdate, (message: { groupId: string }) => {
      if (message.groupId === session.groupId) void this.refresh();
    });
    this.socket.on(EVENTS.groupRemoved, (message: { groupId: string }) => {
      if (message.groupId === session.groupId) this.forgetGroup();
    });
    // A phone that slept or had the page in the background sends what it kept as soon as it is shown again.
    const onVisible = () => {
      if (document.visibilityState !== "visible" || this.removed) return;
      if (!this.socket.connected) this.socket.connect();
      this.outbox.flush();
      void this.refresh();
    };
    document.addEventListener("visibilitychange", onVisible);
    window.addEventListener("online", onVisible);
    this.cleanups.push(() => {
      document.removeEventListener("visibilitychange", onVisible);
      window.removeEventListener("online", onVisible);
    });
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

  /** Asks the server for the group's state again; one request at a time, and one more if asked meanwhile. */
  async refresh(): Promise<void> {
    if (!this.socket.connected || this.removed) return;
    if (this.refreshing) {
      this.refreshAgain = true;
      return;
    }
    this.refreshing = true;
    try {
      const ack: GroupResumeAck = await this.socket.timeout(ACK_TIMEOUT_MS).emitWithAck(EVENTS.groupResume, { token: this.session.token });
      if (ack.ok) this.acceptState(ack.state);
      else if (DEAD_TOKEN_CODES.includes(ack.error.code)) this.forgetGroup();
      else if (ack.error.code === "bad_token" || ack.error.code === "not_found") this.problem = ack.error.message;
    } catch {
      // No answer in time: the next connect, event or visibility change asks again.
    } finally {
      this.refreshing = false;
    }
    this.changed();
    if (this.refreshAgain) {
      this.refreshAgain = false;
      void this.refresh();
    }
  }

  /** Stores a roll on the phone first, then sends it; it stays in the outbox until the server has committed it. */
  recordRoll(state: PadState, faces: number[][]) {
    const totals = faces.map((seat) => seat.reduce((sum, face) => sum + face, 0));
    const roll = { id: uuidv4(), tally: state.run.tally, matchup: state.group.matchup!, faces, recordedAt: new Date().toISOString() };
    this.log = [...this.log, { ...roll, totals, winnerSeat: winnerSeatOf(totals), state: "waiting" as const }].slice(-LOG_LIMIT);
    this.persistLog();
    this.outbox.add(recordOperation(roll));
    this.changed();
  }

  /** Undoes the group's latest roll on this phone: taken back if it has not left yet, otherwise undone on the server. */
  undoLast(tally: number): LocalRoll | null {
    const last = [...this.log].reverse().find((entry) => entry.tally === tally && (entry.state === "waiting" || entry.state === "saved"));
    if (!last) return null;
    if (this.outbox.withdrawRecord(last.id)) {
      this.updateRoll(last.id, { state: "undone" });
    } else {
      this.updateRoll(last.id, { state: "undoing" });
      this.outbox.add(undoOperation(last.id));
    }
    this.changed();
    return last;
  }

  async vote(dieIndex: number): Promise<VoteCastAck> {
    if (!this.socket.connected)
      return {
        ok: false,
        error: { code: "server_error", message: "Not connected: the vote goes when the phone is back online. Try again in a moment." },
      };
    const ack: VoteCastAck = await this.socket
      .timeout(ACK_TIMEOUT_MS)
      .emitWithAck(EVENTS.voteCast, { token: this.session.token, dieIndex })
      .catch(noAnswer);
    if (ack.ok && this.state) this.acceptState({ ...this.state, vote: ack.dieIndex });
    if (!ack.ok) this.checkDeadToken(ack.error);
    this.changed();
    return ack;
  }

  async chooseMatchup(matchup: number[]): Promise<MatchupChooseAck> {
    if (!this.socket.connected)
      return { ok: false, error: { code: "server_error", message: "Not connected: choose again when the phone is back online." } };
    const ack: MatchupChooseAck = await this.socket
      .timeout(ACK_TIMEOUT_MS)
      .emitWithAck(EVENTS.matchupChoose, { token: this.session.token, matchup })
      .catch(noAnswer);
    if (ack.ok) await this.refresh();
    else this.checkDeadToken(ack.error);
    return ack;
  }

  close() {
    for (const cleanup of this.cleanups) cleanup();
    this.outbox.stop();
    this.socket.disconnect();
  }

  private acceptState(state: PadState) {
    this.state = state;
    this.problem = null;
    localStorage.setItem(stateKey(this.session.groupId), JSON.stringify(state));
    // A rename by the teacher: the phone keeps the new nickname for its next reload.
    if (state.group.nickname !== this.session.nickname) {
      this.session = { ...this.session, nickname: state.group.nickname };
      if (storedPadSession()?.token === this.session.token) storePadSession(this.session);
    }
  }

  private checkDeadToken(error: EventError) {
    if (DEAD_TOKEN_CODES.includes(error.code)) this.forgetGroup();
  }

  /** The teacher removed the group: nothing it keeps can be stored any more, so the phone forgets the group entirely. */
  private forgetGroup() {
    if (this.removed) return;
    this.removed = true;
    this.outbox.stop();
    if (storedPadSession()?.token === this.session.token) storePadSession(null);
    for (const key of [stateKey(this.session.groupId), logKey(this.session.groupId), outboxKey(this.session.groupId)])
      localStorage.removeItem(key);
    this.socket.disconnect();
    this.changed();
  }

  private updateRoll(id: string, change: Partial<LocalRoll>) {
    this.log = this.log.map((entry) => (entry.id === id ? { ...entry, ...change } : entry));
    this.persistLog();
  }

  private persistLog() {
    if (!this.removed) localStorage.setItem(logKey(this.session.groupId), JSON.stringify(this.log));
  }

  private buildSnapshot(): PadSnapshot {
    return {
      connected: this.socket.connected,
      waiting: this.removed ? 0 : this.outbox.pending().filter((entry) => entry.kind === "record").length,
      log: this.log,
      notice: this.notice,
      state: this.state,
      problem: this.problem,
      removed: this.removed,
    };
  }

  private changed() {
    this.snapshot = this.buildSnapshot();
    for (const listener of this.listeners) listener();
  }
}

/**
 * Opens a group's connection. socket.io's client loads here, after the first screen, so the code and nickname forms
 * come up without it (the service worker keeps its chunk for a reload offline).
 */
export async function openPadConnection(session: PadSession): Promise<PadConnection> {
  const { openAppSocket } = await import("@/lib/socket");
  return new PadConnection(session, openAppSocket());
}

const noAnswer = (): { ok: false; error: EventError } => ({
  ok: false,
  error: { code: "server_error", message: "No answer from the class run yet. Try again in a moment." },
});

/** What the pad says about rolls kept back: a phase reason is not a problem, just a wait. */
function waitingNotice(reason: string, code: string | undefined): string {
  if (code === "not_roll_phase") return "Rolls kept on this phone go when the class rolls again.";
  if (code === "run_paused") return "The run is paused: your rolls are kept on this phone.";
  return reason;
}
