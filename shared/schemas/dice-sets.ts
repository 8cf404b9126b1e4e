import { z } from "zod";
import { dieFacesSchema } from "../probability/die";
import { SET_SIZE_MAX, SET_SIZE_MIN } from "../probability/dice-set";
import { diePalette } from "../dice-palette";

export { diePalette };

/** Words in a die's name that ask for a palette colour, beyond the colours' own names. */
const colourWords: Record<string, DieColour> = {
  gray: "grey",
  violet: "purple",
  scarlet: "red",
  crimson: "red",
  navy: "blue",
  gold: "yellow",
  golden: "yellow",
};

/**
 * The palette entry a die's name asks for ("Red" or "Big red die" → red, "Grey" or "Gray" → grey), matching whole words
 * case-insensitively, the first colour word in the name winning; null when the name names no palette colour.
 */
export function paletteEntryForName(name: string): (typeof diePalette)[number] | null {
  for (const word of name.toLowerCase().split(/[^a-z]+/)) {
    const colour = colourWords[word] ?? diePalette.find((entry) => entry.colour === word)?.colour;
    if (colour !== undefined) return diePalette.find((entry) => entry.colour === colour) ?? null;
  }
  return null;
}

export const dieColourSchema = z.enum(diePalette.map((entry) => entry.colour) as [string, ...string[]], {
  error: `Choose a colour from the palette: ${diePalette.map((entry) => entry.colour).join(", ")}.`,
});
export type DieColour = (typeof diePalette)[number]["colour"];
export const diePatternSchema = z.enum(diePalette.map((entry) => entry.pattern) as [string, ...string[]], {
  error: `Choose a pattern from the palette: ${diePalette.map((entry) => entry.pattern).join(", ")}.`,
});
export type DiePattern = (typeof diePalette)[number]["pattern"];

export const diceSetVisibilitySchema = z.enum(["private", "department"]);
export type DiceSetVisibility = z.infer<typeof diceSetVisibilitySchema>;

/** One die of a stored set: a teacher-given name, its faces, and its colour and pattern from our palette. */
export const setDieSchema = z.object({
  name: z.string().trim().min(1, "Give each die a name.").max(40, "Keep a die's name under 40 characters."),
  faces: dieFacesSchema,
  colour: dieColourSchema,
  pattern: diePatternSchema,
});
export type SetDie = z.infer<typeof setDieSchema>;

export const setDiceSchema = z
  .array(setDieSchema)
  .min(SET_SIZE_MIN, `A dice set needs at least ${SET_SIZE_MIN} dice.`)
  .max(SET_SIZE_MAX, `A dice set can have at most ${SET_SIZE_MAX} dice.`)
  .refine((dice) => new Set(dice.map((die) => die.name.toLowerCase())).size === dice.length, {
    message: "Each die in a set needs its own name.",
  });

/** What a teacher sends to create a dice set. */
export const diceSetInputSchema = z.object({
  name: z.string().trim().min(1, "Name the dice set.").max(80, "Keep the name under 80 characters."),
  description: z.string().trim().max(2000, "Keep the description under 2000 characters.").default(""),
  visibility: diceSetVisibilitySchema.default("private"),
  dice: setDiceSchema,
});
export type DiceSetInput = z.infer<typeof diceSetInputSchema>;

/** An update carries the version the teacher started from; a stale one is refused. */
export const diceSetUpdateSchema = diceSetInputSchema.extend({ version: z.number().int().positive() });
export type DiceSetUpdate = z.infer<typeof diceSetUpdateSchema>;

/** A stored dice set as the API answers it. */
export type DiceSet = DiceSetInput & {
  id: string;
  version: number;
  ownerId: string;
  ownerName: string;
  departmentId: string | null;
  isOwner: boolean;
  createdAt: string;
  updatedAt: string;
};

/** Route parameters naming one dice set; a malformed id is refused with 400 before any lookup. */
export const diceSetIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a dice set id." }) });

/** What GET /api/dice-sets answers: the teacher's own sets, then sets shared with their department. */
export type DiceSetList = { sets: DiceSet[] };
