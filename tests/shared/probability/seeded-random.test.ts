import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { mulberry32, randomBelow } from "@shared/probability/seeded-random";

describe("mulberry32", () => {
  it("repeats its stream for the same seed and differs for another", () => {
    const first = mulberry32(2024);
    const again = mulberry32(2024);
    const other = mulberry32(2025);
    const draws = Array.from({ length: 50 }, () => [first(), again(), other()]);
    expect(draws.every(([x, y]) => x === y)).toBe(true);
    expect(draws.some(([x, , z]) => x !== z)).toBe(true);
  });
});

describe("randomBelow", () => {
  it("draws each of 6 faces about equally often", () => {
    // Pearson chi-square test with jstat.chisquare.cdf; rejecting only below 0.001 is common practice for a seeded check.
    const source = mulberry32(99);
    const counts = new Array<number>(6).fill(0);
    const draws = 60_000;
    for (let index = 0; index < draws; index += 1) counts[randomBelow(source, 6)] += 1;
    const statistic = counts.reduce((sum, count) => sum + (count - draws / 6) ** 2 / (draws / 6), 0);
    expect(1 - jStat.chisquare.cdf(statistic, 5)).toBeGreaterThan(0.001);
  });

  it("stays within its bound", () => {
    const source = mulberry32(5);
    for (const bound of [1, 2, 7, 60]) for (let index = 0; index < 200; index += 1) expect(randomBelow(source, bound)).toBeLessThan(bound);
  });
});
