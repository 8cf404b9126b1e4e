import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { InvalidDieError } from "@shared/probability/die";
import { compareDice } from "@shared/probability/matchup";
import { matchupSimulation } from "@shared/probability/simulation";
import { naiveMatchup } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: -99, max: 999 }), { minLength: 2, maxLength: 7 });
const smallDie = fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 4 });
const dicePerPlayer = fc.integer({ min: 1, max: 2 });

describe("compareDice", () => {
  it("gives two standard dice win 15/36, tie 6/36", () => {
    // Any probability textbook: 6 of 36 ordered pairs are doubles, the other 30 split evenly.
    const result = compareDice([1, 2, 3, 4, 5, 6], [1, 2, 3, 4, 5, 6]);
    expect(result.tie.equals(new Fraction(6, 36))).toBe(true);
    expect(result.win.equals(new Fraction(15, 36))).toBe(true);
  });

  it("matches brute-force enumeration of every joint outcome", () => {
    // Brute force: scripts/bench/naive.ts visits all (faces)^(2k) outcomes.
    fc.assert(
      fc.property(die, die, dicePerPlayer, (a, b, k) => {
        const exact = compareDice(a, b, { dicePerPlayer: k });
        const naive = naiveMatchup(a, b, k);
        expect([exact.win, exact.tie, exact.loss].map(String)).toEqual([naive.win, naive.tie, naive.loss].map(String));
      }),
      { numRuns: 80 },
    );
    fc.assert(
      fc.property(smallDie, smallDie, fc.integer({ min: 3, max: 4 }), (a, b, k) => {
        expect(compareDice(a, b, { dicePerPlayer: k }).win.equals(naiveMatchup(a, b, k).win)).toBe(true);
      }),
      { numRuns: 15 },
    );
  });

  it("agrees with a seeded Monte Carlo run within 4.5 standard errors", () => {
    // Common practice: a tolerance of a few binomial standard errors √(p(1−p)/n).
    const a = [1, 2, 6, 6, 8, 8];
    const b = [3, 3, 4, 5, 9, 9];
    for (const k of [1, 2, 3]) {
      const exact = compareDice(a, b, { dicePerPlayer: k }).win.valueOf();
      const rolls = 20_000;
      const run = matchupSimulation(a, b, { rolls, seed: 1234 + k, dicePerPlayer: k });
      expect(Math.abs(run.counts.win / rolls - exact)).toBeLessThan(4.5 * Math.sqrt((exact * (1 - exact)) / rolls));
    }
  });

  it("always gives win + tie + loss = 1", () => {
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 6 }), (a, b, k) => {
        const result = compareDice(a, b, { dicePerPlayer: k });
        expect(result.win.add(result.tie).add(result.loss).equals(1)).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("swaps win and loss when the dice swap", () => {
    fc.assert(
      fc.property(die, die, dicePerPlayer, (a, b, k) => {
        const forward = compareDice(a, b, { dicePerPlayer: k });
        const backward = compareDice(b, a, { dicePerPlayer: k });
        expect(forward.win.equals(backward.loss) && forward.loss.equals(backward.win) && forward.tie.equals(backward.tie)).toBe(true);
      }),
    );
  });

  it("does not change when a constant is added to every face of both dice", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -40, max: 400 }), { minLength: 2, maxLength: 7 }),
        fc.array(fc.integer({ min: -40, max: 400 }), { minLength: 2, maxLength: 7 }),
        fc.integer({ min: -59, max: 599 }),
        dicePerPlayer,
        (a, b, shift, k) => {
          const plain = compareDice(a, b, { dicePerPlayer: k });
          const shifted = compareDice(
            a.map((face) => face + shift),
            b.map((face) => face + shift),
            { dicePerPlayer: k },
          );
          expect([plain.win, plain.tie].map(String)).toEqual([shifted.win, shifted.tie].map(String));
        },
      ),
    );
  });

  it("finds no three dice that each beat the next with probability above (√5 − 1)/2", () => {
    // Usiskin (1964), Annals of Mathematical Statistics, and Trybuła (1961): the bound is (√5 − 1)/2.
    // p ≤ (√5 − 1)/2 ⇔ (2p + 1)² ≤ 5, checked exactly with fractions.
    const withinBound = (p: Fraction): boolean => p.mul(2).add(1).pow(2).lte(5);
    const bigDie = fc.array(fc.integer({ min: 1, max: 18 }), { minLength: 2, maxLength: 10 });
    fc.assert(
      fc.property(bigDie, bigDie, bigDie, (a, b, c) => {
        const links = [compareDice(a, b).win, compareDice(b, c).win, compareDice(c, a).win];
        expect(links.some(withinBound)).toBe(true);
      }),
      { numRuns: 2000 },
    );
    // Dice splitting 1 … 3m between them with distinct values are where the near-extreme sets live.
    const split = fc.integer({ min: 2, max: 8 }).chain((m) =>
      fc
        .shuffledSubarray(
          Array.from({ length: 3 * m }, (_, index) => index + 1),
          { minLength: 3 * m, maxLength: 3 * m },
        )
        .map((values) => [values.slice(0, m), values.slice(m, 2 * m), values.slice(2 * m)]),
    );
    fc.assert(
      fc.property(split, ([a, b, c]) => {
        expect([compareDice(a, b).win, compareDice(b, c).win, compareDice(c, a).win].some(withinBound)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it("refuses a die that fails validation", () => {
    expect(() => compareDice([], [1, 2])).toThrow(InvalidDieError);
  });
});
