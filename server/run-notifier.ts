import { EventEmitter } from "node:events";

/** What changed in a class run: the socket layer turns each into broadcasts and a board refresh. */
export type RunChange =
  | { runId: string; kind: "status" }
  | { runId: string; kind: "phase" }
  | { runId: string; kind: "group"; groupId: string }
  | { runId: string; kind: "removed"; groupId: string }
  | { runId: string; kind: "run" }
  | { runId: string; kind: "groups" }
  | { runId: string; kind: "rolls" }
  | { runId: string; kind: "vote" };

const emitter = new EventEmitter();
emitter.setMaxListeners(50);

/** Services call this after a change commits; it never throws back into the service. */
export function notifyRunChanged(change: RunChange): void {
  emitter.emit("change", change);
}

/** The socket layer subscribes here; returns the unsubscribe function. */
export function onRunChanged(listener: (change: RunChange) => void): () => void {
  emitter.on("change", listener);
  return () => emitter.off("change", listener);
}
