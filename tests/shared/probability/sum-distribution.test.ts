import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { InvalidDieError } from "@shared/probability/die";
import { sumDistribution } from "@shared/probability/sum-distribution";
import { naiveSumDistribution } from "../../../scripts/bench/naive";

const standardDie = [1, 2, 3, 4, 5, 6];

describe("sumDistribution", () => {
  it("gives 7 probability 1/6 for two standard dice", () => {
    // Any probability textbook: 6 of the 36 outcomes of two dice sum to 7.
    expect(sumDistribution(standardDie, 2).get(7)!.equals(new Fraction(6, 36))).toBe(true);
  });

  it("gives 10 in 27 ways and 9 in 25 ways for three standard dice", () => {
    // Galileo, "Sopra le scoperte dei dadi": 27 of 216 throws make 10, 25 make 9.
    const three = sumDistribution(standardDie, 3);
    expect(three.get(10)!.equals(new Fraction(27, 216))).toBe(true);
    expect(three.get(9)!.equals(new Fraction(25, 216))).toBe(true);
  });

  it("gives at least one six in four rolls probability 671/1296", () => {
    // Pascal and Fermat's correspondence (1654), de Méré's problem; a die marking a six as 1 counts sixes.
    const sixes = sumDistribution([0, 0, 0, 0, 0, 1], 4);
    expect(new Fraction(1).sub(sixes.get(0)!).equals(new Fraction(671, 1296))).toBe(true);
  });

  it("matches listing every roll for invented dice", () => {
    // Brute force: scripts/bench/naive.ts lists all faces^count rolls.
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -99, max: 999 }), { minLength: 2, maxLength: 6 }),
        fc.integer({ min: 1, max: 4 }),
        (faces, count) => {
          const exact = [...sumDistribution(faces, count)].map(([value, p]) => [value, p.toFraction()]);
          const naive = [...naiveSumDistribution(faces, count)].map(([value, p]) => [value, p.toFraction()]);
          expect(exact).toEqual(naive);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("sums to 1 for six copies of a 60-face die", () => {
    const faces = Array.from({ length: 60 }, (_, index) => (index * 37) % 211);
    const total = [...sumDistribution(faces, 6).values()].reduce((sum, p) => sum.add(p), new Fraction(0));
    expect(total.equals(1)).toBe(true);
  });

  it.each([0, 7])("refuses %s copies", (count) => {
    expect(() => sumDistribution(standardDie, count)).toThrow(InvalidDieError);
  });
});
