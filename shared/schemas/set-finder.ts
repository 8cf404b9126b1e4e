import { z } from "zod";
import { faceValueSchema } from "../probability/die";

/** Fewest dice the Set finder looks for. */
export const FINDER_DICE_MIN = 3;
/** Most dice the Set finder looks for. */
export const FINDER_DICE_MAX = 6;
/** Fewest faces per die the Set finder allows. */
export const FINDER_FACES_MIN = 4;
/** Most faces per die the Set finder allows. */
export const FINDER_FACES_MAX = 12;
/** Most distinct face values a request may allow (a range's width or a list's length). */
export const FINDER_VALUES_MAX = 40;
/** Most results one search returns. */
export const FINDER_RESULTS_MAX = 50;
/** Longest time budget a search may ask for, in seconds. */
export const FINDER_TIME_BUDGET_MAX = 300;
/** Time budget when a request names none, in seconds. */
export const FINDER_TIME_BUDGET_DEFAULT = 60;

/** The face values the dice may carry: a whole range, or a list of chosen values. */
export const finderFaceValuesSchema = z.discriminatedUnion("kind", [
  z
    .object({ kind: z.literal("range"), min: faceValueSchema, max: faceValueSchema })
    .refine((range) => range.min < range.max, { error: "The smallest face value must be below the largest.", path: ["max"] })
    .refine((range) => range.max - range.min + 1 <= FINDER_VALUES_MAX, {
      error: `Allow at most ${FINDER_VALUES_MAX} face values (for example 1 to ${FINDER_VALUES_MAX}).`,
      path: ["max"],
    }),
  z.object({
    kind: z.literal("list"),
    values: z
      .array(faceValueSchema)
      .min(2, "List at least 2 face values.")
      .max(FINDER_VALUES_MAX, `List at most ${FINDER_VALUES_MAX} face values.`)
      .refine((values) => new Set(values).size === values.length, { error: "List each face value once." }),
  }),
]);
export type FinderFaceValues = z.infer<typeof finderFaceValuesSchema>;

/**
 * What the set must do with one die each (and two dice each):
 * "one-cycle": the dice in order beat each other round one cycle through every die;
 * "reversing-cycle": as one-cycle, and with two dice each every matchup of that cycle reverses;
 * "two-cycles": two cycles through every die sharing no matchup, one keeping its direction and one reversing with two dice each (5 or 6 dice).
 */
export const finderPropertySchema = z.enum(["one-cycle", "reversing-cycle", "two-cycles"]);
export type FinderProperty = z.infer<typeof finderPropertySchema>;

/** "strongest-cycle": maximise the smallest winning chance the property relies on; "small-faces": prefer small face values. */
export const finderObjectiveSchema = z.enum(["strongest-cycle", "small-faces"]);
export type FinderObjective = z.infer<typeof finderObjectiveSchema>;

/** A Set finder request, shared by the form, the route, the worker and the tests. */
export const setFinderRequestSchema = z
  .object({
    diceCount: z
      .number({ error: "Number of dice must be a number." })
      .int("Number of dice must be a whole number.")
      .min(FINDER_DICE_MIN, `The Set finder looks for at least ${FINDER_DICE_MIN} dice.`)
      .max(FINDER_DICE_MAX, `The Set finder looks for at most ${FINDER_DICE_MAX} dice.`),
    facesPerDie: z
      .number({ error: "Faces per die must be a number." })
      .int("Faces per die must be a whole number.")
      .min(FINDER_FACES_MIN, `Each die needs at least ${FINDER_FACES_MIN} faces.`)
      .max(FINDER_FACES_MAX, `Each die can have at most ${FINDER_FACES_MAX} faces.`),
    faceValues: finderFaceValuesSchema,
    property: finderPropertySchema,
    /** False: no two dice share a face value, so a roll of one die each never ties. */
    allowTies: z.boolean().default(false),
    /** True: leave out dice whose faces all show the same value (a die like 3, 3, 3, 3 hardly feels like a die in a lesson). */
    refuseAllEqualFaces: z.boolean().default(true),
    objective: finderObjectiveSchema.default("strongest-cycle"),
    maxResults: z
      .number()
      .int("Number of results must be a whole number.")
      .min(1, "Ask for at least 1 result.")
      .max(FINDER_RESULTS_MAX, `Ask for at most ${FINDER_RESULTS_MAX} results.`)
      .default(10),
    /** The search stops after this many seconds and returns the best sets found so far. */
    timeBudgetSeconds: z
      .number()
      .int("The time budget must be a whole number of seconds.")
      .min(1, "Give the search at least 1 second.")
      .max(FINDER_TIME_BUDGET_MAX, `Give the search at most ${FINDER_TIME_BUDGET_MAX} seconds.`)
      .default(FINDER_TIME_BUDGET_DEFAULT),
    /** Seed for the randomized search used on large requests, so a search can be repeated. */
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 31 - 1)
      .optional(),
  })
  .refine((request) => request.property !== "two-cycles" || request.diceCount >= 5, {
    error: "Two cycles that share no matchup need at least 5 dice.",
    path: ["diceCount"],
  })
  .refine((request) => request.allowTies || allowedValueCount(request.faceValues) >= request.diceCount, {
    error: "Without ties every die needs face values of its own: allow at least as many values as dice, or allow ties.",
    path: ["allowTies"],
  });
export type SetFinderRequest = z.infer<typeof setFinderRequestSchema>;
/** A request as a client may send it (defaults not yet filled in). */
export type SetFinderRequestInput = z.input<typeof setFinderRequestSchema>;

/** How many distinct face values a request allows. */
export function allowedValueCount(faceValues: FinderFaceValues): number {
  return faceValues.kind === "range" ? faceValues.max - faceValues.min + 1 : faceValues.values.length;
}

/** The key figures of one found set, all computed by the exact engine (analyzeSet). */
export interface FoundSetFigures {
  /** Smallest P(win) along the main cycle with one die each, as "a/b". */
  weakestCycleWin: string;
  weakestCycleWinDecimal: number;
  /** The main cycle as indices into `dice`: each beats the next, the last beats the first (one die each). */
  cycleOrder: number[];
  /** P(win) of each matchup of the main cycle with one die each, as "a/b", in cycle order. */
  cycleWins: string[];
  /** True when every matchup of the main cycle reverses with two dice each. */
  reversesWithTwoDice: boolean;
  /** Two-cycles only: the second cycle (one die each), the one that reverses with two dice each; otherwise null. */
  secondCycleOrder: number[] | null;
  /** Smallest P(win) the property relies on with two dice each (the reversed or kept matchups), as "a/b"; null for one-cycle. */
  weakestTwoDiceWin: string | null;
  weakestTwoDiceWinDecimal: number | null;
  /** True when some pair of dice shares a face value, so a roll of one die each can tie. */
  hasTies: boolean;
  /** For every pair of opponents' dice, some other die beats both of them head to head with one or with two dice each. */
  beatsAnyTwoOpponents: boolean;
  largestFace: number;
  smallestFace: number;
  faceTotal: number;
}

/** One set the Set finder returns, already verified by the exact engine. */
export interface FoundSet {
  dice: { name: string; faces: number[] }[];
  figures: FoundSetFigures;
  /** Higher is better under the request's objective (see docs/user-guide.md, "The Set finder"). */
  score: number;
  /** How many other found sets play every matchup the search asked about with the same chances, folded into this one ("and 4 variants"). */
  variants?: number;
}

/** How far a search has got. `examined` counts candidate sets settled, whether checked one by one or ruled out together by a bound. */
export interface SetFinderProgress {
  examined: number;
  total: number;
  fraction: number;
  etaSeconds: number | null;
}

/** "queued": waiting for a free search slot on some app process. */
export type SetFinderStatus = "queued" | "running" | "finished" | "cancelled" | "failed";

/**
 * "exhaustive": every candidate up to symmetry (results are the proven best unless the time budget ran out); "randomized": a local
 * search within the time budget.
 */
export type SetFinderMode = "exhaustive" | "randomized";

/** What GET /api/set-finder/searches/:id answers. */
export interface SetFinderJob {
  id: string;
  status: SetFinderStatus;
  request: SetFinderRequest;
  mode: SetFinderMode | null;
  progress: SetFinderProgress;
  results: FoundSet[];
  /** True when an exhaustive search covered the whole space, so the results are the best there are. */
  complete: boolean;
  message?: string;
  startedAt: string;
  finishedAt: string | null;
}

/** One of a teacher's recent searches, as the Set finder page lists them (GET /api/set-finder/searches). */
export type SetFinderSearchSummary = Omit<SetFinderJob, "results"> & {
  resultCount: number;
  /** The best set's weakest cycle win ("a/b"), or null when none was found. */
  bestWeakestCycleWin: string | null;
};

/** Route parameters naming one search. */
export const setFinderSearchIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a search id." }) });
