import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { formatCount, formatDate, formatDateTime, formatDecimal, formatFraction, formatNumber, formatTime } from "@/lib/format";

describe("format", () => {
  const lateEvening = "2026-12-05T23:30:00Z";

  it("writes a day and a time in the teacher's time zone, which can change the day", () => {
    expect(formatDateTime(lateEvening, "Europe/London")).toBe("5 Dec 2026, 23:30");
    expect(formatDateTime(lateEvening, "Europe/Berlin")).toBe("6 Dec 2026, 00:30");
    expect(formatDate(lateEvening, "America/New_York")).toBe("5 Dec 2026");
    expect(formatTime(lateEvening, "America/New_York")).toBe("18:30");
  });

  it("says one of a thing in the singular", () => {
    expect(formatCount(1, "undone roll")).toBe("1 undone roll");
    expect(formatCount(3, "undone roll")).toBe("3 undone rolls");
    expect(formatCount(0, "die", "dice")).toBe("0 dice");
    expect(formatCount(12345, "roll")).toBe("12,345 rolls");
  });

  it("writes numbers and fractions one way", () => {
    expect(formatNumber(787712)).toBe("787,712");
    expect(formatFraction(new Fraction(10, 18))).toBe("5/9");
    expect(formatDecimal(new Fraction(5, 9))).toBe("0.556");
  });
});
