import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { treeDiagram } from "@shared/probability/tree-diagram";
import { naiveMatchup } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 6 });

describe("treeDiagram", () => {
  it("branches on distinct values with their probabilities", () => {
    // Counted by hand: [2,2,5] shows 2 with 2/3 and 5 with 1/3; [3,4] shows each with 1/2.
    const tree = treeDiagram([2, 2, 5], [3, 4]);
    expect(tree.branches.map((branch) => [branch.value, branch.probability.toFraction()])).toEqual([
      [2, "2/3"],
      [5, "1/3"],
    ]);
    expect(tree.branches[0].leaves.map((leaf) => [leaf.value, leaf.outcome, leaf.probability.toFraction()])).toEqual([
      [3, "loss", "1/3"],
      [4, "loss", "1/3"],
    ]);
  });

  it("sums leaves per outcome to the brute-force matchup", () => {
    // Multiplication rule for independent stages, checked against scripts/bench/naive.ts.
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 2 }), (a, b, k) => {
        const tree = treeDiagram(a, b, { dicePerPlayer: k });
        const naive = naiveMatchup(a, b, k);
        expect([tree.totals.win, tree.totals.tie, tree.totals.loss].map(String)).toEqual([naive.win, naive.tie, naive.loss].map(String));
        const all = tree.branches.flatMap((branch) => branch.leaves).reduce((sum, leaf) => sum.add(leaf.probability), new Fraction(0));
        expect(all.equals(1)).toBe(true);
      }),
      { numRuns: 40 },
    );
  });
});
