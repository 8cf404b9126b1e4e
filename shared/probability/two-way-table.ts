import Fraction from "fraction.js";
import { dicePerPlayerChecked, dieFacesChecked } from "./die";
import { type Outcome, outcomeOfTotals } from "./outcome";
import { sumCountDistribution } from "./sum-distribution";

/** A row or column heading: one sum value and its probability. */
export interface TableHeading {
  value: number;
  probability: Fraction;
  /** Number of equally likely ways to roll this sum. */
  ways: bigint;
}

/** One cell: A's outcome and the cell's probability P(row) × P(column). */
export interface TableCell {
  outcome: Outcome;
  probability: Fraction;
  /** Equally likely joint outcomes in this cell, out of `TwoWayTable.totalWays`. */
  ways: bigint;
}

/** The two-way table (sample space) of a matchup's sums. */
export interface TwoWayTable {
  dicePerPlayer: number;
  rows: TableHeading[];
  columns: TableHeading[];
  /** cells[r][c]: A's sum rows[r].value against B's sum columns[c].value. */
  cells: TableCell[][];
  totalWays: bigint;
  totals: Record<Outcome, Fraction>;
}

/**
 * Two-way table of a matchup's sample space: rows are A's sum values, columns B's, each cell
 * A's outcome with its probability (product of independent marginals) and its count of equally likely outcomes.
 */
export function twoWayTable(a: number[], b: number[], options?: { dicePerPlayer?: number }): TwoWayTable {
  const dicePerPlayer = dicePerPlayerChecked(options?.dicePerPlayer ?? 1);
  const first = sumCountDistribution(dieFacesChecked(a), dicePerPlayer);
  const second = sumCountDistribution(dieFacesChecked(b), dicePerPlayer);
  const heading = (value: number, ways: bigint, total: bigint): TableHeading => ({ value, ways, probability: new Fraction(ways, total) });
  const rows = first.values.map((value, index) => heading(value, first.counts[index], first.total));
  const columns = second.values.map((value, index) => heading(value, second.counts[index], second.total));
  const totalWays = first.total * second.total;
  const tally: Record<Outcome, bigint> = { win: 0n, tie: 0n, loss: 0n };
  const cells = rows.map((row) =>
    columns.map((column) => {
      const outcome = outcomeOfTotals(row.value, column.value);
      const ways = row.ways * column.ways;
      tally[outcome] += ways;
      return { outcome, ways, probability: new Fraction(ways, totalWays) };
    }),
  );
  const totals = {
    win: new Fraction(tally.win, totalWays),
    tie: new Fraction(tally.tie, totalWays),
    loss: new Fraction(tally.loss, totalWays),
  };
  return { dicePerPlayer, rows, columns, cells, totalWays, totals };
}
