import { describe, expect, it } from "vitest";
import { multiPlayerMatchup, wilsonInterval } from "@shared/probability/index";
import { simulatedMatchupRolls, winnerSeatOf } from "@shared/class-results/virtual-class";

// Invented dice for the checks.
const skua = [1, 1, 5, 5, 6, 6];
const fulmar = [2, 3, 3, 4, 7, 7];
const gull = [0, 4, 4, 4, 4, 8];

describe("simulatedMatchupRolls", () => {
  it("gives the same rolls for the same seed and different ones for another", () => {
    const first = simulatedMatchupRolls({ dice: [skua, fulmar, gull], dicePerPlayer: 1, rolls: 50, seed: 11 });
    expect(simulatedMatchupRolls({ dice: [skua, fulmar, gull], dicePerPlayer: 1, rolls: 50, seed: 11 })).toEqual(first);
    expect(simulatedMatchupRolls({ dice: [skua, fulmar, gull], dicePerPlayer: 1, rolls: 50, seed: 12 })).not.toEqual(first);
  });

  it("only rolls faces the dice have, summing two dice each", () => {
    for (const entry of simulatedMatchupRolls({ dice: [skua, gull], dicePerPlayer: 2, rolls: 200, seed: 3 })) {
      expect(entry.faces[0].every((face) => skua.includes(face))).toBe(true);
      expect(entry.faces[1].every((face) => gull.includes(face))).toBe(true);
      expect(entry.totals).toEqual(entry.faces.map((seat) => seat[0] + seat[1]));
    }
  });

  it("converges on the engine's exact three-player chances (law of large numbers, 20 000 seeded rolls)", () => {
    const rolls = simulatedMatchupRolls({ dice: [skua, fulmar, gull], dicePerPlayer: 1, rolls: 20_000, seed: 2026 });
    const exact = multiPlayerMatchup([skua, fulmar, gull]).highestOutright.map((value) => value.valueOf());
    for (let seat = 0; seat < 3; seat += 1) {
      const wins = rolls.filter((entry) => winnerSeatOf(entry.totals) === seat).length;
      // A 99.9% Wilson interval around the observed share should hold the exact value (common practice for a seeded check).
      const interval = wilsonInterval(wins, rolls.length, 0.999);
      expect(exact[seat]).toBeGreaterThan(interval.lower);
      expect(exact[seat]).toBeLessThan(interval.upper);
    }
  });
});

describe("winnerSeatOf", () => {
  it.each([
    [[3, 2], 0],
    [[2, 5], 1],
    [[4, 4], null],
    [[1, 6, 6], null],
    [[1, 2, 9], 2],
  ])("gives %j the winner %s", (totals, winner) => {
    expect(winnerSeatOf(totals as number[])).toBe(winner);
  });
});
