import { dicePerPlayerChecked, dieFacesChecked } from "./die";
import { type Outcome, outcomeOfTotals } from "./outcome";
import { mulberry32, randomBelow } from "./seeded-random";

/** Most rolls one simulation run may make. */
export const SIMULATION_ROLLS_MAX = 1_000_000;

/** One simulated roll of a matchup. */
export interface SimulatedRoll {
  /** Face values rolled by the first player (one per die). */
  first: number[];
  /** Face values rolled by the second player. */
  second: number[];
  firstTotal: number;
  secondTotal: number;
  outcome: Outcome;
}

/** A seeded simulation run of a matchup (experimental probability). */
export interface MatchupSimulation {
  seed: number;
  dicePerPlayer: number;
  rolls: SimulatedRoll[];
  /** winFrequency[i]: the first player's relative frequency of wins after rolls 0 … i. */
  winFrequency: number[];
  /** tieFrequency[i]: relative frequency of ties after rolls 0 … i. */
  tieFrequency: number[];
  /** decidedWinFrequency[i]: wins / (wins + losses) after rolls 0 … i, the re-roll-ties view; null before any decided roll. */
  decidedWinFrequency: (number | null)[];
  counts: Record<Outcome, number>;
}

/**
 * Simulates `rolls` rolls of die `a` against die `b` (each player rolling `dicePerPlayer` dice) with the seeded
 * mulberry32 generator, returning every roll and the running relative frequencies for a law-of-large-numbers demo.
 * The same seed gives the same rolls.
 */
export function matchupSimulation(
  a: number[],
  b: number[],
  options: { rolls: number; seed: number; dicePerPlayer?: number },
): MatchupSimulation {
  const first = dieFacesChecked(a);
  const second = dieFacesChecked(b);
  const dicePerPlayer = dicePerPlayerChecked(options.dicePerPlayer ?? 1);
  if (!Number.isInteger(options.rolls) || options.rolls < 1 || options.rolls > SIMULATION_ROLLS_MAX) {
    throw new RangeError(`A simulation makes from 1 to ${SIMULATION_ROLLS_MAX} rolls.`);
  }
  const source = mulberry32(options.seed);
  const rollDice = (faces: number[]): number[] => Array.from({ length: dicePerPlayer }, () => faces[randomBelow(source, faces.length)]);
  const counts: Record<Outcome, number> = { win: 0, tie: 0, loss: 0 };
  const rolls: SimulatedRoll[] = [];
  const winFrequency: number[] = [];
  const tieFrequency: number[] = [];
  const decidedWinFrequency: (number | null)[] = [];
  for (let index = 1; index <= options.rolls; index += 1) {
    const firstFaces = rollDice(first);
    const secondFaces = rollDice(second);
    const firstTotal = firstFaces.reduce((sum, face) => sum + face, 0);
    const secondTotal = secondFaces.reduce((sum, face) => sum + face, 0);
    const outcome = outcomeOfTotals(firstTotal, secondTotal);
    counts[outcome] += 1;
    rolls.push({ first: firstFaces, second: secondFaces, firstTotal, secondTotal, outcome });
    winFrequency.push(counts.win / index);
    tieFrequency.push(counts.tie / index);
    const decided = counts.win + counts.loss;
    decidedWinFrequency.push(decided === 0 ? null : counts.win / decided);
  }
  return { seed: options.seed, dicePerPlayer, rolls, winFrequency, tieFrequency, decidedWinFrequency, counts };
}
