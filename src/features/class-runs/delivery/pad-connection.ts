import type { QueryClient } from "@tanstack/react-query";
import type { Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import { winnerSeatOf } from "@shared/class-results/virtual-class";
import { EVENTS, type GroupResumeAck, type MatchupChooseAck, type PadState, type VoteCastAck } from "@shared/events";
import { openAppSocket } from "@/lib/socket";
import { keyValueOutboxStore, recordOperation, RollOutbox, undoOperation } from "./roll-outbox";
import { socketOutboxTransport } from "./socket-transport";

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

export type PadSnapshot = { connected: boolean; waiting: number; log: LocalRoll[]; notice: string | null };

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
export function storedPadState(groupId: string): PadState | undefined {
  return readJson<PadState | undefined>(stateKey(groupId), undefined);
}

export const padStateQueryKey = (groupId: string) => ["pad", groupId, "state"] as const;

/**
 * One phone's live link to its group: the socket, the outbox that survives reloads, and the log of this phone's rolls.
 * The group's state from the server lives in the TanStack Query cache; server events only invalidate it.
 */
export class PadConnection {
  readonly socket: Socket;
  private readonly outbox: RollOutbox;
  private log: LocalRoll[];
  private notice: string | null = null;
  private snapshot: PadSnapshot;
  private readonly listeners = new Set<() => void>();
  private readonly cleanups: (() => void)[] = [];

  constructor(
    readonly session: PadSession,
    private readonly queryClient: QueryClient,
  ) {
    this.log = readJson<LocalRoll[]>(logKey(session.groupId), []);
    this.socket = openAppSocket();
    this.outbox = new RollOutbox(keyValueOutboxStore(localStorage, outboxKey(session.groupId)), socketOutboxTransport(this.socket, () => session.token), {
      maxInFlight: 6,
      retryDelayMs: 2_000,
    });
    this.snapshot = this.buildSnapshot();
    this.cleanups.push(
      this.outbox.subscribe((event) => {
        if (event.type === "saved" && event.operation.kind === "record") this.updateRoll(event.operation.key, { state: "saved", message: undefined });
        if (event.type === "saved" && event.operation.kind === "undo") this.updateRoll(event.operation.rollId, { state: "undone" });
        if (event.type === "refused" && event.operation.kind === "record") this.updateRoll(event.operation.key, { state: "refused", message: event.error.message });
        if (event.type === "refused" && event.operation.kind === "undo") {
          this.updateRoll(event.operation.rollId, { state: "saved" });
          this.notice = event.error.message;
        }
        if (event.type === "waiting") this.notice = event.reason;
        if (event.type === "saved" && this.outbox.pending().length === 0) this.notice = null;
        this.changed();
      }),
    );
    const refresh = () => void this.queryClient.invalidateQueries({ queryKey: padStateQueryKey(session.groupId) });
    this.socket.on("connect", () => {
      refresh();
      this.outbox.flush();
      this.changed();
    });
    this.socket.on("disconnect", () => this.changed());
    this.socket.on(EVENTS.runPhase, refresh);
    this.socket.on(EVENTS.runStatus, () => {
      refresh();
      this.outbox.flush();
    });
    this.socket.on(EVENTS.groupUpdate, (message: { groupId: string }) => {
      if (message.groupId === session.groupId) refresh();
    });
    // A phone that slept or had the page in the background sends what it kept as soon as it is shown again.
    const onVisible = () => {
      if (document.visibilityState !== "visible") return;
      if (!this.socket.connected) this.socket.connect();
      this.outbox.flush();
      refresh();
    };
    document.addEventListener("visibilitychange", onVisible);
    window.addEventListener("online", onVisible);
    this.cleanups.push(() => {
      document.removeEventListener("visibilitychange", onVisible);
      window.removeEventListener("online", onVisible);
    });
  }

  /** Asks the server for the group's state (the query function behind padStateQueryKey). */
  async resume(): Promise<PadState> {
    const ack: GroupResumeAck = await this.socket.emitWithAck(EVENTS.groupResume, { token: this.session.token });
    if (!ack.ok) throw new Error(ack.error.message);
    localStorage.setItem(stateKey(this.session.groupId), JSON.stringify(ack.state));
    return ack.state;
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

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
    if (!this.socket.connected) return { ok: false, error: { code: "server_error", message: "Not connected: the vote goes when the phone is back online. Try again in a moment." } };
    const ack: VoteCastAck = await this.socket.emitWithAck(EVENTS.voteCast, { token: this.session.token, dieIndex });
    if (ack.ok) this.queryClient.setQueryData<PadState>(padStateQueryKey(this.session.groupId), (current) => (current ? { ...current, vote: ack.dieIndex } : current));
    return ack;
  }

  async chooseMatchup(matchup: number[]): Promise<MatchupChooseAck> {
    if (!this.socket.connected) return { ok: false, error: { code: "server_error", message: "Not connected: choose again when the phone is back online." } };
    const ack: MatchupChooseAck = await this.socket.emitWithAck(EVENTS.matchupChoose, { token: this.session.token, matchup });
    if (ack.ok) await this.queryClient.invalidateQueries({ queryKey: padStateQueryKey(this.session.groupId) });
    return ack;
  }

  close() {
    for (const cleanup of this.cleanups) cleanup();
    this.outbox.stop();
    this.socket.disconnect();
  }

  private updateRoll(id: string, change: Partial<LocalRoll>) {
    this.log = this.log.map((entry) => (entry.id === id ? { ...entry, ...change } : entry));
    this.persistLog();
  }

  private persistLog() {
    localStorage.setItem(logKey(this.session.groupId), JSON.stringify(this.log));
  }

  private buildSnapshot(): PadSnapshot {
    return { connected: this.socket.connected, waiting: this.outbox.pending().filter((entry) => entry.kind === "record").length, log: this.log, notice: this.notice };
  }

  private changed() {
    this.snapshot = this.buildSnapshot();
    for (const listener of this.listeners) listener();
  }
}
