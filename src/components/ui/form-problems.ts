import type { FieldErrors, FieldValues } from "react-hook-form";

/** Every message in a react-hook-form error tree, with its field path as segments (e.g. ["dice", "1", "faces", "3"]). */
export function formProblems<T extends FieldValues>(errors: FieldErrors<T>): { path: string[]; message: string }[] {
  const found: { path: string[]; message: string }[] = [];
  const walk = (node: unknown, path: string[]) => {
    if (node === null || typeof node !== "object") return;
    const entry = node as { message?: unknown; ref?: unknown; type?: unknown };
    if (typeof entry.message === "string" && entry.message !== "" && typeof entry.type === "string") {
      found.push({ path, message: entry.message });
    }
    for (const [key, child] of Object.entries(node)) {
      if (key === "ref" || key === "message" || key === "type" || key === "types") continue;
      walk(child, key === "root" ? path : [...path, key]);
    }
  };
  walk(errors, []);
  return found;
}
