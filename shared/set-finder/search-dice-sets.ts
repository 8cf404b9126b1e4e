import {
  type FoundSet,
  type SetFinderMode,
  type SetFinderProgress,
  type SetFinderRequest,
  type SetFinderRequestInput,
  setFinderRequestSchema,
} from "../schemas/set-finder";
import { allowedFaceValues, buildDicePool, candidateDieCount } from "./candidate-dice";
import { exhaustiveSearch, type ExhaustiveTally } from "./exhaustive-search";
import { randomizedSearch } from "./randomized-search";
import { type Candidate, TopList } from "./ranking";
import { collapseEquivalentSets } from "./equivalent-sets";
import { verifyFoundSet } from "./verify-found-set";

/** Largest pool of candidate dice the exhaustive search takes on (its win table holds pool² bytes); above it the search is randomized. */
export const EXHAUSTIVE_POOL_MAX = 4000;

/** What a search reports while it runs and when it ends. */
export interface SetFinderUpdate {
  mode: SetFinderMode;
  progress: SetFinderProgress;
  /** The best sets so far, best first, each verified by the exact engine. */
  results: FoundSet[];
  /** True when an exhaustive search covered every candidate, so the results are the best there are. */
  complete: boolean;
  message: string;
  /** Candidate cycles checked one by one (exhaustive) or sets evaluated (randomized). */
  checked: number;
  elapsedSeconds: number;
}

export interface SearchOptions {
  /** Milliseconds between progress reports (default 250). */
  progressIntervalMs?: number;
  /** Seconds of randomized search an exhaustive search starts with, to find strong sets early so its bound prunes sooner (default 0.3). */
  warmUpSeconds?: number;
  /** The clock in milliseconds (default performance.now). */
  now?: () => number;
  /** Fold sets that play every asked matchup alike into one result with a variants count (default true). */
  collapseVariants?: boolean;
}

/** How many ranked sets the search keeps per result asked for when folding variants, so folding still leaves enough distinct results. */
export const KEPT_PER_RESULT_WHEN_FOLDING = 3;

/** How an exhaustive search would cover a request, or why it would not: used to choose the mode. */
export function searchPlan(request: SetFinderRequest): { mode: SetFinderMode; poolSize: number; values: number[]; shiftsPruned: boolean } {
  const values = allowedFaceValues(request.faceValues);
  const poolSize = candidateDieCount(values.length, request.facesPerDie);
  return {
    mode: poolSize <= EXHAUSTIVE_POOL_MAX ? "exhaustive" : "randomized",
    poolSize,
    values,
    shiftsPruned: request.faceValues.kind === "range",
  };
}

/**
 * Searches for dice sets with the requested property, ranked by the objective, within the request's time budget.
 * Small requests are searched exhaustively up to symmetry (faces sorted, cycles up to rotation, value shifts), with branch and bound;
 * requests with more than EXHAUSTIVE_POOL_MAX candidate dice get a randomized local search. Every result is verified by the exact
 * engine before it is reported; sets that play every asked matchup alike are folded into the best of them (`variants`). Synchronous
 * and free of I/O, so it runs in a worker thread; `shouldStop` ends it early with the best so far.
 */
export function searchDiceSets(
  input: SetFinderRequestInput,
  onProgress: (update: SetFinderUpdate) => void = () => {},
  shouldStop: () => boolean = () => false,
  options: SearchOptions = {},
): SetFinderUpdate {
  const request = setFinderRequestSchema.parse(input);
  const now = options.now ?? (() => performance.now());
  const interval = options.progressIntervalMs ?? 250;
  const started = now();
  const deadline = started + request.timeBudgetSeconds * 1000;
  const plan = searchPlan(request);
  const collapse = options.collapseVariants ?? true;
  const top = new TopList(request.objective, collapse ? request.maxResults * KEPT_PER_RESULT_WHEN_FOLDING : request.maxResults);
  const verified = new Map<string, FoundSet | null>();
  let failedChecks = 0;
  let stoppedByCaller = false;
  const outOfTime = () => now() >= deadline;
  const stop = () => {
    if (shouldStop()) stoppedByCaller = true;
    return stoppedByCaller || outOfTime();
  };

  const results = (): FoundSet[] => {
    const found: FoundSet[] = [];
    for (const candidate of top.list()) {
      const cacheKey = orderKey(candidate);
      if (!verified.has(cacheKey)) {
        const checked = verifyFoundSet(request, candidate);
        if (checked === null) failedChecks += 1;
        verified.set(cacheKey, checked);
      }
      const checked = verified.get(cacheKey);
      if (checked) found.push(checked);
    }
    return collapse ? collapseEquivalentSets(request.property, found, request.maxResults) : found;
  };
  const elapsedSeconds = () => (now() - started) / 1000;
  let lastReport = Number.NEGATIVE_INFINITY;
  const report = (build: () => Omit<SetFinderUpdate, "results" | "elapsedSeconds">, force = false) => {
    const time = now();
    if (!force && time - lastReport < interval) return;
    lastReport = time;
    onProgress({ ...build(), results: results(), elapsedSeconds: elapsedSeconds() });
  };
  const budgetLeft = () => Math.max(0, (deadline - now()) / 1000);

  if (plan.mode === "randomized") {
    const describe = `${plan.poolSize.toLocaleString("en-GB")} candidate dice are too many for an exhaustive search, so a randomized local search (simulated annealing with restarts) runs for the ${request.timeBudgetSeconds} s time budget; the sets shown are the best found, not proven best.`;
    const progressOf = (evaluated: number): SetFinderProgress => {
      const elapsed = elapsedSeconds();
      const fraction = Math.min(1, elapsed / request.timeBudgetSeconds);
      return {
        examined: evaluated,
        total: elapsed > 0 ? Math.max(evaluated, Math.round((evaluated / elapsed) * request.timeBudgetSeconds)) : evaluated,
        fraction,
        etaSeconds: budgetLeft(),
      };
    };
    const tally = randomizedSearch(request, plan.values, plan.shiftsPruned, top, {
      shouldStop: stop,
      seed: request.seed ?? Math.floor(Math.random() * 2 ** 31),
      onTick: (current) =>
        report(() => ({
          mode: "randomized",
          progress: progressOf(current.evaluated),
          complete: false,
          message: describe,
          checked: current.evaluated,
        })),
    });
    const final = results();
    const ending = stoppedByCaller
      ? "Stopped on request."
      : `Searched for ${Math.round(elapsedSeconds())} s, ${tally.evaluated.toLocaleString("en-GB")} sets evaluated.`;
    return {
      mode: "randomized",
      progress: { ...progressOf(tally.evaluated), total: tally.evaluated, fraction: 1, etaSeconds: 0 },
      results: final,
      complete: false,
      message: `${ending} ${final.length === 0 ? "No set with this property turned up; try more face values, more faces per die, or allowing ties." : describe}${checkNote(failedChecks)}`,
      checked: tally.evaluated,
      elapsedSeconds: elapsedSeconds(),
    };
  }

  const pool = buildDicePool(plan.values, request.facesPerDie);
  const warmUp = Math.min(options.warmUpSeconds ?? 0.3, request.timeBudgetSeconds / 10);
  if (warmUp > 0) {
    const warmUpEnd = now() + warmUp * 1000;
    randomizedSearch(request, plan.values, plan.shiftsPruned, top, {
      shouldStop: () => stop() || now() >= warmUpEnd,
      seed: request.seed ?? 1,
      onTick: () => {},
    });
  }
  const describe = `Exhaustive search over ${pool.size.toLocaleString("en-GB")} candidate dice (faces sorted, cycles up to rotation${plan.shiftsPruned ? ", values shifted down to the lowest allowed" : ""}).`;
  const progressOf = (tally: ExhaustiveTally): SetFinderProgress => {
    const fraction = tally.total === 0 ? 1 : Math.min(1, tally.settled / tally.total);
    const elapsed = elapsedSeconds();
    const estimate = fraction > 0.001 ? (elapsed * (1 - fraction)) / fraction : null;
    return {
      examined: tally.settled,
      total: tally.total,
      fraction,
      etaSeconds: estimate === null ? null : Math.min(estimate, budgetLeft()),
    };
  };
  const outcome = exhaustiveSearch(request, pool, plan.shiftsPruned, top, {
    shouldStop: stop,
    onTick: (tally) =>
      report(() => ({ mode: "exhaustive", progress: progressOf(tally), complete: false, message: describe, checked: tally.checked })),
  });
  const final = results();
  const { tally } = outcome;
  const covered = `${(100 * (tally.total === 0 ? 1 : tally.settled / tally.total)).toFixed(1)}%`;
  let message: string;
  if (outcome.complete) {
    message =
      final.length === 0
        ? `${describe} No set with this property exists among the ${formatCount(tally.total)} candidate cycles.`
        : `${describe} All ${formatCount(tally.total)} candidate cycles covered in ${elapsedSeconds().toFixed(1)} s: these are the best sets there are.`;
  } else {
    message = `${describe} ${stoppedByCaller ? "Stopped on request" : "Stopped at the time budget"} after covering ${covered} of the candidates: the sets shown are the best found so far, not proven best.`;
  }
  return {
    mode: "exhaustive",
    progress: { ...progressOf(tally), etaSeconds: 0 },
    results: final,
    complete: outcome.complete,
    message: message + checkNote(failedChecks),
    checked: tally.checked,
    elapsedSeconds: elapsedSeconds(),
  };
}

function orderKey(candidate: Candidate): string {
  return candidate.faces.map((faces) => faces.join(",")).join("|");
}

function formatCount(count: number): string {
  return count < 1e15 ? Math.round(count).toLocaleString("en-GB") : count.toExponential(2);
}

function checkNote(failed: number): string {
  return failed === 0
    ? ""
    : ` ${failed} found ${failed === 1 ? "set" : "sets"} failed the exact engine's check and ${failed === 1 ? "was" : "were"} left out.`;
}
