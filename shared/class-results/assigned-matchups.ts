/**
 * The matchups a teacher's assignment cycles through: each die against the next one in the set (and, for three players,
 * the one after), wrapping round, so the groups together play every step of a cycle A → B → C → A.
 */
export function cycleMatchups(diceCount: number, players: number): number[][] {
  if (!Number.isInteger(diceCount) || diceCount < players)
    throw new RangeError(`${players} players need at least ${players} dice in the set.`);
  const seen = new Set<string>();
  const matchups: number[][] = [];
  for (let first = 0; first < diceCount; first += 1) {
    const matchup = Array.from({ length: players }, (_, seat) => (first + seat) % diceCount);
    const key = [...matchup].sort((x, y) => x - y).join("-");
    if (seen.has(key)) continue;
    seen.add(key);
    matchups.push(matchup);
  }
  return matchups;
}

/** The matchup given to the group that joins `groupIndex`-th (from 0): the cycle's matchups in turn. */
export function assignedMatchup(diceCount: number, players: number, groupIndex: number): number[] {
  const matchups = cycleMatchups(diceCount, players);
  return matchups[groupIndex % matchups.length];
}
