import type Fraction from "fraction.js";
import { fractionToDecimal, fractionToString } from "@shared/probability/index";

/**
 * How Outroll writes numbers, fractions, dates and times: one style everywhere ("5 Dec 2026", "14:05", "5 Dec 2026, 14:05",
 * "1,234"), dates and times in the teacher's own time zone (the browser's, unless a test names one).
 */
const LOCALE = "en-GB";

function dateFormat(options: Intl.DateTimeFormatOptions, timeZone?: string) {
  return new Intl.DateTimeFormat(LOCALE, { ...options, timeZone });
}

const dayOptions: Intl.DateTimeFormatOptions = { day: "numeric", month: "short", year: "numeric" };
const timeOptions: Intl.DateTimeFormatOptions = { hour: "2-digit", minute: "2-digit", hourCycle: "h23" };

/** A day, e.g. "5 Dec 2026". */
export function formatDate(when: string | Date, timeZone?: string): string {
  return dateFormat(dayOptions, timeZone).format(new Date(when));
}

/** A time of day on the 24-hour clock, e.g. "14:05". */
export function formatTime(when: string | Date, timeZone?: string): string {
  return dateFormat(timeOptions, timeZone).format(new Date(when));
}

/** A day and a time, e.g. "5 Dec 2026, 14:05". */
export function formatDateTime(when: string | Date, timeZone?: string): string {
  return `${formatDate(when, timeZone)}, ${formatTime(when, timeZone)}`;
}

/** A whole number with thousands separated, e.g. "12,345". */
export function formatNumber(value: number): string {
  return value.toLocaleString(LOCALE);
}

/** A count with its noun, singular for exactly one: "1 undone roll", "3 undone rolls". */
export function formatCount(count: number, one: string, many = `${one}s`): string {
  return `${formatNumber(count)} ${count === 1 ? one : many}`;
}

/** An exact fraction as teachers write it, e.g. "5/9". */
export function formatFraction(value: Fraction): string {
  return fractionToString(value);
}

/** A fraction as a decimal with `places` decimal places, e.g. "0.556". */
export function formatDecimal(value: Fraction, places = 3): string {
  return fractionToDecimal(value, places);
}
