import type { Socket } from "socket.io-client";
import { EVENTS } from "@shared/event-names";
import type { RollRecordAck, RollUndoAck } from "@shared/events";
import type { OutboxTransport } from "./roll-outbox";

/** Milliseconds to wait for an acknowledgement before the outbox counts the operation as not arrived (and keeps it). */
export const ACK_TIMEOUT_MS = 8_000;

/**
 * The outbox's way to the server over socket.io, each emit with an acknowledgement timeout. Retries are the outbox's
 * job rather than socket.io's own `retries` queue, because that queue lives in memory and a reload would lose it.
 */
export function socketOutboxTransport(socket: Socket, token: () => string, timeoutMs = ACK_TIMEOUT_MS): OutboxTransport {
  return {
    isConnected: () => socket.connected,
    record: (roll) => socket.timeout(timeoutMs).emitWithAck(EVENTS.rollRecord, { token: token(), roll }) as Promise<RollRecordAck>,
    undo: (rollId) => socket.timeout(timeoutMs).emitWithAck(EVENTS.rollUndo, { token: token(), rollId }) as Promise<RollUndoAck>,
  };
}
