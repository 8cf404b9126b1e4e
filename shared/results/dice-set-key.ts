/** A die as far as pooling cares: its faces (names and colours may differ between runs of the same set). */
type FacedDie = { faces: readonly number[] };

/** One die's faces in ascending order, written "1,4,4,4,4,4". */
function facesSignature(die: FacedDie): string {
  return [...die.faces].sort((a, b) => a - b).join(",");
}

/**
 * 64-bit FNV-1a hash of a string as 16 hex digits (Fowler–Noll–Vo, the published offset basis and prime);
 * a short stable key, not a security measure.
 */
export function fnv1a64(text: string): string {
  let hash = 0xcbf29ce484222325n;
  const prime = 0x100000001b3n;
  for (const byte of new TextEncoder().encode(text)) {
    hash ^= BigInt(byte);
    hash = (hash * prime) & 0xffffffffffffffffn;
  }
  return hash.toString(16).padStart(16, "0");
}

/**
 * The key that says two class runs used "the same set": the same dice, each with the same faces, in any order and
 * under any names. Runs keep their own copy of the dice, so the key is computed from those copies, not a set id.
 */
export function diceSetKey(dice: readonly FacedDie[]): string {
  return fnv1a64(dice.map(facesSignature).sort().join("|"));
}

/**
 * For each die of `dice`, its position in the set's canonical order (dice sorted by their face signatures), so die
 * indexes recorded in runs that list the same dice in different orders can be compared.
 */
export function canonicalDiePositions(dice: readonly FacedDie[]): number[] {
  const signatures = dice.map(facesSignature);
  const order = signatures
    .map((signature, index) => ({ signature, index }))
    .sort((a, b) => (a.signature < b.signature ? -1 : a.signature > b.signature ? 1 : a.index - b.index));
  const positions = new Array<number>(dice.length);
  order.forEach((entry, position) => {
    positions[entry.index] = position;
  });
  return positions;
}
