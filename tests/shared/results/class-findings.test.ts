import { describe, expect, it } from "vitest";
import { poolRolls, type PoolableRoll } from "@shared/class-results/pooled-results";
import { classFindings, mainMatchup } from "@shared/results/class-findings";
import { groupInterval } from "@shared/results/group-interval";

const dice = [
  { name: "Skua", faces: [1, 5, 10, 12, 13, 15] },
  { name: "Tern", faces: [4, 7, 8, 9, 11, 18] },
  { name: "Gannet", faces: [2, 3, 6, 14, 16, 17] },
];
const names = dice.map((die) => die.name);
let clock = 0;
/** `wins` rolls won by the matchup's first seat, then `losses` lost, recorded by one group. */
function rolls(groupId: string, matchup: number[], wins: number, losses: number): PoolableRoll[] {
  const make = (won: boolean): PoolableRoll => ({
    groupId,
    tally: 1,
    dicePerPlayer: 1,
    matchup,
    totals: won ? [15, 4] : [1, 18],
    winnerSeat: won ? 0 : 1,
    source: "phone",
    recordedAt: new Date(Date.UTC(2026, 2, 10, 9) + (clock += 1000)).toISOString(),
  });
  return [...Array.from({ length: wins }, () => make(true)), ...Array.from({ length: losses }, () => make(false))];
}

describe("classFindings", () => {
  it("says how close the main matchup's class estimate came to the exact value, rounding the gap up", () => {
    // Skua beats Tern in 20 of the 36 equally likely face pairs (direct enumeration): exactly 5/9.
    const pooled = poolRolls({ dice, tieRule: "re-roll-ties", rolls: [...rolls("a", [0, 1], 6, 4), ...rolls("b", [1, 2], 2, 1)] });
    expect(mainMatchup(pooled)?.label).toBe("Skua v Tern");
    const [first] = classFindings(pooled, names);
    // 6/10 − 5/9 = 0.0444…, so "within 0.045".
    expect(first).toBe(
      "After 10 rolls of Skua v Tern, with ties re-rolled, the class estimate of Skua's chance of winning is 0.600, within 0.045 of the exact 5/9 (0.556).",
    );
  });

  it("says 'equal to' when the estimate is the exact value", () => {
    const pooled = poolRolls({ dice, tieRule: "re-roll-ties", rolls: rolls("a", [0, 1], 5, 4) });
    expect(classFindings(pooled, names)[0]).toContain("is 0.556, equal to the exact 5/9 (0.556).");
  });

  it("names the cycle the class's own favourites made", () => {
    const pooled = poolRolls({
      dice,
      tieRule: "re-roll-ties",
      rolls: [...rolls("a", [0, 1], 7, 3), ...rolls("b", [1, 2], 6, 4), ...rolls("c", [2, 0], 7, 5)],
    });
    expect(classFindings(pooled, names)[1]).toBe(
      "The class's own rolls went round in a circle: Skua beat Tern, Tern beat Gannet and Gannet beat Skua more often than not, so no die was best.",
    );
  });

  it("without a cycle, says whether the 95% interval still contains 1/2", () => {
    const few = poolRolls({ dice, tieRule: "re-roll-ties", rolls: rolls("a", [0, 1], 6, 4) });
    expect(classFindings(few, names)[1]).toMatch(/^The 95% interval from 0\.\d{3} to 0\.\d{3} still contains 1\/2/);
    const many = poolRolls({ dice, tieRule: "re-roll-ties", rolls: rolls("a", [0, 1], 300, 100) });
    expect(classFindings(many, names)[1]).toContain("lies wholly above 1/2, so these rolls alone show Skua beats Tern");
  });

  it("says plainly when there are no rolls", () => {
    expect(classFindings(poolRolls({ dice, tieRule: "re-roll-ties", rolls: [] }), names)[0]).toContain("No rolls that count");
  });
});

describe("groupInterval", () => {
  it.each(["re-roll-ties", "ties-score-half", "ties-score-nothing"] as const)(
    "for a single group equals poolRolls' interval of the matchup (%s)",
    (tieRule) => {
      const tie: PoolableRoll = { ...rolls("a", [0, 1], 1, 0)[0], totals: [9, 9], winnerSeat: null };
      const pooled = poolRolls({ dice, tieRule, rolls: [...rolls("a", [0, 1], 12, 7), tie, tie] });
      expect(groupInterval(pooled.groups[0], tieRule)).toEqual(pooled.matchups[0].interval);
    },
  );
});
