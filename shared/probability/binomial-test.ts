import Fraction, { type FractionInput } from "fraction.js";
import { fractionToNumber, ratioToNumber } from "./format";

/** Most trials `binomialTest` accepts, to keep its exact BigInt sums quick. */
export const BINOMIAL_TRIALS_MAX = 5_000;

/** Result of an exact two-sided binomial test. */
export interface BinomialTestResult {
  successes: number;
  trials: number;
  /** The null hypothesis's success probability. */
  nullProbability: Fraction;
  /** Exact two-sided p-value. */
  pValue: Fraction;
  /** The p-value as a display number. */
  pValueNumber: number;
  /** Expected successes under the null hypothesis: trials × p. */
  expected: Fraction;
}

/**
 * Exact two-sided binomial test of `successes` in `trials` against success probability p (default 1/2):
 * the p-value is the sum of P(X = k) over every k with P(X = k) ≤ P(X = observed), the method of R's binom.test,
 * here compared exactly in BigInt instead of with binom.test's 1 + 10⁻⁷ tolerance.
 */
export function binomialTest(successes: number, trials: number, nullProbability: FractionInput = new Fraction(1, 2)): BinomialTestResult {
  const { p, tail, denominator } = exactTail(successes, trials, nullProbability);
  const pValue = new Fraction(tail, denominator);
  return { successes, trials, nullProbability: p, pValue, pValueNumber: fractionToNumber(pValue), expected: p.mul(trials) };
}

/**
 * binomialTest's p-value as a number only: the same exact sum, without reducing the fraction to lowest terms (for Run
 * boards, which test every group at each refresh and show the number).
 */
export function binomialTestPValue(successes: number, trials: number, nullProbability: FractionInput = new Fraction(1, 2)): number {
  const { tail, denominator } = exactTail(successes, trials, nullProbability);
  return ratioToNumber(tail, denominator);
}

/** The two-sided tail of binomialTest as tail / denominator, not reduced. */
function exactTail(successes: number, trials: number, nullProbability: FractionInput): { p: Fraction; tail: bigint; denominator: bigint } {
  if (!Number.isInteger(trials) || trials < 1 || trials > BINOMIAL_TRIALS_MAX)
    throw new RangeError(`Trials must be a whole number from 1 to ${BINOMIAL_TRIALS_MAX}.`);
  if (!Number.isInteger(successes) || successes < 0 || successes > trials)
    throw new RangeError("Successes must be a whole number from 0 to the number of trials.");
  const p = new Fraction(nullProbability);
  if (p.lt(0) || p.gt(1)) throw new RangeError("The null probability must be from 0 to 1.");
  // With p = a/b, P(X = k) = C(n, k)·a^k·(b − a)^(n − k) / b^n, so whole-number numerators compare exactly.
  const a = p.n;
  const rest = p.d - p.n;
  const n = BigInt(trials);
  const binomialCoefficient = (k: number): bigint => {
    let value = 1n;
    for (let step = 0; step < k; step += 1) value = (value * (n - BigInt(step))) / BigInt(step + 1);
    return value;
  };
  const observed = binomialCoefficient(successes) * a ** BigInt(successes) * rest ** BigInt(trials - successes);
  // Streams k = 0 … n keeping one term: P(X = k + 1) / P(X = k) = (n − k)·a / ((k + 1)·(b − a)), and the whole-number
  // numerators divide exactly, so each step multiplies and divides by small numbers only.
  // With p = 1 every k below n has probability 0, so the tail is the observed term itself.
  let tail = rest === 0n ? observed : 0n;
  if (rest !== 0n) {
    let numerator = rest ** n;
    for (let k = 0; k <= trials; k += 1) {
      if (numerator <= observed) tail += numerator;
      if (k < trials) numerator = (numerator * (n - BigInt(k)) * a) / (BigInt(k + 1) * rest);
    }
  }
  return { p, tail, denominator: p.d ** n };
}
