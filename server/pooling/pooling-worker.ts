// A worker thread that pools rolls for Run boards, so a board refresh over thousands of rolls never holds up the
// event loop that acknowledges pupils' rolls. It keeps each watched run's running pool, so a refresh sends only the
// new rolls and pools only those. Started by pooling-pool.ts.
import { parentPort } from "node:worker_threads";
import { BoardPool, poolBoard, SimulatedRollError, type BoardPools } from "../../shared/class-results/board-pool";
import { encodeBoardTallies } from "../../shared/events";
import type { BoardPoolRequest, KeptBoardPoolRequest } from "./pooling-pool";
import { requestRows } from "./pool-rows-wire";

const runs = new Map<string, { generation: number; ids: Set<string>; pool: BoardPool }>();

/** A watched run's figures, with the tallies encoded here so the main thread sends them on untouched. */
function encoded(pools: BoardPools): BoardPools<Uint8Array> {
  return { ...pools, tallies: encodeBoardTallies(pools.tallies) };
}

function pooled(request: BoardPoolRequest | KeptBoardPoolRequest): BoardPools | BoardPools<Uint8Array> | null {
  const rows = requestRows(request.rows);
  if (!("keep" in request)) return poolBoard({ ...request, rolls: rows });
  const { keep, rows: _rows, nicknames, ...settings } = request;
  if (keep.reset) {
    const run = { generation: keep.generation, ids: new Set(rows.map((row) => row.id)), pool: BoardPool.of(settings, rows) };
    runs.set(keep.runId, run);
    return encoded(run.pool.result(nicknames));
  }
  const run = runs.get(keep.runId);
  if (!run || run.generation !== keep.generation) return null;
  // A roll the batcher reported while the last full read was running may be in both: it is pooled once.
  const fresh = rows.filter((row) => !run.ids.has(row.id));
  for (const row of fresh) run.ids.add(row.id);
  try {
    run.pool.add(fresh);
  } catch (error) {
    // New rolls come from pupils' phones; simulated ones come with a full read. Pool the run again from the database.
    if (!(error instanceof SimulatedRollError)) throw error;
    runs.delete(keep.runId);
    return null;
  }
  return encoded(run.pool.result(nicknames));
}

parentPort?.on("message", (message: { forget?: string; id: number; request: BoardPoolRequest }) => {
  if (message.forget) {
    runs.delete(message.forget);
    return;
  }
  const { id, request } = message;
  try {
    const result = pooled(request);
    if (!result) parentPort!.postMessage({ id, needsReset: true });
    // The encoded tallies' memory moves to the main thread rather than being copied.
    else if (result.tallies instanceof Uint8Array) parentPort!.postMessage({ id, result }, [result.tallies.buffer as ArrayBuffer]);
    else parentPort!.postMessage({ id, result });
  } catch (error) {
    parentPort!.postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
});
parentPort?.postMessage({ ready: true });
