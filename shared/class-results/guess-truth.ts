import { compareDice, fractionToDecimal, fractionToString, type TieRule, winProbabilityUnderTieRule } from "../probability/index";

/** For one die: the die that beats it most strongly (if any), with the exact chance under the tie rule. */
export type DieVerdict = {
  dieIndex: number;
  name: string;
  /** The strongest counter: the die with the highest chance of beating this one, or null when no die beats it. */
  beatenBy: { dieIndex: number; name: string; fraction: string; decimal: string } | null;
};

/** What the Guess votes are compared with: each die's strongest counter, and the best die if one beats every other. */
export type GuessTruth = { verdicts: DieVerdict[]; bestDieIndex: number | null };

/**
 * The truth behind "which die is best?": for every die, the other die with the highest exact chance (compareDice and
 * the tie rule) of beating it, where that chance is above 1/2. An intransitive set has a counter for every die.
 */
export function guessTruth(dice: { name: string; faces: number[] }[], tieRule: TieRule, dicePerPlayer = 1): GuessTruth {
  const verdicts = dice.map((die, dieIndex) => {
    let best: DieVerdict["beatenBy"] = null;
    let bestValue = 0.5;
    dice.forEach((other, otherIndex) => {
      if (otherIndex === dieIndex) return;
      const chance = winProbabilityUnderTieRule(compareDice(other.faces, die.faces, { dicePerPlayer }), tieRule);
      if (chance === null) return;
      const value = chance.valueOf();
      if (value > bestValue) {
        bestValue = value;
        best = { dieIndex: otherIndex, name: other.name, fraction: fractionToString(chance), decimal: fractionToDecimal(chance, 3) };
      }
    });
    return { dieIndex, name: die.name, beatenBy: best };
  });
  const unbeaten = verdicts.filter((verdict) => verdict.beatenBy === null);
  const bestDieIndex =
    unbeaten.length === 1 &&
    dice.every((other, otherIndex) => {
      if (otherIndex === unbeaten[0].dieIndex) return true;
      const chance = winProbabilityUnderTieRule(compareDice(dice[unbeaten[0].dieIndex].faces, other.faces, { dicePerPlayer }), tieRule);
      return chance !== null && chance.valueOf() > 0.5;
    })
      ? unbeaten[0].dieIndex
      : null;
  return { verdicts, bestDieIndex };
}
