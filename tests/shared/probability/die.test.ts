import { describe, expect, it } from "vitest";
import { dicePerPlayerChecked, dieFacesChecked, dieFacesSchema, InvalidDieError } from "@shared/probability/die";

const messagesFor = (faces: unknown): string[] => {
  const result = dieFacesSchema.safeParse(faces);
  return result.success ? [] : result.error.issues.map((issue) => issue.message);
};

describe("dieFacesSchema", () => {
  it.each([[[2, 2, 6, 6, 7, 7]], [[-99, 999]], [Array.from({ length: 60 }, (_, index) => index)], [[5, 5]]])(
    "accepts a valid die %j",
    (faces) => {
      expect(dieFacesSchema.safeParse(faces).success).toBe(true);
    },
  );

  it.each([
    ["an empty die", [], /empty/],
    ["a one-face die", [4], /at least 2 faces; this one has 1/],
    ["a 61-face die", Array.from({ length: 61 }, () => 1), /at most 60 faces; this one has 61/],
    ["a non-integer face", [1, 2.5], /whole numbers; 2\.5 is not/],
    ["a face below -99", [-100, 3], /at least -99/],
    ["a face above 999", [3, 1000], /at most 999/],
    ["a face that is not a number", [3, "four"], /must be a number/],
  ])("refuses %s with a clear message", (_, faces, pattern) => {
    const messages = messagesFor(faces);
    expect(messages.length).toBeGreaterThan(0);
    expect(messages.join(" ")).toMatch(pattern);
  });
});

describe("dieFacesChecked", () => {
  it("throws InvalidDieError listing every problem", () => {
    expect(() => dieFacesChecked([1.5, 1000])).toThrow(InvalidDieError);
    try {
      dieFacesChecked([1.5, 1000]);
    } catch (error) {
      expect((error as InvalidDieError).issues).toHaveLength(2);
    }
  });
});

describe("dicePerPlayerChecked", () => {
  it.each([0, 7, 1.5])("refuses %s dice per player", (count) => {
    expect(() => dicePerPlayerChecked(count)).toThrow(InvalidDieError);
  });

  it("defaults to one die each", () => {
    expect(dicePerPlayerChecked(undefined)).toBe(1);
  });
});
