import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { groupedTreeDiagram } from "@shared/probability/grouped-tree";
import { mulberry32, randomBelow } from "@shared/probability/seeded-random";
import { naiveMatchup } from "../../../scripts/bench/naive";

const die = fc.array(fc.integer({ min: 0, max: 12 }), { minLength: 2, maxLength: 6 });

/** Brute force: every equally likely pair of rolls, each player summing `dicePerPlayer` rolls, counted per band of the first player's sum. */
function bruteBands(a: number[], b: number[], dicePerPlayer: number, bands: { from: number; to: number }[]) {
  const sums = (faces: number[]): number[] => (dicePerPlayer === 1 ? faces : faces.flatMap((x) => faces.map((y) => x + y)));
  const counted = bands.map(() => ({ win: 0n, tie: 0n, loss: 0n, ways: 0n }));
  for (const x of sums(a)) {
    const band = bands.findIndex((each) => x >= each.from && x <= each.to);
    for (const y of sums(b)) counted[band][x > y ? "win" : x === y ? "tie" : "loss"] += 1n;
  }
  for (const each of counted) each.ways = (each.win + each.tie + each.loss) / BigInt(sums(b).length);
  return counted;
}

describe("groupedTreeDiagram", () => {
  it("counts each band's paths per outcome as enumerating every pair of rolls does", () => {
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 2 }), fc.integer({ min: 1, max: 5 }), (a, b, dicePerPlayer, bandsMax) => {
        const grouped = groupedTreeDiagram(a, b, { dicePerPlayer, bandsMax });
        expect(grouped.bands.length).toBeLessThanOrEqual(bandsMax);
        const brute = bruteBands(a, b, dicePerPlayer, grouped.bands);
        grouped.bands.forEach((each, index) => {
          expect(each.outcomes).toEqual({ win: brute[index].win, tie: brute[index].tie, loss: brute[index].loss });
          expect(each.ways).toBe(brute[index].ways);
        });
      }),
      { numRuns: 200 },
    );
  });

  it("sums to the matchup's exact chances (brute force over every joint roll, scripts/bench/naive.ts)", () => {
    fc.assert(
      fc.property(die, die, fc.integer({ min: 1, max: 2 }), (a, b, dicePerPlayer) => {
        const grouped = groupedTreeDiagram(a, b, { dicePerPlayer });
        const naive = naiveMatchup(a, b, dicePerPlayer);
        expect(new Fraction(grouped.totals.win, grouped.total).equals(naive.win)).toBe(true);
        expect(new Fraction(grouped.totals.tie, grouped.total).equals(naive.tie)).toBe(true);
        expect(new Fraction(grouped.totals.loss, grouped.total).equals(naive.loss)).toBe(true);
      }),
      { numRuns: 100 },
    );
  });

  it("groups two 60-faced dice at two dice each without a path apiece", () => {
    const spread = (seed: number) => {
      const random = mulberry32(seed);
      return Array.from({ length: 60 }, () => 1 + randomBelow(random, 999));
    };
    const grouped = groupedTreeDiagram(spread(5), spread(11), { dicePerPlayer: 2 });
    expect(grouped.firstValues * grouped.secondValues).toBeGreaterThan(1_000_000);
    expect(grouped.bands.length).toBe(12);
    expect(grouped.total).toBe(60n ** 4n);
    expect(grouped.totals.win + grouped.totals.tie + grouped.totals.loss).toBe(grouped.total);
  });
});
