import { describe, expect, it } from "vitest";
import { canonicalDiePositions, diceSetKey, fnv1a64 } from "@shared/results/dice-set-key";

const skua = { name: "Skua", faces: [1, 5, 10, 12, 13, 15] };
const tern = { name: "Tern", faces: [4, 7, 8, 9, 11, 18] };
const gannet = { name: "Gannet", faces: [2, 3, 6, 14, 16, 17] };

describe("diceSetKey", () => {
  it("gives the same 16-hex-digit key whatever the dice are called, their order and the order of their faces", () => {
    const key = diceSetKey([skua, tern, gannet]);
    expect(key).toMatch(/^[0-9a-f]{16}$/);
    expect(diceSetKey([{ ...gannet, name: "Northern gannet" }, { ...skua, faces: [...skua.faces].reverse() }, tern])).toBe(key);
  });

  it("gives another key when one face changes, or when a die is added", () => {
    const key = diceSetKey([skua, tern, gannet]);
    expect(diceSetKey([skua, tern, { ...gannet, faces: [2, 3, 6, 14, 16, 19] }])).not.toBe(key);
    expect(diceSetKey([skua, tern])).not.toBe(key);
  });

  it("hashes with 64-bit FNV-1a, matching its reference test vectors", () => {
    // Test vectors of the FNV reference code (Fowler, Noll, Vo), from memory: "" → the offset basis, "a", "foobar".
    expect(fnv1a64("")).toBe("cbf29ce484222325");
    expect(fnv1a64("a")).toBe("af63dc4c8601ec8c");
    expect(fnv1a64("foobar")).toBe("85944171f73967e8");
    expect(diceSetKey([])).toBe(fnv1a64(""));
  });
});

describe("canonicalDiePositions", () => {
  it("maps each die to its place among the dice sorted by their faces, so two listings can be matched die by die", () => {
    const first = [skua, tern, gannet];
    const second = [gannet, skua, tern];
    const a = canonicalDiePositions(first);
    const b = canonicalDiePositions(second);
    for (const [index, die] of second.entries()) expect(b[index]).toBe(a[first.findIndex((other) => other.faces === die.faces)]);
    expect([...a].sort()).toEqual([0, 1, 2]);
  });
});
