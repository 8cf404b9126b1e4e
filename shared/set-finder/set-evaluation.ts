import type { PropertyTemplate } from "./property-templates";

/** Win counts between the dice at two positions: with one die each (out of f²) and with two dice each (out of f⁴). */
export interface PositionCounts {
  oneDie(winner: number, loser: number): number;
  twoDice(winner: number, loser: number): number;
}

/** The best way a set meets its property, or null: the template whose weakest needed win is largest. */
export interface TemplateMatch {
  /** Weakest needed win, in outcomes out of f⁴ (one-die counts scaled by f²). */
  strength: number;
  /** How far the weakest needed matchup is from even: (wins − losses) out of f⁴; positive exactly when every need is met. */
  margin: number;
  /** Total shortfall over the needed matchups, in outcomes out of f⁴: zero exactly when every need is met. */
  shortfall: number;
  secondCycle: number[] | null;
}

/**
 * Checks every template against the counts: a template holds when each needed winner wins more outcomes than it loses.
 * Answers the holding template with the largest strength, or, when none holds, the template with the least shortfall.
 */
export function matchTemplates(
  templates: readonly PropertyTemplate[],
  facesPerDie: number,
  counts: PositionCounts,
): TemplateMatch & { holds: boolean } {
  const scale = facesPerDie * facesPerDie;
  let best: (TemplateMatch & { holds: boolean }) | null = null;
  for (const template of templates) {
    let strength = Number.POSITIVE_INFINITY;
    let margin = Number.POSITIVE_INFINITY;
    let shortfall = 0;
    for (const need of template.requirements) {
      const wins = need.dicePerPlayer === 1 ? counts.oneDie(need.winner, need.loser) * scale : counts.twoDice(need.winner, need.loser);
      const losses = need.dicePerPlayer === 1 ? counts.oneDie(need.loser, need.winner) * scale : counts.twoDice(need.loser, need.winner);
      if (wins < strength) strength = wins;
      if (wins - losses < margin) margin = wins - losses;
      if (wins <= losses) shortfall += losses - wins + (need.dicePerPlayer === 1 ? scale : 1);
    }
    const holds = margin > 0;
    const better =
      best === null || (holds && !best.holds) || (holds === best.holds && (holds ? strength > best.strength : shortfall < best.shortfall));
    if (better) best = { strength, margin, shortfall, secondCycle: template.secondCycle, holds };
  }
  return best!;
}
