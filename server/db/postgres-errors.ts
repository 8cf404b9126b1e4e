/** PostgreSQL's SQLSTATE for text it cannot store (a NUL character, bytes that are not UTF-8), on the error or its cause. */
export function isUnstorableText(error: unknown): boolean {
  const codeOf = (value: unknown) =>
    typeof value === "object" && value !== null && "code" in value ? (value as { code: unknown }).code : undefined;
  const codes = [codeOf(error), codeOf((error as { cause?: unknown } | null)?.cause)];
  return codes.includes("22021") || codes.includes("22P05");
}
