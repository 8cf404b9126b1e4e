import type { NewRoll, RollWriteOutcome } from "../db/queries/class-runs";

type Pending<R> = { roll: R; resolve: (outcome: RollWriteOutcome) => void; reject: (error: unknown) => void };

/**
 * Group commit for rolls: rolls arriving within `windowMs` of each other are written in one transaction with one
 * multi-row insert, and each caller's promise settles only after that transaction has committed (or failed).
 * Up to `concurrency` batches are written at once, so one batch's commit (its WAL flush) overlaps the next batch.
 * Rows are the server's NewRoll; the load case's insert-only yardstick batches its own bare rows the same way.
 */
export class RollBatcher<R extends { id: string } = NewRoll> {
  private queue: Pending<R>[] = [];
  private timer: NodeJS.Timeout | null = null;
  private writing = 0;
  private inBatches = 0;
  private idleWaiters: (() => void)[] = [];

  constructor(
    private readonly write: (rolls: R[]) => Promise<Map<string, RollWriteOutcome>>,
    private readonly options: {
      windowMs: number;
      maxBatch: number;
      concurrency: number;
      onWritten?: (rolls: R[], outcomes: Map<string, RollWriteOutcome>) => void;
      /** A failed write is tried once more after this pause (a dropped connection, a database restart) before callers hear of it. */
      retryDelayMs?: number;
      onWriteFailed?: (error: unknown, attempt: number, rolls: R[]) => void;
    },
  ) {}

  /** Queues a roll; resolves with what became of it once its batch has committed. */
  submit(roll: R): Promise<RollWriteOutcome> {
    return new Promise((resolve, reject) => {
      this.queue.push({ roll, resolve, reject });
      this.schedule();
    });
  }

  /** Rolls queued or being written. */
  depth(): number {
    return this.queue.length + this.inBatches;
  }

  /** Writes everything queued now, without waiting for the window, and resolves once every batch has settled. */
  async drain(): Promise<void> {
    while (this.queue.length > 0 || this.writing > 0) {
      if (this.queue.length > 0 && this.writing < this.options.concurrency) {
        void this.flush();
        continue;
      }
      await new Promise<void>((resolve) => this.idleWaiters.push(resolve));
    }
  }

  private async writeWithRetry(rolls: R[]): Promise<Map<string, RollWriteOutcome>> {
    try {
      return await this.write(rolls);
    } catch (error) {
      this.options.onWriteFailed?.(error, 1, rolls);
      if (this.options.retryDelayMs === undefined) throw error;
      await new Promise((resolve) => setTimeout(resolve, this.options.retryDelayMs));
      // The insert is ON CONFLICT DO NOTHING, so a batch that did commit before its answer was lost comes back as duplicates.
      try {
        return await this.write(rolls);
      } catch (again) {
        this.options.onWriteFailed?.(again, 2, rolls);
        throw again;
      }
    }
  }

  private schedule() {
    if (this.queue.length === 0 || this.writing >= this.options.concurrency) return;
    if (this.queue.length >= this.options.maxBatch) {
      if (this.timer) clearTimeout(this.timer);
      this.timer = null;
      void this.flush();
      return;
    }
    if (!this.timer) this.timer = setTimeout(() => void this.flush(), this.options.windowMs);
  }

  private async flush() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.queue.length === 0) return;
    this.writing += 1;
    const batch = this.queue.splice(0, this.options.maxBatch);
    this.inBatches += batch.length;
    // The same id twice in one batch (a resend racing its original) is written once and both callers get the answer.
    const unique = new Map<string, R>();
    for (const entry of batch) if (!unique.has(entry.roll.id)) unique.set(entry.roll.id, entry.roll);
    try {
      const outcomes = await this.writeWithRetry([...unique.values()]);
      const answered = new Set<string>();
      for (const entry of batch) {
        const outcome = outcomes.get(entry.roll.id) ?? "run_closed";
        entry.resolve(answered.has(entry.roll.id) && outcome === "stored" ? "duplicate" : outcome);
        answered.add(entry.roll.id);
      }
      this.options.onWritten?.([...unique.values()], outcomes);
    } catch (error) {
      for (const entry of batch) entry.reject(error);
    } finally {
      this.writing -= 1;
      this.inBatches -= batch.length;
      this.schedule();
      for (const wake of this.idleWaiters.splice(0)) wake();
    }
  }
}
