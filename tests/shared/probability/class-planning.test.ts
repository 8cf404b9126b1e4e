import Fraction from "fraction.js";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { rollsNeededToExcludeHalf } from "@shared/probability/class-planning";

/** Wilson (1927) interval at a fractional count, with z from jstat, as an outside reference. */
function excludesHalf(p: number, n: number, confidence: number): boolean {
  const z = jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
  const centre = (p + (z * z) / (2 * n)) / (1 + (z * z) / n);
  const half = (z / (1 + (z * z) / n)) * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n));
  return centre - half > 0.5 || centre + half < 0.5;
}

describe("rollsNeededToExcludeHalf", () => {
  it.each([
    [2 / 3, 0.95],
    [5 / 9, 0.95],
    [0.52, 0.95],
    [0.4, 0.9],
    [0.75, 0.99],
    [0.999, 0.95],
  ])("returns the smallest n whose Wilson interval at n·p excludes 1/2 for p = %s at %s", (p, confidence) => {
    const rolls = rollsNeededToExcludeHalf(p, confidence)!;
    expect(excludesHalf(p, rolls, confidence)).toBe(true);
    if (rolls > 1) expect(excludesHalf(p, rolls - 1, confidence)).toBe(false);
  });

  it("needs about z²/(4(p − 1/2)²) rolls", () => {
    // Score-test sample size at p₀ = 1/2: n > z²·p₀(1 − p₀)/(p − p₀)² (common practice for planning).
    const z = jStat.normal.inv(0.975, 0, 1);
    expect(rollsNeededToExcludeHalf(new Fraction(2, 3))).toBe(Math.floor((z * z) / (4 * (1 / 6) ** 2)) + 1);
  });

  it("needs the same rolls for p and 1 − p", () => {
    expect(rollsNeededToExcludeHalf(0.3)).toBe(rollsNeededToExcludeHalf(0.7));
  });

  it("gives no answer for an even matchup", () => {
    expect(rollsNeededToExcludeHalf(new Fraction(1, 2))).toBeNull();
  });
});
