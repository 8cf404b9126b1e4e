import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { compareDice } from "@shared/probability/matchup";
import { beatAllProbability, multiPlayerMatchup } from "@shared/probability/multi-player";
import { naiveBeatAll, naiveEnumeration } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 5 });

describe("beatAllProbability", () => {
  it("matches brute-force enumeration of every joint outcome", () => {
    // Brute force: scripts/bench/naive.ts visits every joint outcome of all dice rolled.
    fc.assert(
      fc.property(die, die, die, fc.integer({ min: 1, max: 2 }), (pick, first, second, k) => {
        expect(beatAllProbability(pick, [first, second], { dicePerPlayer: k }).equals(naiveBeatAll(pick, [first, second], k))).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("equals the compareDice win for one opponent", () => {
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 3 }), (pick, opponent, k) => {
        expect(
          beatAllProbability(pick, [opponent], { dicePerPlayer: k }).equals(compareDice(pick, opponent, { dicePerPlayer: k }).win),
        ).toBe(true);
      }),
    );
  });

  it("is not the product of the pairwise wins", () => {
    // Both events need the pick's roll to be high, so they are positively correlated (joint > product).
    const pick = [1, 1, 1, 9, 9, 9];
    const opponents = [
      [5, 5, 5, 5, 5, 5],
      [4, 4, 4, 4, 4, 4],
    ];
    const product = compareDice(pick, opponents[0]).win.mul(compareDice(pick, opponents[1]).win);
    expect(beatAllProbability(pick, opponents).gt(product)).toBe(true);
  });

  it("refuses an empty list of opponents", () => {
    expect(() => beatAllProbability([1, 2], [])).toThrow(/at least one opponent/);
  });
});

describe("multiPlayerMatchup", () => {
  it("matches brute force for each player's outright highest and every pair", () => {
    fc.assert(
      fc.property(fc.array(die, { minLength: 2, maxLength: 4 }), (players) => {
        const result = multiPlayerMatchup(players);
        const tally = naiveEnumeration(players, 1);
        result.highestOutright.forEach((p, index) => expect(p.equals(new Fraction(tally.highest[index], tally.outcomesTotal))).toBe(true));
        result.pairwise.forEach((row, i) =>
          row.forEach((cell, j) => {
            if (cell !== null) expect(cell.win.equals(new Fraction(tally.pairwiseWins[i][j], tally.outcomesTotal))).toBe(true);
          }),
        );
        const sum = result.highestOutright.reduce((total, p) => total.add(p), result.sharedHighest);
        expect(sum.equals(1)).toBe(true);
      }),
      { numRuns: 40 },
    );
  });
});
