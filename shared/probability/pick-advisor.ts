import Fraction from "fraction.js";
import type { CountDistribution } from "./count-distribution";
import { beatAllCountsFromDistributions } from "./multi-player";

/** One candidate of the Pick advisor: a die, a mode (dice per player) and its exact chance to beat both opponents at once. */
export interface PickCandidate {
  pick: string;
  pickIndex: number;
  dicePerPlayer: number;
  probability: Fraction;
}

/** The Pick advisor's answer for one choice of two opponents' dice. */
export interface PickAdvice {
  opponents: [string, string];
  opponentIndices: [number, number];
  /** The candidate with the highest chance; ties go to fewer dice, then to the earlier die in the set. */
  best: PickCandidate;
  /** Every candidate, best first. */
  candidates: PickCandidate[];
}

/**
 * For every unordered pair of two different dice given to the opponents, ranks each remaining die and each mode
 * (all three players rolling the same number of dice) by the exact chance of beating both opponents at once.
 * `distributionOf(index, k)` supplies cached sum distributions.
 */
export function pickAdviceForThreePlayers(
  names: readonly string[],
  distributionOf: (index: number, dicePerPlayer: number) => CountDistribution,
  modes: readonly number[] = [1, 2],
): PickAdvice[] {
  const advice: PickAdvice[] = [];
  for (let first = 0; first < names.length; first += 1) {
    for (let second = first + 1; second < names.length; second += 1) {
      const candidates: PickCandidate[] = [];
      for (const dicePerPlayer of modes) {
        const opponents = [distributionOf(first, dicePerPlayer), distributionOf(second, dicePerPlayer)];
        names.forEach((pick, pickIndex) => {
          if (pickIndex === first || pickIndex === second) return;
          const { beatAll, total } = beatAllCountsFromDistributions(distributionOf(pickIndex, dicePerPlayer), opponents);
          candidates.push({ pick, pickIndex, dicePerPlayer, probability: new Fraction(beatAll, total) });
        });
      }
      if (candidates.length === 0) continue;
      candidates.sort((x, y) => y.probability.compare(x.probability) || x.dicePerPlayer - y.dicePerPlayer || x.pickIndex - y.pickIndex);
      advice.push({ opponents: [names[first], names[second]], opponentIndices: [first, second], best: candidates[0], candidates });
    }
  }
  return advice;
}
