import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { compareDice } from "@shared/probability/matchup";
import { winProbabilitiesByTieRule, winProbabilityUnderTieRule } from "@shared/probability/tie-rule";
import { naiveEnumeration } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 6 });

describe("winProbabilityUnderTieRule", () => {
  it("matches counting outcomes under each rule", () => {
    // Counting the sample space directly: re-roll = wins / decided outcomes; half = (wins + ties/2) / all; nothing = wins / all.
    fc.assert(
      fc.property(die, die, (a, b) => {
        const tally = naiveEnumeration([a, b], 1);
        const wins = tally.pairwiseWins[0][1];
        const losses = tally.pairwiseWins[1][0];
        const ties = tally.outcomesTotal - wins - losses;
        const rules = winProbabilitiesByTieRule(compareDice(a, b));
        if (wins + losses > 0) expect(rules["re-roll-ties"]!.equals(new Fraction(wins, wins + losses))).toBe(true);
        expect(rules["ties-score-half"]!.equals(new Fraction(2 * wins + ties, 2 * tally.outcomesTotal))).toBe(true);
        expect(rules["ties-score-nothing"]!.equals(new Fraction(wins, tally.outcomesTotal))).toBe(true);
      }),
    );
  });

  it("gives no re-roll answer when every roll ties", () => {
    expect(winProbabilityUnderTieRule(compareDice([4, 4], [4, 4, 4]), "re-roll-ties")).toBeNull();
  });

  it("gives an evenly matched pair one half under every rule", () => {
    // Symmetry: two copies of one die win as often as they lose.
    const rules = winProbabilitiesByTieRule(compareDice([1, 3, 3, 8], [1, 3, 3, 8]));
    expect(rules["re-roll-ties"]!.equals(new Fraction(1, 2)) && rules["ties-score-half"]!.equals(new Fraction(1, 2))).toBe(true);
  });
});
