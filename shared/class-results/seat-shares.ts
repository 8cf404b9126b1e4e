import { wilsonIntervalFromProportion, type ProportionInterval, type TieRule } from "../probability/index";
import { cycleMatchups } from "./assigned-matchups";
import { seatFrequencyUnderTieRule, type ExactValue, type PooledMatchup } from "./pooled-results";

/** One die's share of a pooled matchup under the tie rule, beside its one exact value. */
export interface SeatShare {
  /** The seat in the pooled matchup (ascending die index), whose counts this share reads. */
  seat: number;
  dieIndex: number;
  dieName: string;
  wins: number;
  ties: number;
  losses: number;
  /** The die's relative frequency under the tie rule; null while no roll counts. */
  share: number | null;
  /** The die's exact share under the same tie rule; null when every roll ties under "re-roll ties". */
  exact: ExactValue | null;
  /** Wilson 95% score interval around `share` over the rolls that count, as the pooled first seat's (`PooledMatchup.interval`); null while none counts. */
  interval: ProportionInterval | null;
}

/**
 * The order a matchup's dice are played in on the pads: the order most groups were given or chose (their matchups), else
 * the order the teacher's assignment cycle hands it out, else ascending die index. Answers die indexes.
 */
export function padDieOrder(
  matchup: readonly number[],
  playedMatchups: readonly (readonly number[] | null)[],
  diceCount: number,
): number[] {
  const sameDice = (order: readonly number[]) =>
    order.length === matchup.length && [...order].sort((x, y) => x - y).join("-") === [...matchup].sort((x, y) => x - y).join("-");
  const counts = new Map<string, { order: number[]; groups: number }>();
  for (const played of playedMatchups) {
    if (!played || !sameDice(played)) continue;
    const key = played.join("-");
    const known = counts.get(key) ?? { order: [...played], groups: 0 };
    known.groups += 1;
    counts.set(key, known);
  }
  const mostPlayed = [...counts.values()].sort((x, y) => y.groups - x.groups)[0];
  if (mostPlayed) return mostPlayed.order;
  if (diceCount >= matchup.length) {
    const cycled = cycleMatchups(diceCount, matchup.length).find(sameDice);
    if (cycled) return cycled;
  }
  return [...matchup];
}

/** Each die's share of a pooled matchup under the tie rule with its exact value, in the given die order (the pooled seat order by default). */
export function seatShares(entry: PooledMatchup, tieRule: TieRule, dieOrder: readonly number[] = entry.matchup): SeatShare[] {
  return dieOrder.map((dieIndex) => {
    const seat = entry.matchup.indexOf(dieIndex);
    if (seat < 0) throw new RangeError(`Die ${dieIndex} does not play in the matchup ${entry.label}.`);
    const counts = entry.seats[seat];
    const share = seatFrequencyUnderTieRule(counts, entry.rolls, entry.decidedRolls, tieRule);
    const counted = tieRule === "re-roll-ties" ? entry.decidedRolls : entry.rolls;
    return {
      seat,
      dieIndex,
      dieName: counts.dieName,
      wins: counts.wins,
      ties: counts.ties,
      losses: counts.losses,
      share,
      exact: entry.exact.seatsUnderTieRule[seat],
      interval: share === null || counted === 0 ? null : wilsonIntervalFromProportion(share, counted),
    };
  });
}

/** What a share counts under each tie rule, to follow "Puffin wins 0.450": the whole sentence says whose share it is. */
export const shareMeanings: Record<TieRule, { verb: string; of: string }> = {
  "re-roll-ties": { verb: "wins", of: "of the rolls that were not ties" },
  "ties-score-half": { verb: "scores", of: "per roll (a tie scores half)" },
  "ties-score-nothing": { verb: "wins", of: "of rolls" },
};

/** "Puffin wins 0.450 of rolls" (three decimal places), or "Puffin has no rolls that count yet". */
export function shareSentence(dieName: string, share: number | null, tieRule: TieRule): string {
  if (share === null) return `${dieName} has no rolls that count yet`;
  const meaning = shareMeanings[tieRule];
  return `${dieName} ${meaning.verb} ${share.toFixed(3)} ${meaning.of}`;
}

/**
 * A two-player matchup seen from the die in `seat`: seats reordered so that die comes first, its share under the tie rule,
 * exact value, interval and convergence series (1 − the first seat's, the band mirrored). Only where one die's share is the
 * other's complement: two players under "re-roll ties" or "ties score half"; otherwise (and for seat 0) the entry as it is.
 */
export function matchupFromSeat(entry: PooledMatchup, tieRule: TieRule, seat: number): PooledMatchup {
  if (seat === 0 || entry.players !== 2 || tieRule === "ties-score-nothing") return entry;
  const [shared] = seatShares(entry, tieRule, [entry.matchup[seat]]);
  const flip = (value: number | null) => (value === null ? null : 1 - value);
  return {
    ...entry,
    matchup: [entry.matchup[1], entry.matchup[0]],
    label: `${entry.seats[1].dieName} v ${entry.seats[0].dieName}`,
    seats: [entry.seats[1], entry.seats[0]],
    frequency: entry.rolls ? entry.seats[1].wins / entry.rolls : 0,
    frequencyUnderTieRule: shared.share,
    interval: shared.interval,
    exact: {
      ...entry.exact,
      win: entry.exact.seatWins[1],
      loss: entry.exact.seatWins[0],
      underTieRule: shared.exact,
      seatWins: [entry.exact.seatWins[1], entry.exact.seatWins[0]],
      seatsUnderTieRule: [entry.exact.seatsUnderTieRule[1], entry.exact.seatsUnderTieRule[0]],
    },
    convergence: entry.convergence.map((point) => ({
      rolls: point.rolls,
      frequency: flip(point.frequency),
      bandLower: flip(point.bandUpper),
      bandUpper: flip(point.bandLower),
    })),
  };
}
