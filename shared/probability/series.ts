import Fraction from "fraction.js";
import { InvalidDieError } from "./die";
import { compareDice, type MatchupResult } from "./matchup";
import type { TieRule } from "./tie-rule";

/** Most games in a series. */
export const SERIES_GAMES_MAX = 101;

/** Exact outcome of a series from the first player's side; `draw` is 0 under re-roll-ties. */
export interface SeriesOutcome {
  win: Fraction;
  draw: Fraction;
  loss: Fraction;
}

/** Writes win, tie and loss over one common denominator: whole-number weights summing to `total`. */
function matchupWeights(result: MatchupResult): { win: bigint; tie: bigint; loss: bigint; total: bigint } {
  const gcd = (x: bigint, y: bigint): bigint => (y === 0n ? x : gcd(y, x % y));
  const lcm = (x: bigint, y: bigint): bigint => (x / gcd(x, y)) * y;
  const total = lcm(lcm(result.win.d, result.tie.d), result.loss.d);
  const scale = (part: Fraction): bigint => part.n * (total / part.d);
  return { win: scale(result.win), tie: scale(result.tie), loss: scale(result.loss), total };
}

/** Powers base^0 … base^top as BigInt. */
function powers(base: bigint, top: number): bigint[] {
  const list = [1n];
  for (let exponent = 1; exponent <= top; exponent += 1) list.push(list[exponent - 1] * base);
  return list;
}

/** Pascal's triangle rows 0 … top as BigInt binomial coefficients. */
function binomialRows(top: number): bigint[][] {
  const rows: bigint[][] = [[1n]];
  for (let n = 1; n <= top; n += 1) {
    const previous = rows[n - 1];
    rows.push(Array.from({ length: n + 1 }, (_, k) => (k === 0 || k === n ? 1n : previous[k - 1] + previous[k])));
  }
  return rows;
}

/**
 * Exact outcome of a best-of-N series (N odd, 1 to 101) of a matchup, by binomial / trinomial sums.
 * re-roll-ties: tied rolls are replayed, so the series is N decided rolls and the first player wins it with more than N/2
 * of them (binomial with p = win / (win + loss)); throws when every roll ties.
 * ties-score-half and ties-score-nothing: exactly N rolls; the player with more points wins, equal points is a drawn series.
 * A tie gives both players the same points under either rule, so both rules give the same series outcome (more wins than losses).
 */
export function seriesOutcome(result: MatchupResult, games: number, tieRule: TieRule): SeriesOutcome {
  if (!Number.isInteger(games) || games < 1 || games > SERIES_GAMES_MAX || games % 2 === 0) {
    throw new InvalidDieError([`A best-of-N series needs an odd number of games from 1 to ${SERIES_GAMES_MAX}.`]);
  }
  const weights = matchupWeights(result);
  const rows = binomialRows(games);
  if (tieRule === "re-roll-ties") {
    const decided = weights.win + weights.loss;
    if (decided === 0n) throw new RangeError("Every roll ties, so a re-roll-ties series never ends.");
    const winPowers = powers(weights.win, games);
    const lossPowers = powers(weights.loss, games);
    let winWays = 0n;
    for (let wins = (games + 1) / 2; wins <= games; wins += 1) winWays += rows[games][wins] * winPowers[wins] * lossPowers[games - wins];
    const win = new Fraction(winWays, decided ** BigInt(games));
    return { win, draw: new Fraction(0), loss: new Fraction(1).sub(win) };
  }
  const winPowers = powers(weights.win, games);
  const lossPowers = powers(weights.loss, games);
  const tiePowers = powers(weights.tie, games);
  let winWays = 0n;
  let drawWays = 0n;
  // Group by the number of decided rolls m: C(N, m)·tie^(N−m) times a binomial split of the m into wins and losses.
  for (let decidedRolls = 0; decidedRolls <= games; decidedRolls += 1) {
    const outer = rows[games][decidedRolls] * tiePowers[games - decidedRolls];
    let inner = 0n;
    for (let wins = Math.floor(decidedRolls / 2) + 1; wins <= decidedRolls; wins += 1) {
      inner += rows[decidedRolls][wins] * winPowers[wins] * lossPowers[decidedRolls - wins];
    }
    winWays += outer * inner;
    if (decidedRolls % 2 === 0) {
      const half = decidedRolls / 2;
      drawWays += outer * rows[decidedRolls][half] * winPowers[half] * lossPowers[half];
    }
  }
  const denominator = weights.total ** BigInt(games);
  const win = new Fraction(winWays, denominator);
  const draw = new Fraction(drawWays, denominator);
  return { win, draw, loss: new Fraction(1).sub(win).sub(draw) };
}

/** Exact best-of-N series outcome for die `a` against die `b` (see `seriesOutcome` for how ties work). */
export function seriesOutcomeForDice(
  a: number[],
  b: number[],
  options: { games: number; tieRule: TieRule; dicePerPlayer?: number },
): SeriesOutcome {
  return seriesOutcome(compareDice(a, b, { dicePerPlayer: options.dicePerPlayer }), options.games, options.tieRule);
}

/** Expected number of wins for the first player in `rolls` rolls: rolls × P(win) (linearity of expectation). */
export function expectedWins(result: MatchupResult, rolls: number): Fraction {
  return result.win.mul(rolls);
}

/**
 * Expected points for the first player in `rolls` counted rolls under a tie rule (linearity of expectation):
 * re-roll-ties counts only decided rolls, rolls × win/(win+loss), null when every roll ties;
 * ties-score-half rolls × (win + tie/2); ties-score-nothing rolls × win.
 */
export function expectedPoints(result: MatchupResult, rolls: number, tieRule: TieRule): Fraction | null {
  if (tieRule === "ties-score-half") return result.win.add(result.tie.div(2)).mul(rolls);
  if (tieRule === "ties-score-nothing") return result.win.mul(rolls);
  const decided = result.win.add(result.loss);
  return decided.equals(0) ? null : result.win.div(decided).mul(rolls);
}
