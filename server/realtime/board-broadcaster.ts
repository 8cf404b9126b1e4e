import { performance } from "node:perf_hooks";
import type { Server } from "socket.io";
import { EVENTS } from "@shared/events";
import type { NewRoll } from "../db/queries/class-runs";
import { readBoardUpdate, refreshBoardWithRolls, type BoardRollCache } from "../services/class-runs.service";
import { logger } from "../logger";
import { forgetBoardRun } from "../pooling/pooling-pool";

export const boardRoom = (runId: string) => `board:${runId}`;

/**
 * Pushes a run's aggregates to its Run boards at most once per `intervalMs` (or eight times the time the last snapshot
 * took to build, if longer), however many rolls arrive. New rolls come straight from the roll batcher once committed
 * (`addRolls`) and are added to the pooling worker's running pool for the run, so a refresh after rolls reads nothing
 * from the database. Any other change (`markDirty`: an undo, a group, a vote, a phase, a Paper import, the virtual
 * class) reads the run in full from the database. Runs nobody watches cost nothing.
 */
export class BoardBroadcaster {
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private readonly lastSent = new Map<string, number>();
  private readonly lastCost = new Map<string, number>();
  private readonly busy = new Set<string>();
  private readonly again = new Set<string>();
  /** Runs whose next refresh reads everything from the database. */
  private readonly fullRead = new Set<string>();
  /** Rolls committed since the run's last refresh. */
  private readonly pending = new Map<string, NewRoll[]>();
  private readonly kept: BoardRollCache = new Map();
  private loopSample = { at: 0, busy: false, utilization: performance.eventLoopUtilization() };

  constructor(
    private readonly io: Server,
    private readonly intervalMs: number,
  ) {}

  /** Whether the event loop was busy more than 90% of the time over the last second or so. */
  private loopBusy(): boolean {
    const now = Date.now();
    if (now - this.loopSample.at >= 1_000) {
      const utilization = performance.eventLoopUtilization();
      this.loopSample = {
        at: now,
        busy: performance.eventLoopUtilization(utilization, this.loopSample.utilization).utilization > 0.9,
        utilization,
      };
    }
    return this.loopSample.busy;
  }

  private watched(runId: string): boolean {
    if (this.io.sockets.adapter.rooms.get(boardRoom(runId))?.size) return true;
    this.pending.delete(runId);
    this.fullRead.delete(runId);
    if (this.kept.delete(runId)) forgetBoardRun(runId);
    return false;
  }

  /** Rolls the batcher has just committed for a run; kept for the next refresh only while a board watches the run. */
  addRolls(runId: string, rolls: NewRoll[]) {
    if (!this.watched(runId)) return;
    const pending = this.pending.get(runId);
    if (pending) pending.push(...rolls);
    else this.pending.set(runId, [...rolls]);
    this.schedule(runId);
  }

  /** Something besides new rolls changed in a run: its next refresh reads it in full. */
  markDirty(runId: string) {
    if (!this.watched(runId)) return;
    this.fullRead.add(runId);
    this.schedule(runId);
  }

  private schedule(runId: string) {
    if (this.busy.has(runId)) {
      this.again.add(runId);
      return;
    }
    if (this.timers.has(runId)) return;
    // A run whose snapshot takes long to build (many thousands of rolls on a busy server) is refreshed less often, and
    // so is every board while the event loop is nearly always busy: pupils' acknowledgements come first.
    const interval = Math.max(this.intervalMs * (this.loopBusy() ? 2 : 1), 8 * (this.lastCost.get(runId) ?? 0));
    const wait = Math.max(0, (this.lastSent.get(runId) ?? 0) + interval - Date.now());
    this.timers.set(
      runId,
      setTimeout(() => void this.send(runId), wait),
    );
  }

  private async send(runId: string) {
    this.timers.delete(runId);
    this.busy.add(runId);
    const started = performance.now();
    // Every roll taken here was committed before the full read below starts, so that read holds it; a roll reported
    // while the read runs waits for the next refresh, where the worker pools it once even if the read held it too.
    const rows = this.pending.get(runId) ?? [];
    this.pending.delete(runId);
    const full = this.fullRead.delete(runId) || !this.kept.has(runId);
    try {
      const update = (!full && (await refreshBoardWithRolls(runId, rows, this.kept))) || (await readBoardUpdate(runId, this.kept));
      if (update) {
        // isOwner depends on the viewer; each board already knows it from its own first snapshot.
        // Local only: every process with a board watching this run sends its own (see class-run-events.ts).
        this.io.local.to(boardRoom(runId)).emit(EVENTS.boardUpdate, update);
      }
    } catch (error) {
      logger.error({ err: error, runId }, "board update failed");
      // The rolls taken above may not have reached the worker: the next refresh reads the run in full.
      this.kept.delete(runId);
      this.fullRead.add(runId);
    } finally {
      this.lastCost.set(runId, performance.now() - started);
      this.lastSent.set(runId, Date.now());
      this.busy.delete(runId);
      if (this.again.delete(runId) && this.watched(runId)) this.schedule(runId);
    }
  }

  close() {
    for (const timer of this.timers.values()) clearTimeout(timer);
    this.timers.clear();
    this.pending.clear();
    this.kept.clear();
  }
}
