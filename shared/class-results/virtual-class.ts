import { matchupSimulation, mulberry32, randomBelow } from "../probability/index";

/** One simulated roll: faces per seat and each seat's total. */
export type SimulatedMatchupRoll = { faces: number[][]; totals: number[] };

/**
 * Seeded rolls of a matchup for the virtual class: two players through the engine's matchupSimulation, three players
 * with the engine's mulberry32 generator and rejection sampling (randomBelow); the same seed gives the same rolls.
 */
export function simulatedMatchupRolls(input: { dice: number[][]; dicePerPlayer: number; rolls: number; seed: number }): SimulatedMatchupRoll[] {
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

/** The seat with the highest total, or null when the highest total is shared (a tie). */
export function winnerSeatOf(totals: readonly number[]): number | null {
  const highest = Math.max(...totals);
  const top = totals.flatMap((total, seat) => (total === highest ? [seat] : []));
  return top.length === 1 ? top[0] : null;
}
