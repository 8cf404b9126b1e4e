const LANCZOS_G = 7;
const LANCZOS_COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];
const ITERATIONS_MAX = 1000;
const EPSILON = 1e-16;
const TINY = 1e-300;

/** Natural log of the gamma function for x > 0, by the Lanczos approximation (Lanczos 1964, g = 7, nine coefficients), with reflection below 1/2. */
export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const shifted = x - 1;
  let series = LANCZOS_COEFFICIENTS[0];
  for (let index = 1; index < LANCZOS_COEFFICIENTS.length; index += 1) series += LANCZOS_COEFFICIENTS[index] / (shifted + index);
  const base = shifted + LANCZOS_G + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (shifted + 0.5) * Math.log(base) - base + Math.log(series);
}

/** P(a, x) by its power series, for x < a + 1 (Numerical Recipes §6.2, gser). */
function lowerGammaSeries(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  for (let step = 1; step <= ITERATIONS_MAX; step += 1) {
    term *= x / (a + step);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * EPSILON) break;
  }
  return sum * Math.exp(-x + a * Math.log(x) - logGamma(a));
}

/** Q(a, x) by its continued fraction with the modified Lentz method, for x ≥ a + 1 (Numerical Recipes §6.2, gcf). */
function upperGammaContinuedFraction(a: number, x: number): number {
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let step = 1; step <= ITERATIONS_MAX; step += 1) {
    const an = -step * (step - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const change = d * c;
    h *= change;
    if (Math.abs(change - 1) < EPSILON) break;
  }
  return Math.exp(-x + a * Math.log(x) - logGamma(a)) * h;
}

/**
 * Regularized upper incomplete gamma function Q(a, x) = Γ(a, x) / Γ(a), for a > 0 and x ≥ 0,
 * by the series / continued-fraction split of Numerical Recipes (Press et al., §6.2). Floating point: display use only.
 */
export function regularizedGammaUpper(a: number, x: number): number {
  if (!(a > 0) || !(x >= 0)) throw new RangeError("The incomplete gamma function needs a > 0 and x ≥ 0.");
  if (x === 0) return 1;
  return x < a + 1 ? 1 - lowerGammaSeries(a, x) : upperGammaContinuedFraction(a, x);
}

/** Regularized lower incomplete gamma function P(a, x) = 1 − Q(a, x) (Numerical Recipes §6.2). */
export function regularizedGammaLower(a: number, x: number): number {
  if (!(a > 0) || !(x >= 0)) throw new RangeError("The incomplete gamma function needs a > 0 and x ≥ 0.");
  if (x === 0) return 0;
  return x < a + 1 ? lowerGammaSeries(a, x) : 1 - upperGammaContinuedFraction(a, x);
}
