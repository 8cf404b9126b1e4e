import { describe, expect, it } from "vitest";
import { fractionToString } from "@shared/probability/index";
import { lessonSetSummary } from "@shared/lessons/lesson-set-summary";
import { naiveMatchup } from "../../../scripts/bench/naive";

// Martin Gardner, "Mathematical Games", Scientific American, December 1970: each die beats the next with probability 2/3 (faces from memory).
const gardner = [
  { name: "A", faces: [0, 0, 4, 4, 4, 4] },
  { name: "B", faces: [3, 3, 3, 3, 3, 3] },
  { name: "C", faces: [2, 2, 2, 2, 6, 6] },
  { name: "D", faces: [1, 1, 1, 5, 5, 5] },
];
// Our own trio (the browser test's set).
const trio = [
  { name: "Tern", faces: [1, 5, 5, 5, 5, 6] },
  { name: "Auk", faces: [3, 3, 3, 4, 4, 8] },
  { name: "Eider", faces: [2, 2, 2, 7, 7, 9] },
];

describe("lessonSetSummary", () => {
  it("tells Gardner's cycle with its published 2/3 and says there is no best die", () => {
    const summary = lessonSetSummary(gardner, 1);
    expect(summary.cycleSentence).toBe("A beats B (2/3), B beats C (2/3), C beats D (2/3) and D beats A (2/3).");
    expect(summary.noBestDieSentence).not.toBeNull();
  });

  it("gives every winning matchup's win, tie and loss as brute-force enumeration counts them", () => {
    for (const dicePerPlayer of [1, 2] as const) {
      const summary = lessonSetSummary(trio, dicePerPlayer);
      expect(summary.matchups.length).toBeGreaterThan(0);
      for (const entry of summary.matchups) {
        const winner = trio.find((die) => die.name === entry.winner)!;
        const loser = trio.find((die) => die.name === entry.loser)!;
        const naive = naiveMatchup(winner.faces, loser.faces, dicePerPlayer);
        expect([entry.win, entry.tie, entry.loss]).toEqual([naive.win, naive.tie, naive.loss].map(fractionToString));
        expect(naive.win.gt(naive.loss)).toBe(true);
      }
    }
  });

  it("names each matchup whose winner changes with two dice each, as brute force finds them", () => {
    const summary = lessonSetSummary(trio, 1);
    const changed: [string, string][] = [];
    for (let i = 0; i < trio.length; i += 1) {
      for (let j = i + 1; j < trio.length; j += 1) {
        const one = naiveMatchup(trio[i].faces, trio[j].faces, 1);
        const two = naiveMatchup(trio[i].faces, trio[j].faces, 2);
        if (one.win.gt(one.loss) !== two.win.gt(two.loss)) changed.push([trio[i].name, trio[j].name]);
      }
    }
    expect(changed.length).toBeGreaterThan(0);
    expect(summary.twoDiceChanges).toHaveLength(changed.length);
    for (const [first, second] of changed)
      expect(summary.twoDiceChanges.some((sentence) => sentence.includes(first) && sentence.includes(second))).toBe(true);
  });
});
