import { randomInt } from "node:crypto";
import { JOIN_CODE_ALPHABET, JOIN_CODE_LENGTH } from "@shared/schemas/class-runs";

/** A random join code from the alphabet without look-alikes (31 symbols, so about 887 million codes). */
export function generateJoinCode(): string {
  let code = "";
  for (let index = 0; index < JOIN_CODE_LENGTH; index += 1) code += JOIN_CODE_ALPHABET[randomInt(JOIN_CODE_ALPHABET.length)];
  return code;
}

/** True for PostgreSQL's unique violation (23505), optionally on one named constraint; drizzle wraps it in `cause`. */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  for (let current: unknown = error; current && typeof current === "object"; current = (current as { cause?: unknown }).cause) {
    const pgError = current as { code?: string; constraint?: string };
    if (pgError.code === "23505") return constraint === undefined || pgError.constraint === constraint;
  }
  return false;
}
