import { describe, expect, it } from "vitest";
import { poolBoard } from "@shared/class-results/board-pool";
import { decodeBoardUpdate, encodeBoardTallies, type BoardUpdateMessage } from "@shared/events";
import type { BoardSnapshot } from "@shared/schemas/class-runs";

// Invented dice for this check.
const dice = [
  { name: "Dunlin", faces: [1, 1, 6] },
  { name: "Knot", faces: [2, 3, 4] },
];

function tallies(): BoardSnapshot["tallies"] {
  const rolls = [
    [1, 2],
    [6, 3],
    [1, 4],
  ].map((totals, index) => ({
    groupId: "g1",
    tally: 1,
    dicePerPlayer: 1,
    matchup: [0, 1],
    totals,
    winnerSeat: null,
    source: "phone" as const,
    recordedAt: new Date(Date.UTC(2026, 3, 1, 9, 0, index)).toISOString(),
  }));
  return poolBoard({
    dice,
    tieRule: "re-roll-ties",
    tallies: [{ tally: 1, dicePerPlayer: 1, players: 2, startedAt: "2026-04-01T09:00:00.000Z" }],
    rolls,
    nicknames: { g1: "Mudflat Crew" },
  }).tallies;
}

describe("board:update on the wire", () => {
  const base = { runId: "run", version: 7, undoneRolls: 0, generatedAt: "2026-04-01T09:01:00.000Z" } as unknown as Omit<
    BoardSnapshot,
    "tallies"
  >;

  it("gives back the same tallies from the bytes Node receives (a Buffer) and from a browser's ArrayBuffer", () => {
    const pooled = tallies();
    const bytes = encodeBoardTallies(pooled);
    const asBuffer: BoardUpdateMessage = { ...base, tallies: Buffer.from(bytes) };
    const copy = new ArrayBuffer(bytes.byteLength);
    new Uint8Array(copy).set(bytes);
    const asArrayBuffer: BoardUpdateMessage = { ...base, tallies: copy };
    for (const message of [asBuffer, asArrayBuffer]) {
      const snapshot = decodeBoardUpdate(message);
      expect(snapshot.tallies).toEqual(pooled);
      expect(snapshot.version).toBe(7);
    }
    // The pooled counts survive the round trip: Dunlin won one of the three rolls (6 against 3).
    expect(decodeBoardUpdate(asArrayBuffer).tallies[0].pooled.matchups[0].seats[0].wins).toBe(1);
  });
});
