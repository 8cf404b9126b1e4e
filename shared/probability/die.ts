import { z } from "zod";

/** Smallest face value a die may carry. */
export const FACE_VALUE_MIN = -99;
/** Largest face value a die may carry. */
export const FACE_VALUE_MAX = 999;
/** Fewest faces a die may have. */
export const FACES_MIN = 2;
/** Most faces a die may have. */
export const FACES_MAX = 60;
/** Most dice each player may roll and sum in one matchup. */
export const DICE_PER_PLAYER_MAX = 6;

/** Zod schema for one face value: a whole number from -99 to 999. */
export const faceValueSchema = z
  .number({ error: "Each face value must be a number." })
  .int({ error: (issue) => `Face values must be whole numbers; ${String(issue.input)} is not.` })
  .min(FACE_VALUE_MIN, { error: `Face values must be at least ${FACE_VALUE_MIN}.` })
  .max(FACE_VALUE_MAX, { error: `Face values must be at most ${FACE_VALUE_MAX}.` });

/**
 * Zod schema for a die: the list of its face values, 2 to 60 faces, repeats allowed.
 * Reuse it in forms and routes so every layer gives the same messages.
 */
export const dieFacesSchema = z.array(faceValueSchema, { error: "A die must be a list of face values." }).check((context) => {
  const length = context.value.length;
  const message =
    length === 0
      ? "The die is empty: give it at least 2 faces."
      : length < FACES_MIN
        ? `A die needs at least ${FACES_MIN} faces; this one has ${length}.`
        : length > FACES_MAX
          ? `A die can have at most ${FACES_MAX} faces; this one has ${length}.`
          : null;
  if (message !== null) context.issues.push({ code: "custom", message, input: context.value });
});

/** Zod schema for the number of dice each player rolls and sums: 1 to 6. */
export const dicePerPlayerSchema = z
  .number({ error: "Dice per player must be a number." })
  .int({ error: "Dice per player must be a whole number." })
  .min(1, { error: "Each player rolls at least 1 die." })
  .max(DICE_PER_PLAYER_MAX, { error: `Each player rolls at most ${DICE_PER_PLAYER_MAX} dice.` });

/** The face values of one die, as validated by `dieFacesSchema`. */
export type DieFaces = z.infer<typeof dieFacesSchema>;

/** Thrown when a die or a dice count fails validation; `issues` holds one plain message per problem. */
export class InvalidDieError extends Error {
  readonly issues: string[];
  constructor(issues: string[]) {
    super(issues.join(" "));
    this.name = "InvalidDieError";
    this.issues = issues;
  }
}

/** Validates a die's faces with `dieFacesSchema`, returning them or throwing `InvalidDieError`. */
export function dieFacesChecked(faces: unknown): DieFaces {
  const result = dieFacesSchema.safeParse(faces);
  if (result.success) return result.data;
  throw new InvalidDieError(result.error.issues.map((issue) => issue.message));
}

/** Validates a dice-per-player count (default 1) with `dicePerPlayerSchema`, returning it or throwing `InvalidDieError`. */
export function dicePerPlayerChecked(count: unknown = 1): number {
  const result = dicePerPlayerSchema.safeParse(count);
  if (result.success) return result.data;
  throw new InvalidDieError(result.error.issues.map((issue) => issue.message));
}
