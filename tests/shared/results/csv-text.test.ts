import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvLines, FORMULA_START, unescapeFormulaCell } from "@shared/results/csv-text";

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells starting with =, +, -, @, tab or
// carriage return are read as formulas; a leading apostrophe makes them text.
describe("csvLines", () => {
  it.each([
    ['=HYPERLINK("http://evil.test","x")', `"'=HYPERLINK(""http://evil.test"",""x"")"`],
    ["+Tern", `"'+Tern"`],
    ["-1+1", `"'-1+1"`],
    ["@Gulls", `"'@Gulls"`],
    ["\tTabs", `"'\tTabs"`],
    ["\rReturns", `"'\rReturns"`],
    ["=1\n=2", `"'=1\n=2"`],
    ["Puffins", "Puffins"],
    ["Gulls, loud", `"Gulls, loud"`],
  ])("writes the text cell %j as %s", (cell, written) => {
    expect(csvLines(["name"], [{ name: cell }], { header: false })).toBe(`${written}\r\n`);
  });

  it("writes numbers as numbers, negative ones included, and fixes the decimals asked for", () => {
    const text = csvLines(
      ["total", "share"],
      [
        { total: -2, share: 0.492 },
        { total: 7, share: 0.68125 },
      ],
      { header: true, decimals: { share: 4 } },
    );
    expect(text).toBe("total,share\r\n-2,0.4920\r\n7,0.6813\r\n");
  });

  it("writes the header alone, with no empty line, when there are no rows", () => {
    expect(csvLines(["a", "b"], [], { header: true })).toBe("a,b\r\n");
    expect(csvLines(["a", "b"], [], { header: false })).toBe("");
  });

  it("reads back, with the apostrophe taken off, exactly the text written", () => {
    const cells = ["=Crabs", "-2+3*7", "@x", "'quoted", "plain", "'"];
    const parsed = Papa.parse<string[]>(
      csvLines(
        ["cell"],
        cells.map((cell) => ({ cell })),
        { header: false },
      ).trimEnd(),
      { skipEmptyLines: false },
    );
    expect(parsed.data.map(([cell]) => unescapeFormulaCell(cell))).toEqual(cells);
    expect(cells.filter((cell) => FORMULA_START.test(cell))).toHaveLength(3);
  });
});
