import fc from "fast-check";
import Fraction from "fraction.js";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { InvalidDieError } from "@shared/probability/die";
import { compareDice, type MatchupResult } from "@shared/probability/matchup";
import { expectedPoints, expectedWins, seriesOutcome, seriesOutcomeForDice } from "@shared/probability/series";

const matchupFrom = (win: number, tie: number, loss: number): MatchupResult => {
  const total = win + tie + loss;
  return { win: new Fraction(win, total), tie: new Fraction(tie, total), loss: new Fraction(loss, total) };
};
const weights = fc
  .tuple(fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 12 }))
  .filter(([w, t, l]) => w + l > 0 && w + t + l > 0);

/** Brute force: play out all 3^N roll sequences, scoring points exactly as each tie rule says. */
function seriesByEnumeration(
  result: MatchupResult,
  games: number,
  rule: "ties-score-half" | "ties-score-nothing",
): { win: Fraction; draw: Fraction } {
  let win = new Fraction(0);
  let draw = new Fraction(0);
  const play = (played: number, mine: Fraction, theirs: Fraction, chance: Fraction): void => {
    if (played === games) {
      if (mine.gt(theirs)) win = win.add(chance);
      else if (mine.equals(theirs)) draw = draw.add(chance);
      return;
    }
    const tiePoint = rule === "ties-score-half" ? new Fraction(1, 2) : new Fraction(0);
    play(played + 1, mine.add(1), theirs, chance.mul(result.win));
    play(played + 1, mine.add(tiePoint), theirs.add(tiePoint), chance.mul(result.tie));
    play(played + 1, mine, theirs.add(1), chance.mul(result.loss));
  };
  play(0, new Fraction(0), new Fraction(0), new Fraction(1));
  return { win, draw };
}

describe("seriesOutcome", () => {
  it("wins a best-of-3 re-roll series with p²(3 − 2p)", () => {
    // Any probability textbook: win two of three, P = p³ + 3p²(1 − p), with p = P(win | no tie).
    fc.assert(
      fc.property(weights, ([w, t, l]) => {
        const p = new Fraction(w, w + l);
        expect(seriesOutcome(matchupFrom(w, t, l), 3, "re-roll-ties").win.equals(p.pow(2).mul(p.mul(-2).add(3)))).toBe(true);
      }),
    );
  });

  it.each([1, 5, 11, 51, 101])("matches jstat's binomial distribution for a re-roll best-of-%i", (games) => {
    // jstat.binomial.cdf: P(series win) = 1 − P(at most (N − 1)/2 decided wins).
    for (const [w, t, l] of [
      [5, 1, 3],
      [11, 6, 19],
      [2, 0, 1],
      [7, 3, 7],
    ]) {
      const exact = seriesOutcome(matchupFrom(w, t, l), games, "re-roll-ties").win.valueOf();
      expect(exact).toBeCloseTo(1 - jStat.binomial.cdf((games - 1) / 2, games, w / (w + l)), 10);
    }
  });

  it.each(["ties-score-half", "ties-score-nothing"] as const)("matches playing out every sequence of rolls under %s", (rule) => {
    fc.assert(
      fc.property(weights, fc.constantFrom(1, 3, 5, 7), ([w, t, l], games) => {
        const result = matchupFrom(w, t, l);
        const exact = seriesOutcome(result, games, rule);
        const brute = seriesByEnumeration(result, games, rule);
        expect(exact.win.equals(brute.win) && exact.draw.equals(brute.draw)).toBe(true);
        expect(exact.win.add(exact.draw).add(exact.loss).equals(1)).toBe(true);
      }),
      { numRuns: 25 },
    );
  });

  it("never draws a re-roll series", () => {
    expect(seriesOutcome(matchupFrom(3, 2, 4), 9, "re-roll-ties").draw.equals(0)).toBe(true);
  });

  it.each([0, 2, 103, 4.5])("refuses a series of %s games", (games) => {
    expect(() => seriesOutcome(matchupFrom(1, 1, 1), games, "re-roll-ties")).toThrow(InvalidDieError);
  });

  it("refuses a re-roll series where every roll ties", () => {
    expect(() => seriesOutcomeForDice([5, 5], [5, 5], { games: 3, tieRule: "re-roll-ties" })).toThrow(/never ends/);
  });

  it("works from two dice as from their matchup", () => {
    const a = [1, 2, 6, 6, 8, 8];
    const b = [3, 3, 4, 5, 9, 9];
    const direct = seriesOutcomeForDice(a, b, { games: 7, tieRule: "ties-score-half", dicePerPlayer: 2 });
    expect(direct.win.equals(seriesOutcome(compareDice(a, b, { dicePerPlayer: 2 }), 7, "ties-score-half").win)).toBe(true);
  });
});

describe("expectedWins and expectedPoints", () => {
  it("equal the mean of the binomial distribution of wins", () => {
    // Mean of a binomial: Σ k·P(X = k) = n·p, summed here with jstat.binomial.pdf.
    const result = matchupFrom(5, 2, 4);
    const rolls = 30;
    let mean = 0;
    for (let k = 0; k <= rolls; k += 1) mean += k * jStat.binomial.pdf(k, rolls, 5 / 11);
    expect(expectedWins(result, rolls).valueOf()).toBeCloseTo(mean, 10);
    expect(expectedPoints(result, rolls, "ties-score-half")!.valueOf()).toBeCloseTo(mean + (rolls * 2) / 11 / 2, 10);
    expect(expectedPoints(result, rolls, "re-roll-ties")!.valueOf()).toBeCloseTo((rolls * 5) / 9, 10);
  });
});
