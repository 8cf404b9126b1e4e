import { RETRYABLE_ERROR_CODES, type EventError, type EventErrorCode } from "@shared/event-names";
import type { RollPayload, RollRecordAck, RollUndoAck } from "@shared/events";

/** One operation waiting for the server: a roll to record, or an undo of one. */
export type OutboxOperation = { kind: "record"; key: string; roll: RollPayload } | { kind: "undo"; key: string; rollId: string };

/** Where the outbox keeps its operations; synchronous, so an operation is stored before anything is sent. */
export interface OutboxStore {
  read(): OutboxOperation[];
  write(operations: OutboxOperation[]): void;
}

/** How the outbox reaches the server; a promise that rejects means "not known to have arrived" (timeout, disconnect). */
export interface OutboxTransport {
  isConnected(): boolean;
  record(roll: RollPayload): Promise<RollRecordAck>;
  undo(rollId: string): Promise<RollUndoAck>;
}

export type OutboxEvent =
  | { type: "saved"; operation: OutboxOperation; duplicate: boolean }
  | { type: "refused"; operation: OutboxOperation; error: EventError }
  | { type: "waiting"; operation: OutboxOperation; reason: string; code?: EventErrorCode }
  | { type: "changed" };

/** Keeps operations in a store under one key, as JSON (the phone passes localStorage; tests pass a Map). */
export function keyValueOutboxStore(
  storage: { getItem(key: string): string | null; setItem(key: string, value: string): void },
  key: string,
): OutboxStore {
  return {
    read() {
      try {
        const parsed: unknown = JSON.parse(storage.getItem(key) ?? "[]");
        return Array.isArray(parsed) ? (parsed as OutboxOperation[]) : [];
      } catch {
        return [];
      }
    },
    write(operations) {
      storage.setItem(key, JSON.stringify(operations));
    },
  };
}

export const recordOperation = (roll: RollPayload): OutboxOperation => ({ kind: "record", key: roll.id, roll });
export const undoOperation = (rollId: string): OutboxOperation => ({ kind: "undo", key: `undo:${rollId}`, rollId });

/**
 * The phone's outbox: at-least-once delivery on top of socket.io, made exactly-once by the server's roll ids.
 * Every operation is stored before it is sent and removed only when the server acknowledges it (saved, a duplicate,
 * or refused for good); a timeout or a dropped connection leaves it stored, and `flush()` (on reconnect, when the page
 * is shown again, on a timer) sends what is left. Records go several at a time; an undo waits for everything before it,
 * and nothing after an undo goes before it, so a roll is never undone before it is stored.
 */
export class RollOutbox {
  private readonly inFlight = new Set<string>();
  private blockedUntil = 0;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private readonly listeners = new Set<(event: OutboxEvent) => void>();

  constructor(
    private readonly store: OutboxStore,
    private readonly transport: OutboxTransport,
    private readonly options: { maxInFlight?: number; retryDelayMs?: number } = {},
  ) {}

  /** Operations not yet acknowledged, oldest first. */
  pending(): OutboxOperation[] {
    return this.store.read();
  }

  /** How many operations are being sent right now. */
  inFlightCount(): number {
    return this.inFlight.size;
  }

  subscribe(listener: (event: OutboxEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Stores an operation, then tries to send it. */
  add(operation: OutboxOperation): void {
    const operations = this.store.read();
    if (!operations.some((entry) => entry.key === operation.key)) this.store.write([...operations, operation]);
    this.emit({ type: "changed" });
    this.flush();
  }

  /** Takes back a roll that has not left the phone yet (an undo before sending); false once it is on its way. */
  withdrawRecord(rollId: string): boolean {
    if (this.inFlight.has(rollId)) return false;
    const operations = this.store.read();
    if (!operations.some((entry) => entry.kind === "record" && entry.key === rollId)) return false;
    this.store.write(operations.filter((entry) => entry.key !== rollId));
    this.emit({ type: "changed" });
    return true;
  }

  /** Sends whatever may go now; call it on connect, on visibilitychange and after any change. */
  flush(): void {
    if (!this.transport.isConnected()) return;
    const wait = this.blockedUntil - Date.now();
    if (wait > 0) {
      this.retryLater(wait);
      return;
    }
    const maxInFlight = this.options.maxInFlight ?? 8;
    const operations = this.store.read();
    for (let index = 0; index < operations.length; index += 1) {
      const operation = operations[index];
      if (this.inFlight.has(operation.key)) {
        if (operation.kind === "undo") break;
        continue;
      }
      if (operation.kind === "undo" && index > 0) break;
      if (this.inFlight.size >= maxInFlight) break;
      this.send(operation);
      if (operation.kind === "undo") break;
    }
  }

  /** Stops the retry timer (the page is going away, or a test is done). */
  stop(): void {
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = null;
  }

  private send(operation: OutboxOperation) {
    this.inFlight.add(operation.key);
    const request = operation.kind === "record" ? this.transport.record(operation.roll) : this.transport.undo(operation.rollId);
    request.then(
      (ack) => {
        this.inFlight.delete(operation.key);
        if (ack.ok) {
          this.remove(operation.key);
          this.emit({ type: "saved", operation, duplicate: "duplicate" in ack && ack.duplicate === true });
        } else if (RETRYABLE_ERROR_CODES.includes(ack.error.code)) {
          this.blockedUntil = Date.now() + (ack.error.retryAfterMs ?? this.options.retryDelayMs ?? 2_000);
          this.emit({ type: "waiting", operation, reason: ack.error.message, code: ack.error.code });
        } else {
          this.remove(operation.key);
          this.emit({ type: "refused", operation, error: ack.error });
        }
        this.flush();
      },
      () => {
        this.inFlight.delete(operation.key);
        this.emit({ type: "waiting", operation, reason: "No answer from the server yet." });
        this.retryLater(this.options.retryDelayMs ?? 2_000);
      },
    );
  }

  private remove(key: string) {
    this.store.write(this.store.read().filter((entry) => entry.key !== key));
  }

  private retryLater(delay: number) {
    if (this.retryTimer) return;
    this.retryTimer = setTimeout(() => {
      this.retryTimer = null;
      this.flush();
    }, delay);
  }

  private emit(event: OutboxEvent) {
    for (const listener of this.listeners) listener(event);
  }
}
