import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { countDistributionFromFaces, countsBelow, probabilityOfValue } from "@shared/probability/count-distribution";

const faces = fc.array(fc.integer({ min: -5, max: 12 }), { minLength: 2, maxLength: 12 });

describe("countDistributionFromFaces", () => {
  it("counts repeated face values and sorts them", () => {
    // Counted by hand from the faces.
    const distribution = countDistributionFromFaces([7, 2, 7, 2, 2, 9]);
    expect(distribution.values).toEqual([2, 7, 9]);
    expect(distribution.counts).toEqual([3n, 2n, 1n]);
    expect(distribution.total).toBe(6n);
  });

  it("gives probability zero to a value the die does not have", () => {
    expect(probabilityOfValue(countDistributionFromFaces([1, 4]), 3).equals(0)).toBe(true);
  });
});

describe("countsBelow", () => {
  it("matches counting faces below and equal one by one", () => {
    fc.assert(
      fc.property(faces, fc.array(fc.integer({ min: -7, max: 14 }), { minLength: 1, maxLength: 8 }), (die, probes) => {
        const sorted = [...new Set(probes)].sort((x, y) => x - y);
        const { below, equal } = countsBelow(countDistributionFromFaces(die), sorted);
        sorted.forEach((probe, index) => {
          expect(below[index]).toBe(BigInt(die.filter((face) => face < probe).length));
          expect(equal[index]).toBe(BigInt(die.filter((face) => face === probe).length));
        });
      }),
    );
  });
});
