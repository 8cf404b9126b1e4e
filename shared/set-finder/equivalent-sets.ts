import { sumCountDistribution } from "../probability/sum-distribution";
import { matchupCountsFromDistributions } from "../probability/matchup";
import type { FinderProperty, FoundSet } from "../schemas/set-finder";
import { propertyTemplates } from "./property-templates";

/** The matchups a search asks about, as [first position, second position, dice per player], each pair once with the smaller position first. */
export function askedMatchups(property: FinderProperty, diceCount: number): [number, number, 1 | 2][] {
  const seen = new Map<string, [number, number, 1 | 2]>();
  for (const template of propertyTemplates(property, diceCount)) {
    for (const need of template.requirements) {
      const first = Math.min(need.winner, need.loser);
      const second = Math.max(need.winner, need.loser);
      seen.set(`${first}-${second}-${need.dicePerPlayer}`, [first, second, need.dicePerPlayer]);
    }
  }
  return [...seen.values()].sort((x, y) => x[2] - y[2] || x[0] - y[0] || x[1] - y[1]);
}

/**
 * What a found set does in every matchup the search asked about: for each rotation of its cycle, the exact win and tie counts
 * of each asked matchup (out of the same total for every set of the search), and the smallest of these strings. Two sets with the
 * same fingerprint play every asked matchup with the same chances, so a pupil could not tell them apart by those games.
 */
export function matchupFingerprint(property: FinderProperty, faces: readonly (readonly number[])[]): string {
  const n = faces.length;
  const asked = askedMatchups(property, n);
  const distributions = new Map<string, ReturnType<typeof sumCountDistribution>>();
  const distributionOf = (die: number, dicePerPlayer: number) => {
    const key = `${die}:${dicePerPlayer}`;
    let distribution = distributions.get(key);
    if (distribution === undefined) {
      distribution = sumCountDistribution([...faces[die]], dicePerPlayer);
      distributions.set(key, distribution);
    }
    return distribution;
  };
  let smallest: string | null = null;
  for (let shift = 0; shift < n; shift += 1) {
    const text = asked
      .map(([first, second, dicePerPlayer]) => {
        const counts = matchupCountsFromDistributions(
          distributionOf((first + shift) % n, dicePerPlayer),
          distributionOf((second + shift) % n, dicePerPlayer),
        );
        return `${counts.win}/${counts.tie}`;
      })
      .join(" ");
    if (smallest === null || text < smallest) smallest = text;
  }
  return smallest ?? "";
}

/**
 * Folds found sets that play every asked matchup alike (the same `matchupFingerprint`) into the first of them, best first,
 * counting the others in its `variants`; keeps at most `limit` sets.
 */
export function collapseEquivalentSets(
  property: FinderProperty,
  results: readonly FoundSet[],
  limit = Number.POSITIVE_INFINITY,
): FoundSet[] {
  const kept: FoundSet[] = [];
  const byFingerprint = new Map<string, FoundSet>();
  for (const result of results) {
    const fingerprint = matchupFingerprint(
      property,
      result.dice.map((die) => die.faces),
    );
    const first = byFingerprint.get(fingerprint);
    if (first !== undefined) {
      first.variants = (first.variants ?? 0) + 1;
      continue;
    }
    const copy = { ...result, variants: 0 };
    byFingerprint.set(fingerprint, copy);
    kept.push(copy);
  }
  return kept.slice(0, limit);
}
