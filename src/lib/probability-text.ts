import type Fraction from "fraction.js";
import { fractionToDecimal, fractionToString } from "@shared/probability/index";

/** Longest fraction written out; longer ones (e.g. long series) are shown as decimals only. */
const FRACTION_TEXT_MAX = 23;

/** An exact probability as teachers read it: the fraction, then its decimal, e.g. "5/9 (0.556)". */
export function probabilityText(value: Fraction, places = 3): string {
  const exact = fractionToString(value);
  const decimal = fractionToDecimal(value, places);
  return exact.length > FRACTION_TEXT_MAX ? decimal : `${exact} (${decimal})`;
}

const countWords = ["no", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten"];

/** A small count as a word ("two"), larger ones as digits. */
export function countWord(count: number): string {
  return countWords[count] ?? String(count);
}

/** The glossary's mode names: "one die each", "two dice each", "three dice each". */
export function modeLabel(dicePerPlayer: number): string {
  return dicePerPlayer === 1 ? "one die each" : `${countWord(dicePerPlayer)} dice each`;
}

/** A mode name with a capital first letter, for headings and sentence starts. */
export function modeTitle(dicePerPlayer: number): string {
  const label = modeLabel(dicePerPlayer);
  return label.charAt(0).toUpperCase() + label.slice(1);
}
