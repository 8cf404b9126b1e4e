import Fraction from "fraction.js";

/** Bit length of a non-negative BigInt. */
function bitLength(value: bigint): number {
  return value === 0n ? 0 : value.toString(2).length;
}

/** A fraction as "a/b" in lowest terms, or "a" when it is a whole number (display only). */
export function fractionToString(value: Fraction): string {
  const sign = value.s < 0n && value.n !== 0n ? "-" : "";
  return value.d === 1n ? `${sign}${value.n}` : `${sign}${value.n}/${value.d}`;
}

/** A fraction as a decimal string with exactly `places` decimal places, rounded half away from zero, computed exactly in BigInt (display only). */
export function fractionToDecimal(value: Fraction, places = 3): string {
  if (!Number.isInteger(places) || places < 0 || places > 100) throw new RangeError("Decimal places must be a whole number from 0 to 100.");
  const scale = 10n ** BigInt(places);
  const rounded = (2n * value.n * scale + value.d) / (2n * value.d);
  const sign = value.s < 0n && rounded !== 0n ? "-" : "";
  const whole = rounded / scale;
  const fraction = (rounded % scale).toString().padStart(places, "0");
  return places === 0 ? `${sign}${whole}` : `${sign}${whole}.${fraction}`;
}

/** A fraction as a percentage string with `places` decimal places, e.g. "66.7%" (display only). */
export function fractionToPercent(value: Fraction, places = 1): string {
  return `${fractionToDecimal(value.mul(100), places)}%`;
}

/** A fraction as the nearest double, safe for numerators and denominators far beyond 2^1024 (display only). */
export function fractionToNumber(value: Fraction): number {
  return (value.s < 0n ? -1 : 1) * ratioToNumber(value.n, value.d);
}

/** numerator / denominator (both non-negative, not necessarily in lowest terms) as a double, however many bits they have (display only). */
export function ratioToNumber(numerator: bigint, denominator: bigint): number {
  const shift = Math.max(0, Math.max(bitLength(numerator), bitLength(denominator)) - 1000);
  if (shift === 0) return Number(numerator) / Number(denominator);
  return Number(numerator >> BigInt(shift)) / Number(denominator >> BigInt(shift));
}
