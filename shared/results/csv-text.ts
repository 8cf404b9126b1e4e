import Papa from "papaparse";

/**
 * Cells a spreadsheet program would read as a formula: text starting with =, +, -, @, a tab or a carriage return
 * (OWASP, "CSV Injection", owasp.org/www-community/attacks/CSV_Injection). Such cells get a leading apostrophe.
 */
export const FORMULA_START = /^[=+\-@\t\r]/;

/** A cell value as Outroll writes it: text is escaped against formulas, numbers stay numbers. */
export type CsvCell = string | number | null | undefined;

/**
 * CSV lines through papaparse (RFC 4180 quoting, CRLF), each line ending in CRLF: the header line when `header` is
 * true, then one line per row. Every text cell starting like a formula gets a leading apostrophe (papaparse's
 * `escapeFormulae`, given the OWASP pattern), numbers are written as they are; `decimals` fixes the places of a
 * number column so every row reads the same (0.4920, not 0.492).
 */
export function csvLines(
  columns: readonly string[],
  rows: Record<string, CsvCell>[],
  options: { header: boolean; decimals?: Record<string, number> },
): string {
  const lines: string[] = [];
  const unparse = (data: CsvCell[][]) => Papa.unparse(data, { newline: "\r\n", escapeFormulae: FORMULA_START });
  if (options.header) lines.push(unparse([[...columns]]));
  if (rows.length > 0) {
    const decimals = options.decimals ?? {};
    lines.push(
      unparse(
        rows.map((row) =>
          columns.map((column) => {
            const value = row[column];
            const places = decimals[column];
            if (typeof value === "number" && places !== undefined) return value.toFixed(places);
            return value ?? "";
          }),
        ),
      ),
    );
  }
  return lines.length === 0 ? "" : `${lines.join("\r\n")}\r\n`;
}

/** Undoes the apostrophe `csvLines` puts before a formula-like cell, for files that come back to Outroll (Paper import). */
export function unescapeFormulaCell(cell: string): string {
  return cell.length > 1 && cell.startsWith("'") && FORMULA_START.test(cell.slice(1)) ? cell.slice(1) : cell;
}
