import path from "node:path";
import { Worker } from "node:worker_threads";
import { env } from "../env";
import { poolBoard, type BoardPools, type BoardPoolSettings } from "@shared/class-results/board-pool";
import { encodeBoardTallies } from "@shared/events";
import type { PoolRow } from "../db/queries/class-runs";
import { logger } from "../logger";
import { requestRows } from "./pool-rows-wire";

/** One board's rolls to pool at once: the rows, or a `poolRowsJson` string of them (quicker to post than many objects). */
export type BoardPoolRequest = BoardPoolSettings & { nicknames: Record<string, string>; rows: PoolRow[] | string };

/**
 * One refresh of a watched run: the worker holds the run's running pool between refreshes. `reset` sends every kept
 * roll, otherwise `rows` are only the new ones, added (once each) to what the worker holds for that `generation`.
 * The answer's tallies are the UTF-8 JSON bytes a board:update carries.
 */
export type KeptBoardPoolRequest = BoardPoolRequest & { keep: { runId: string; generation: number; reset: boolean } };

/** The worker could not add new rows (it was restarted, or lost the run): send every row again. */
export class NeedsResetError extends Error {}

type Result = BoardPools | BoardPools<Uint8Array>;
type Waiting = { resolve: (result: Result) => void; reject: (error: Error) => void };

let worker: Worker | null = null;
let unavailable = false;
let ready = false;
let nextId = 1;
const beforeReady: (() => void)[] = [];
const waiting = new Map<number, Waiting>();

function giveUp(reason: string, error?: unknown) {
  logger.warn({ err: error }, `${reason}; Run boards pool on the main thread from now on`);
  unavailable = true;
  worker = null;
  for (const entry of waiting.values()) entry.reject(new Error(reason));
  waiting.clear();
  for (const send of beforeReady.splice(0)) send();
}

function startWorker(): Worker | null {
  if (unavailable) return null;
  if (worker) return worker;
  try {
    // The worker is TypeScript like the server; Node 20 workers ignore --import tsx, so a two-line bootstrap registers it.
    const started = import.meta.url.endsWith(".ts")
      ? new Worker(
          `import("tsx/esm/api").then(({ register }) => { register(); return import(${JSON.stringify(new URL("./pooling-worker.ts", import.meta.url).href)}); });`,
          { eval: true },
        )
      : // The built server (npm run build) has the worker as an entry of its own.
        new Worker(path.join(env.projectRoot, "dist/server/pooling-worker.js"));
    worker = started;
    started.unref();
    started.on("message", (message: { ready?: boolean; id: number; result?: Result; needsReset?: boolean; error?: string }) => {
      if (message.ready) {
        ready = true;
        for (const send of beforeReady.splice(0)) send();
        return;
      }
      const entry = waiting.get(message.id);
      if (!entry) return;
      waiting.delete(message.id);
      if (message.result) entry.resolve(message.result);
      else if (message.needsReset) entry.reject(new NeedsResetError("the pooling worker needs every row again"));
      else entry.reject(new Error(message.error ?? "pooling failed"));
    });
    started.on("error", (error) => giveUp("pooling worker stopped", error));
    started.on("exit", () => {
      if (worker === started) giveUp("pooling worker exited");
    });
    // A worker that never says it is ready is given up on.
    setTimeout(() => {
      if (!ready && worker === started) {
        void started.terminate();
        giveUp("pooling worker did not start in time");
      }
    }, 15_000).unref();
    return started;
  } catch (error) {
    giveUp("pooling worker did not start", error);
    return null;
  }
}

function postToWorker(running: Worker, request: BoardPoolRequest | KeptBoardPoolRequest): Promise<Result> {
  const id = nextId++;
  return new Promise<Result>((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    const send = () => (unavailable ? reject(new Error("pooling worker unavailable")) : running.postMessage({ id, request }));
    if (ready) send();
    else beforeReady.push(send);
  });
}

/** Pools one board's rolls on the worker thread (on this thread when the worker is unavailable). */
export async function poolBoardOffThread(request: BoardPoolRequest): Promise<BoardPools> {
  const running = startWorker();
  if (!running) return poolBoard({ ...request, rolls: requestRows(request.rows) });
  return (await postToWorker(running, request)) as BoardPools;
}

/** Pools a watched run's refresh on the worker thread; rejects with NeedsResetError when the worker lacks the run's rows. */
export async function poolKeptBoardOffThread(request: KeptBoardPoolRequest): Promise<BoardPools<Uint8Array>> {
  const running = startWorker();
  if (!running) {
    // Without the worker nobody holds the run's earlier rolls: new rows alone cannot be pooled.
    if (!request.keep.reset) throw new NeedsResetError("no pooling worker holds this run's rolls");
    const pools = poolBoard({ ...request, rolls: requestRows(request.rows) });
    return { ...pools, tallies: encodeBoardTallies(pools.tallies) };
  }
  return (await postToWorker(running, request)) as BoardPools<Uint8Array>;
}

/** Lets the worker drop a run nobody watches any more. */
export function forgetBoardRun(runId: string) {
  if (worker && ready) worker.postMessage({ forget: runId });
}
