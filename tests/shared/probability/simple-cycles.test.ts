import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { simpleCycles } from "@shared/probability/simple-cycles";

/** Brute force: try every ordered list of distinct vertices starting at its smallest and keep those that close up. */
function cyclesByPermutation(successors: number[][]): string[] {
  const found: string[] = [];
  const extend = (path: number[]): void => {
    const last = path[path.length - 1];
    if (path.length > 1 && successors[last].includes(path[0])) found.push(path.join(","));
    for (const next of successors[last]) if (next > path[0] && !path.includes(next)) extend([...path, next]);
  };
  successors.forEach((_, start) => extend([start]));
  return found.sort();
}

const graph = fc
  .integer({ min: 1, max: 7 })
  .chain((size) =>
    fc
      .array(fc.array(fc.boolean(), { minLength: size, maxLength: size }), { minLength: size, maxLength: size })
      .map((rows) => rows.map((row, from) => row.flatMap((edge, to) => (edge && to !== from ? [to] : [])))),
  );

describe("simpleCycles", () => {
  it("finds every cycle a brute-force search over vertex orders finds", () => {
    fc.assert(
      fc.property(graph, (successors) => {
        expect(
          simpleCycles(successors)
            .cycles.map((cycle) => cycle.join(","))
            .sort(),
        ).toEqual(cyclesByPermutation(successors));
      }),
      { numRuns: 300 },
    );
  });

  it.each([3, 4, 5, 6])("finds Σ C(n, l)·(l − 1)! cycles in the complete directed graph on %i vertices", (size) => {
    // Standard combinatorics: choose l vertices, then (l − 1)! cyclic orders of them (a 2-cycle counts once).
    const complete = Array.from({ length: size }, (_, from) => Array.from({ length: size }, (_, to) => to).filter((to) => to !== from));
    const choose = (n: number, k: number): number => (k === 0 ? 1 : (choose(n - 1, k - 1) * n) / k);
    const factorial = (n: number): number => (n <= 1 ? 1 : n * factorial(n - 1));
    let expected = 0;
    for (let length = 2; length <= size; length += 1) expected += choose(size, length) * factorial(length - 1);
    expect(simpleCycles(complete).cycles).toHaveLength(expected);
  });

  it("stops at the limit and says the list is incomplete", () => {
    const complete = Array.from({ length: 6 }, (_, from) => [0, 1, 2, 3, 4, 5].filter((to) => to !== from));
    const cut = simpleCycles(complete, 10);
    expect(cut.cycles).toHaveLength(10);
    expect(cut.complete).toBe(false);
  });

  it("finds nothing in a graph without cycles", () => {
    expect(simpleCycles([[1, 2], [2], []])).toEqual({ cycles: [], complete: true });
  });
});
