// What a pupil types to join a run, checked with zod's mini build so the Roll pad can check it without the full library.
import * as z from "zod/mini";

/** Join codes use no look-alike characters (no 0/O, 1/I/L), so a code read from the back of a room is typed right. */
export const JOIN_CODE_ALPHABET = "ABCDEFGHJKMNPQRSTUVWXYZ23456789";
export const JOIN_CODE_LENGTH = 6;

/** A group nickname's length; the full rules (nicknameSchema) live beside the other class run schemas. */
export const NICKNAME_MIN = 2;
export const NICKNAME_MAX = 24;

/**
 * A typed join code: spaces and dashes dropped, letters upper-cased, then checked against the alphabet. Written with
 * zod's mini build, so the Roll pad checks codes without loading the full library; the server's schemas embed it as is.
 */
export const joinCodeSchema = z.pipe(
  z.pipe(
    z.string({ error: "Type the join code." }),
    z.transform((value: string) => value.replace(/[\s-]/g, "").toUpperCase()),
  ),
  z
    .string()
    .check(
      z.length(JOIN_CODE_LENGTH, { error: `A join code has ${JOIN_CODE_LENGTH} characters.` }),
      z.regex(new RegExp(`^[${JOIN_CODE_ALPHABET}]+$`), { error: "A join code uses letters and the digits 2 to 9 only." }),
    ),
);
