import Fraction from "fraction.js";
import {
  binomialTestPValue,
  countsBelow,
  criticalValueForConfidence,
  fractionToDecimal,
  fractionToNumber,
  fractionToString,
  logGamma,
  multiPlayerMatchup,
  sumCountDistribution,
  type ProportionInterval,
  type TieRule,
  wilsonInterval,
  wilsonIntervalFromProportion,
} from "../probability/index";

/** Where a roll came from: a group's phone, the virtual class (seeded simulation) or a Paper import. */
export type RollSource = "phone" | "simulated" | "paper";

/** One stored roll, as much of it as pooling needs. */
export interface PoolableRoll {
  groupId: string;
  groupNickname?: string;
  tally: number;
  dicePerPlayer: number;
  /** Die indexes (into `dice`), one per seat, in the order the group recorded them. */
  matchup: number[];
  /** Each seat's total (the sum of its dicePerPlayer faces), in the same seat order as `matchup`. */
  totals: number[];
  /** Seat with the highest total, null when the highest total is shared; pooling re-derives it from `totals`. */
  winnerSeat: number | null;
  source: RollSource;
  /** ISO timestamp; the convergence series follows this order. */
  recordedAt: string;
}

/**
 * One group's win/tie/loss counts for one two-player matchup, entered as counts (the tally grid's quick mode) with no
 * rolls behind them: they count in every tally, frequency, interval and test, and never in the convergence series.
 */
export interface PoolableCounts {
  groupId: string;
  groupNickname?: string;
  tally: number;
  dicePerPlayer: number;
  /** The two die indexes (into `dice`), in the order the counts are given. */
  matchup: number[];
  firstWins: number;
  ties: number;
  secondWins: number;
  source: RollSource;
}

/** An exact probability for display: the fraction "a/b", a 3-place decimal string and the nearest double. */
export interface ExactValue {
  fraction: string;
  decimal: string;
  value: number;
}

/** One seat's counts: wins = the highest total outright, ties = sharing the highest total, losses = the rest. */
export interface SeatCounts {
  seat: number;
  dieIndex: number;
  dieName: string;
  wins: number;
  ties: number;
  losses: number;
}

/** One point of the convergence chart: after `rolls` rolls, the running frequency and the 95% band around the exact value. */
export interface ConvergencePoint {
  rolls: number;
  /** The first seat's running relative frequency under the tie rule; null while no roll counts (only ties, re-roll-ties). */
  frequency: number | null;
  /** The band exact ± z·σ/√m in which the running frequency falls about 95% of the time for fair dice; null with m = 0. */
  bandLower: number | null;
  bandUpper: number | null;
}

/** Exact probabilities of one matchup from the first seat's side. */
export interface MatchupExact {
  /** P(the first seat's total is the highest outright). */
  win: ExactValue;
  /** P(the first seat shares the highest total with another seat). */
  tie: ExactValue;
  /** P(another seat is strictly higher than the first seat). */
  loss: ExactValue;
  /** P(the highest total is shared by any seats): the chance a roll is re-rolled under "re-roll ties". */
  sharedHighest: ExactValue;
  /** The first seat's winning chance under the tie rule; null when every roll ties under "re-roll ties". */
  underTieRule: ExactValue | null;
  /** Each seat's exact chance of the highest total outright. */
  seatWins: ExactValue[];
  /** Each seat's exact share under the tie rule (`underTieRule` for the first seat); null when every roll ties under "re-roll ties". */
  seatsUnderTieRule: (ExactValue | null)[];
}

/** The class's pooled results for one matchup (one ordered set of dice and one number of dice each). */
export interface PooledMatchup {
  /** `${dicePerPlayer}:${matchup.join("-")}`, e.g. "1:0-2". */
  key: string;
  /** Die indexes in ascending order; rolls recorded in another seat order are pooled here with their seats reordered. */
  matchup: number[];
  /** Dice names joined by " v ", e.g. "Puffin v Gannet". */
  label: string;
  dicePerPlayer: number;
  players: number;
  rolls: number;
  /** Of `rolls`, those entered as win/tie/loss counts rather than roll by roll; the convergence series leaves them out. */
  countedRolls: number;
  /** Rolls with one outright highest total (the rolls that count under "re-roll ties"). */
  decidedRolls: number;
  seats: SeatCounts[];
  /** The first seat's outright wins / rolls. */
  frequency: number;
  /** The first seat's relative frequency under the tie rule (see `scoreUnderTieRule`); null when no roll counts yet. */
  frequencyUnderTieRule: number | null;
  exact: MatchupExact;
  /** Wilson 95% score interval around `frequencyUnderTieRule`; null when no roll counts yet. */
  interval: ProportionInterval | null;
  /**
   * Running frequency after each roll recorded one by one (counts have no order), in recordedAt order, evenly downsampled to at most
   * CONVERGENCE_POINTS_MAX points (the last roll always kept).
   */
  convergence: ConvergencePoint[];
}

/** How a group's results were tested against the exact probability. */
export type PlausibilityMethod = "exact binomial test (whole numbers)" | "exact binomial test (floating point)";

/** One group's results for one matchup, with a plausibility check of its recording. */
export interface PooledGroup {
  groupId: string;
  groupNickname: string | null;
  matchupKey: string;
  matchup: number[];
  label: string;
  dicePerPlayer: number;
  players: number;
  rolls: number;
  /** Of `rolls`, those entered as win/tie/loss counts. */
  countedRolls: number;
  decidedRolls: number;
  seats: SeatCounts[];
  sources: RollSource[];
  frequency: number;
  frequencyUnderTieRule: number | null;
  /**
   * Two-sided binomial test (R's binom.test rule) of the first seat's outright wins among all the group's rolls of this
   * matchup against the exact P(first seat wins outright); `implausible` when p < IMPLAUSIBLE_P_VALUE.
   */
  test: {
    method: PlausibilityMethod;
    successes: number;
    trials: number;
    nullProbability: ExactValue;
    pValue: number;
    implausible: boolean;
  };
}

/** Everything the Run board, exports and the class report show about a set of rolls. */
export interface PooledResults {
  tieRule: TieRule;
  matchups: PooledMatchup[];
  groups: PooledGroup[];
  totals: {
    rolls: number;
    /** Of `rolls`, those entered as win/tie/loss counts. */
    countedRolls: number;
    bySource: Record<RollSource, number>;
    /** Distinct groups with at least one roll. */
    groups: number;
    matchups: number;
    implausibleGroups: number;
  };
}

/** A group's result is flagged when its binomial test gives p below this (1%, common practice for a stricter flag than 5%). */
export const IMPLAUSIBLE_P_VALUE = 0.01;
/** Most points a convergence series keeps, so a chart stays light after thousands of rolls. */
export const CONVERGENCE_POINTS_MAX = 200;
/** Above this many trials × denominator bits, the binomial test sums in floating point (the whole-number sum grows too slow). */
const WHOLE_NUMBER_TEST_BUDGET = 6_000;

interface ExactFractions {
  seatWins: Fraction[];
  firstTie: Fraction;
  /** Each seat's chance of sharing the highest total with another seat (`firstTie` is the first). */
  seatTies: Fraction[];
  sharedHighest: Fraction;
}

/** A roll's score for the first seat under a tie rule; null when the roll does not count (a tie under "re-roll ties"). */
export function scoreUnderTieRule(totals: readonly number[], tieRule: TieRule): number | null {
  const code = firstSeatCode(totals);
  const first = code & 3;
  if (tieRule === "re-roll-ties") return code & SHARED_TOP ? null : first === FIRST_WIN ? 1 : 0;
  if (tieRule === "ties-score-half") return first === FIRST_WIN ? 1 : first === FIRST_TIE ? 0.5 : 0;
  return first === FIRST_WIN ? 1 : 0;
}

/**
 * Exact outcome probabilities of dice `faces` (one list per seat), each seat summing `dicePerPlayer` dice: each seat's chance
 * of the highest total outright (the engine's multiPlayerMatchup) and the first seat's chance of sharing the top,
 * Σₓ P(X = x)·[∏ P(Yᵢ ≤ x) − ∏ P(Yᵢ < x)] over the other seats (distribution of the maximum).
 */
function exactFractions(faces: number[][], dicePerPlayer: number): ExactFractions {
  const outcome = multiPlayerMatchup(faces, { dicePerPlayer });
  const distributions = faces.map((die) => sumCountDistribution(die, dicePerPlayer));
  const total = distributions.reduce((product, distribution) => product * distribution.total, 1n);
  const seatTies = distributions.map((own, seat) => {
    const sweeps = distributions.filter((_, other) => other !== seat).map((other) => countsBelow(other, own.values));
    let shared = 0n;
    own.counts.forEach((ways, index) => {
      let atMost = ways;
      let below = ways;
      for (const sweep of sweeps) {
        atMost *= sweep.below[index] + sweep.equal[index];
        below *= sweep.below[index];
      }
      shared += atMost - below;
    });
    return new Fraction(shared, total);
  });
  return { seatWins: outcome.highestOutright, firstTie: seatTies[0], seatTies, sharedHighest: outcome.sharedHighest };
}

/** A seat's (the first by default) exact winning chance under a tie rule, the same rules as `scoreUnderTieRule`. */
function exactUnderTieRule(exact: ExactFractions, tieRule: TieRule, seat = 0): Fraction | null {
  const win = exact.seatWins[seat];
  if (tieRule === "ties-score-half") return win.add(exact.seatTies[seat].div(2));
  if (tieRule === "ties-score-nothing") return win;
  const decided = new Fraction(1).sub(exact.sharedHighest);
  return decided.equals(0) ? null : win.div(decided);
}

/** Variance of one roll's score under the tie rule, for the convergence band: E[S²] − E[S]², with S ∈ {0, ½, 1}. */
function scoreVariance(exact: ExactFractions, tieRule: TieRule, mean: Fraction): number {
  const p = fractionToNumber(mean);
  if (tieRule !== "ties-score-half") return p * (1 - p);
  return fractionToNumber(exact.seatWins[0].add(exact.firstTie.div(4))) - p * p;
}

/** An exact fraction for display. */
export function exactValue(value: Fraction): ExactValue {
  return { fraction: fractionToString(value), decimal: fractionToDecimal(value, 3), value: fractionToNumber(value) };
}

/**
 * Two-sided binomial p-value, R's binom.test rule (sum of P(X = k) over every k no more likely than the observed count):
 * exact in whole numbers through the engine's binomial test when that is quick, otherwise the same sum in floating point
 * with log-gamma terms and R's relative tolerance of 1 + 10⁻⁷.
 */
export function binomialPValue(successes: number, trials: number, probability: Fraction): { pValue: number; method: PlausibilityMethod } {
  const bits = probability.d.toString(2).length;
  if (trials * bits <= WHOLE_NUMBER_TEST_BUDGET) {
    return { pValue: binomialTestPValue(successes, trials, probability), method: "exact binomial test (whole numbers)" };
  }
  const p = fractionToNumber(probability);
  if (p === 0 || p === 1) {
    const certain = p === 0 ? 0 : trials;
    return { pValue: successes === certain ? 1 : 0, method: "exact binomial test (floating point)" };
  }
  const logCombinations = (k: number) => logGamma(trials + 1) - logGamma(k + 1) - logGamma(trials - k + 1);
  const logProbability = (k: number) => logCombinations(k) + k * Math.log(p) + (trials - k) * Math.log(1 - p);
  const observed = logProbability(successes);
  const threshold = observed + Math.log(1 + 1e-7);
  let total = 0;
  for (let k = 0; k <= trials; k += 1) {
    const term = logProbability(k);
    if (term <= threshold) total += Math.exp(term);
  }
  return { pValue: Math.min(1, total), method: "exact binomial test (floating point)" };
}

/** The indexes 1 … n (as roll counts) kept in a convergence series: every one up to the limit, else evenly spaced, ending at n. */
function convergenceRollCounts(rolls: number): number[] {
  if (rolls <= CONVERGENCE_POINTS_MAX) return Array.from({ length: rolls }, (_, index) => index + 1);
  const kept = new Set<number>();
  for (let step = 1; step <= CONVERGENCE_POINTS_MAX; step += 1) kept.add(Math.round((step * rolls) / CONVERGENCE_POINTS_MAX));
  return [...kept].filter((count) => count >= 1).sort((x, y) => x - y);
}

function emptySeats(matchup: number[], names: string[]): SeatCounts[] {
  return matchup.map((dieIndex, seat) => ({ seat, dieIndex, dieName: names[dieIndex], wins: 0, ties: 0, losses: 0 }));
}

/** Adds one roll to the seat counts without allocating (this runs for every roll on every board refresh); true when decided. */
function countInto(seats: SeatCounts[], totals: number[]): boolean {
  let highest = totals[0];
  for (let seat = 1; seat < totals.length; seat += 1) if (totals[seat] > highest) highest = totals[seat];
  let atTop = 0;
  for (let seat = 0; seat < totals.length; seat += 1) if (totals[seat] === highest) atTop += 1;
  for (let seat = 0; seat < totals.length; seat += 1) {
    if (totals[seat] < highest) seats[seat].losses += 1;
    else if (atTop === 1) seats[seat].wins += 1;
    else seats[seat].ties += 1;
  }
  return atTop === 1;
}

/** The first seat's relative frequency under the tie rule from its wins and ties; null when no roll counts yet. */
function runningFrequency(wins: number, ties: number, rolls: number, decided: number, tieRule: TieRule): number | null {
  if (tieRule === "re-roll-ties") return decided === 0 ? null : wins / decided;
  if (tieRule === "ties-score-half") return rolls === 0 ? null : (wins + ties / 2) / rolls;
  return rolls === 0 ? null : wins / rolls;
}

/** Any seat's relative frequency under the tie rule from its counts (the same rules as the first seat's); null when no roll counts yet. */
export function seatFrequencyUnderTieRule(
  seat: Pick<SeatCounts, "wins" | "ties">,
  rolls: number,
  decidedRolls: number,
  tieRule: TieRule,
): number | null {
  return runningFrequency(seat.wins, seat.ties, rolls, decidedRolls, tieRule);
}

function frequencyUnder(seats: SeatCounts[], rolls: number, decided: number, tieRule: TieRule): number | null {
  return runningFrequency(seats[0].wins, seats[0].ties, rolls, decided, tieRule);
}

/** First-seat outcome codes kept per roll for the convergence series: bit 0–1 the outcome, bit 2 a shared top total. */
const FIRST_LOSS = 0;
const FIRST_TIE = 1;
const FIRST_WIN = 2;
const SHARED_TOP = 4;

/** The first seat's outcome code of one roll (totals in the matchup's seat order). */
function firstSeatCode(totals: readonly number[]): number {
  let highest = totals[0];
  for (let seat = 1; seat < totals.length; seat += 1) if (totals[seat] > highest) highest = totals[seat];
  let atTop = 0;
  for (const total of totals) if (total === highest) atTop += 1;
  const first = totals[0] < highest ? FIRST_LOSS : atTop === 1 ? FIRST_WIN : FIRST_TIE;
  return first | (atTop > 1 ? SHARED_TOP : 0);
}

/** Running seat counts of one matchup (for the class, or for one group). */
interface SeatTally {
  key: string;
  matchup: number[];
  dicePerPlayer: number;
  seats: SeatCounts[];
  decided: number;
  rolls: number;
  counted: number;
}

/** Adds a two-player matchup's counts (first seat's wins, ties, second seat's wins, in the tally's seat order) into a tally. */
function countCounts(tally: SeatTally, firstWins: number, ties: number, secondWins: number) {
  const [first, second] = tally.seats;
  first.wins += firstWins;
  first.ties += ties;
  first.losses += secondWins;
  second.wins += secondWins;
  second.ties += ties;
  second.losses += firstWins;
  tally.decided += firstWins + secondWins;
  tally.rolls += firstWins + ties + secondWins;
  tally.counted += firstWins + ties + secondWins;
}

/** Counts one roll (totals in the tally's seat order) into a tally. */
function countRoll(tally: SeatTally, totals: number[]) {
  if (countInto(tally.seats, totals)) tally.decided += 1;
  tally.rolls += 1;
}

/** One matchup's running figures: seat counts, and per roll its time, arrival order and first-seat code for the convergence series. */
interface MatchupTally extends SeatTally {
  times: number[];
  arrivals: number[];
  codes: number[];
  /** False once a roll arrived with an earlier time than the last one: the series is re-sorted before it is read. */
  inOrder: boolean;
}

/** One group's running figures for one matchup. */
interface GroupTally extends SeatTally {
  groupId: string;
  nickname: string | null;
  sources: Set<RollSource>;
}

/**
 * A class's rolls pooled as they come: `add` counts each roll into its matchup and group in constant time (keeping
 * two numbers and a code per roll for the convergence series), and `result` reads the pooled figures at any moment,
 * the same as poolRolls over every roll added so far. The Run board adds only the new rolls on each refresh, and the
 * summary export adds rolls from a database cursor without holding them.
 */
export class RollPool {
  private readonly names: string[];
  private readonly z = criticalValueForConfidence(0.95);
  private readonly exactCache = new Map<string, ExactFractions>();
  private readonly matchups = new Map<string, MatchupTally>();
  private readonly groups = new Map<string, GroupTally>();
  // Keys are built once per distinct seat order, not once per roll.
  private readonly orderKeys = new Map<string, { key: string; seats: number[]; matchup: number[] }>();
  private readonly groupIds = new Set<string>();
  /** Each group's last binomial test by its counts: in a class most groups record nothing between two board refreshes. */
  private readonly tests = new Map<string, { wins: number; rolls: number; pValue: number; method: PlausibilityMethod }>();
  private readonly bySource: Record<RollSource, number> = { phone: 0, simulated: 0, paper: 0 };
  private count = 0;
  private counted = 0;

  private readonly series: boolean;

  /** With `series: false` no convergence series is kept (its result is empty), so memory stays flat however many rolls come. */
  constructor(
    private readonly dice: { name: string; faces: number[] }[],
    private readonly tieRule: TieRule,
    options: { series?: boolean } = {},
  ) {
    this.names = dice.map((die) => die.name);
    this.series = options.series ?? true;
  }

  /** How many rolls have been added. */
  get size(): number {
    return this.count;
  }

  /** Adds rolls (undone rolls must be left out); throws a RangeError, adding nothing of that roll, for a roll that does not fit the set. */
  add(rolls: Iterable<PoolableRoll>): this {
    for (const roll of rolls) this.addOne(roll);
    return this;
  }

  /** The pooled key and seat order of a matchup as recorded (seats sorted by die index). */
  private orderOf(dicePerPlayer: number, recordedMatchup: number[]) {
    const recorded = `${dicePerPlayer}:${recordedMatchup.join("-")}`;
    let known = this.orderKeys.get(recorded);
    if (!known) {
      if (recordedMatchup.length < 2) throw new RangeError("Each roll needs one total per seat of its matchup, and at least two seats.");
      if (recordedMatchup.some((index) => !Number.isInteger(index) || index < 0 || index >= this.dice.length)) {
        throw new RangeError(`A roll names a die that is not in the set (the set has ${this.dice.length} dice).`);
      }
      const seats = recordedMatchup
        .map((dieIndex, seat) => ({ dieIndex, seat }))
        .sort((x, y) => x.dieIndex - y.dieIndex || x.seat - y.seat);
      const matchup = seats.map((entry) => entry.dieIndex);
      known = { key: `${dicePerPlayer}:${matchup.join("-")}`, seats: seats.map((entry) => entry.seat), matchup };
      this.orderKeys.set(recorded, known);
    }
    return known;
  }

  private matchupTally(known: { key: string; matchup: number[] }, dicePerPlayer: number): MatchupTally {
    let ofMatchup = this.matchups.get(known.key);
    if (!ofMatchup) {
      ofMatchup = { ...this.emptyTally(known, dicePerPlayer), times: [], arrivals: [], codes: [], inOrder: true };
      this.matchups.set(known.key, ofMatchup);
    }
    return ofMatchup;
  }

  private groupTally(
    known: { key: string; matchup: number[] },
    entry: { groupId: string; groupNickname?: string; dicePerPlayer: number; source: RollSource },
  ): GroupTally {
    const groupKey = `${entry.groupId} ${known.key}`;
    let ofGroup = this.groups.get(groupKey);
    if (!ofGroup) {
      ofGroup = { ...this.emptyTally(known, entry.dicePerPlayer), groupId: entry.groupId, nickname: null, sources: new Set() };
      this.groups.set(groupKey, ofGroup);
    }
    ofGroup.sources.add(entry.source);
    if (ofGroup.nickname === null && entry.groupNickname) ofGroup.nickname = entry.groupNickname;
    return ofGroup;
  }

  /**
   * Adds a group's win/tie/loss counts of one two-player matchup, rolls nobody recorded one by one: they count in the
   * tallies, frequencies, intervals and tests, and add nothing to the convergence series. Throws a RangeError for
   * counts that are not whole numbers from 0 or a matchup that is not two dice of the set.
   */
  addCounts(entry: PoolableCounts): void {
    if (entry.matchup.length !== 2) throw new RangeError("Counts are for two-player matchups: two dice.");
    const numbers = [entry.firstWins, entry.ties, entry.secondWins];
    if (numbers.some((value) => !Number.isInteger(value) || value < 0)) throw new RangeError("Counts must be whole numbers from 0.");
    const known = this.orderOf(entry.dicePerPlayer, entry.matchup);
    const swapped = known.seats[0] === 1;
    const firstWins = swapped ? entry.secondWins : entry.firstWins;
    const secondWins = swapped ? entry.firstWins : entry.secondWins;
    const rolls = firstWins + entry.ties + secondWins;
    if (rolls === 0) return;
    countCounts(this.matchupTally(known, entry.dicePerPlayer), firstWins, entry.ties, secondWins);
    countCounts(this.groupTally(known, entry), firstWins, entry.ties, secondWins);
    this.groupIds.add(entry.groupId);
    this.bySource[entry.source] += rolls;
    this.count += rolls;
    this.counted += rolls;
  }

  addOne(roll: PoolableRoll): void {
    const known = this.orderOf(roll.dicePerPlayer, roll.matchup);
    if (roll.totals.length !== known.seats.length)
      throw new RangeError("Each roll needs one total per seat of its matchup, and at least two seats.");
    const totals = known.seats.map((seat) => roll.totals[seat]);

    const ofMatchup = this.matchupTally(known, roll.dicePerPlayer);
    countRoll(ofMatchup, totals);
    if (this.series) {
      const time = Date.parse(roll.recordedAt);
      if (ofMatchup.times.length > 0 && time < ofMatchup.times[ofMatchup.times.length - 1]) ofMatchup.inOrder = false;
      ofMatchup.times.push(time);
      ofMatchup.arrivals.push(this.count);
      ofMatchup.codes.push(firstSeatCode(totals));
    }

    countRoll(this.groupTally(known, roll), totals);

    this.groupIds.add(roll.groupId);
    this.bySource[roll.source] += 1;
    this.count += 1;
  }

  /** The pooled figures of every roll added so far; `nicknames` (group id → nickname) overrides those the rolls carried. */
  result(nicknames?: Record<string, string>): PooledResults {
    const matchups = [...this.matchups.values()].map((tally) => this.matchupResult(tally));
    matchups.sort(
      (x, y) => x.dicePerPlayer - y.dicePerPlayer || x.players - y.players || x.key.localeCompare(y.key, "en", { numeric: true }),
    );
    const groups = [...this.groups.values()].map((tally) => this.groupResult(tally, nicknames?.[tally.groupId] ?? tally.nickname));
    groups.sort(
      (x, y) => (x.groupNickname ?? x.groupId).localeCompare(y.groupNickname ?? y.groupId) || x.matchupKey.localeCompare(y.matchupKey),
    );
    return {
      tieRule: this.tieRule,
      matchups,
      groups,
      totals: {
        rolls: this.count,
        countedRolls: this.counted,
        bySource: { ...this.bySource },
        groups: this.groupIds.size,
        matchups: matchups.length,
        implausibleGroups: new Set(groups.filter((group) => group.test.implausible).map((group) => group.groupId)).size,
      },
    };
  }

  private emptyTally(known: { key: string; matchup: number[] }, dicePerPlayer: number): SeatTally {
    return {
      key: known.key,
      matchup: known.matchup,
      dicePerPlayer,
      seats: emptySeats(known.matchup, this.names),
      decided: 0,
      rolls: 0,
      counted: 0,
    };
  }

  private exactFor(key: string, matchup: number[], dicePerPlayer: number): ExactFractions {
    let exact = this.exactCache.get(key);
    if (!exact)
      this.exactCache.set(
        key,
        (exact = exactFractions(
          matchup.map((index) => this.dice[index].faces),
          dicePerPlayer,
        )),
      );
    return exact;
  }

  /** Puts a matchup's series back in recorded order (ties in arrival order) after a roll arrived out of order. */
  private sortSeries(tally: MatchupTally) {
    const order = tally.times
      .map((_, index) => index)
      .sort((x, y) => tally.times[x] - tally.times[y] || tally.arrivals[x] - tally.arrivals[y]);
    tally.times = order.map((index) => tally.times[index]);
    tally.arrivals = order.map((index) => tally.arrivals[index]);
    tally.codes = order.map((index) => tally.codes[index]);
    tally.inOrder = true;
  }

  private matchupResult(tally: MatchupTally): PooledMatchup {
    const { tieRule, z } = this;
    const { key, matchup, dicePerPlayer, seats, decided, rolls } = tally;
    if (!tally.inOrder) this.sortSeries(tally);
    const exact = this.exactFor(key, matchup, dicePerPlayer);
    const underTieRule = exactUnderTieRule(exact, tieRule);
    const sigma = underTieRule === null ? 0 : Math.sqrt(Math.max(0, scoreVariance(exact, tieRule, underTieRule)));
    const centre = underTieRule === null ? null : fractionToNumber(underTieRule);
    // Only rolls recorded one by one have an order; counts never enter the series.
    const recordedRolls = tally.codes.length;
    const kept = this.series ? convergenceRollCounts(recordedRolls) : [];
    const convergence: ConvergencePoint[] = [];
    // The running first-seat figures, replayed from the codes in recorded order.
    let wins = 0;
    let ties = 0;
    let decidedSoFar = 0;
    let next = 0;
    for (let index = 0; index < recordedRolls && next < kept.length; index += 1) {
      const code = tally.codes[index];
      const first = code & 3;
      if (first === FIRST_WIN) wins += 1;
      else if (first === FIRST_TIE) ties += 1;
      if ((code & SHARED_TOP) === 0) decidedSoFar += 1;
      const count = index + 1;
      if (count !== kept[next]) continue;
      next += 1;
      const counted = tieRule === "re-roll-ties" ? decidedSoFar : count;
      const half = centre === null || counted === 0 ? null : (z * sigma) / Math.sqrt(counted);
      convergence.push({
        rolls: count,
        frequency: runningFrequency(wins, ties, count, decidedSoFar, tieRule),
        bandLower: half === null || centre === null ? null : Math.max(0, centre - half),
        bandUpper: half === null || centre === null ? null : Math.min(1, centre + half),
      });
    }
    const frequencyUnderTieRule = frequencyUnder(seats, rolls, decided, tieRule);
    const interval =
      frequencyUnderTieRule === null
        ? null
        : tieRule === "re-roll-ties"
          ? wilsonInterval(seats[0].wins, decided)
          : tieRule === "ties-score-half"
            ? wilsonIntervalFromProportion(frequencyUnderTieRule, rolls)
            : wilsonInterval(seats[0].wins, rolls);
    const tie = exact.firstTie;
    return {
      key,
      matchup,
      label: matchup.map((index) => this.names[index]).join(" v "),
      dicePerPlayer,
      players: matchup.length,
      rolls,
      countedRolls: tally.counted,
      decidedRolls: decided,
      seats: seats.map((seat) => ({ ...seat })),
      frequency: seats[0].wins / rolls,
      frequencyUnderTieRule,
      exact: {
        win: exactValue(exact.seatWins[0]),
        tie: exactValue(tie),
        loss: exactValue(new Fraction(1).sub(exact.seatWins[0]).sub(tie)),
        sharedHighest: exactValue(exact.sharedHighest),
        underTieRule: underTieRule === null ? null : exactValue(underTieRule),
        seatWins: exact.seatWins.map(exactValue),
        seatsUnderTieRule: exact.seatWins.map((_, seat) => {
          const value = exactUnderTieRule(exact, tieRule, seat);
          return value === null ? null : exactValue(value);
        }),
      },
      interval,
      convergence,
    };
  }

  private groupResult(tally: GroupTally, nickname: string | null): PooledGroup {
    const { key, matchup, dicePerPlayer, seats, decided, rolls } = tally;
    const exact = this.exactFor(key, matchup, dicePerPlayer);
    const testKey = `${tally.groupId} ${key}`;
    let tested = this.tests.get(testKey);
    if (!tested || tested.wins !== seats[0].wins || tested.rolls !== rolls) {
      tested = { wins: seats[0].wins, rolls, ...binomialPValue(seats[0].wins, rolls, exact.seatWins[0]) };
      this.tests.set(testKey, tested);
    }
    const { pValue, method } = tested;
    return {
      groupId: tally.groupId,
      groupNickname: nickname,
      matchupKey: key,
      matchup,
      label: matchup.map((index) => this.names[index]).join(" v "),
      dicePerPlayer,
      players: matchup.length,
      rolls,
      countedRolls: tally.counted,
      decidedRolls: decided,
      seats: seats.map((seat) => ({ ...seat })),
      sources: [...tally.sources],
      frequency: seats[0].wins / rolls,
      frequencyUnderTieRule: frequencyUnder(seats, rolls, decided, this.tieRule),
      test: {
        method,
        successes: seats[0].wins,
        trials: rolls,
        nullProbability: exactValue(exact.seatWins[0]),
        pValue,
        implausible: pValue < IMPLAUSIBLE_P_VALUE,
      },
    };
  }
}

/**
 * Pools a class's rolls per matchup against the exact probabilities from the engine: counts per seat, the first seat's
 * relative frequency (raw and under the tie rule) beside the exact fraction, a Wilson 95% interval, a downsampled
 * convergence series with its 95% band, and per group an exact two-sided binomial test flagging implausible recording.
 * Rolls of the same dice in another seat order pool together, seats reordered by ascending die index.
 * Callers choose the rolls (one tally, with or without simulated rolls); undone rolls must be left out.
 * The same as adding every roll to a RollPool and reading its result.
 */
export function poolRolls(input: {
  dice: { name: string; faces: number[] }[];
  tieRule: TieRule;
  rolls: Iterable<PoolableRoll>;
}): PooledResults {
  return new RollPool(input.dice, input.tieRule).add(input.rolls).result();
}
