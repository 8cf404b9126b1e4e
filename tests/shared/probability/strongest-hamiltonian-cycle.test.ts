import fc from "fast-check";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { analyzeSet } from "@shared/probability/analyze-set";
import { strongestHamiltonianCycle } from "@shared/probability/strongest-hamiltonian-cycle";

/** Brute force: every order of the vertices after 0, keeping the strongest weakest edge of those that close up. */
function strongestByPermutation(weights: (Fraction | null)[][]): Fraction | null {
  let best: Fraction | null = null;
  const extend = (path: number[], weakest: Fraction | null): void => {
    const last = path[path.length - 1];
    if (path.length === weights.length) {
      const closing = weights[last][0];
      if (closing === null) return;
      const cycleWeakest = weakest === null || closing.lt(weakest) ? closing : weakest;
      if (best === null || cycleWeakest.gt(best)) best = cycleWeakest;
      return;
    }
    for (let next = 1; next < weights.length; next += 1) {
      const edge = weights[last][next];
      if (path.includes(next) || edge === null) continue;
      extend([...path, next], weakest === null || edge.lt(weakest) ? edge : weakest);
    }
  };
  extend([0], null);
  return best;
}

const weightedGraph = fc.integer({ min: 2, max: 7 }).chain((size) =>
  fc
    .array(fc.array(fc.option(fc.integer({ min: 1, max: 35 }), { nil: null, freq: 3 }), { minLength: size, maxLength: size }), {
      minLength: size,
      maxLength: size,
    })
    .map((rows) => rows.map((row, from) => row.map((weight, to) => (weight === null || to === from ? null : new Fraction(weight, 36))))),
);

describe("strongestHamiltonianCycle", () => {
  it("finds the weakest link a brute-force search over vertex orders finds, and a cycle that has it", () => {
    fc.assert(
      fc.property(weightedGraph, (weights) => {
        const expected = strongestByPermutation(weights);
        const found = strongestHamiltonianCycle(weights);
        if (expected === null) {
          expect(found).toBeNull();
          return;
        }
        expect(found!.weakest.equals(expected)).toBe(true);
        expect([...found!.order].sort((a, b) => a - b)).toEqual(weights.map((_row, index) => index));
        const links = found!.order.map((vertex, position) => weights[vertex][found!.order[(position + 1) % found!.order.length]]);
        expect(links.every((link) => link !== null && link.gte(expected))).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it("answers null for a graph with no cycle through every vertex", () => {
    const w = new Fraction(2, 3);
    expect(
      strongestHamiltonianCycle([
        [null, w, null],
        [null, null, w],
        [null, null, null],
      ]),
    ).toBeNull();
  });
});

describe("analyzeSet: the strongest cycle through every die", () => {
  const names = ["Petrel", "Gannet", "Shag", "Puffin", "Tern", "Skua"];
  const diceSet = fc
    .array(fc.array(fc.integer({ min: 1, max: 12 }), { minLength: 4, maxLength: 4 }), { minLength: 3, maxLength: 6 })
    .map((faces) => faces.map((die, index) => ({ name: names[index], faces: die })));

  it("matches the strongest of the complete cycle list even when the listed cycles are cut at one", () => {
    fc.assert(
      fc.property(diceSet, (dice) => {
        const everyCycle = analyzeSet(dice, { dicePerPlayer: 1, cycleLimit: 1_000_000 }).levels[0];
        expect(everyCycle.cyclesComplete).toBe(true);
        const strongestListed = everyCycle.hamiltonianCycles.reduce<Fraction | null>(
          (best, cycle) => (best === null || cycle.weakestWin.gt(best) ? cycle.weakestWin : best),
          null,
        );
        const cut = analyzeSet(dice, { dicePerPlayer: 1, cycleLimit: 1 }).levels[0];
        if (strongestListed === null) {
          expect(cut.strongestHamiltonianCycle).toBeNull();
          return;
        }
        expect(cut.strongestHamiltonianCycle!.weakestWin.equals(strongestListed)).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it.each([0, -3, 2.5, Number.NaN])("refuses a cycle limit of %s", (cycleLimit) => {
    const dice = [
      { name: "Petrel", faces: [1, 2, 3] },
      { name: "Gannet", faces: [2, 2, 2] },
    ];
    expect(() => analyzeSet(dice, { cycleLimit })).toThrow(/cycle limit must be a whole number of at least 1/);
  });
});
