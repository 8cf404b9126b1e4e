import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { wilsonInterval } from "@shared/probability/wilson-interval";

const cases: [number, number, number][] = [];
for (const trials of [1, 10, 37, 200, 5000]) {
  for (const share of [0, 0.13, 0.5, 0.71, 1])
    for (const confidence of [0.8, 0.9, 0.95, 0.99]) cases.push([Math.round(share * trials), trials, confidence]);
}

describe("wilsonInterval", () => {
  it.each(cases)("matches Wilson's formula with jstat's z for %i of %i at %s", (successes, trials, confidence) => {
    // Wilson (1927), JASA: centre (p̂ + z²/2n)/(1 + z²/n), half-width z/(1 + z²/n)·√(p̂(1 − p̂)/n + z²/4n²); z from jstat.normal.inv.
    const z = jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
    const p = successes / trials;
    const centre = (p + (z * z) / (2 * trials)) / (1 + (z * z) / trials);
    const half = (z / (1 + (z * z) / trials)) * Math.sqrt((p * (1 - p)) / trials + (z * z) / (4 * trials * trials));
    const interval = wilsonInterval(successes, trials, confidence);
    expect(interval.lower).toBeCloseTo(Math.max(0, centre - half), 9);
    expect(interval.upper).toBeCloseTo(Math.min(1, centre + half), 9);
  });

  it("puts each bound where the score test is exactly at its critical value", () => {
    // Wilson's interval inverts the score test: |p̂ − p₀| = z·√(p₀(1 − p₀)/n) at both ends.
    const z = jStat.normal.inv(0.975, 0, 1);
    const { lower, upper } = wilsonInterval(31, 50);
    for (const bound of [lower, upper]) expect(Math.abs(31 / 50 - bound)).toBeCloseTo(z * Math.sqrt((bound * (1 - bound)) / 50), 9);
  });

  it.each([
    [11, 10],
    [-1, 10],
    [3, 0],
    [2.5, 10],
  ])("refuses %s successes in %s trials", (successes, trials) => {
    expect(() => wilsonInterval(successes, trials)).toThrow(RangeError);
  });
});
