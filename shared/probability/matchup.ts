import Fraction from "fraction.js";
import { type CountDistribution, countsBelow } from "./count-distribution";
import { dicePerPlayerChecked, dieFacesChecked } from "./die";
import { sumCountDistribution } from "./sum-distribution";

/** Exact outcome counts of one matchup roll, out of `total` equally likely joint outcomes. */
export interface MatchupCounts {
  win: bigint;
  tie: bigint;
  loss: bigint;
  total: bigint;
}

/** Exact probabilities of one matchup roll, from the first player's side. */
export interface MatchupResult {
  win: Fraction;
  tie: Fraction;
  loss: Fraction;
}

/**
 * Counts wins, ties and losses of distribution `a` against `b` exactly, in O(|a| + |b|):
 * for each value of `a`, a two-pointer sweep gives how many outcomes of `b` lie below and equal.
 */
export function matchupCountsFromDistributions(a: CountDistribution, b: CountDistribution): MatchupCounts {
  const { below, equal } = countsBelow(b, a.values);
  let win = 0n;
  let tie = 0n;
  a.counts.forEach((ways, index) => {
    win += ways * below[index];
    tie += ways * equal[index];
  });
  const total = a.total * b.total;
  return { win, tie, loss: total - win - tie, total };
}

/** Turns matchup counts into exact probabilities. */
export function matchupResultFromCounts(counts: MatchupCounts): MatchupResult {
  return {
    win: new Fraction(counts.win, counts.total),
    tie: new Fraction(counts.tie, counts.total),
    loss: new Fraction(counts.loss, counts.total),
  };
}

/**
 * Exact P(win), P(tie), P(loss) for die `a` against die `b` when each player rolls
 * `dicePerPlayer` dice (default 1) and compares sums; sums come from convolution of value counts.
 */
export function compareDice(a: number[], b: number[], options?: { dicePerPlayer?: number }): MatchupResult {
  const count = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const first = sumCountDistribution(dieFacesChecked(a), count);
  const second = sumCountDistribution(dieFacesChecked(b), count);
  return matchupResultFromCounts(matchupCountsFromDistributions(first, second));
}
