import { parentPort, workerData } from "node:worker_threads";
import type { SetFinderRequest } from "@shared/schemas/set-finder";
import { searchDiceSets, type SetFinderUpdate } from "@shared/set-finder/search-dice-sets";

/** What the worker posts to the job that started it. */
export type SearchWorkerMessage =
  { kind: "progress"; update: SetFinderUpdate } | { kind: "done"; update: SetFinderUpdate } | { kind: "failed"; message: string };

const { request, stopFlag } = workerData as { request: SetFinderRequest; stopFlag: SharedArrayBuffer };
const stop = new Int32Array(stopFlag);
const post = (message: SearchWorkerMessage) => parentPort!.postMessage(message);

try {
  const final = searchDiceSets(
    request,
    (update) => post({ kind: "progress", update }),
    () => Atomics.load(stop, 0) === 1,
  );
  post({ kind: "done", update: final });
} catch (error) {
  post({ kind: "failed", message: error instanceof Error ? error.message : String(error) });
}
