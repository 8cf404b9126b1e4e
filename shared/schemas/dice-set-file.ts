import { z } from "zod";
import { diceSetInputSchema, setDiceSchema, type DiceSet, type DiceSetInput } from "./dice-sets";

/** The format name every Outroll dice set file carries, so other JSON files are refused plainly. */
export const DICE_SET_FILE_FORMAT = "outroll-dice-set";
/** The file format version this code writes and reads. */
export const DICE_SET_FILE_VERSION = 1;

/**
 * A dice set file, version 1: `format` and `version` identify it; `name`, `description` and `dice`
 * are the set itself (each die with its name, faces, colour and pattern); `exportedAt` is informative only.
 * Visibility and ownership are not part of the file: an imported set is private to the importing teacher.
 */
export const diceSetFileSchema = z.object({
  format: z.literal(DICE_SET_FILE_FORMAT, { error: `This is not an Outroll dice set file: "format" must be "${DICE_SET_FILE_FORMAT}".` }),
  version: z.literal(DICE_SET_FILE_VERSION, {
    error: `This file's version is not one Outroll reads: "version" must be ${DICE_SET_FILE_VERSION}.`,
  }),
  name: diceSetInputSchema.shape.name,
  description: z.string({ error: "The description must be text." }).max(2000, "Keep the description under 2000 characters.").default(""),
  dice: setDiceSchema,
  exportedAt: z.string().optional(),
});
export type DiceSetFile = z.infer<typeof diceSetFileSchema>;

/** The file for a stored set. */
export function diceSetToFile(set: Pick<DiceSet, "name" | "description" | "dice">, exportedAt: Date = new Date()): DiceSetFile {
  return {
    format: DICE_SET_FILE_FORMAT,
    version: DICE_SET_FILE_VERSION,
    name: set.name,
    description: set.description,
    dice: set.dice.map((die) => ({ name: die.name, faces: [...die.faces], colour: die.colour, pattern: die.pattern })),
    exportedAt: exportedAt.toISOString(),
  };
}

/** The input that creates a stored set from a checked file (always private to start with). */
export function diceSetInputFromFile(file: DiceSetFile): DiceSetInput {
  return { name: file.name, description: file.description, visibility: "private", dice: file.dice };
}

/** Writes a zod issue path as a reader would: ["dice", 2, "faces", 4] → "dice[2].faces[4]". */
export function issuePathText(path: readonly PropertyKey[]): string {
  return path.reduce<string>(
    (text, key) => (typeof key === "number" ? `${text}[${key}]` : text === "" ? String(key) : `${text}.${String(key)}`),
    "",
  );
}

/** One plain message per problem, each led by where it is ("dice[2].faces[4]: Face values must be at most 999."). */
export function fileIssueMessages(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const where = issuePathText(issue.path);
    return where === "" ? issue.message : `${where}: ${issue.message}`;
  });
}

/** Checks parsed JSON as a dice set file: the file, or the list of what is wrong with it. */
export function checkDiceSetFile(content: unknown): { ok: true; file: DiceSetFile } | { ok: false; issues: string[] } {
  if (content === null || typeof content !== "object" || Array.isArray(content)) {
    return { ok: false, issues: ["The file must hold one JSON object with format, version, name and dice."] };
  }
  const result = diceSetFileSchema.safeParse(content);
  return result.success ? { ok: true, file: result.data } : { ok: false, issues: fileIssueMessages(result.error) };
}

/** A file name for a set's download: its name in lowercase words joined by hyphens, ending .outroll-dice.json. */
export function diceSetFileName(name: string): string {
  const stem = name
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, "-")
    .slice(0, 60);
  return `${stem === "" ? "dice-set" : stem}.outroll-dice.json`;
}
