import { tieRuleLabels } from "@shared/schemas/lessons";
import type { ResultsTally } from "@shared/schemas/results";
import { modeLabel } from "@/lib/probability-text";
import { formatCount, formatDate } from "@/lib/format";

/** A probability or frequency as three decimal places ("0.556"); a dash when there is none yet. */
export function three(value: number | null | undefined): string {
  return value === null || value === undefined ? "—" : value.toFixed(3);
}

/** A day as teachers write it, e.g. "12 Mar 2026". */
export function dayText(iso: string): string {
  return formatDate(iso);
}

/** The glossary's name of a tie rule ("Re-roll ties"), or the stored text when unknown. */
export function tieRuleText(rule: string): string {
  return (tieRuleLabels as Record<string, string>)[rule] ?? rule;
}

/** "two players" or "three players". */
export function playersText(players: number): string {
  return players === 3 ? "three players" : "two players";
}

/** "1 roll", "12 rolls". */
export function plural(count: number, one: string, many = `${one}s`): string {
  return formatCount(count, one, many);
}

const tieRulePhrases: Record<string, string> = {
  "re-roll-ties": "with ties re-rolled",
  "ties-score-half": "with a tie scoring half",
  "ties-score-nothing": "with a tie scoring nothing",
};

/** A tie rule as a phrase for sentences: "with ties re-rolled". */
export function tieRulePhrase(rule: string): string {
  return tieRulePhrases[rule] ?? `under the rule ${rule}`;
}

/** "one die each, two players". */
export function modeText(mode: Pick<ResultsTally, "dicePerPlayer" | "players">): string {
  return `${modeLabel(mode.dicePerPlayer)}, ${playersText(mode.players)}`;
}

/** A run by its main mode, with its Twist as a second tally: "one die each, two players · Twist: two dice each, two players". */
export function runModeText(run: Pick<ResultsTally, "dicePerPlayer" | "players"> & { twist: ResultsTally | null }): string {
  return run.twist ? `${modeText(run)} · Twist: ${modeText(run.twist)}` : modeText(run);
}

/** A tally by its part of the lesson: "Main tally: one die each, two players" or "Twist: two dice each, two players". */
export function tallyHeading(tally: ResultsTally): string {
  return `${tally.tally === 1 ? "Main tally" : "Twist"}: ${modeText(tally)}`;
}
