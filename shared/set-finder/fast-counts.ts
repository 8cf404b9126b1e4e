/**
 * Whole-number matchup counts for the search's inner loops, in plain numbers (at most 12 faces, so at most 12^4 outcomes).
 * The exact engine in shared/probability re-checks every set before it is shown.
 */

/** The sum of two rolls of a die as distinct sums, ascending, with their counts. */
export interface TwoDiceCounts {
  sums: Int32Array;
  counts: Int32Array;
}

/** Counts each sum of two rolls of a die by listing all face pairs (the die's convolution with itself). */
export function twoDiceCounts(faces: readonly number[]): TwoDiceCounts {
  const tally = new Map<number, number>();
  for (const first of faces) for (const second of faces) tally.set(first + second, (tally.get(first + second) ?? 0) + 1);
  const sums = [...tally.keys()].sort((x, y) => x - y);
  return { sums: Int32Array.from(sums), counts: Int32Array.from(sums.map((sum) => tally.get(sum)!)) };
}

/** Outcomes in which the sum from `a` beats the sum from `b`: for each sum of a, the outcomes of b below it, by a two-pointer sweep. */
export function twoDiceWinCount(a: TwoDiceCounts, b: TwoDiceCounts): number {
  let wins = 0;
  let pointer = 0;
  let below = 0;
  for (let index = 0; index < a.sums.length; index += 1) {
    const sum = a.sums[index];
    while (pointer < b.sums.length && b.sums[pointer] < sum) {
      below += b.counts[pointer];
      pointer += 1;
    }
    wins += a.counts[index] * below;
  }
  return wins;
}

/** Outcomes in which a face of sorted die `a` beats a face of sorted die `b` (both ascending), by a two-pointer sweep. */
export function oneDieWinCount(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let wins = 0;
  let pointer = 0;
  for (let index = 0; index < a.length; index += 1) {
    while (pointer < b.length && b[pointer] < a[index]) pointer += 1;
    wins += pointer;
  }
  return wins;
}
