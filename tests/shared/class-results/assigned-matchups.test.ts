import { describe, expect, it } from "vitest";
import { assignedMatchup, cycleMatchups } from "@shared/class-results/assigned-matchups";

describe("cycleMatchups", () => {
  it.each([
    [
      3,
      2,
      [
        [0, 1],
        [1, 2],
        [2, 0],
      ],
    ],
    [2, 2, [[0, 1]]],
    [
      4,
      2,
      [
        [0, 1],
        [1, 2],
        [2, 3],
        [3, 0],
      ],
    ],
    [3, 3, [[0, 1, 2]]],
    [
      5,
      3,
      [
        [0, 1, 2],
        [1, 2, 3],
        [2, 3, 4],
        [3, 4, 0],
        [4, 0, 1],
      ],
    ],
  ])("gives %i dice and %i players the neighbouring matchups round the set", (dice, players, expected) => {
    expect(cycleMatchups(dice, players)).toEqual(expected);
  });

  it("refuses three players with two dice", () => {
    expect(() => cycleMatchups(2, 3)).toThrow(RangeError);
  });

  it("hands the matchups out to groups in turn", () => {
    expect([0, 1, 2, 3, 4].map((group) => assignedMatchup(3, 2, group))).toEqual([
      [0, 1],
      [1, 2],
      [2, 0],
      [0, 1],
      [1, 2],
    ]);
  });
});
