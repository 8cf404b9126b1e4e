import Fraction from "fraction.js";
import type { MatchupResult } from "./matchup";

/** The glossary's tie rules: re-roll ties, ties score half, ties score nothing. */
export type TieRule = "re-roll-ties" | "ties-score-half" | "ties-score-nothing";

/** Every tie rule, in glossary order. */
export const TIE_RULES: readonly TieRule[] = ["re-roll-ties", "ties-score-half", "ties-score-nothing"];

/**
 * The first player's winning chance under a tie rule:
 * re-roll-ties → P(win | no tie) = win / (win + loss), null when every roll ties (a re-roll never ends);
 * ties-score-half → expected score win + tie/2; ties-score-nothing → win.
 */
export function winProbabilityUnderTieRule(result: MatchupResult, rule: TieRule): Fraction | null {
  if (rule === "ties-score-half") return result.win.add(result.tie.div(2));
  if (rule === "ties-score-nothing") return result.win;
  const decided = result.win.add(result.loss);
  return decided.equals(0) ? null : result.win.div(decided);
}

/** The first player's winning chance under each tie rule (see `winProbabilityUnderTieRule`). */
export function winProbabilitiesByTieRule(result: MatchupResult): Record<TieRule, Fraction | null> {
  return {
    "re-roll-ties": winProbabilityUnderTieRule(result, "re-roll-ties"),
    "ties-score-half": winProbabilityUnderTieRule(result, "ties-score-half"),
    "ties-score-nothing": winProbabilityUnderTieRule(result, "ties-score-nothing"),
  };
}
