import Fraction from "fraction.js";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { lessonMaterials, sparesFor } from "@shared/lessons/lesson-materials";
import { analyzeSet } from "@shared/probability/analyze-set";
import { emptyLessonInput, type LessonInput } from "@shared/schemas/lessons";

// Martin Gardner, "Mathematical Games", Scientific American, December 1970: each die beats the next with probability 2/3 (faces from memory).
const gardner = [
  { name: "A", faces: [0, 0, 4, 4, 4, 4] },
  { name: "B", faces: [3, 3, 3, 3, 3, 3] },
  { name: "C", faces: [2, 2, 2, 2, 6, 6] },
  { name: "D", faces: [1, 1, 1, 5, 5, 5] },
];
// Our own pair with ties, counted by hand over the 16 outcomes: First wins 8, ties 2, loses 6.
const tiedPair = [
  { name: "First", faces: [1, 2, 4, 4] },
  { name: "Second", faces: [2, 2, 3, 3] },
];

const z95 = jStat.normal.inv(0.975, 0, 1);
/** Score-test planning size n > z²/(4(p − 1/2)²), with z from jstat (outside reference; common practice for planning). */
const plannedSize = (p: number) => Math.floor((z95 * z95) / (4 * (p - 0.5) ** 2)) + 1;

/** A plan without a Twist and with a 30-minute Roll phase (room for 90 rolls at 3 a minute), unless overridden. */
function plan(overrides: Partial<LessonInput> = {}): LessonInput {
  const phases = emptyLessonInput().phases.map((entry) => ({
    ...entry,
    included: entry.phase !== "Twist",
    minutes: entry.phase === "Roll" ? 30 : entry.minutes,
  }));
  return { ...emptyLessonInput(), title: "Test", phases, ...overrides };
}

/** The same plan with a Roll phase of `minutes`. */
function withRollMinutes(input: LessonInput, minutes: number): LessonInput {
  return { ...input, phases: input.phases.map((entry) => (entry.phase === "Roll" ? { ...entry, minutes } : entry)) };
}

// Our demo Kittiwake trio: each die of the cycle wins 7/12 (checked in tests/shared/set-finder/demo-dice-sets.test.ts).
const kittiwake = [
  { name: "Puffin", faces: [1, 1, 6, 6, 7, 11] },
  { name: "Gannet", faces: [3, 3, 4, 4, 5, 10] },
  { name: "Skua", faces: [2, 2, 2, 8, 8, 9] },
];
// Our own transitive trio with one close matchup: Middle beats Low 16 to 15 in 36 (5 ties), High beats both outright or nearly.
const nearlyEven = [
  { name: "Low", faces: [1, 2, 3, 4, 5, 6] },
  { name: "Middle", faces: [1, 2, 3, 4, 5, 7] },
  { name: "High", faces: [7, 7, 7, 7, 7, 8] },
];

describe("lessonMaterials: the materials list", () => {
  it("gives each group the dice of its assigned matchup round the cycle", () => {
    // 8 groups over Gardner's 4-cycle A→B→C→D→A: each matchup is played by 2 groups and each die sits in 2 matchups,
    // so 4 groups hold each die; spares are one per four groups (2).
    const result = lessonMaterials(plan({ groups: 8 }), gardner);
    expect(result.mainMatchupSource).toBe("cycle");
    expect(result.games).toEqual([
      ["A", "B"],
      ["B", "C"],
      ["C", "D"],
      ["D", "A"],
    ]);
    expect(result.materials.dice).toEqual(["A", "B", "C", "D"].map((name) => ({ name, forGroups: 4, spares: 2, total: 6 })));
    expect(result.materials.totalDice).toBe(24);
    expect(result.materials.recordingSheets).toEqual({ perGroup: 1, forGroups: 8, spares: 2, total: 10, rowsPerSheet: 30 });
  });

  it("gives every group the whole set when groups choose their matchups", () => {
    const result = lessonMaterials(plan({ groups: 5, matchupChoice: "group-choice" }), gardner);
    expect(result.materials.dice.map((entry) => [entry.forGroups, entry.spares])).toEqual([
      [5, 2],
      [5, 2],
      [5, 2],
      [5, 2],
    ]);
  });

  it("doubles every die for two dice each, and for a Twist round played two dice each", () => {
    const twoEach = lessonMaterials(plan({ groups: 4, mode: { dicePerPlayer: 2, players: 2 } }), gardner);
    expect(twoEach.materials.copiesPerPlayer).toBe(2);
    expect(twoEach.materials.dice[0]).toEqual({ name: "A", forGroups: 4, spares: 2, total: 6 });
    const withTwist = lessonMaterials({ ...plan({ groups: 4 }), phases: emptyLessonInput().phases }, gardner);
    expect(withTwist.materials.copiesPerPlayer).toBe(2);
    expect(withTwist.materials.recordingSheets.perGroup).toBe(2);
  });

  it("seats three players round the cycle in trios of neighbours", () => {
    const result = lessonMaterials(plan({ groups: 4, mode: { dicePerPlayer: 1, players: 3 } }), gardner);
    expect(result.games).toEqual([
      ["A", "B", "C"],
      ["B", "C", "D"],
      ["C", "D", "A"],
      ["D", "A", "B"],
    ]);
    // Each die is in 3 of the 4 trios.
    expect(result.materials.dice.map((entry) => entry.forGroups)).toEqual([3, 3, 3, 3]);
  });

  it("counts exit ticket slips per pupil only when Reflect runs and there is a ticket", () => {
    expect(lessonMaterials(plan({ groups: 6, pupilsPerGroup: 4, exitTicket: "Which die?" }), gardner).materials.exitTicketSlips).toBe(24);
    expect(lessonMaterials(plan({ groups: 6, pupilsPerGroup: 4, exitTicket: "" }), gardner).materials.exitTicketSlips).toBe(0);
  });

  it("rounds spares up to one per four groups (common practice)", () => {
    expect([1, 4, 5, 8, 9].map(sparesFor)).toEqual([1, 1, 2, 2, 3]);
  });

  it("asks for a set when there is none, still counting sheets", () => {
    const result = lessonMaterials(plan({ groups: 3 }), null);
    expect(result.verdict.status).toBe("no-set");
    expect(result.materials.dice).toEqual([]);
    expect(result.materials.recordingSheets.total).toBe(4);
  });
});

describe("lessonMaterials: is the class's pooled result convincing?", () => {
  it("needs the published planning size for p = 2/3 per matchup and finds 60 rolls per matchup enough", () => {
    const result = lessonMaterials(plan({ groups: 8, rollsPerGroup: 30 }), gardner);
    expect(plannedSize(2 / 3)).toBe(35);
    for (const entry of result.verdict.matchups) {
      expect(entry.winChance.equals(new Fraction(2, 3))).toBe(true);
      expect(entry.neededRolls).toBe(plannedSize(2 / 3));
      expect(entry.plannedRolls).toBe(60);
      expect(entry.enough).toBe(true);
    }
    expect(result.verdict.status).toBe("enough");
    expect(result.verdict.pooledRolls).toBe(240);
  });

  it("says not enough one roll short of the planning size and suggests the rolls per group that reach it", () => {
    // 4 groups: one group per matchup, so a matchup's rolls are one group's rolls.
    const short = lessonMaterials(plan({ groups: 4, rollsPerGroup: 34 }), gardner);
    expect(short.verdict.status).toBe("not-enough");
    expect(short.verdict.suggestedRollsPerGroup).toBe(35);
    expect(short.verdict.message).toContain("35 rolls per group");
    expect(lessonMaterials(plan({ groups: 4, rollsPerGroup: 35 }), gardner).verdict.status).toBe("enough");
  });

  it("asks for more groups when some main matchup would get no group", () => {
    const result = lessonMaterials(plan({ groups: 3, rollsPerGroup: 50 }), gardner);
    expect(result.verdict.matchups.map((entry) => entry.plannedRolls)).toEqual([50, 50, 50, 0]);
    expect(result.verdict.suggestedGroups).toBe(4);
    expect(result.verdict.suggestedRollsPerGroup).toBeNull();
  });

  it("spreads a choosing class's rolls evenly over the main matchups", () => {
    // 6 groups × 40 rolls over 4 matchups = 60 each; 35 needed.
    const result = lessonMaterials(plan({ groups: 6, rollsPerGroup: 40, matchupChoice: "group-choice" }), gardner);
    expect(result.verdict.matchups.map((entry) => entry.plannedRolls)).toEqual([60, 60, 60, 60]);
    const short = lessonMaterials(plan({ groups: 6, rollsPerGroup: 20, matchupChoice: "group-choice" }), gardner);
    // Needs 35 per matchup = 140 pooled = 24 rolls for each of 6 groups (rounded up).
    expect(short.verdict.suggestedRollsPerGroup).toBe(Math.ceil((35 * 4) / 6));
  });

  it("counts the pair comparisons inside three-player games", () => {
    // With 4 groups, each neighbouring pair sits in two of the four trios.
    const result = lessonMaterials(plan({ groups: 4, rollsPerGroup: 18, mode: { dicePerPlayer: 1, players: 3 } }), gardner);
    expect(result.verdict.matchups.map((entry) => entry.plannedRolls)).toEqual([36, 36, 36, 36]);
    expect(result.verdict.status).toBe("enough");
  });

  it("tests the share of decided rolls for re-roll ties and ties score nothing, and the mean score for ties score half", () => {
    // First against Second: win 8/16, tie 2/16, loss 6/16 (counted by hand).
    const rerolled = lessonMaterials(plan({ groups: 1, tieRule: "re-roll-ties" }), tiedPair).verdict.matchups[0];
    expect(rerolled.testedChance.equals(new Fraction(4, 7))).toBe(true);
    expect(rerolled.neededRolls).toBe(plannedSize(4 / 7));
    const nothing = lessonMaterials(plan({ groups: 1, tieRule: "ties-score-nothing" }), tiedPair).verdict.matchups[0];
    expect(nothing.winChance.equals(new Fraction(1, 2))).toBe(true);
    // A tie decides nothing, so on average 14 of every 16 recorded rolls count.
    expect(nothing.neededRolls).toBe(Math.ceil(plannedSize(4 / 7) / (14 / 16)));
    const half = lessonMaterials(plan({ groups: 1, tieRule: "ties-score-half" }), tiedPair).verdict.matchups[0];
    expect(half.testedChance.equals(new Fraction(9, 16))).toBe(true);
    expect(half.neededRolls).toBe(plannedSize(9 / 16));
  });

  it("reports the expected 95% Wilson interval at the planned rolls", () => {
    const entry = lessonMaterials(plan({ groups: 4, rollsPerGroup: 60 }), gardner).verdict.matchups[0];
    // Wilson (1927) at p = 2/3, n = 60, z from jstat.
    const p = 2 / 3;
    const n = 60;
    const centre = (p + (z95 * z95) / (2 * n)) / (1 + (z95 * z95) / n);
    const half = (z95 / (1 + (z95 * z95) / n)) * Math.sqrt((p * (1 - p)) / n + (z95 * z95) / (4 * n * n));
    expect(entry.expectedInterval!.lower).toBeCloseTo(centre - half, 9);
    expect(entry.expectedInterval!.upper).toBeCloseTo(centre + half, 9);
    expect(entry.expectedInterval!.lower).toBeGreaterThan(0.5);
  });

  it("finds no winner to show when every matchup is even", () => {
    const same = [
      { name: "One", faces: [1, 2, 3] },
      { name: "Two", faces: [1, 2, 3] },
    ];
    const result = lessonMaterials(plan(), same);
    expect(result.verdict.status).toBe("no-winner");
    expect(result.mainMatchupSource).toBe("none");
  });

  it("falls back to every matchup a die wins when no cycle runs through every die", () => {
    // Our own transitive trio: High beats Middle beats Low, and High beats Low.
    const transitive = [
      { name: "Low", faces: [1, 1, 1] },
      { name: "Middle", faces: [2, 2, 2] },
      { name: "High", faces: [3, 3, 3] },
    ];
    const result = lessonMaterials(plan({ groups: 3 }), transitive);
    expect(result.mainMatchupSource).toBe("beats");
    expect(result.verdict.matchups.map((entry) => `${entry.winner}>${entry.loser}`).sort()).toEqual([
      "High>Low",
      "High>Middle",
      "Middle>Low",
    ]);
  });
});

describe("lessonMaterials: the rolls verdict within the Roll phase", () => {
  it("counts only the rolls that fit in the Roll phase at the common-practice pace", () => {
    // 15 minutes at 3 rolls a minute (our common-practice pace for one die each, two players) = 45 rolls per group.
    const result = lessonMaterials(withRollMinutes(plan({ groups: 3, rollsPerGroup: 312 }), 15), kittiwake);
    expect(result.verdict.budget).toEqual({ minutes: 15, rollsPerMinute: 3, rollsPerGroup: 45 });
    expect(result.verdict.fitsTime).toBe(false);
    expect(result.verdict.matchups.map((entry) => entry.plannedRolls)).toEqual([45, 45, 45]);
    expect(result.verdict.message).toContain("312 rolls per group do not fit in the 15-minute Roll phase");
    expect(result.verdict.suggestedRollsPerGroup).not.toBeNull();
    expect(result.verdict.suggestedRollsPerGroup!).toBeLessThanOrEqual(45);
    // The sheets never promise the rolls that do not fit.
    expect(result.materials.recordingSheets.rowsPerSheet).toBe(45);
    expect(result.materials.notes.join(" ")).not.toContain("312 rolls each");
  });

  it("suggests more groups rather than more rolls than fit: 3 groups × 20 rolls of a 7/12 cycle in 15 minutes", () => {
    const result = lessonMaterials(withRollMinutes(plan({ groups: 3, rollsPerGroup: 20 }), 15), kittiwake);
    // Each main matchup needs the planning size for p = 7/12 (139); 45 rolls a group reach it with 4 groups per matchup.
    expect(plannedSize(7 / 12)).toBe(139);
    expect(result.verdict.matchups.map((entry) => entry.neededRolls)).toEqual([139, 139, 139]);
    expect(result.verdict.status).toBe("not-enough");
    expect(result.verdict.suggestedGroups).toBe(12);
    expect(result.verdict.suggestedRollsPerGroup).toBe(Math.ceil(139 / 4));
    expect(result.verdict.tooClose).toEqual([]);
    const applied = lessonMaterials(withRollMinutes(plan({ groups: 12, rollsPerGroup: 35 }), 15), kittiwake);
    expect(applied.verdict.status).toBe("enough");
  });

  it("slows the pace to 2 rolls a minute with two dice each", () => {
    const result = lessonMaterials(withRollMinutes(plan({ groups: 4, mode: { dicePerPlayer: 2, players: 2 } }), 15), gardner);
    expect(result.verdict.budget).toEqual({ minutes: 15, rollsPerMinute: 2, rollsPerGroup: 30 });
  });

  it("says plainly when a matchup is too close for one lesson, offers a Virtual class top-up and proposes the strongest matchup", () => {
    const result = lessonMaterials(withRollMinutes(plan({ groups: 6, rollsPerGroup: 30 }), 15), nearlyEven);
    // Middle over Low under re-roll ties: 16/31, so the planning size is in the thousands, beyond 20 groups × 45 rolls.
    const close = result.verdict.matchups.find((entry) => entry.winner === "Middle")!;
    expect(close.testedChance.equals(new Fraction(16, 31))).toBe(true);
    expect(close.neededRolls).toBe(plannedSize(16 / 31));
    expect(result.verdict.tooClose).toEqual(["Middle over Low"]);
    expect(result.verdict.message).toContain("too close to show in one lesson");
    expect(result.verdict.virtualTopUp).toBeGreaterThan(0);
    expect(result.verdict.strongestMatchup).toMatchObject({ winner: "High", loser: "Low", neededRolls: 4, groupsInTime: 1 });
    expect(result.verdict.suggestedRollsPerGroup ?? 0).toBeLessThanOrEqual(45);
  });

  it("does not check the time when the lesson has no Roll phase", () => {
    const noRoll = plan({ groups: 4, rollsPerGroup: 500 });
    const result = lessonMaterials(
      { ...noRoll, phases: noRoll.phases.map((entry) => (entry.phase === "Roll" ? { ...entry, included: false } : entry)) },
      gardner,
    );
    expect(result.verdict.budget).toBeNull();
    expect(result.verdict.fitsTime).toBe(true);
    expect(result.materials.recordingSheets.rowsPerSheet).toBe(500);
  });
});

describe("lessonMaterials: the main cycle of a set with many cycles", () => {
  // Ten dice of our own (random faces summing to 39, seed 216): the first 500 cycles listed hold none through every die stronger than 17/36.
  const crowded = [
    [1, 3, 7, 8, 10, 10],
    [3, 3, 4, 8, 10, 11],
    [1, 3, 6, 6, 11, 12],
    [3, 7, 7, 7, 7, 8],
    [5, 5, 5, 6, 8, 10],
    [3, 3, 5, 9, 9, 10],
    [1, 4, 6, 7, 9, 12],
    [2, 2, 3, 8, 12, 12],
    [1, 2, 3, 10, 11, 12],
    [1, 2, 3, 11, 11, 11],
  ].map((faces, index) => ({ name: `Die ${index + 1}`, faces }));

  it("plays round the strongest cycle through every die, not just the strongest of the first 500 listed", () => {
    const complete = analyzeSet(crowded, { dicePerPlayer: 1, cycleLimit: 10_000_000 }).levels[0];
    expect(complete.cyclesComplete).toBe(true);
    expect(complete.cycles.length).toBeGreaterThan(500);
    const strongest = complete.hamiltonianCycles.reduce((best, cycle) => (cycle.weakestWin.gt(best.weakestWin) ? cycle : best));
    const firstListed = analyzeSet(crowded, { dicePerPlayer: 1, cycleLimit: 500 }).levels[0].hamiltonianCycles;
    expect(firstListed.every((cycle) => cycle.weakestWin.lt(strongest.weakestWin))).toBe(true);
    const result = lessonMaterials(plan({ groups: 10 }), crowded);
    expect(result.mainMatchupSource).toBe("cycle");
    const weakestPlayed = result.games
      .map(
        ([winner, loser]) =>
          complete.matrix[crowded.findIndex((die) => die.name === winner)][crowded.findIndex((die) => die.name === loser)]!.win,
      )
      .reduce((least, win) => (win.lt(least) ? win : least));
    expect(weakestPlayed.equals(strongest.weakestWin)).toBe(true);
  });
});
