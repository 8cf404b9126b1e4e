import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { twoWayTable } from "@shared/probability/two-way-table";
import { naiveMatchup } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 6 });

describe("twoWayTable", () => {
  it("has 11 rows and columns and 36 ways for two standard dice each", () => {
    // Any probability textbook: two dice sum to 2 … 12, and 36 · 36 equally likely pairs of sums.
    const table = twoWayTable([1, 2, 3, 4, 5, 6], [1, 2, 3, 4, 5, 6], { dicePerPlayer: 2 });
    expect(table.rows.map((row) => row.value)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(table.totalWays).toBe(36n * 36n);
    expect(table.cells[5][5]).toMatchObject({ outcome: "tie", ways: 36n });
  });

  it("adds up by outcome to the brute-force matchup", () => {
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 2 }), (a, b, k) => {
        const table = twoWayTable(a, b, { dicePerPlayer: k });
        const naive = naiveMatchup(a, b, k);
        const byOutcome = { win: new Fraction(0), tie: new Fraction(0), loss: new Fraction(0) };
        table.cells.flat().forEach((cell) => (byOutcome[cell.outcome] = byOutcome[cell.outcome].add(cell.probability)));
        expect([byOutcome.win, byOutcome.tie, byOutcome.loss].map(String)).toEqual([naive.win, naive.tie, naive.loss].map(String));
        expect(table.totals.win.equals(naive.win)).toBe(true);
      }),
      { numRuns: 40 },
    );
  });
});
