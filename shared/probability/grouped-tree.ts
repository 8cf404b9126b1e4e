import { countsBelow } from "./count-distribution";
import { dicePerPlayerChecked, dieFacesChecked } from "./die";
import type { Outcome } from "./outcome";
import { sumCountDistribution } from "./sum-distribution";

/** A run of the first die's neighbouring values (sums with several dice each), with its paths counted per outcome. */
export interface GroupedTreeBand {
  /** Smallest and largest value of the first die in the band. */
  from: number;
  to: number;
  /** How many distinct values of the first die the band holds. */
  valueCount: number;
  /** Equally likely ways the first die lands in the band, out of the first die's own total. */
  ways: bigint;
  /** Equally likely joint outcomes in the band that end in each outcome for the first die, out of `GroupedTree.total`. */
  outcomes: Record<Outcome, bigint>;
}

/**
 * A tree diagram too large to draw path by path, grouped: the first die's values in at most `bandsMax` bands of neighbours,
 * and within each band the paths summed by outcome. Everything is an exact count (bigint), so it crosses to and from a worker
 * as it is; divide by `total` (or `firstTotal` for a band's own chance) for the fractions.
 */
export interface GroupedTree {
  dicePerPlayer: number;
  /** Distinct values of each die: the full tree would have firstValues × secondValues paths. */
  firstValues: number;
  secondValues: number;
  firstTotal: bigint;
  total: bigint;
  bands: GroupedTreeBand[];
  totals: Record<Outcome, bigint>;
}

/**
 * The tree diagram of die A against die B grouped by A's value (multiplication rule for independent stages, then the
 * addition rule over each group's paths): for each of A's values v with w ways, the paths to B's lower values count w × ways(B < v)
 * wins, w × ways(B = v) ties and the rest losses. O(|A| + |B|) after the sum distributions, with no object per path, so two
 * 60-faced dice at two dice each (millions of paths) take milliseconds.
 */
export function groupedTreeDiagram(a: number[], b: number[], options?: { dicePerPlayer?: number; bandsMax?: number }): GroupedTree {
  const dicePerPlayer = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const bandsMax = Math.max(1, Math.floor(options?.bandsMax ?? 12));
  const first = sumCountDistribution(dieFacesChecked(a), dicePerPlayer);
  const second = sumCountDistribution(dieFacesChecked(b), dicePerPlayer);
  const { below, equal } = countsBelow(second, first.values);
  const perBand = Math.ceil(first.values.length / bandsMax);
  const bands: GroupedTreeBand[] = [];
  const totals: Record<Outcome, bigint> = { win: 0n, tie: 0n, loss: 0n };
  for (let start = 0; start < first.values.length; start += perBand) {
    const end = Math.min(first.values.length, start + perBand);
    const band: GroupedTreeBand = {
      from: first.values[start],
      to: first.values[end - 1],
      valueCount: end - start,
      ways: 0n,
      outcomes: { win: 0n, tie: 0n, loss: 0n },
    };
    for (let index = start; index < end; index += 1) {
      const ways = first.counts[index];
      const win = ways * below[index];
      const tie = ways * equal[index];
      band.ways += ways;
      band.outcomes.win += win;
      band.outcomes.tie += tie;
      band.outcomes.loss += ways * second.total - win - tie;
    }
    for (const outcome of ["win", "tie", "loss"] as const) totals[outcome] += band.outcomes[outcome];
    bands.push(band);
  }
  return {
    dicePerPlayer,
    firstValues: first.values.length,
    secondValues: second.values.length,
    firstTotal: first.total,
    total: first.total * second.total,
    bands,
    totals,
  };
}
