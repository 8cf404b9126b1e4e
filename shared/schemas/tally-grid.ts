import { z } from "zod";
import { PAPER_IMPORT_MAX_ROWS, type PaperImportResult, type ResultsTally } from "./results";

/** Most count rows one save of the tally grid takes (20 groups × 45 matchups of a ten-die set, with room). */
export const TALLY_COUNT_ROWS_MAX = 1000;
/** Largest count in one cell: more rolls than any group makes in a lesson. */
export const TALLY_COUNT_MAX = 10_000;

const tallyNumber = z.coerce
  .number({ error: "tally must be a number." })
  .int("tally must be a whole number.")
  .min(1, "Tallies count from 1.")
  .max(20)
  .default(1);
const nickname = z.string().trim().min(1, "Write the group's nickname.").max(24, "Group nicknames have at most 24 characters.");
const count = (label: string) =>
  z
    .number({ error: `${label} must be a number.` })
    .int(`${label} must be a whole number.`)
    .min(0, `${label} cannot be below 0.`)
    .max(TALLY_COUNT_MAX, `${label} must be at most ${TALLY_COUNT_MAX}.`);

/**
 * POST /api/results/runs/:id/tally-grid/rolls: rolls typed into the tally grid, one row per roll, as cells of the Paper
 * import columns (the same checks, the same roll ids: a roll typed here and in a CSV file is stored once).
 */
export const tallyGridRollsInputSchema = z.object({
  tally: tallyNumber,
  createGroups: z.boolean().default(false),
  rows: z
    .array(
      z.object({
        group: z.string().max(100),
        roll: z.string().max(10),
        die_1: z.string().max(100),
        faces_1: z.string().max(40),
        die_2: z.string().max(100),
        faces_2: z.string().max(40),
        die_3: z.string().max(100).default(""),
        faces_3: z.string().max(40).default(""),
      }),
    )
    .min(1, "Type at least one roll.")
    .max(PAPER_IMPORT_MAX_ROWS, `Save at most ${PAPER_IMPORT_MAX_ROWS} rolls at once.`),
});
export type TallyGridRollsInput = z.infer<typeof tallyGridRollsInputSchema>;

/** One row of the counts grid: a group's wins, ties and losses for one two-player matchup, from the first die's side. */
export const tallyCountRowSchema = z.object({
  group: nickname,
  dice: z.tuple([z.string().trim().min(1, "Choose the first die."), z.string().trim().min(1, "Choose the second die.")]),
  firstWins: count("Wins of the first die"),
  ties: count("Ties"),
  secondWins: count("Wins of the second die"),
});
export type TallyCountRow = z.infer<typeof tallyCountRowSchema>;

/**
 * PUT /api/results/runs/:id/tally-grid/counts: every count row of one tally, replacing what was stored for it (a row
 * left out is removed), checked whole before anything is written.
 */
export const tallyGridCountsInputSchema = z.object({
  tally: tallyNumber,
  createGroups: z.boolean().default(false),
  counts: z.array(tallyCountRowSchema).max(TALLY_COUNT_ROWS_MAX, `Save at most ${TALLY_COUNT_ROWS_MAX} count rows at once.`),
});
export type TallyGridCountsInput = z.infer<typeof tallyGridCountsInputSchema>;

/** A stored count row, as the grid shows it. */
export type StoredTallyCount = TallyCountRow & { tally: number; updatedAt: string };

/** What GET /api/results/runs/:id/tally-grid answers: what the grid needs to draw itself, and the stored counts. */
export type TallyGrid = {
  run: { id: string; title: string; classGroup: string; dieNames: string[]; tallies: ResultsTally[]; isOwner: boolean };
  groups: { id: string; nickname: string; source: "phone" | "simulated" | "paper" }[];
  counts: StoredTallyCount[];
  /** Rows each group's sheet has: the lesson's rolls per group, or null when the run has no lesson any more. */
  plannedRolls: number | null;
};

/** What a counts save answers. */
export type TallyCountsResult = { saved: number; removed: number; newGroups: string[]; counts: StoredTallyCount[] };

/** What a rolls save answers: the Paper import result of the typed rows. */
export type TallyRollsResult = PaperImportResult;
