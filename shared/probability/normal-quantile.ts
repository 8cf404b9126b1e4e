import { regularizedGammaUpper } from "./incomplete-gamma";

const CENTRAL_NUMERATOR = [
  -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239,
];
const CENTRAL_DENOMINATOR = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
const TAIL_NUMERATOR = [
  -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783,
];
const TAIL_DENOMINATOR = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const TAIL_SPLIT = 0.02425;

/** Evaluates a polynomial with coefficients from the highest power down (Horner's rule). */
function horner(coefficients: readonly number[], x: number): number {
  return coefficients.reduce((sum, coefficient) => sum * x + coefficient, 0);
}

/** Standard normal distribution function P(Z ≤ x), via erfc(t) = Q(1/2, t²) from the incomplete gamma function. */
export function normalDistribution(x: number): number {
  const tail = 0.5 * regularizedGammaUpper(0.5, (x * x) / 2);
  return x <= 0 ? tail : 1 - tail;
}

/**
 * Inverse of the standard normal distribution function (the z with P(Z ≤ z) = p), for 0 < p < 1,
 * by Peter J. Acklam's rational approximation (relative error 1.15·10⁻⁹) and one Halley refinement step as Acklam recommends.
 */
export function normalQuantile(probability: number): number {
  if (!(probability > 0 && probability < 1)) throw new RangeError("The normal quantile needs a probability strictly between 0 and 1.");
  let x: number;
  if (probability < TAIL_SPLIT) {
    const q = Math.sqrt(-2 * Math.log(probability));
    x = horner(TAIL_NUMERATOR, q) / (horner(TAIL_DENOMINATOR, q) * q + 1);
  } else if (probability <= 1 - TAIL_SPLIT) {
    const q = probability - 0.5;
    const r = q * q;
    x = (horner(CENTRAL_NUMERATOR, r) * q) / (horner(CENTRAL_DENOMINATOR, r) * r + 1);
  } else {
    const q = Math.sqrt(-2 * Math.log(1 - probability));
    x = -horner(TAIL_NUMERATOR, q) / (horner(TAIL_DENOMINATOR, q) * q + 1);
  }
  const error = normalDistribution(x) - probability;
  const step = error * Math.sqrt(2 * Math.PI) * Math.exp((x * x) / 2);
  return x - step / (1 + (x * step) / 2);
}
