/** The message for text holding a NUL character (U+0000), which PostgreSQL cannot store in text. */
export const NUL_CHARACTER_MESSAGE =
  "Some of the text sent holds an invisible control character (NUL), often pasted from another program. Retype that text and try again.";

/** Whether any string in a value (nested in arrays and objects, keys included) holds a NUL character. */
export function hasNulCharacter(value: unknown, depth = 0): boolean {
  if (typeof value === "string") return value.includes("\u0000");
  if (depth > 32 || value === null || typeof value !== "object") return false;
  if (Array.isArray(value)) return value.some((item) => hasNulCharacter(item, depth + 1));
  return Object.entries(value).some(([key, item]) => key.includes("\u0000") || hasNulCharacter(item, depth + 1));
}
