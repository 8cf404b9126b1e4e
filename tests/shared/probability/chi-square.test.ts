import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { chiSquareCriticalValue, chiSquareGoodnessOfFit, chiSquareUpperTail } from "@shared/probability/chi-square";

describe("chiSquareCriticalValue", () => {
  it.each([
    // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.4, upper critical values of the chi-square distribution (from memory).
    [1, 0.05, 3.841],
    [2, 0.05, 5.991],
    [5, 0.05, 11.07],
    [10, 0.05, 18.307],
    [5, 0.01, 15.086],
    [3, 0.1, 6.251],
  ])("gives the handbook's value for %i degrees of freedom at %s", (df, alpha, tabled) => {
    expect(chiSquareCriticalValue(df, alpha)).toBeCloseTo(tabled, 3);
  });

  it.each([1, 3, 5, 11, 59])("matches jstat.chisquare.inv for %i degrees of freedom", (df) => {
    expect(chiSquareCriticalValue(df, 0.05)).toBeCloseTo(jStat.chisquare.inv(0.95, df), 6);
  });
});

describe("chiSquareUpperTail", () => {
  const grid: [number, number][] = [];
  for (const df of [1, 2, 3, 5, 9, 19, 59]) for (const x of [0.01, 0.5, 1, 3.2, 7, 15, 40, 90]) grid.push([x, df]);
  it.each(grid)("matches 1 − jstat.chisquare.cdf at x = %s, df = %i", (x, df) => {
    expect(chiSquareUpperTail(x, df)).toBeCloseTo(1 - jStat.chisquare.cdf(x, df), 10);
  });
});

describe("chiSquareGoodnessOfFit", () => {
  it.each([[[10, 12, 8, 9, 11, 10]], [[30, 2, 7, 9, 11, 1]], [[5, 5]], [[0, 0, 17, 3, 4, 1, 9, 0]]])(
    "matches Pearson's statistic and jstat's p-value for counts %j",
    (counts) => {
      // Pearson (1900): Σ (O − E)²/E with E = total / faces, df = faces − 1; p-value from jstat.chisquare.cdf.
      const expected = counts.reduce((sum, count) => sum + count, 0) / counts.length;
      const statistic = counts.reduce((sum, count) => sum + (count - expected) ** 2 / expected, 0);
      const result = chiSquareGoodnessOfFit(counts);
      expect(result.statisticNumber).toBeCloseTo(statistic, 10);
      expect(result.degreesOfFreedom).toBe(counts.length - 1);
      expect(result.pValue).toBeCloseTo(1 - jStat.chisquare.cdf(statistic, counts.length - 1), 10);
    },
  );

  it.each([[[4]], [[0, 0, 0]], [[1, -2, 3]], [[1.5, 2]]])("refuses counts %j", (counts) => {
    expect(() => chiSquareGoodnessOfFit(counts)).toThrow(RangeError);
  });
});
