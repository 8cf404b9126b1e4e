// A worker thread that pools rolls for Run boards, so a board refresh over thousands of rolls never holds up the
// event loop that acknowledges pupils' rolls. It keeps each watched run's rolls, so a refresh sends only new ones.
// Started by pooling-pool.ts.
import { parentPort } from "node:worker_threads";
import { poolBoard } from "../../shared/class-results/board-pool";
import type { BoardPoolRequest } from "./pooling-pool";

const runs = new Map<string, { generation: number; rolls: BoardPoolRequest["rows"] }>();

parentPort?.on("message", (message: { forget?: string; id: number; request: BoardPoolRequest }) => {
  if (message.forget) {
    runs.delete(message.forget);
    return;
  }
  const { id, request } = message;
  try {
    let rolls = request.rows;
    if (request.keep) {
      const held = runs.get(request.keep.runId);
      if (request.keep.reset) runs.set(request.keep.runId, { generation: request.keep.generation, rolls: [...request.rows] });
      else if (!held || held.generation !== request.keep.generation) {
        parentPort!.postMessage({ id, needsReset: true });
        return;
      } else held.rolls.push(...request.rows);
      rolls = runs.get(request.keep.runId)!.rolls;
    }
    parentPort!.postMessage({ id, result: poolBoard({ ...request, rolls }) });
  } catch (error) {
    parentPort!.postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
});
parentPort?.postMessage({ ready: true });
