import Fraction from "fraction.js";
import { criticalValueForConfidence, wilsonIntervalFromProportion } from "./wilson-interval";

/** Largest roll count `rollsNeededToExcludeHalf` reports. */
export const PLANNED_ROLLS_MAX = 10_000_000;

/** True when the Wilson interval at the expected count n·p lies wholly above or below 1/2. */
function excludesHalf(winProbability: number, rolls: number, confidence: number): boolean {
  const interval = wilsonIntervalFromProportion(winProbability, rolls, confidence);
  return interval.lower > 0.5 || interval.upper < 0.5;
}

/**
 * How many pooled rolls a class needs: the smallest n such that the Wilson score interval (Wilson 1927) computed at the
 * expected win count n·p (not rounded) excludes 1/2. The Wilson interval inverts the score test, so this is the smallest
 * n > z²/(4(p − 1/2)²); the closed form is then checked against the interval itself. Returns null when p = 1/2
 * (never) or the answer exceeds PLANNED_ROLLS_MAX. p is the win probability under the tie rule the class plays.
 */
export function rollsNeededToExcludeHalf(winProbability: Fraction | number, confidence = 0.95): number | null {
  const p = typeof winProbability === "number" ? winProbability : winProbability.valueOf();
  if (!(p >= 0 && p <= 1)) throw new RangeError("The win probability must be from 0 to 1.");
  const distance = Math.abs(p - 0.5);
  if (distance === 0) return null;
  const z = criticalValueForConfidence(confidence);
  let rolls = Math.max(1, Math.floor((z * z) / (4 * distance * distance)) + 1);
  if (rolls > PLANNED_ROLLS_MAX) return null;
  // Floating rounding can put the closed form one off the interval's own verdict; let the interval decide.
  while (!excludesHalf(p, rolls, confidence)) rolls += 1;
  while (rolls > 1 && excludesHalf(p, rolls - 1, confidence)) rolls -= 1;
  return rolls;
}
