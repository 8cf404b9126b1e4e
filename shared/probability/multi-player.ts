import Fraction from "fraction.js";
import { type CountDistribution, countsBelow } from "./count-distribution";
import { dicePerPlayerChecked, dieFacesChecked, InvalidDieError } from "./die";
import { type MatchupResult, matchupCountsFromDistributions, matchupResultFromCounts } from "./matchup";
import { sumCountDistribution } from "./sum-distribution";

/**
 * Exact count of joint outcomes where `pick` is strictly above every opponent, with the total.
 * Independent players make P(X > max Yᵢ) = Σₓ P(X = x)·∏ᵢ P(Yᵢ < x), the distribution function of the maximum.
 */
export function beatAllCountsFromDistributions(
  pick: CountDistribution,
  opponents: readonly CountDistribution[],
): { beatAll: bigint; total: bigint } {
  const belowPerOpponent = opponents.map((opponent) => countsBelow(opponent, pick.values).below);
  let beatAll = 0n;
  pick.counts.forEach((ways, index) => {
    let joint = ways;
    for (const below of belowPerOpponent) joint *= below[index];
    beatAll += joint;
  });
  const total = opponents.reduce((product, opponent) => product * opponent.total, pick.total);
  return { beatAll, total };
}

/**
 * Exact probability that `pick` beats every opponent at once (its sum strictly above each opponent's sum),
 * every player rolling `dicePerPlayer` dice; exact over the joint distribution via the distribution of the maximum.
 */
export function beatAllProbability(pick: number[], opponents: number[][], options?: { dicePerPlayer?: number }): Fraction {
  if (opponents.length === 0) throw new InvalidDieError(["Give at least one opponent's die."]);
  const count = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const pickDistribution = sumCountDistribution(dieFacesChecked(pick), count);
  const opponentDistributions = opponents.map((faces) => sumCountDistribution(dieFacesChecked(faces), count));
  const { beatAll, total } = beatAllCountsFromDistributions(pickDistribution, opponentDistributions);
  return new Fraction(beatAll, total);
}

/** Exact outcome of one roll among several players. */
export interface MultiPlayerResult {
  /** highestOutright[i]: P(player i's sum is strictly above every other player's). */
  highestOutright: Fraction[];
  /** P(two or more players share the highest sum); with highestOutright this sums to 1. */
  sharedHighest: Fraction;
  /** pairwise[i][j]: the matchup of player i against player j (null on the diagonal). */
  pairwise: (MatchupResult | null)[][];
}

/**
 * For 2 or more players each rolling `dicePerPlayer` dice: each player's exact chance of the highest sum outright,
 * the chance the highest sum is shared, and every pairwise matchup (distribution of the maximum, two-pointer sweeps).
 */
export function multiPlayerMatchup(players: number[][], options?: { dicePerPlayer?: number }): MultiPlayerResult {
  if (players.length < 2) throw new InvalidDieError(["A matchup needs at least two players."]);
  const count = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const distributions = players.map((faces) => sumCountDistribution(dieFacesChecked(faces), count));
  const highestOutright = distributions.map((pick, index) => {
    const { beatAll, total } = beatAllCountsFromDistributions(
      pick,
      distributions.filter((_, other) => other !== index),
    );
    return new Fraction(beatAll, total);
  });
  const sharedHighest = highestOutright.reduce((rest, part) => rest.sub(part), new Fraction(1));
  const pairwise = distributions.map((first, i) =>
    distributions.map((second, j) => (i === j ? null : matchupResultFromCounts(matchupCountsFromDistributions(first, second)))),
  );
  return { highestOutright, sharedHighest, pairwise };
}
