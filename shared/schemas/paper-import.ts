import { z } from "zod";

/**
 * The Paper import CSV: one row per roll, typed up from the printed group recording sheet (same columns, same order).
 * Faces for two dice each are joined with "+" ("3+5"); the third player's columns stay empty with two players.
 */
export const paperImportColumns = ["group", "roll", "die_1", "faces_1", "die_2", "faces_2", "die_3", "faces_3"] as const;
export type PaperImportColumn = (typeof paperImportColumns)[number];

export const paperImportColumnHelp: Record<PaperImportColumn, string> = {
  group: "The group's nickname, as written at the top of its sheet.",
  roll: "The roll's number on the sheet: 1, 2, 3 … (each group counts from 1).",
  die_1: "Name of the first player's die.",
  faces_1: "Face the first player rolled; with two dice each, both faces joined by +, e.g. 3+5.",
  die_2: "Name of the second player's die.",
  faces_2: "Face (or faces) the second player rolled.",
  die_3: "Name of the third player's die (three players only; otherwise empty).",
  faces_3: "Face (or faces) the third player rolled (three players only; otherwise empty).",
};

const facesCell = z
  .string()
  .trim()
  .regex(/^-?\d+(\s*\+\s*-?\d+)*$/, "Write the faces as whole numbers joined by +, e.g. 4 or 3+5.")
  .transform((cell) => cell.split("+").map((part) => Number(part.trim())));

/** One CSV row as text, checked for shape; whether the dice and faces exist is checked against the run's set. */
export const paperImportRowSchema = z.object({
  group: z.string().trim().min(1, "Write the group's nickname.").max(24, "Group nicknames have at most 24 characters."),
  roll: z.coerce.number({ error: "Roll must be a number." }).int("Roll must be a whole number.").min(1, "Rolls count from 1."),
  die_1: z.string().trim().min(1, "Name the first player's die."),
  faces_1: facesCell,
  die_2: z.string().trim().min(1, "Name the second player's die."),
  faces_2: facesCell,
  die_3: z.string().trim().optional().default(""),
  faces_3: z
    .union([z.literal(""), facesCell])
    .optional()
    .default(""),
});
export type PaperImportRow = z.infer<typeof paperImportRowSchema>;
