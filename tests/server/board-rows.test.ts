import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BoardPool } from "@shared/class-results/board-pool";
import type { NewRoll } from "../../server/db/queries/class-runs";
import { poolRowsJson, requestRows } from "../../server/pooling/pool-rows-wire";

// Invented dice for these checks.
const dice = [
  { name: "Petrel", faces: [1, 1, 4, 6] },
  { name: "Skua", faces: [2, 3, 3, 5] },
];

const newRollArbitrary = fc
  .record({
    id: fc.uuid(),
    group: fc.constantFrom("a", "b", "c"),
    first: fc.nat(3),
    second: fc.nat(3),
    flip: fc.boolean(),
    at: fc.nat(86_400_000),
  })
  .map(({ id, group, first, second, flip, at }): NewRoll => {
    const matchup = flip ? [1, 0] : [0, 1];
    const faces = [[dice[matchup[0]].faces[first]], [dice[matchup[1]].faces[second]]];
    const totals = faces.map((seat) => seat[0]);
    return {
      id,
      runId: "00000000-0000-4000-8000-000000000001",
      groupId: group,
      tally: 1,
      dicePerPlayer: 1,
      matchup,
      faces,
      totals,
      winnerSeat: totals[0] === totals[1] ? null : totals[0] > totals[1] ? 0 : 1,
      source: "phone",
      recordedAt: new Date(Date.UTC(2026, 10, 30) + at),
    };
  });

describe("poolRowsJson and requestRows", () => {
  it("hands the pooling worker exactly the fields a Run board pools, with the recorded time as an ISO string", () => {
    fc.assert(
      fc.property(fc.array(newRollArbitrary, { maxLength: 40 }), (rolls) => {
        const expected = rolls.map((entry) => ({
          id: entry.id,
          groupId: entry.groupId,
          tally: entry.tally,
          dicePerPlayer: entry.dicePerPlayer,
          matchup: entry.matchup,
          totals: entry.totals,
          winnerSeat: entry.winnerSeat,
          source: entry.source,
          recordedAt: entry.recordedAt.toISOString(),
        }));
        const fromJson = requestRows(poolRowsJson(rolls));
        expect(fromJson).toEqual(expected);
        const settings = {
          dice,
          tieRule: "re-roll-ties" as const,
          tallies: [{ tally: 1, dicePerPlayer: 1, players: 2, startedAt: "2026-11-30T00:00:00.000Z" }],
        };
        expect(BoardPool.of(settings, fromJson).result({})).toEqual(BoardPool.of(settings, expected).result({}));
      }),
      { numRuns: 50 },
    );
  });
});
