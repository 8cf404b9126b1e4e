/** A seeded source of 32-bit unsigned integers. */
export type RandomSource = () => number;

/**
 * Seeded pseudo-random generator mulberry32 (Tommy Ettinger, 2017): a 32-bit state advanced by a Weyl sequence
 * and mixed; the same seed always gives the same stream. For demonstrations, not for security.
 */
export function mulberry32(seed: number): RandomSource {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let mixed = state;
    mixed = Math.imul(mixed ^ (mixed >>> 15), mixed | 1);
    mixed ^= mixed + Math.imul(mixed ^ (mixed >>> 7), mixed | 61);
    return (mixed ^ (mixed >>> 14)) >>> 0;
  };
}

/** A uniform whole number from 0 to bound − 1, by rejection sampling so no value is favoured (bound up to 2^32). */
export function randomBelow(source: RandomSource, bound: number): number {
  const limit = 2 ** 32 - (2 ** 32 % bound);
  let draw = source();
  while (draw >= limit) draw = source();
  return draw % bound;
}
