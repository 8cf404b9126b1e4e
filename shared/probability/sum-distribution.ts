import Fraction from "fraction.js";
import { type CountDistribution, countDistributionFromFaces, probabilityMapFromCounts } from "./count-distribution";
import { dicePerPlayerChecked, dieFacesChecked } from "./die";

/**
 * Exact counts for the sum of `count` independent rolls of one die, by repeated discrete
 * convolution of its value counts (the standard method for sums of independent variables).
 * Counts stay below 60^6 < 2^53, so the dense convolution runs in plain numbers.
 */
export function sumCountDistribution(faces: readonly number[], count: number): CountDistribution {
  const single = countDistributionFromFaces(faces);
  if (count === 1) return single;
  const minimum = single.values[0];
  const offsets = single.values.map((value) => value - minimum);
  const weights = single.counts.map(Number);
  let current = [1];
  for (let step = 0; step < count; step += 1) {
    const next = new Array<number>(current.length + offsets[offsets.length - 1]).fill(0);
    for (let index = 0; index < current.length; index += 1) {
      const ways = current[index];
      if (ways === 0) continue;
      for (let face = 0; face < offsets.length; face += 1) next[index + offsets[face]] += ways * weights[face];
    }
    current = next;
  }
  const values: number[] = [];
  const counts: bigint[] = [];
  current.forEach((ways, offset) => {
    if (ways === 0) return;
    values.push(count * minimum + offset);
    counts.push(BigInt(ways));
  });
  return { values, counts, total: single.total ** BigInt(count) };
}

/**
 * Exact distribution of the sum of `count` copies (1 to 6) of a die: sum value → probability,
 * in ascending order of sum, computed by convolution of value counts.
 */
export function sumDistribution(faces: number[], count: number): Map<number, Fraction> {
  return probabilityMapFromCounts(sumCountDistribution(dieFacesChecked(faces), dicePerPlayerChecked(count)));
}
