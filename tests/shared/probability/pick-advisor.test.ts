import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeSet } from "@shared/probability/analyze-set";
import { naiveBeatAll } from "../../../scripts/bench/naive";

const names = ["Skua", "Fulmar", "Eider", "Auk", "Gull"];
const diceSet = fc
  .array(fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 2, maxLength: 4 }), { minLength: 3, maxLength: 5 })
  .map((faces) => faces.map((die, index) => ({ name: names[index], faces: die })));

describe("pick advice for three players", () => {
  it("rates every candidate as brute force does and puts the highest first", () => {
    // Brute force: scripts/bench/naive.ts enumerates every joint outcome of the three players' dice.
    fc.assert(
      fc.property(diceSet, (dice) => {
        const advice = analyzeSet(dice, { dicePerPlayer: 1 }).pickAdvice;
        expect(advice).toHaveLength((dice.length * (dice.length - 1)) / 2);
        for (const entry of advice) {
          const [first, second] = entry.opponentIndices;
          expect(entry.candidates).toHaveLength(2 * (dice.length - 2));
          for (const candidate of entry.candidates) {
            const naive = naiveBeatAll(dice[candidate.pickIndex].faces, [dice[first].faces, dice[second].faces], candidate.dicePerPlayer);
            expect(candidate.probability.equals(naive)).toBe(true);
            expect(entry.best.probability.gte(candidate.probability)).toBe(true);
          }
        }
      }),
      { numRuns: 15 },
    );
  });

  it("gives no advice for a two-dice set", () => {
    expect(
      analyzeSet([
        { name: "Skua", faces: [1, 4] },
        { name: "Auk", faces: [2, 3] },
      ]).pickAdvice,
    ).toEqual([]);
  });
});
