import type { FinderFaceValues } from "../schemas/set-finder";

/** The allowed face values of a request, ascending and distinct. */
export function allowedFaceValues(faceValues: FinderFaceValues): number[] {
  if (faceValues.kind === "list") return [...new Set(faceValues.values)].sort((x, y) => x - y);
  return Array.from({ length: faceValues.max - faceValues.min + 1 }, (_, index) => faceValues.min + index);
}

/** The binomial coefficient C(n, k) as a double (exact while below 2^53). */
export function binomial(n: number, k: number): number {
  if (k < 0 || k > n) return 0;
  let result = 1;
  for (let step = 1; step <= Math.min(k, n - k); step += 1) result = (result * (n - Math.min(k, n - k) + step)) / step;
  return Math.round(result);
}

/** Ordered choices of r distinct items from n, n·(n−1)·…·(n−r+1), as a double. */
export function orderedChoices(n: number, r: number): number {
  if (r < 0 || r > n) return 0;
  let result = 1;
  for (let step = 0; step < r; step += 1) result *= n - step;
  return result;
}

/** How many dice with `facesPerDie` faces, sorted ascending, can be made from `valueCount` values: C(v + f − 1, f), multisets. */
export function candidateDieCount(valueCount: number, facesPerDie: number): number {
  return binomial(valueCount + facesPerDie - 1, facesPerDie);
}

/**
 * Every candidate die once: its faces sorted ascending (a die's faces have no order), as indices into the allowed values,
 * in lexicographic order. Dice that carry the smallest allowed value therefore come first: `withLowestValue` of them.
 */
export interface DicePool {
  values: number[];
  facesPerDie: number;
  size: number;
  /** size × facesPerDie value indices, die after die. */
  faceIndices: Uint8Array;
  /** How many dice, from index 0, carry the smallest allowed value. */
  withLowestValue: number;
}

/** Builds the pool of candidate dice for a request's values and face count. */
export function buildDicePool(values: number[], facesPerDie: number): DicePool {
  const size = candidateDieCount(values.length, facesPerDie);
  const faceIndices = new Uint8Array(size * facesPerDie);
  const current = new Array<number>(facesPerDie).fill(0);
  let written = 0;
  let withLowestValue = 0;
  for (;;) {
    faceIndices.set(current, written * facesPerDie);
    if (current[0] === 0) withLowestValue += 1;
    written += 1;
    let position = facesPerDie - 1;
    while (position >= 0 && current[position] === values.length - 1) position -= 1;
    if (position < 0) break;
    const next = current[position] + 1;
    for (let fill = position; fill < facesPerDie; fill += 1) current[fill] = next;
  }
  return { values, facesPerDie, size, faceIndices, withLowestValue };
}

/** The face values of die `index` of a pool. */
export function poolDieFaces(pool: DicePool, index: number): number[] {
  const faces: number[] = [];
  for (let face = 0; face < pool.facesPerDie; face += 1) faces.push(pool.values[pool.faceIndices[index * pool.facesPerDie + face]]);
  return faces;
}
