import { z } from "zod";
import type { PooledResults } from "../class-results/pooled-results";
import type { SetDie } from "./dice-sets";

/** Route parameters naming one class run in the Results area; a malformed id is refused with 400 before any lookup. */
export const resultsRunParamsSchema = z.object({ id: z.uuid({ error: "That is not a class run id." }) });

export const resultsScopeSchema = z.enum(["mine", "department"], { error: "Scope is either mine or department." });
export type ResultsScope = z.infer<typeof resultsScopeSchema>;

export const resultsSortSchema = z.enum(["date", "lesson", "set", "class", "rolls", "groups"], {
  error: "Sort by date, lesson, set, class, rolls or groups.",
});
export type ResultsSort = z.infer<typeof resultsSortSchema>;

const isoDate = z.iso.date({ error: "Write dates as YYYY-MM-DD." });

/** Query parameters of GET /api/results/runs: the Results archive's filters and order. */
export const resultsListQuerySchema = z.object({
  scope: resultsScopeSchema.default("mine"),
  lesson: z.string().trim().max(120, "Keep the lesson search under 120 characters.").optional(),
  set: z.string().trim().max(80, "Keep the set search under 80 characters.").optional(),
  classGroup: z.string().trim().max(40, "Keep the class under 40 characters.").optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  sort: resultsSortSchema.default("date"),
  order: z.enum(["asc", "desc"], { error: "Order is asc or desc." }).default("desc"),
});
export type ResultsListQuery = z.infer<typeof resultsListQuerySchema>;

/** Where a run's rolls came from, told from the rolls themselves. */
export type RecordedOn = "phones" | "paper" | "phones and paper" | "no rolls yet";

/** One closed class run in the Results archive. */
export type ResultsRunSummary = {
  id: string;
  title: string;
  lessonId: string | null;
  classGroup: string;
  diceSetName: string;
  /** Identifies the set by its dice faces (see `diceSetKey`); runs with equal keys can be pooled. */
  setKey: string;
  dieNames: string[];
  /** The run's main mode: the lesson's own, its first tally's. */
  dicePerPlayer: number;
  players: number;
  /** The Twist's tally and mode when the run had one, shown as a second tally; null otherwise. */
  twist: ResultsTally | null;
  tieRule: string;
  /** The day the run was taught (its start). */
  taughtAt: string;
  closedAt: string | null;
  rollCount: number;
  simulatedRollCount: number;
  paperRollCount: number;
  /** Of rollCount (and paperRollCount), the rolls typed into the tally grid as win/tie/loss counts, with no roll-level record. */
  countedRollCount: number;
  groupCount: number;
  recordedOn: RecordedOn;
  ownerName: string;
  isOwner: boolean;
};
export type ResultsRunList = { runs: ResultsRunSummary[] };

/** Query parameters of the rolls and workbook exports. */
export const resultsExportQuerySchema = z.object({
  includeSimulated: z
    .enum(["true", "false"], { error: "includeSimulated is true or false." })
    .default("true")
    .transform((value) => value === "true"),
  // Rolls of groups the teacher left out are in no figure or export unless asked for here.
  includeLeftOut: z
    .enum(["true", "false"], { error: "includeLeftOut is true or false." })
    .default("false")
    .transform((value) => value === "true"),
});
export type ResultsExportQuery = z.infer<typeof resultsExportQuerySchema>;

const uuidList = z
  .string()
  .trim()
  .transform((value) =>
    value
      .split(",")
      .map((part) => part.trim())
      .filter(Boolean),
  )
  .pipe(
    z
      .array(z.uuid({ error: "Each run id must be a class run id." }))
      .min(1, "Choose at least one run.")
      .max(50, "Pool at most 50 runs at once."),
  );

/** Query parameters of GET /api/results/pooled: several runs of the same set and mode pooled into one. */
export const pooledQuerySchema = z
  .object({
    setKey: z
      .string()
      .trim()
      .regex(/^[0-9a-f]{16}$/, "The set key is the 16-character key the archive lists for each run.")
      .optional(),
    dicePerPlayer: z.coerce.number({ error: "Dice per player must be a number." }).int().min(1).max(6).default(1),
    runIds: uuidList.optional(),
    scope: resultsScopeSchema.default("mine"),
  })
  .refine((query) => query.setKey !== undefined || query.runIds !== undefined, {
    error: "Name the runs to pool (runIds) or the set whose runs to pool (setKey).",
    path: ["runIds"],
  });
export type PooledQuery = z.infer<typeof pooledQuerySchema>;

/** POST /api/results/paper-runs: a closed run for rolls recorded only on paper, made from one of the teacher's lessons. */
export const paperRunInputSchema = z.object({
  lessonId: z.uuid({ error: "Pick one of your lessons." }),
  // The class taught; the lesson's own class when left out, so a second class's paper run shows under its own name.
  classGroup: z.string().trim().max(40, "Keep the class under 40 characters.").optional(),
  taughtOn: isoDate.optional(),
});
export type PaperRunInput = z.infer<typeof paperRunInputSchema>;

/** Form fields sent with a Paper import upload (multipart, beside the file). */
export const paperImportOptionsSchema = z.object({
  createGroups: z
    .enum(["true", "false"], { error: "createGroups is true or false." })
    .default("false")
    .transform((value) => value === "true"),
  // 1 is the main Roll phase; a Twist starts tally 2 with its own mode.
  tally: z.coerce
    .number({ error: "tally must be a number." })
    .int("tally must be a whole number.")
    .min(1, "Tallies count from 1.")
    .max(20)
    .default(1),
});
export type PaperImportOptions = z.infer<typeof paperImportOptionsSchema>;

/** One tally of a run: its number and the mode its rolls were played in. */
export type ResultsTally = { tally: number; dicePerPlayer: number; players: number };

/** Largest Paper import file the server accepts. */
export const PAPER_IMPORT_MAX_BYTES = 512 * 1024;
/** Most rows one Paper import file may hold. */
export const PAPER_IMPORT_MAX_ROWS = 10_000;

/** One row of a Paper import preview, as it will be stored. */
export type PaperImportPreviewRow = {
  /** The row's number in the spreadsheet: the header is row 1, the first roll row 2. */
  row: number;
  group: string;
  rollNumber: number;
  dieNames: string[];
  faces: number[][];
  totals: number[];
  /** Die name of the winner, or null for a tie. */
  winner: string | null;
  newGroup: boolean;
  /** "new" is stored by the import; "present" is already stored from an earlier upload and is left as it is. */
  status: "new" | "present" | "present-but-different";
};

/** What a Paper import preview or commit answers. */
export type PaperImportResult = {
  fileName: string;
  rows: PaperImportPreviewRow[];
  errors: { row: number; messages: string[] }[];
  newRows: number;
  duplicateRows: number;
  newGroups: string[];
  /** Set when this very file (same bytes) was imported into this run before. */
  alreadyImportedAt: string | null;
  /** Set by the commit; the preview leaves it false. */
  imported: boolean;
};

/** A lesson a teacher can make a paper run from. */
export type PaperRunLesson = {
  id: string;
  title: string;
  classGroup: string;
  diceSetName: string | null;
  ready: boolean;
  reason: string | null;
};

/** What DELETE /api/results/runs/:id answers. */
export type DeletedRun = { id: string; rolls: number; groups: number; votes: number; imports: number };

/** The run's dice as the Results area shows them. */
export type ResultsDie = Pick<SetDie, "name" | "faces" | "colour" | "pattern">;

/** A Guess-phase tally: how many groups picked each die as the best. */
export type GuessVoteCount = { dieIndex: number; dieName: string; votes: number };

/** A group of the run with how many of its rolls count. */
/** A group of a run's results (removed groups are not listed; a left-out group's rolls count only when asked for). */
export type ResultsGroup = { id: string; nickname: string; source: "phone" | "simulated" | "paper"; rolls: number; leftOut: boolean };

/** What GET /api/results/runs/:id answers: the run and its figures, all computed on the server from the stored rolls. */
export type RunResults = {
  run: ResultsRunSummary & { status: "open" | "paused" | "closed"; phases: string[]; dice: ResultsDie[]; tallies: ResultsTally[] };
  includeSimulated: boolean;
  /** Every tally's rolls pooled together (the group table and the convergence chart's choices). */
  pooled: PooledResults;
  /** Each tally pooled on its own: the main tally first, then the Twist. */
  tallies: { tally: ResultsTally; pooled: PooledResults }[];
  /** Key of the main tally's matchup with the most rolls (the report's "main matchup"), or null before any roll. */
  mainMatchupKey: string | null;
  groups: ResultsGroup[];
  guessVotes: GuessVoteCount[];
  /** Two short plain-language sentences drawn from the main tally's pooled figures. */
  findings: string[];
};

/** One run's share of a pooled result. */
export type PooledContribution = {
  run: ResultsRunSummary;
  /** Counts per matchup key (the same keys as the pooled matchups), from this run alone. */
  matchups: { key: string; rolls: number; firstSeatWins: number; ties: number; frequencyUnderTieRule: number | null }[];
};

/** What GET /api/results/pooled answers. */
export type PooledAcrossRuns = {
  setKey: string;
  dicePerPlayer: number;
  players: number;
  tieRule: string;
  /** The dice as the first (oldest) pooled run names them; matchup indexes refer to this list. */
  dice: ResultsDie[];
  pooled: PooledResults;
  contributions: PooledContribution[];
  /** Runs of the same set and mode the viewer could add. */
  candidates: ResultsRunSummary[];
};
