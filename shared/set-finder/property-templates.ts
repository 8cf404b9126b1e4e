import type { FinderProperty } from "../schemas/set-finder";

/** "Die at position `winner` beats die at position `loser` when each player rolls `dicePerPlayer` dice." */
export interface BeatsRequirement {
  winner: number;
  loser: number;
  dicePerPlayer: 1 | 2;
}

/**
 * One way a set in cycle order (position 0 beats 1 beats … beats 0) can have a property: the matchups it needs.
 * `secondCycle` is the cycle that reverses with two dice each, for two-cycles, as positions.
 */
export interface PropertyTemplate {
  requirements: BeatsRequirement[];
  secondCycle: number[] | null;
}

/** What every template asks of each step k → k+1 of the main cycle with two dice each: nothing, to keep, or to reverse. */
export type MainCycleTwoDice = "any" | "keep" | "reverse";

/** How the main cycle's steps must behave with two dice each for a property. */
export function mainCycleTwoDice(property: FinderProperty): MainCycleTwoDice {
  return property === "reversing-cycle" ? "reverse" : property === "two-cycles" ? "keep" : "any";
}

function mainCycleRequirements(property: FinderProperty, diceCount: number): BeatsRequirement[] {
  const twoDice = mainCycleTwoDice(property);
  const requirements: BeatsRequirement[] = [];
  for (let step = 0; step < diceCount; step += 1) {
    const next = (step + 1) % diceCount;
    requirements.push({ winner: step, loser: next, dicePerPlayer: 1 });
    if (twoDice === "keep") requirements.push({ winner: step, loser: next, dicePerPlayer: 2 });
    if (twoDice === "reverse") requirements.push({ winner: next, loser: step, dicePerPlayer: 2 });
  }
  return requirements;
}

/**
 * Directed cycles through every position that use no matchup of the main cycle, each listed once (starting at position 0);
 * both directions of an undirected cycle appear, since which way it runs matters.
 */
export function cyclesAvoidingMainCycle(diceCount: number): number[][] {
  const onMainCycle = (a: number, b: number) => (a - b + diceCount) % diceCount === 1 || (b - a + diceCount) % diceCount === 1;
  const found: number[][] = [];
  const path = [0];
  const used = new Array<boolean>(diceCount).fill(false);
  used[0] = true;
  const extend = () => {
    if (path.length === diceCount) {
      if (!onMainCycle(path[diceCount - 1], 0)) found.push([...path]);
      return;
    }
    for (let next = 1; next < diceCount; next += 1) {
      if (used[next] || onMainCycle(path[path.length - 1], next)) continue;
      used[next] = true;
      path.push(next);
      extend();
      path.pop();
      used[next] = false;
    }
  };
  extend();
  return found;
}

/** Every template for a property on `diceCount` dice: one for one-cycle and reversing-cycle, one per second cycle for two-cycles. */
export function propertyTemplates(property: FinderProperty, diceCount: number): PropertyTemplate[] {
  const main = mainCycleRequirements(property, diceCount);
  if (property !== "two-cycles") return [{ requirements: main, secondCycle: null }];
  return cyclesAvoidingMainCycle(diceCount).map((cycle) => {
    const requirements = [...main];
    cycle.forEach((position, index) => {
      const next = cycle[(index + 1) % cycle.length];
      requirements.push({ winner: position, loser: next, dicePerPlayer: 1 });
      requirements.push({ winner: next, loser: position, dicePerPlayer: 2 });
    });
    return { requirements, secondCycle: cycle };
  });
}
