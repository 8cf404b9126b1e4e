import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { fractionToDecimal, fractionToNumber, fractionToPercent, fractionToString } from "@shared/probability/format";

describe("fractionToString", () => {
  it.each([
    [new Fraction(2, 4), "1/2"],
    [new Fraction(-6, 9), "-2/3"],
    [new Fraction(3), "3"],
    [new Fraction(0), "0"],
  ])("writes %s as %s", (value, text) => {
    expect(fractionToString(value)).toBe(text);
  });
});

describe("fractionToDecimal", () => {
  it.each([
    // Rounded by hand, half away from zero.
    [new Fraction(2, 3), 3, "0.667"],
    [new Fraction(1, 8), 2, "0.13"],
    [new Fraction(-1, 8), 2, "-0.13"],
    [new Fraction(1, 3), 0, "0"],
    [new Fraction(671, 1296), 4, "0.5177"],
    [new Fraction(7, 2), 1, "3.5"],
    [new Fraction(-1, 1000), 2, "0.00"],
  ])("writes %s to %i places as %s", (value, places, text) => {
    expect(fractionToDecimal(value, places)).toBe(text);
  });

  it("writes percentages", () => {
    expect(fractionToPercent(new Fraction(2, 3))).toBe("66.7%");
  });
});

describe("fractionToNumber", () => {
  it("keeps precision for numerators beyond 2^1024", () => {
    const huge = new Fraction(2n ** 3000n + 1n, 3n * 2n ** 3000n);
    expect(fractionToNumber(huge)).toBeCloseTo(1 / 3, 15);
  });
});
