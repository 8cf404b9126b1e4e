import { describe, expect, it } from "vitest";
import { compareDice } from "@shared/probability/matchup";
import { matchupSimulation } from "@shared/probability/simulation";

const a = [2, 2, 5, 5, 9, 9];
const b = [2, 4, 4, 6, 6, 9];

describe("matchupSimulation", () => {
  it("gives the same rolls for the same seed", () => {
    const first = matchupSimulation(a, b, { rolls: 300, seed: 77, dicePerPlayer: 2 });
    const again = matchupSimulation(a, b, { rolls: 300, seed: 77, dicePerPlayer: 2 });
    expect(again.rolls).toEqual(first.rolls);
    expect(matchupSimulation(a, b, { rolls: 300, seed: 78, dicePerPlayer: 2 }).rolls).not.toEqual(first.rolls);
  });

  it("rolls only faces the dice have and scores each roll by its totals", () => {
    const run = matchupSimulation(a, b, { rolls: 500, seed: 3, dicePerPlayer: 3 });
    for (const roll of run.rolls) {
      expect(roll.first.every((face) => a.includes(face)) && roll.second.every((face) => b.includes(face))).toBe(true);
      expect(roll.first).toHaveLength(3);
      const expected = roll.firstTotal > roll.secondTotal ? "win" : roll.firstTotal < roll.secondTotal ? "loss" : "tie";
      expect(roll.outcome).toBe(expected);
    }
  });

  it("converges on the exact probabilities within 4.5 standard errors", () => {
    // Law of large numbers; a tolerance of a few binomial standard errors is common practice.
    const rolls = 40_000;
    const run = matchupSimulation(a, b, { rolls, seed: 2718 });
    const exact = compareDice(a, b);
    for (const [frequency, p] of [
      [run.winFrequency[rolls - 1], exact.win.valueOf()],
      [run.tieFrequency[rolls - 1], exact.tie.valueOf()],
    ]) {
      expect(Math.abs(frequency - p)).toBeLessThan(4.5 * Math.sqrt((p * (1 - p)) / rolls));
    }
    expect(run.decidedWinFrequency[rolls - 1]).toBeCloseTo(run.counts.win / (run.counts.win + run.counts.loss), 12);
  });

  it.each([0, 1.5, 1_000_001])("refuses %s rolls", (rolls) => {
    expect(() => matchupSimulation(a, b, { rolls, seed: 1 })).toThrow(RangeError);
  });
});
