/**
 * How many rolls a group can make, and write down, in the Roll phase. The paces are our own planning figures from
 * common classroom practice (a roll, read aloud and written on the sheet, takes about 20 seconds with one die each and
 * about 30 with two dice each or a third player), not a published rule; the user guide says so.
 */
export const ROLL_PACE_PER_MINUTE = { oneDieTwoPlayers: 3, otherwise: 2 } as const;

/** A lesson's mode as far as the pace needs it. */
export interface PaceMode {
  dicePerPlayer: number;
  players: number;
}

/** Rolls one group makes in a minute at the common-practice pace for the mode. */
export function rollsPerMinute(mode: PaceMode): number {
  return mode.dicePerPlayer === 1 && mode.players === 2 ? ROLL_PACE_PER_MINUTE.oneDieTwoPlayers : ROLL_PACE_PER_MINUTE.otherwise;
}

/** The time budget of rolling: minutes of the Roll phase, the pace, and the rolls one group makes in them. */
export interface RollPhaseBudget {
  minutes: number;
  rollsPerMinute: number;
  /** Rolls one group can make in the Roll phase: minutes × pace, rounded down. */
  rollsPerGroup: number;
}

/** The rolls one group makes in a Roll phase of `minutes` at the mode's pace; null without a Roll phase that has minutes. */
export function rollPhaseBudget(minutes: number | null, mode: PaceMode): RollPhaseBudget | null {
  if (minutes === null || minutes <= 0) return null;
  const pace = rollsPerMinute(mode);
  return { minutes, rollsPerMinute: pace, rollsPerGroup: Math.floor(minutes * pace) };
}

/** Minutes of the included Roll phase of a plan's phases, or null when the lesson has no Roll phase. */
export function rollPhaseMinutes(phases: readonly { phase: string; included: boolean; minutes: number }[]): number | null {
  const roll = phases.find((entry) => entry.phase === "Roll");
  return roll && roll.included ? roll.minutes : null;
}

/** "about 3 rolls a minute (common practice)" for sentences. */
export function paceText(budget: RollPhaseBudget): string {
  return `about ${budget.rollsPerMinute} rolls a minute (a common-practice pace, not a published rule)`;
}

/** Whether a class has time for a matchup's pooled rolls in the Roll phase, and what would make room if not. */
export type ClassTimePlan =
  | { kind: "fits"; perGroup: number }
  | { kind: "more-groups"; perGroup: number; groupsNeeded: number }
  | { kind: "too-close"; perGroup: number; mostRolls: number };

/**
 * For `pooledRolls` shared over `groups`, each making `budget.rollsPerGroup` in the Roll phase: fits; or the groups
 * that would make them (at most `groupsMax`); or too close for one lesson, with the most rolls `groupsMax` groups make.
 */
export function classTimePlan(pooledRolls: number, groups: number, budget: RollPhaseBudget, groupsMax: number): ClassTimePlan {
  const perGroup = Math.ceil(pooledRolls / groups);
  if (perGroup <= budget.rollsPerGroup) return { kind: "fits", perGroup };
  const groupsNeeded = budget.rollsPerGroup === 0 ? Infinity : Math.ceil(pooledRolls / budget.rollsPerGroup);
  if (groupsNeeded <= groupsMax) return { kind: "more-groups", perGroup, groupsNeeded };
  return { kind: "too-close", perGroup, mostRolls: groupsMax * budget.rollsPerGroup };
}
