import type { Server } from "socket.io";
import { EVENTS } from "@shared/events";
import { readBoardSnapshot, type BoardRollCache } from "../services/class-runs.service";
import { logger } from "../logger";
import { forgetBoardRun, poolBoardOffThread } from "./pooling-pool";

export const boardRoom = (runId: string) => `board:${runId}`;

/**
 * Pushes a run's aggregates to its Run boards at most once per `intervalMs` (or eight times the time the last snapshot
 * took to build, if longer), however many rolls arrive: a change marks
 * the run dirty, and one fresh snapshot from the database goes out when the interval allows. Runs nobody watches cost nothing.
 */
export class BoardBroadcaster {
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private readonly lastSent = new Map<string, number>();
  private readonly lastCost = new Map<string, number>();
  private readonly busy = new Set<string>();
  private readonly again = new Set<string>();
  private readonly rolls: BoardRollCache = new Map();

  constructor(
    private readonly io: Server,
    private readonly intervalMs: number,
  ) {}

  markDirty(runId: string) {
    if (!this.io.sockets.adapter.rooms.get(boardRoom(runId))?.size) {
      if (this.rolls.delete(runId)) forgetBoardRun(runId);
      return;
    }
    if (this.busy.has(runId)) {
      this.again.add(runId);
      return;
    }
    if (this.timers.has(runId)) return;
    // A run whose snapshot takes long to build (many thousands of rolls on a busy server) is refreshed less often.
    const interval = Math.max(this.intervalMs, 8 * (this.lastCost.get(runId) ?? 0));
    const wait = Math.max(0, (this.lastSent.get(runId) ?? 0) + interval - Date.now());
    this.timers.set(runId, setTimeout(() => void this.send(runId), wait));
  }

  private async send(runId: string) {
    this.timers.delete(runId);
    this.busy.add(runId);
    const started = performance.now();
    try {
      const snapshot = await readBoardSnapshot(runId, null, { pool: poolBoardOffThread, cache: this.rolls });
      if (snapshot) {
        // isOwner depends on the viewer; each board already knows it from its own first snapshot.
        this.io.to(boardRoom(runId)).emit(EVENTS.boardUpdate, snapshot);
      }
    } catch (error) {
      logger.error({ err: error, runId }, "board update failed");
    } finally {
      this.lastCost.set(runId, performance.now() - started);
      this.lastSent.set(runId, Date.now());
      this.busy.delete(runId);
      if (this.again.delete(runId)) this.markDirty(runId);
    }
  }

  close() {
    for (const timer of this.timers.values()) clearTimeout(timer);
    this.timers.clear();
    this.rolls.clear();
  }
}
