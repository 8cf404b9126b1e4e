import { describe, expect, it } from "vitest";
import { guessTruth } from "@shared/class-results/guess-truth";

describe("guessTruth", () => {
  it("finds a counter for every die of Gardner's published cycle and no best die", () => {
    // Efron's dice as Martin Gardner published them (Scientific American, December 1970): each beats the next with 2/3.
    const dice = [
      { name: "A", faces: [4, 4, 4, 4, 0, 0] },
      { name: "B", faces: [3, 3, 3, 3, 3, 3] },
      { name: "C", faces: [6, 6, 2, 2, 2, 2] },
      { name: "D", faces: [5, 5, 5, 1, 1, 1] },
    ];
    const truth = guessTruth(dice, "re-roll-ties");
    expect(truth.bestDieIndex).toBeNull();
    expect(truth.verdicts.map((verdict) => [verdict.name, verdict.beatenBy?.name, verdict.beatenBy?.fraction])).toEqual([
      ["A", "D", "2/3"],
      ["B", "A", "2/3"],
      ["C", "B", "2/3"],
      ["D", "C", "2/3"],
    ]);
  });

  it("names the best die when one beats every other", () => {
    // Worked by hand: [5,5,6] beats [1,2,3] always and [4,4,4] always; [4,4,4] beats [1,2,3] always.
    const truth = guessTruth(
      [
        { name: "Low", faces: [1, 2, 3] },
        { name: "High", faces: [5, 5, 6] },
        { name: "Middle", faces: [4, 4, 4] },
      ],
      "ties-score-half",
    );
    expect(truth.bestDieIndex).toBe(1);
    expect(truth.verdicts[1].beatenBy).toBeNull();
    expect(truth.verdicts[0].beatenBy).toMatchObject({ name: "High", fraction: "1" });
  });
});
