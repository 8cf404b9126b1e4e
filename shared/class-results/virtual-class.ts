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
  // One pass without allocating: every pupil's roll goes through here.
  let winner: number | null = null;
  let highest = -Infinity;
  for (let seat = 0; seat < totals.length; seat += 1) {
    if (totals[seat] > highest) {
      highest = totals[seat];
      winner = seat;
    } else if (totals[seat] === highest) winner = null;
  }
  return winner;
}
