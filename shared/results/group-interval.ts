import { wilsonInterval, wilsonIntervalFromProportion, type ProportionInterval, type TieRule } from "../probability/index";
import type { PooledGroup } from "../class-results/pooled-results";

/**
 * The Wilson 95% score interval (Wilson 1927) around one group's relative frequency under the tie rule, counted the
 * way poolRolls counts a matchup: decided rolls for "re-roll ties", every roll otherwise; null when no roll counts.
 */
export function groupInterval(group: PooledGroup, tieRule: TieRule): ProportionInterval | null {
  const first = group.seats[0];
  if (tieRule === "re-roll-ties") return group.decidedRolls === 0 ? null : wilsonInterval(first.wins, group.decidedRolls);
  if (group.rolls === 0 || group.frequencyUnderTieRule === null) return null;
  if (tieRule === "ties-score-half") return wilsonIntervalFromProportion(group.frequencyUnderTieRule, group.rolls);
  return wilsonInterval(first.wins, group.rolls);
}
