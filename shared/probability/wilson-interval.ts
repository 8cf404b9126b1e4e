import { normalQuantile } from "./normal-quantile";

/** A confidence interval for a proportion, as display numbers. */
export interface ProportionInterval {
  lower: number;
  upper: number;
  /** The interval's centre, pulled from the observed proportion towards 1/2. */
  centre: number;
  /** The observed proportion successes / trials. */
  proportion: number;
  confidence: number;
}

/** The two-sided critical value z with P(|Z| ≤ z) = confidence (Acklam's inverse normal). */
export function criticalValueForConfidence(confidence: number): number {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError("Confidence must be strictly between 0 and 1, e.g. 0.95.");
  return normalQuantile(1 - (1 - confidence) / 2);
}

/**
 * Wilson score interval for a proportion (E. B. Wilson, JASA 1927) from a possibly fractional success count:
 * the set of p₀ with |p̂ − p₀| ≤ z·√(p₀(1 − p₀)/n), in closed form.
 */
export function wilsonIntervalFromProportion(proportion: number, trials: number, confidence = 0.95): ProportionInterval {
  const z = criticalValueForConfidence(confidence);
  const zSquared = z * z;
  const denominator = 1 + zSquared / trials;
  const centre = (proportion + zSquared / (2 * trials)) / denominator;
  const halfWidth = (z / denominator) * Math.sqrt((proportion * (1 - proportion)) / trials + zSquared / (4 * trials * trials));
  return { lower: Math.max(0, centre - halfWidth), upper: Math.min(1, centre + halfWidth), centre, proportion, confidence };
}

/**
 * Wilson score interval (Wilson 1927) for an observed win count out of `trials` rolls, at any confidence (default 95%),
 * with z from Acklam's inverse normal. Floating point: the interval involves a square root and a normal quantile.
 */
export function wilsonInterval(successes: number, trials: number, confidence = 0.95): ProportionInterval {
  if (!Number.isInteger(trials) || trials < 1) throw new RangeError("Trials must be a whole number of at least 1.");
  if (!Number.isInteger(successes) || successes < 0 || successes > trials)
    throw new RangeError("Successes must be a whole number from 0 to the number of trials.");
  return wilsonIntervalFromProportion(successes / trials, trials, confidence);
}
