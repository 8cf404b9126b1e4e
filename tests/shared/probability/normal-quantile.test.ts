import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { normalDistribution, normalQuantile } from "@shared/probability/normal-quantile";

const grid = [1e-8, 1e-5, 0.001, 0.01, 0.02425, 0.025, 0.05, 0.1, 0.3, 0.5, 0.7, 0.9, 0.95, 0.975, 0.99, 0.999, 1 - 1e-9];

describe("normalQuantile", () => {
  it.each(grid)("matches jstat.normal.inv at p = %s", (p) => {
    const reference = jStat.normal.inv(p, 0, 1);
    expect(Math.abs(normalQuantile(p) - reference)).toBeLessThan(1e-9 * Math.max(1, Math.abs(reference)));
  });

  it("gives 1.959964 for the 95% two-sided critical value", () => {
    // Standard normal tables: z₀.₉₇₅ = 1.959964 (from memory).
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6);
  });

  it("stays accurate in the far tail, where jstat's own inverse drifts", () => {
    // Extreme normal quantile tables: z for a lower tail of 10⁻¹² is −7.0345 (from memory).
    expect(normalQuantile(1e-12)).toBeCloseTo(-7.0345, 4);
  });

  it.each([0, 1, -0.1, Number.NaN])("refuses p = %s", (p) => {
    expect(() => normalQuantile(p)).toThrow(RangeError);
  });
});

describe("normalDistribution", () => {
  it.each([-8, -3, -1.5, -0.2, 0, 0.7, 2, 5])("matches jstat.normal.cdf at x = %s", (x) => {
    expect(normalDistribution(x)).toBeCloseTo(jStat.normal.cdf(x, 0, 1), 12);
  });
});
