import path from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import PgBoss from "pg-boss";
import type { SetFinderProgress, SetFinderRequest } from "@shared/schemas/set-finder";
import type { SetFinderUpdate } from "@shared/set-finder/search-dice-sets";
import { db, pool } from "../db/client";
import { endSearch, findSearch, markSearchRunning, requeueSearch, writeSearchProgress } from "../db/queries/set-finder-searches";
import { env } from "../env";
import { logger } from "../logger";
import type { SearchWorkerMessage } from "./search-worker";

/** The pg-boss queue Set finder searches wait in; any app process may take one up. */
export const SEARCH_QUEUE = "set-finder-search";
/** How often a running search writes its progress and reads whether it was cancelled, in milliseconds. */
const PROGRESS_WRITE_MS = 400;
/** How long a cancelled search may take to hand back its best sets before its thread is stopped. */
const STOP_GRACE_MS = 1500;
/** A search whose process died is taken up again this long after its time budget ran out. */
const EXPIRY_MARGIN_SECONDS = 30;

// Any fixed 64-bit key, as the migrations' lock.
const QUEUE_SETUP_LOCK_KEY = 7_413_900_212;

export const emptyProgress: SetFinderProgress = { examined: 0, total: 0, fraction: 0, etaSeconds: null };

type SearchJobData = { searchId: string };
type LocalSearch = { stopFlag: Int32Array; requeue: boolean; requestStop?: () => void };

let starting: Promise<PgBoss> | undefined;
const local = new Map<string, LocalSearch>();

/** The search worker's entry: TypeScript through tsx in development and tests, the built file in production. */
function searchWorkerUrl(): URL {
  return import.meta.url.endsWith(".ts")
    ? new URL("./start-search-worker.mjs", import.meta.url)
    : pathToFileURL(path.join(env.projectRoot, "dist/server/search-worker.js"));
}

/**
 * Starts pg-boss on the app's database once per process and works SET_FINDER_SEARCHES_PER_PROCESS searches at a time.
 * pg-boss keeps the jobs in PostgreSQL: a search waits for a free slot on any process, and a search whose process dies
 * is taken up again (from the start) once its expiry passes.
 */
export function startSearchQueue(): Promise<PgBoss> {
  starting ??= (async () => {
    const queue = new PgBoss({ connectionString: env.DATABASE_URL, max: 3, schema: "pgboss" });
    queue.on("error", (error) => logger.warn({ err: error }, "Set finder queue could not reach the database"));
    // Processes starting at once take turns: pg-boss's schema set-up and createQueue deadlock when two run together.
    const lock = await pool.connect();
    try {
      await lock.query("select pg_advisory_lock($1)", [QUEUE_SETUP_LOCK_KEY]);
      await queue.start();
      if (!(await queue.getQueue(SEARCH_QUEUE)))
        await queue.createQueue(SEARCH_QUEUE, { name: SEARCH_QUEUE, retryLimit: 3, retryDelay: 1 });
    } finally {
      await lock.query("select pg_advisory_unlock($1)", [QUEUE_SETUP_LOCK_KEY]).catch(() => undefined);
      lock.release();
    }
    for (let slot = 0; slot < env.SET_FINDER_SEARCHES_PER_PROCESS; slot += 1) {
      await queue.work<SearchJobData>(SEARCH_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) =>
        runSearch(job.data.searchId),
      );
    }
    return queue;
  })().catch((error: unknown) => {
    starting = undefined;
    throw error;
  });
  return starting;
}

/** Queues a search that is already in the set_finder_search table. */
export async function enqueueSearch(searchId: string, request: SetFinderRequest): Promise<void> {
  const queue = await startSearchQueue();
  await queue.send(SEARCH_QUEUE, { searchId } satisfies SearchJobData, {
    expireInSeconds: request.timeBudgetSeconds + EXPIRY_MARGIN_SECONDS,
    retryLimit: 3,
    retryDelay: 1,
  });
}

/**
 * Stops taking searches; searches running here go back to the queue for another process (or this one after a restart).
 */
export async function stopSearchQueue(): Promise<void> {
  if (!starting) return;
  const queue = await starting.catch(() => null);
  starting = undefined;
  if (!queue) return;
  await queue.offWork(SEARCH_QUEUE).catch(() => undefined);
  for (const search of local.values()) {
    search.requeue = true;
    if (search.requestStop) search.requestStop();
    else Atomics.store(search.stopFlag, 0, 1);
  }
  await queue.stop({ graceful: true, wait: true, timeout: STOP_GRACE_MS * 2 });
}

/** Runs one search on a worker thread, writing its progress to its row until it ends, is cancelled or must move. */
async function runSearch(searchId: string): Promise<void> {
  const row = await markSearchRunning(db, searchId, emptyProgress, "Starting the search…");
  if (!row) return;
  const stopFlag = new Int32Array(new SharedArrayBuffer(4));
  const search: LocalSearch = { stopFlag, requeue: false };
  local.set(searchId, search);
  let latest: SetFinderUpdate | null = null;
  let lastRunning: SetFinderProgress | null = null;
  let written: SetFinderUpdate | null = null;
  const worker = new Worker(searchWorkerUrl(), { workerData: { request: row.request, stopFlag: stopFlag.buffer } });
  worker.unref();

  const ended = new Promise<{ kind: "done"; update: SetFinderUpdate } | { kind: "failed"; message: string }>((resolve) => {
    worker.on("message", (message: SearchWorkerMessage) => {
      if (message.kind === "progress") {
        latest = message.update;
        lastRunning = message.update.progress;
      } else resolve(message);
    });
    worker.on("error", (error) => {
      logger.error({ err: error, searchId }, "set finder worker failed");
      resolve({ kind: "failed", message: "The search failed on the server; try again, or ask for a smaller search." });
    });
    worker.on("exit", () => resolve({ kind: "failed", message: "The search stopped before it finished; try again." }));
  });

  let graceTimer: NodeJS.Timeout | undefined;
  const requestStop = () => {
    if (Atomics.load(stopFlag, 0) === 1 && graceTimer) return;
    Atomics.store(stopFlag, 0, 1);
    graceTimer ??= setTimeout(() => void worker.terminate(), STOP_GRACE_MS);
  };
  search.requestStop = requestStop;

  // Progress goes to the row a few times a second; the answer says whether the owner asked to stop (from any process).
  const writer = setInterval(() => {
    const update = latest;
    if (update === written || update === null) {
      void findSearch(db, searchId).then(
        (current) => {
          if (current?.cancelRequested) requestStop();
        },
        () => undefined,
      );
      return;
    }
    written = update;
    void writeSearchProgress(db, searchId, update).then(
      (cancelRequested) => {
        if (cancelRequested !== false) requestStop();
      },
      (error: unknown) => logger.warn({ err: error, searchId }, "could not write Set finder progress"),
    );
  }, PROGRESS_WRITE_MS);

  try {
    const outcome = await ended;
    const stopped = Atomics.load(stopFlag, 0) === 1;
    if (search.requeue) {
      await requeueSearch(db, searchId, "Moved to another server process; the search starts again there.");
      throw new Error("The process is stopping; the search goes back to the queue.");
    }
    if (outcome.kind === "failed" && !stopped) {
      await endSearch(db, searchId, "failed", { message: outcome.message });
      return;
    }
    // A search stopped past its grace period hands back what its last progress report held.
    const final: SetFinderUpdate | null = outcome.kind === "done" ? outcome.update : latest;
    if (final === null) {
      await endSearch(db, searchId, "cancelled", {
        progress: { ...(lastRunning ?? emptyProgress), etaSeconds: null },
        message: "Cancelled. No set had turned up yet.",
      });
      return;
    }
    if (stopped) {
      // A cancelled search reports the share it had examined, not the "everything examined" of a search that ran out.
      const share: SetFinderProgress = lastRunning ?? emptyProgress;
      await endSearch(db, searchId, "cancelled", {
        mode: final.mode,
        results: final.results,
        complete: false,
        progress: { ...share, etaSeconds: null },
        message: `Cancelled. ${final.results.length > 0 ? "The sets shown are the best found before it stopped, each checked by the exact engine." : "No set had turned up yet."}`,
      });
      return;
    }
    await endSearch(db, searchId, "finished", {
      mode: final.mode,
      results: final.results,
      complete: final.complete,
      progress: final.progress,
      message: final.message,
    });
  } finally {
    clearInterval(writer);
    clearTimeout(graceTimer);
    local.delete(searchId);
    void worker.terminate();
  }
}

export { STOP_GRACE_MS };
