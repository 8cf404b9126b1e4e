import { simpleCycles } from "../probability/index";
import type { PooledMatchup, PooledResults } from "../class-results/pooled-results";

const tieRulePhrases: Record<string, string> = {
  "re-roll-ties": "ties re-rolled",
  "ties-score-half": "a tie scoring half",
  "ties-score-nothing": "a tie scoring nothing",
};

/** A probability for a sentence: three decimal places. */
function three(value: number): string {
  return value.toFixed(3);
}

/** The matchup with the most rolls (ties broken by the pooled order), or null before any roll. */
export function mainMatchup(pooled: PooledResults): PooledMatchup | null {
  return pooled.matchups.reduce<PooledMatchup | null>((best, entry) => (best === null || entry.rolls > best.rolls ? entry : best), null);
}

/** The cycle, if any, that the class's own favourites make among two-player matchups with `dicePerPlayer` dice each. */
function observedCycle(pooled: PooledResults, dicePerPlayer: number, dieCount: number): number[] | null {
  const successors: number[][] = Array.from({ length: dieCount }, () => []);
  for (const entry of pooled.matchups) {
    if (entry.players !== 2 || entry.dicePerPlayer !== dicePerPlayer || entry.frequencyUnderTieRule === null) continue;
    const [first, second] = entry.matchup;
    if (entry.frequencyUnderTieRule > 0.5) successors[first].push(second);
    else if (entry.frequencyUnderTieRule < 0.5) successors[second].push(first);
  }
  const { cycles } = simpleCycles(successors, 1000);
  const longest = cycles.filter((cycle) => cycle.length >= 3).sort((a, b) => b.length - a.length)[0];
  return longest ?? null;
}

/**
 * Two short, plain-language findings computed from a run's pooled rolls: how close the class estimate of the main
 * matchup came to its exact value, then either the cycle the class's own favourites made or what the 95% interval
 * of the main matchup can and cannot say yet.
 */
export function classFindings(pooled: PooledResults, dieNames: readonly string[]): string[] {
  const main = mainMatchup(pooled);
  if (main === null || main.frequencyUnderTieRule === null || main.exact.underTieRule === null) {
    return [
      "No rolls that count are stored for this run yet, so there is nothing to set beside the exact values.",
      "Record rolls in a class run, or type up the paper recording sheets and bring them in with Paper import.",
    ];
  }
  const [firstDie, secondDie] = main.matchup.map((index) => dieNames[index]);
  const exact = main.exact.underTieRule;
  const estimate = main.frequencyUnderTieRule;
  // Rounded up, so "within" stays true of the unrounded gap.
  const gap = Math.ceil(Math.abs(estimate - exact.value) * 1000 - 1e-9) / 1000;
  const closeness = gap === 0 ? "equal to" : `within ${three(gap)} of`;
  const rule = pooled.tieRule in tieRulePhrases ? `, with ${tieRulePhrases[pooled.tieRule]}` : "";
  const first = `After ${main.rolls} rolls of ${main.label}${rule}, the class estimate of ${firstDie}'s chance of winning is ${three(estimate)}, ${closeness} the exact ${exact.fraction} (${exact.decimal}).`;

  const cycle = observedCycle(pooled, main.dicePerPlayer, dieNames.length);
  if (cycle !== null) {
    const steps = cycle.map((die, index) => `${dieNames[die]} beat ${dieNames[cycle[(index + 1) % cycle.length]]}`);
    const listed = `${steps.slice(0, -1).join(", ")} and ${steps[steps.length - 1]}`;
    return [first, `The class's own rolls went round in a circle: ${listed} more often than not, so no die was best.`];
  }
  const interval = main.interval;
  if (interval === null) return [first, "Every roll of this matchup was a tie, so the rolls cannot compare the dice yet."];
  const range = `from ${three(interval.lower)} to ${three(interval.upper)}`;
  if (main.players === 2 && interval.lower > 0.5) {
    return [
      first,
      `The 95% interval ${range} lies wholly above 1/2, so these rolls alone show ${firstDie} beats ${secondDie} more often than not.`,
    ];
  }
  if (main.players === 2 && interval.upper < 0.5) {
    return [
      first,
      `The 95% interval ${range} lies wholly below 1/2, so these rolls alone show ${secondDie} beats ${firstDie} more often than not.`,
    ];
  }
  if (main.players === 2) {
    return [
      first,
      `The 95% interval ${range} still contains 1/2, so these rolls alone cannot yet say which die is better; more rolls would narrow it.`,
    ];
  }
  const inside = interval.lower <= exact.value && exact.value <= interval.upper;
  return [first, `The exact ${exact.fraction} lies ${inside ? "inside" : "outside"} the 95% interval ${range} of the class's estimate.`];
}
