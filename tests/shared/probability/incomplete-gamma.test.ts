import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { logGamma, regularizedGammaLower, regularizedGammaUpper } from "@shared/probability/incomplete-gamma";

describe("logGamma", () => {
  it.each([1, 2, 5, 10, 20])("gives ln((n − 1)!) at n = %i", (n) => {
    // Γ(n) = (n − 1)! for whole n (any analysis textbook).
    let factorial = 1;
    for (let k = 2; k < n; k += 1) factorial *= k;
    expect(logGamma(n)).toBeCloseTo(Math.log(factorial), 10);
  });

  it("gives ln √π at 1/2", () => {
    // Γ(1/2) = √π (any analysis textbook).
    expect(logGamma(0.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI)), 12);
  });

  it.each([0.3, 2.5, 7.25, 31])("matches jstat.gammaln at %s", (x) => {
    expect(logGamma(x)).toBeCloseTo(jStat.gammaln(x), 10);
  });
});

describe("regularizedGammaLower", () => {
  const grid: [number, number][] = [];
  for (const a of [0.5, 1, 2.5, 5, 12, 30]) for (const x of [0, 0.1, 1, 3, 6, 13, 29, 45]) grid.push([a, x]);
  it.each(grid)("matches jstat.lowRegGamma at a = %s, x = %s", (a, x) => {
    expect(regularizedGammaLower(a, x)).toBeCloseTo(jStat.lowRegGamma(a, x), 10);
    expect(regularizedGammaLower(a, x) + regularizedGammaUpper(a, x)).toBeCloseTo(1, 12);
  });

  it.each([
    [0, 1],
    [1, -1],
  ])("refuses a = %s, x = %s", (a, x) => {
    expect(() => regularizedGammaUpper(a, x)).toThrow(RangeError);
  });
});
