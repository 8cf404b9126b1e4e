import Fraction from "fraction.js";

/**
 * An exact distribution held as whole-number counts: `values` sorted ascending and distinct,
 * `counts[i]` the number of equally likely outcomes giving `values[i]`, `total` their sum.
 */
export interface CountDistribution {
  values: number[];
  counts: bigint[];
  total: bigint;
}

/** Counts how often each distinct face value appears on a die (its value counts, sorted by value). */
export function countDistributionFromFaces(faces: readonly number[]): CountDistribution {
  const tally = new Map<number, number>();
  for (const face of faces) tally.set(face, (tally.get(face) ?? 0) + 1);
  const values = [...tally.keys()].sort((x, y) => x - y);
  return { values, counts: values.map((value) => BigInt(tally.get(value)!)), total: BigInt(faces.length) };
}

/** Turns a count distribution into value → exact probability (count / total), in ascending value order. */
export function probabilityMapFromCounts(distribution: CountDistribution): Map<number, Fraction> {
  const probabilities = new Map<number, Fraction>();
  distribution.values.forEach((value, index) => {
    probabilities.set(value, new Fraction(distribution.counts[index], distribution.total));
  });
  return probabilities;
}

/** Exact probability of one value under a count distribution (0 when the value cannot occur). */
export function probabilityOfValue(distribution: CountDistribution, value: number): Fraction {
  const index = distribution.values.indexOf(value);
  return index < 0 ? new Fraction(0) : new Fraction(distribution.counts[index], distribution.total);
}

/**
 * Counts of outcomes strictly below each value of `probe`, using a two-pointer sweep over the
 * sorted values of `distribution` (prefix sums of a cumulative distribution function).
 */
export function countsBelow(distribution: CountDistribution, probe: readonly number[]): { below: bigint[]; equal: bigint[] } {
  const below: bigint[] = [];
  const equal: bigint[] = [];
  let pointer = 0;
  let cumulative = 0n;
  for (const value of probe) {
    while (pointer < distribution.values.length && distribution.values[pointer] < value) {
      cumulative += distribution.counts[pointer];
      pointer += 1;
    }
    below.push(cumulative);
    equal.push(pointer < distribution.values.length && distribution.values[pointer] === value ? distribution.counts[pointer] : 0n);
  }
  return { below, equal };
}
