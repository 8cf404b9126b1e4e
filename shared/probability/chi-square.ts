import Fraction from "fraction.js";
import { fractionToNumber } from "./format";
import { regularizedGammaUpper } from "./incomplete-gamma";

/** Result of a chi-square goodness-of-fit test against a fair die. */
export interface ChiSquareResult {
  /** Pearson's statistic Σ (observed − expected)² / expected, exact. */
  statistic: Fraction;
  statisticNumber: number;
  /** Faces − 1. */
  degreesOfFreedom: number;
  /** P(χ² ≥ statistic) = Q(df/2, statistic/2), floating point. */
  pValue: number;
  /** Expected count on each face: total rolls / faces. */
  expectedPerFace: Fraction;
}

/** Upper-tail probability P(χ²_df ≥ x) of the chi-square distribution, as Q(df/2, x/2) (Numerical Recipes §6.2). */
export function chiSquareUpperTail(x: number, degreesOfFreedom: number): number {
  return regularizedGammaUpper(degreesOfFreedom / 2, Math.max(0, x) / 2);
}

/** The upper critical value x with P(χ²_df ≥ x) = alpha, by bisection on `chiSquareUpperTail` (as tabulated in handbooks). */
export function chiSquareCriticalValue(degreesOfFreedom: number, alpha = 0.05): number {
  if (!(alpha > 0 && alpha < 1)) throw new RangeError("Alpha must be strictly between 0 and 1.");
  let low = 0;
  let high = Math.max(1, degreesOfFreedom);
  while (chiSquareUpperTail(high, degreesOfFreedom) > alpha) high *= 2;
  for (let step = 0; step < 200 && high - low > 1e-12 * high; step += 1) {
    const middle = (low + high) / 2;
    if (chiSquareUpperTail(middle, degreesOfFreedom) > alpha) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}

/**
 * Pearson's chi-square goodness-of-fit test (Pearson 1900) of observed counts per face against a fair die:
 * exact statistic, faces − 1 degrees of freedom, p-value from the regularized incomplete gamma function
 * (Numerical Recipes series / continued fraction). The usual caution applies when expected counts are below 5 (common practice).
 */
export function chiSquareGoodnessOfFit(observedPerFace: readonly number[]): ChiSquareResult {
  if (observedPerFace.length < 2) throw new RangeError("A goodness-of-fit test needs counts for at least 2 faces.");
  if (observedPerFace.some((count) => !Number.isInteger(count) || count < 0))
    throw new RangeError("Face counts must be whole numbers of at least 0.");
  const total = observedPerFace.reduce((sum, count) => sum + count, 0);
  if (total === 0) throw new RangeError("A goodness-of-fit test needs at least one roll.");
  const faces = observedPerFace.length;
  const expectedPerFace = new Fraction(total, faces);
  // Σ (O − E)²/E with E = T/f equals (f/T)·Σ O² − T, kept in whole numbers.
  const sumOfSquares = observedPerFace.reduce((sum, count) => sum + BigInt(count) * BigInt(count), 0n);
  const statistic = new Fraction(BigInt(faces) * sumOfSquares, BigInt(total)).sub(total);
  const statisticNumber = fractionToNumber(statistic);
  const degreesOfFreedom = faces - 1;
  return { statistic, statisticNumber, degreesOfFreedom, pValue: chiSquareUpperTail(statisticNumber, degreesOfFreedom), expectedPerFace };
}
