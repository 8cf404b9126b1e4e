import { describe, expect, it } from "vitest";
import { beatsGraph, matchupRelation } from "@shared/probability/beats-graph";
import { compareDice } from "@shared/probability/matchup";

describe("matchupRelation", () => {
  it.each([
    // Counted by hand: [5,5] always beats [1,2]; [3,3] against [1,5] wins half and loses half.
    [[5, 5], [1, 2], "beats"],
    [[1, 2], [5, 5], "loses"],
    [[3, 3], [1, 5], "even"],
  ] as const)("says %j against %j %s", (a, b, relation) => {
    expect(matchupRelation(compareDice([...a], [...b]))).toBe(relation);
  });
});

describe("beatsGraph", () => {
  it("draws an edge only where the row die beats the column die", () => {
    const dice = [
      [5, 5],
      [1, 2],
      [3, 3],
    ];
    const matrix = dice.map((a, i) => dice.map((b, j) => (i === j ? null : compareDice(a, b))));
    // By hand: [5,5] beats both; [3,3] beats [1,2].
    expect(beatsGraph(matrix)).toEqual([[1, 2], [], [1]]);
  });
});
