import { z } from "zod";
import { dieFacesSchema, InvalidDieError } from "./die";

/** Fewest dice in a dice set. */
export const SET_SIZE_MIN = 2;
/** Most dice in a dice set. */
export const SET_SIZE_MAX = 10;

/** Zod schema for one named die of a set. */
export const namedDieSchema = z.object({
  name: z.string({ error: "Each die needs a name." }).trim().min(1, { error: "Each die needs a name." }),
  faces: dieFacesSchema,
});

/** Zod schema for a dice set: 2 to 10 named dice with distinct names. */
export const diceSetSchema = z
  .array(namedDieSchema)
  .min(SET_SIZE_MIN, { error: `A dice set needs at least ${SET_SIZE_MIN} dice.` })
  .max(SET_SIZE_MAX, { error: `A dice set can have at most ${SET_SIZE_MAX} dice.` })
  .refine((dice) => new Set(dice.map((die) => die.name)).size === dice.length, { error: "Each die in a set needs its own name." });

/** One named die of a set, as validated by `namedDieSchema`. */
export type NamedDie = z.infer<typeof namedDieSchema>;

/** Validates a dice set with `diceSetSchema`, returning it or throwing `InvalidDieError` with every message. */
export function diceSetChecked(dice: unknown): NamedDie[] {
  const result = diceSetSchema.safeParse(dice);
  if (result.success) return result.data;
  throw new InvalidDieError(
    result.error.issues.map((issue) => (issue.path.length > 0 ? `Die ${Number(issue.path[0]) + 1}: ${issue.message}` : issue.message)),
  );
}
