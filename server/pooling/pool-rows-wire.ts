// How the server hands committed rolls to its pooling worker: one JSON string of short tuples per board refresh. A
// string crosses between threads in one copy, where an object per roll is copied field by field, and JSON.stringify
// writes arrays of numbers and strings faster than objects picked by key. Used by pooling-pool.ts and pooling-worker.ts.
import type { NewRoll, PoolRow } from "../db/queries/class-runs";

type PoolRowTuple = [
  id: string,
  groupId: string,
  tally: number,
  dicePerPlayer: number,
  matchup: number[],
  totals: number[],
  winnerSeat: number | null,
  source: PoolRow["source"],
  recordedAtMs: number,
];

/** Rolls the batcher has just committed, as the string `poolRowsFromJson` reads back. */
export function poolRowsJson(rolls: readonly NewRoll[]): string {
  return JSON.stringify(
    rolls.map((entry): PoolRowTuple => [
      entry.id,
      entry.groupId,
      entry.tally,
      entry.dicePerPlayer,
      entry.matchup,
      entry.totals,
      entry.winnerSeat,
      entry.source,
      entry.recordedAt.getTime(),
    ]),
  );
}

/** The pool rows in a `poolRowsJson` string. */
export function poolRowsFromJson(json: string): PoolRow[] {
  return (JSON.parse(json) as PoolRowTuple[]).map(
    ([id, groupId, tally, dicePerPlayer, matchup, totals, winnerSeat, source, recordedAtMs]) => ({
      id,
      groupId,
      tally,
      dicePerPlayer,
      matchup,
      totals,
      winnerSeat,
      source,
      recordedAt: new Date(recordedAtMs).toISOString(),
    }),
  );
}

/** A board request's rows as objects, from the objects or from a `poolRowsJson` string. */
export function requestRows(rows: PoolRow[] | string): PoolRow[] {
  return typeof rows === "string" ? poolRowsFromJson(rows) : rows;
}
