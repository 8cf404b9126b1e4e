import { describe, expect, it } from "vitest";
import { binomial, buildDicePool, candidateDieCount, orderedChoices, poolDieFaces } from "@shared/set-finder/candidate-dice";
import { cyclesAvoidingMainCycle } from "@shared/set-finder/property-templates";
import { oneDieWinTable } from "@shared/set-finder/exhaustive-search";
import { compareDice } from "@shared/probability/index";

describe("candidate dice", () => {
  it.each([
    [9, 6, 3003],
    [5, 4, 70],
    [6, 4, 126],
    [2, 12, 13],
  ])("counts dice with sorted faces as multisets: %i values, %i faces → %i (stars and bars, C(v+f−1, f))", (values, faces, expected) => {
    expect(candidateDieCount(values, faces)).toBe(expected);
    const pool = buildDicePool(
      Array.from({ length: values }, (_, index) => index + 1),
      faces,
    );
    expect(pool.size).toBe(expected);
    const seen = new Set<string>();
    for (let die = 0; die < pool.size; die += 1) {
      const list = poolDieFaces(pool, die);
      expect([...list].sort((a, b) => a - b)).toEqual(list);
      seen.add(list.join(","));
    }
    expect(seen.size).toBe(expected);
    expect(pool.withLowestValue).toBe(candidateDieCount(values, faces - 1));
  });

  it("puts every die that carries the lowest value first", () => {
    const pool = buildDicePool([2, 3, 5, 8], 3);
    for (let die = 0; die < pool.size; die += 1) expect(poolDieFaces(pool, die)[0] === 2).toBe(die < pool.withLowestValue);
  });

  it("agrees with textbook values of C(n, k) and n!/(n−r)!", () => {
    expect([binomial(5, 2), binomial(10, 3), binomial(14, 6), binomial(4, 5)]).toEqual([10, 120, 3003, 0]);
    expect([orderedChoices(5, 2), orderedChoices(10, 3), orderedChoices(3, 4)]).toEqual([20, 720, 0]);
  });

  it("fills the win table with the engine's counts", () => {
    const pool = buildDicePool([1, 2, 4, 7], 3);
    const table = oneDieWinTable(pool);
    for (let a = 0; a < pool.size; a += 3) {
      for (let b = 0; b < pool.size; b += 5) {
        const exact = compareDice(poolDieFaces(pool, a), poolDieFaces(pool, b)).win.mul(9);
        expect(table[a * pool.size + b]).toBe(Number(exact.valueOf()));
      }
    }
  });

  it("finds the one other cycle through five dice (the pentagram) in both directions, and none for four", () => {
    expect(cyclesAvoidingMainCycle(5)).toEqual([
      [0, 2, 4, 1, 3],
      [0, 3, 1, 4, 2],
    ]);
    expect(cyclesAvoidingMainCycle(4)).toEqual([]);
  });
});
