import { matchupSimulation, mulberry32, randomBelow } from "../probability/index";

// In a file of its own so the Roll pad can score rolls without the engine; kept importable from here.
export { winnerSeatOf } from "./winner-seat";

/** One simulated roll: faces per seat and each seat's total. */
export type SimulatedMatchupRoll = { faces: number[][]; totals: number[] };

/**
 * Seeded rolls of a matchup for the virtual class: two players through the engine's matchupSimulation, three players
 * with the engine's mulberry32 generator and rejection sampling (randomBelow); the same seed gives the same rolls.
 */
export function simulatedMatchupRolls(input: {
  dice: number[][];
  dicePerPlayer: number;
  rolls: number;
  seed: number;
}): SimulatedMatchupRoll[] {
  const { dice, dicePerPlayer, rolls, seed } = input;
  if (dice.length === 2) {
    return matchupSimulation(dice[0], dice[1], { rolls, seed, dicePerPlayer }).rolls.map((entry) => ({
      faces: [entry.first, entry.second],
      totals: [entry.firstTotal, entry.secondTotal],
    }));
  }
  const source = mulberry32(seed);
  return Array.from({ length: rolls }, () => {
    const faces = dice.map((die) => Array.from({ length: dicePerPlayer }, () => die[randomBelow(source, die.length)]));
    return { faces, totals: faces.map((seat) => seat.reduce((sum, face) => sum + face, 0)) };
  });
}
