import { describe, expect, it } from "vitest";
import { classTimePlan, rollPhaseBudget, rollPhaseMinutes } from "@shared/lessons/roll-pace";

// The paces are our own common-practice planning figures (documented in the user guide), not a published rule.
describe("the Roll phase's time budget", () => {
  it("gives 3 rolls a minute with one die each and two players, 2 otherwise", () => {
    expect(rollPhaseBudget(15, { dicePerPlayer: 1, players: 2 })).toEqual({ minutes: 15, rollsPerMinute: 3, rollsPerGroup: 45 });
    expect(rollPhaseBudget(15, { dicePerPlayer: 2, players: 2 })?.rollsPerGroup).toBe(30);
    expect(rollPhaseBudget(15, { dicePerPlayer: 1, players: 3 })?.rollsPerGroup).toBe(30);
  });

  it("has no budget without a Roll phase with minutes", () => {
    expect(rollPhaseBudget(null, { dicePerPlayer: 1, players: 2 })).toBeNull();
    expect(rollPhaseBudget(0, { dicePerPlayer: 1, players: 2 })).toBeNull();
    expect(rollPhaseMinutes([{ phase: "Roll", included: false, minutes: 20 }])).toBeNull();
    expect(
      rollPhaseMinutes([
        { phase: "Guess", included: true, minutes: 5 },
        { phase: "Roll", included: true, minutes: 20 },
      ]),
    ).toBe(20);
  });

  it("says whether a class has time for a matchup's pooled rolls, how many groups would, or that it is too close", () => {
    const budget = rollPhaseBudget(15, { dicePerPlayer: 1, players: 2 })!;
    // 139 rolls (a 7/12 matchup) over 4 groups: 35 each, within 45.
    expect(classTimePlan(139, 4, budget, 20)).toEqual({ kind: "fits", perGroup: 35 });
    // 312 rolls (5/9) over 3 groups is 104 each; 45 a group needs 7 groups.
    expect(classTimePlan(312, 3, budget, 20)).toEqual({ kind: "more-groups", perGroup: 104, groupsNeeded: 7 });
    // 3692 rolls (16/31) is beyond 20 groups × 45.
    expect(classTimePlan(3692, 8, budget, 20)).toEqual({ kind: "too-close", perGroup: 462, mostRolls: 900 });
  });
});
