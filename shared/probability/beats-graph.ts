import type { MatchupResult } from "./matchup";

/** How die i fares against die j in one roll: "beats" when P(i wins) > P(j wins), "loses" when below, "even" when equal. */
export type MatchupRelation = "beats" | "loses" | "even";

/** The relation of a matchup from the first die's side, comparing P(win) with P(loss) exactly. */
export function matchupRelation(result: MatchupResult): MatchupRelation {
  const order = result.win.compare(result.loss);
  return order > 0 ? "beats" : order < 0 ? "loses" : "even";
}

/**
 * The "beats" graph of a matchup matrix: `successors[i]` lists every j that die i beats
 * (P(i wins) > P(j wins) in one roll); even matchups give no edge.
 */
export function beatsGraph(matrix: readonly (readonly (MatchupResult | null)[])[]): number[][] {
  return matrix.map((row) => row.flatMap((cell, j) => (cell !== null && matchupRelation(cell) === "beats" ? [j] : [])));
}
