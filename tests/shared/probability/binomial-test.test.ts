import Fraction from "fraction.js";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { binomialTest, binomialTestPValue } from "@shared/probability/binomial-test";

/** R's binom.test two-sided rule in floating point, built on jstat.binomial.pdf. */
function referencePValue(successes: number, trials: number, p: number): number {
  const observed = jStat.binomial.pdf(successes, trials, p);
  let total = 0;
  for (let k = 0; k <= trials; k += 1) {
    const probability = jStat.binomial.pdf(k, trials, p);
    if (probability <= observed * (1 + 1e-7)) total += probability;
  }
  return Math.min(1, total);
}

const cases: [number, number, [number, number]][] = [];
for (const trials of [1, 6, 10, 25, 60]) {
  for (const p of [
    [1, 2],
    [1, 3],
    [1, 6],
    [5, 9],
  ] as [number, number][]) {
    for (const successes of new Set([0, 1, Math.floor(trials / 3), Math.floor(trials / 2), trials - 1, trials]))
      if (successes >= 0) cases.push([successes, trials, p]);
  }
}

describe("binomialTest", () => {
  it.each(cases)("matches R's rule on jstat's binomial for %i of %i at p = %j", (successes, trials, [a, b]) => {
    expect(binomialTest(successes, trials, new Fraction(a, b)).pValueNumber).toBeCloseTo(referencePValue(successes, trials, a / b), 9);
  });

  it("gives 7 heads in 10 fair tosses a p-value of 0.3438", () => {
    // R: binom.test(7, 10) reports p-value = 0.3438 (from memory).
    expect(binomialTest(7, 10).pValueNumber).toBeCloseTo(0.3438, 4);
  });

  it("stays exact for a thousand rolls", () => {
    const result = binomialTest(540, 1000);
    expect(result.pValueNumber).toBeCloseTo(referencePValue(540, 1000, 0.5), 9);
    expect(result.expected.equals(500)).toBe(true);
  });

  it.each([
    [11, 10],
    [0, 0],
    [1, 5001],
  ])("refuses %s successes in %s trials", (successes, trials) => {
    expect(() => binomialTest(successes, trials)).toThrow(RangeError);
  });
});

describe("binomialTestPValue", () => {
  it.each(cases)("matches R's rule on jstat's binomial for %i of %i at p = %j", (successes, trials, [a, b]) => {
    expect(binomialTestPValue(successes, trials, new Fraction(a, b))).toBeCloseTo(referencePValue(successes, trials, a / b), 9);
  });

  it("gives the exact test's number without reducing its fraction, out to a thousand rolls at p = 15/36", () => {
    for (const [successes, trials] of [
      [0, 1],
      [3, 7],
      [60, 150],
      [190, 400],
      [401, 1000],
      [1000, 1000],
    ]) {
      const exact = binomialTest(successes, trials, new Fraction(15, 36)).pValueNumber;
      const quick = binomialTestPValue(successes, trials, new Fraction(15, 36));
      expect(Math.abs(quick - exact)).toBeLessThanOrEqual(1e-12 * Math.max(exact, Number.MIN_VALUE));
    }
  });

  it("refuses what binomialTest refuses", () => {
    expect(() => binomialTestPValue(11, 10)).toThrow(RangeError);
  });
});
