import { Worker } from "node:worker_threads";
import type { SetFinderJob, SetFinderRequest } from "@shared/schemas/set-finder";
import type { SetFinderUpdate } from "@shared/set-finder/search-dice-sets";
import { logger } from "../logger";
import type { SearchWorkerMessage } from "./search-worker";

/** Searches one teacher may run at once. */
export const RUNNING_PER_TEACHER = 2;
/** Searches kept per teacher (running and ended); the oldest ended one goes first. */
export const KEPT_PER_TEACHER = 10;
/** Searches running at once on the server: each takes a whole core while it runs. */
export const RUNNING_ON_SERVER = 4;
/** An ended search is forgotten this long after it ended. */
export const KEPT_FOR_MS = 60 * 60 * 1000;
/** How long a cancelled search may take to hand back its best sets before its thread is stopped. */
const STOP_GRACE_MS = 1500;

type Job = SetFinderJob & { ownerId: string; worker: Worker | null; stopFlag: Int32Array; endedAt: number | null; ended: Promise<void>; markEnded: () => void };

const jobs = new Map<string, Job>();

/** Why a search could not start: the teacher or the server already runs as many as allowed. */
export class SearchLimitError extends Error {}

function forgetOld(now: number) {
  for (const [id, job] of jobs) if (job.endedAt !== null && now - job.endedAt > KEPT_FOR_MS) jobs.delete(id);
}

function ownedBy(ownerId: string): Job[] {
  return [...jobs.values()].filter((job) => job.ownerId === ownerId);
}

function applyUpdate(job: Job, update: SetFinderUpdate) {
  job.mode = update.mode;
  job.progress = update.progress;
  job.results = update.results;
  job.complete = update.complete;
  job.message = update.message;
}

function end(job: Job, status: SetFinderJob["status"], message?: string) {
  if (job.endedAt !== null) return;
  job.status = status;
  if (message !== undefined) job.message = message;
  job.endedAt = Date.now();
  job.finishedAt = new Date(job.endedAt).toISOString();
  if (status !== "finished") job.progress = { ...job.progress, etaSeconds: null };
  const worker = job.worker;
  job.worker = null;
  job.markEnded();
  void worker?.terminate();
}

/** Starts a search in its own worker thread and answers its id at once. */
export function startSearchJob(ownerId: string, request: SetFinderRequest): string {
  const now = Date.now();
  forgetOld(now);
  const running = [...jobs.values()].filter((job) => job.status === "running");
  if (running.filter((job) => job.ownerId === ownerId).length >= RUNNING_PER_TEACHER) {
    throw new SearchLimitError(`You already have ${RUNNING_PER_TEACHER} searches running; wait for one to finish or cancel it.`);
  }
  if (running.length >= RUNNING_ON_SERVER) throw new SearchLimitError("The server is running as many searches as it can; try again in a minute.");
  const mine = ownedBy(ownerId).filter((job) => job.endedAt !== null).sort((a, b) => a.endedAt! - b.endedAt!);
  while (mine.length > 0 && ownedBy(ownerId).length >= KEPT_PER_TEACHER) jobs.delete(mine.shift()!.id);

  const id = crypto.randomUUID();
  const stopFlag = new Int32Array(new SharedArrayBuffer(4));
  let markEnded = () => {};
  const ended = new Promise<void>((resolve) => (markEnded = resolve));
  const job: Job = {
    id,
    ownerId,
    status: "running",
    request,
    mode: null,
    progress: { examined: 0, total: 0, fraction: 0, etaSeconds: null },
    results: [],
    complete: false,
    message: "Starting the search…",
    startedAt: new Date(now).toISOString(),
    finishedAt: null,
    worker: null,
    stopFlag,
    endedAt: null,
    ended,
    markEnded,
  };
  jobs.set(id, job);

  // The worker runs from TypeScript source: its start file registers tsx in the thread first (see start-search-worker.mjs).
  const worker = new Worker(new URL("./start-search-worker.mjs", import.meta.url), { workerData: { request, stopFlag: stopFlag.buffer } });
  worker.unref();
  job.worker = worker;
  worker.on("message", (message: SearchWorkerMessage) => {
    if (job.endedAt !== null) return;
    if (message.kind === "progress") applyUpdate(job, message.update);
    else if (message.kind === "done") {
      applyUpdate(job, message.update);
      end(job, Atomics.load(stopFlag, 0) === 1 ? "cancelled" : "finished");
    } else end(job, "failed", `The search failed: ${message.message}`);
  });
  worker.on("error", (error) => {
    logger.error({ err: error, searchId: id }, "set finder worker failed");
    end(job, "failed", "The search failed on the server; try again, or ask for a smaller search.");
  });
  worker.on("exit", () => end(job, "failed", "The search stopped before it finished; try again."));
  return id;
}

function publicView(job: Job): SetFinderJob {
  const { id, status, request, mode, progress, results, complete, message, startedAt, finishedAt } = job;
  return { id, status, request, mode, progress, results, complete, message, startedAt, finishedAt };
}

/** The teacher's search, or null (another teacher's search is not theirs to see). */
export function findSearchJob(ownerId: string, id: string): SetFinderJob | null {
  const job = jobs.get(id);
  return job && job.ownerId === ownerId ? publicView(job) : null;
}

/** Stops a running search, keeping the best verified sets it found; an ended search is left as it is. Answers null when not theirs. */
export async function cancelSearchJob(ownerId: string, id: string): Promise<SetFinderJob | null> {
  const job = jobs.get(id);
  if (!job || job.ownerId !== ownerId) return null;
  if (job.status === "running") {
    Atomics.store(job.stopFlag, 0, 1);
    const grace = new Promise<void>((resolve) => setTimeout(resolve, STOP_GRACE_MS).unref());
    await Promise.race([job.ended, grace]);
    end(job, "cancelled");
    job.status = "cancelled";
    job.message = `Cancelled. ${job.results.length > 0 ? "The sets shown are the best found before it stopped, each checked by the exact engine." : "No set had turned up yet."}`;
  }
  return publicView(job);
}

/** Stops every running search (at server shutdown and after tests). */
export async function stopAllSearchJobs(): Promise<void> {
  await Promise.all([...jobs.values()].filter((job) => job.status === "running").map((job) => cancelSearchJob(job.ownerId, job.id)));
}
