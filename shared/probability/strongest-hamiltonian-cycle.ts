import type Fraction from "fraction.js";

/** A cycle through every vertex, starting at vertex 0, and its weakest edge. */
export interface StrongestHamiltonianCycle {
  order: number[];
  weakest: Fraction;
}

/** Most vertices the search takes: its table holds 2^n · n entries. */
export const STRONGEST_CYCLE_VERTICES_MAX = 16;

/**
 * The cycle through every vertex whose weakest edge is strongest (the bottleneck travelling-salesman cycle), found by the
 * Held–Karp dynamic programme over vertex subsets (Bellman 1962; Held and Karp 1962) with "min along the path, max over paths"
 * in place of sums: O(2^n · n²) steps, however many Hamiltonian cycles the graph has. `weights[i][j]` is the edge i → j, or null
 * without one. Answers null when no cycle visits every vertex; of equally strong cycles it answers the first met.
 */
export function strongestHamiltonianCycle(weights: readonly (readonly (Fraction | null)[])[]): StrongestHamiltonianCycle | null {
  const size = weights.length;
  if (size < 2) return null;
  if (size > STRONGEST_CYCLE_VERTICES_MAX)
    throw new RangeError(`The strongest cycle search takes at most ${STRONGEST_CYCLE_VERTICES_MAX} vertices.`);
  // Edge weights become ranks (0 = weakest), so the table compares small integers instead of fractions.
  const distinct: Fraction[] = [];
  for (const row of weights)
    for (const weight of row) if (weight !== null && !distinct.some((known) => known.equals(weight))) distinct.push(weight);
  distinct.sort((a, b) => a.compare(b));
  const rank = weights.map((row) => row.map((weight) => (weight === null ? -1 : distinct.findIndex((known) => known.equals(weight)))));
  const full = (1 << size) - 1;
  // best[mask·size + v]: the strongest weakest edge of a path from 0 through exactly `mask`, ending at v; −2 when none.
  const best = new Int32Array((full + 1) * size).fill(-2);
  const previous = new Int8Array((full + 1) * size).fill(-1);
  best[1 * size + 0] = 0x3fffffff; // the empty path has no weakest edge yet
  for (let mask = 1; mask <= full; mask += 2) {
    for (let last = 0; last < size; last += 1) {
      const here = best[mask * size + last];
      if (here === -2) continue;
      for (let next = 1; next < size; next += 1) {
        if (mask & (1 << next) || rank[last][next] < 0) continue;
        const through = Math.min(here, rank[last][next]);
        const slot = (mask | (1 << next)) * size + next;
        if (through > best[slot]) {
          best[slot] = through;
          previous[slot] = last;
        }
      }
    }
  }
  let closing = -1;
  let strength = -1;
  for (let last = 1; last < size; last += 1) {
    const path = best[full * size + last];
    if (path === -2 || rank[last][0] < 0) continue;
    const through = Math.min(path, rank[last][0]);
    if (through > strength) {
      strength = through;
      closing = last;
    }
  }
  if (closing < 0) return null;
  const order: number[] = [];
  let mask = full;
  let vertex = closing;
  while (vertex !== 0) {
    order.push(vertex);
    const before = previous[mask * size + vertex];
    mask &= ~(1 << vertex);
    vertex = before;
  }
  order.push(0);
  order.reverse();
  return { order, weakest: distinct[strength] };
}
