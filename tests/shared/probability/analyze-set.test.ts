import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { analyzeSet } from "@shared/probability/analyze-set";
import { naiveMatchup } from "../../../scripts/bench/naive";

const names = ["Petrel", "Gannet", "Shag", "Puffin", "Tern"];
const diceSet = fc
  .array(fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 3, maxLength: 4 }), { minLength: 2, maxLength: 4 })
  .map((faces) => faces.map((die, index) => ({ name: names[index], faces: die })));
const relationOf = (win: Fraction, loss: Fraction): string => (win.gt(loss) ? "beats" : win.lt(loss) ? "loses" : "even");

describe("analyzeSet", () => {
  it("finds each die of Martin Gardner's four-dice set beating the next with probability 2/3", () => {
    // Martin Gardner, "Mathematical Games", Scientific American, December 1970; faces (from memory).
    const gardner = [
      { name: "A", faces: [0, 0, 4, 4, 4, 4] },
      { name: "B", faces: [3, 3, 3, 3, 3, 3] },
      { name: "C", faces: [2, 2, 2, 2, 6, 6] },
      { name: "D", faces: [1, 1, 1, 5, 5, 5] },
    ];
    const level = analyzeSet(gardner, { dicePerPlayer: 1 }).levels[0];
    [
      [0, 1],
      [1, 2],
      [2, 3],
      [3, 0],
    ].forEach(([i, j]) => expect(level.matrix[i][j]!.win.equals(new Fraction(2, 3))).toBe(true));
    expect(level.hamiltonianCycles.map((cycle) => cycle.dice)).toEqual([["A", "B", "C", "D"]]);
    expect(level.isIntransitive && level.everyDieIsBeaten).toBe(true);
  });

  it("fills the matrix with the brute-force matchup of every pair", () => {
    // Brute force: scripts/bench/naive.ts enumerates every joint outcome.
    fc.assert(
      fc.property(diceSet, (dice) => {
        for (const level of analyzeSet(dice).levels) {
          level.matrix.forEach((row, i) =>
            row.forEach((cell, j) => {
              if (i === j) return expect(cell).toBeNull();
              const naive = naiveMatchup(dice[i].faces, dice[j].faces, level.dicePerPlayer);
              expect([cell!.win, cell!.tie, cell!.loss].map(String)).toEqual([naive.win, naive.tie, naive.loss].map(String));
            }),
          );
        }
      }),
      { numRuns: 25 },
    );
  });

  it("reports exactly the pairs whose brute-force relation differs from one die each", () => {
    fc.assert(
      fc.property(diceSet, (dice) => {
        const analysis = analyzeSet(dice);
        const expected: string[] = [];
        for (const k of [2, 3]) {
          for (let i = 0; i < dice.length; i += 1) {
            for (let j = i + 1; j < dice.length; j += 1) {
              const before = naiveMatchup(dice[i].faces, dice[j].faces, 1);
              const after = naiveMatchup(dice[i].faces, dice[j].faces, k);
              if (relationOf(before.win, before.loss) !== relationOf(after.win, after.loss)) expected.push(`${i}-${j}@${k}`);
            }
          }
        }
        expect(analysis.reversals.map((r) => `${r.firstIndex}-${r.secondIndex}@${r.toDicePerPlayer}`).sort()).toEqual(expected.sort());
      }),
      { numRuns: 20 },
    );
  });

  it("lists only cycles whose every step beats the next by brute force", () => {
    fc.assert(
      fc.property(diceSet, (dice) => {
        const level = analyzeSet(dice, { dicePerPlayer: 1 }).levels[0];
        for (const cycle of level.cycles) {
          cycle.indices.forEach((from, step) => {
            const to = cycle.indices[(step + 1) % cycle.indices.length];
            const naive = naiveMatchup(dice[from].faces, dice[to].faces);
            expect(naive.win.gt(naive.loss)).toBe(true);
          });
        }
        expect(level.isIntransitive).toBe(level.cycles.length > 0);
      }),
      { numRuns: 40 },
    );
  });

  it("names as best counter the die that beats each die most often", () => {
    fc.assert(
      fc.property(diceSet, (dice) => {
        const level = analyzeSet(dice, { dicePerPlayer: 1 }).levels[0];
        level.bestCounters.forEach((counter, target) => {
          const beaters = dice
            .map((die, index) => ({ index, ...naiveMatchup(die.faces, dice[target].faces) }))
            .filter((m) => m.index !== target && m.win.gt(m.loss));
          if (beaters.length === 0) return expect(counter.counter).toBeNull();
          const best = beaters.reduce((top, m) => (m.win.gt(top.win) ? m : top));
          expect(counter.win.equals(best.win)).toBe(true);
        });
        expect(level.everyDieIsBeaten).toBe(level.bestCounters.every((counter) => counter.counter !== null));
      }),
      { numRuns: 40 },
    );
  });

  it("analyses one die each and the chosen count when dicePerPlayer is given", () => {
    const dice = [
      { name: "Petrel", faces: [1, 1, 5, 5, 8, 8] },
      { name: "Gannet", faces: [3, 3, 3, 6, 6, 6] },
    ];
    expect(analyzeSet(dice, { dicePerPlayer: 4 }).levels.map((level) => level.dicePerPlayer)).toEqual([1, 4]);
    expect(analyzeSet(dice).levels.map((level) => level.dicePerPlayer)).toEqual([1, 2, 3]);
  });

  it("summarises intransitivity over the analysed counts", () => {
    fc.assert(
      fc.property(diceSet, (dice) => {
        const analysis = analyzeSet(dice);
        expect(analysis.summary.intransitiveAt).toEqual(
          analysis.levels.filter((level) => level.cycles.length > 0).map((level) => level.dicePerPlayer),
        );
        expect(analysis.summary.reversalCount).toBe(analysis.reversals.length);
      }),
      { numRuns: 20 },
    );
  });
});
