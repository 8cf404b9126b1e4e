import Fraction from "fraction.js";
import { beatsGraph, type MatchupRelation, matchupRelation } from "./beats-graph";
import type { CountDistribution } from "./count-distribution";
import { diceSetChecked, type NamedDie } from "./dice-set";
import { dicePerPlayerChecked } from "./die";
import { type MatchupResult, matchupCountsFromDistributions, matchupResultFromCounts } from "./matchup";
import { type PickAdvice, pickAdviceForThreePlayers } from "./pick-advisor";
import { simpleCycles } from "./simple-cycles";
import { strongestHamiltonianCycle } from "./strongest-hamiltonian-cycle";
import { type TieRule, winProbabilitiesByTieRule } from "./tie-rule";
import { sumCountDistribution } from "./sum-distribution";

/** One cell of the matchup matrix: the row die against the column die. */
export interface MatchupEntry extends MatchupResult {
  relation: MatchupRelation;
  /** The row die's winning chance under each tie rule (re-roll-ties is null only when every roll ties). */
  byTieRule: Record<TieRule, Fraction | null>;
}

/** One edge of the beats graph. */
export interface BeatsEdge {
  winner: string;
  loser: string;
  winnerIndex: number;
  loserIndex: number;
  /** P(winner wins one roll). */
  win: Fraction;
  /** P(winner wins | no tie), the chance under re-roll-ties. */
  winReRollTies: Fraction;
}

/** One directed cycle of the beats graph: each die beats the next, and the last beats the first. */
export interface DiceCycle {
  dice: string[];
  indices: number[];
  /** The smallest P(win) along the cycle: the cycle's weakest link. */
  weakestWin: Fraction;
}

/** For one die, the die that beats it with the highest P(win), or null when no die beats it. */
export interface BestCounter {
  die: string;
  dieIndex: number;
  counter: string | null;
  counterIndex: number | null;
  /** P(counter wins one roll against the die), 0 when there is no counter. */
  win: Fraction;
  /** P(counter wins | no tie). */
  winReRollTies: Fraction | null;
}

/** The analysis of a dice set when every player rolls `dicePerPlayer` dice. */
export interface SetLevelAnalysis {
  dicePerPlayer: number;
  /** matrix[i][j]: die i against die j; null on the diagonal. */
  matrix: (MatchupEntry | null)[][];
  beats: BeatsEdge[];
  /** Every simple cycle of the beats graph (Johnson's algorithm), each starting from its earliest die. */
  cycles: DiceCycle[];
  /** False when the cycle list was cut at `cycleLimit`. */
  cyclesComplete: boolean;
  /** Cycles that visit every die once (among the listed cycles, so cut short with them). */
  hamiltonianCycles: DiceCycle[];
  /** The cycle through every die whose weakest link is strongest, found without listing cycles, so never cut short; null without one. */
  strongestHamiltonianCycle: DiceCycle | null;
  /** True when the beats graph has at least one cycle. */
  isIntransitive: boolean;
  /** True when every die is beaten by some other die: whichever die you pick, an opponent can do better. */
  everyDieIsBeaten: boolean;
  bestCounters: BestCounter[];
}

/** A matchup whose relation differs from the one-die-each relation. */
export interface MatchupReversal {
  first: string;
  second: string;
  firstIndex: number;
  secondIndex: number;
  fromDicePerPlayer: number;
  toDicePerPlayer: number;
  before: MatchupRelation;
  after: MatchupRelation;
  /** "reversed" when beats ↔ loses; "changed" when one side of the change is even. */
  kind: "reversed" | "changed";
}

/** What `analyzeSet` returns. */
export interface SetAnalysis {
  dice: NamedDie[];
  /** One analysis per dice-per-player count, ascending. */
  levels: SetLevelAnalysis[];
  /** Matchups whose relation changes from one die each to each other analysed count. */
  reversals: MatchupReversal[];
  /** Three players: for every pair of opponents' dice, the best pick and mode (1 or 2 dice each); empty for a 2-dice set. */
  pickAdvice: PickAdvice[];
  summary: {
    /** True when some analysed level has a cycle. */
    isIntransitive: boolean;
    /** Dice-per-player counts whose beats graph has a cycle. */
    intransitiveAt: number[];
    /** Dice-per-player counts at which every die is beaten. */
    everyDieIsBeatenAt: number[];
    /** Dice-per-player counts with a cycle through every die. */
    hamiltonianAt: number[];
    reversalCount: number;
  };
}

/**
 * Analyses a set of 2 to 10 dice exactly: the matchup matrix, the beats graph, every simple cycle
 * (Johnson's algorithm, 1975) and the Hamiltonian ones, best counters, reversals relative to one die each,
 * and three-player pick advice. Without `dicePerPlayer` it analyses 1, 2 and 3 dice each; with it, 1 and that count.
 * Sum distributions are convolved once per (die, count) and reused. `cycleLimit` (a whole number, at least 1) caps the cycle list;
 * the strongest cycle through every die is searched for separately (Held–Karp) and does not depend on it.
 */
export function analyzeSet(
  dice: { name: string; faces: number[] }[],
  options?: { dicePerPlayer?: number; cycleLimit?: number },
): SetAnalysis {
  const checked = diceSetChecked(dice);
  if (options?.cycleLimit !== undefined && (!Number.isInteger(options.cycleLimit) || options.cycleLimit < 1)) {
    throw new RangeError(`The cycle limit must be a whole number of at least 1 (got ${options.cycleLimit}).`);
  }
  const counts =
    options?.dicePerPlayer === undefined ? [1, 2, 3] : [...new Set([1, dicePerPlayerChecked(options.dicePerPlayer)])].sort((x, y) => x - y);
  const cache = new Map<string, CountDistribution>();
  const distributionOf = (index: number, dicePerPlayer: number): CountDistribution => {
    const key = `${index}:${dicePerPlayer}`;
    let distribution = cache.get(key);
    if (distribution === undefined) {
      distribution = sumCountDistribution(checked[index].faces, dicePerPlayer);
      cache.set(key, distribution);
    }
    return distribution;
  };
  const names = checked.map((die) => die.name);
  const levels = counts.map((dicePerPlayer) => setLevelAnalysis(names, dicePerPlayer, distributionOf, options?.cycleLimit));
  const reversals = levels.slice(1).flatMap((level) => matchupReversals(names, levels[0], level));
  const pickAdvice = pickAdviceForThreePlayers(names, distributionOf);
  return {
    dice: checked,
    levels,
    reversals,
    pickAdvice,
    summary: {
      isIntransitive: levels.some((level) => level.isIntransitive),
      intransitiveAt: levels.filter((level) => level.isIntransitive).map((level) => level.dicePerPlayer),
      everyDieIsBeatenAt: levels.filter((level) => level.everyDieIsBeaten).map((level) => level.dicePerPlayer),
      hamiltonianAt: levels.filter((level) => level.hamiltonianCycles.length > 0).map((level) => level.dicePerPlayer),
      reversalCount: reversals.length,
    },
  };
}

/** The matrix, beats graph, cycles and counters of a set at one dice-per-player count. */
function setLevelAnalysis(
  names: string[],
  dicePerPlayer: number,
  distributionOf: (index: number, dicePerPlayer: number) => CountDistribution,
  cycleLimit?: number,
): SetLevelAnalysis {
  const size = names.length;
  const matrix: (MatchupEntry | null)[][] = Array.from({ length: size }, () => new Array<MatchupEntry | null>(size).fill(null));
  for (let i = 0; i < size; i += 1) {
    for (let j = i + 1; j < size; j += 1) {
      const forward = matchupResultFromCounts(
        matchupCountsFromDistributions(distributionOf(i, dicePerPlayer), distributionOf(j, dicePerPlayer)),
      );
      const backward = { win: forward.loss, tie: forward.tie, loss: forward.win };
      matrix[i][j] = { ...forward, relation: matchupRelation(forward), byTieRule: winProbabilitiesByTieRule(forward) };
      matrix[j][i] = { ...backward, relation: matchupRelation(backward), byTieRule: winProbabilitiesByTieRule(backward) };
    }
  }
  const graph = beatsGraph(matrix);
  const beats: BeatsEdge[] = graph.flatMap((losers, winnerIndex) =>
    losers.map((loserIndex) => {
      const entry = matrix[winnerIndex][loserIndex]!;
      return {
        winner: names[winnerIndex],
        loser: names[loserIndex],
        winnerIndex,
        loserIndex,
        win: entry.win,
        winReRollTies: entry.byTieRule["re-roll-ties"]!,
      };
    }),
  );
  const found = simpleCycles(graph, cycleLimit);
  const cycles: DiceCycle[] = found.cycles.map((indices) => ({
    dice: indices.map((index) => names[index]),
    indices,
    weakestWin: indices
      .map((index, position) => matrix[index][indices[(position + 1) % indices.length]]!.win)
      .reduce((least, win) => (win.lt(least) ? win : least)),
  }));
  const strongest = strongestHamiltonianCycle(
    graph.map((losers, winner) => names.map((_name, loser) => (losers.includes(loser) ? matrix[winner][loser]!.win : null))),
  );
  const bestCounters: BestCounter[] = names.map((die, dieIndex) => {
    let counterIndex: number | null = null;
    for (let other = 0; other < size; other += 1) {
      const entry = matrix[other][dieIndex];
      if (entry === null || entry.relation !== "beats") continue;
      if (counterIndex === null || entry.win.gt(matrix[counterIndex][dieIndex]!.win)) counterIndex = other;
    }
    const entry = counterIndex === null ? null : matrix[counterIndex][dieIndex]!;
    return {
      die,
      dieIndex,
      counter: counterIndex === null ? null : names[counterIndex],
      counterIndex,
      win: entry === null ? new Fraction(0) : entry.win,
      winReRollTies: entry === null ? null : entry.byTieRule["re-roll-ties"],
    };
  });
  return {
    dicePerPlayer,
    matrix,
    beats,
    cycles,
    cyclesComplete: found.complete,
    hamiltonianCycles: cycles.filter((cycle) => cycle.indices.length === size),
    strongestHamiltonianCycle:
      strongest === null
        ? null
        : { dice: strongest.order.map((index) => names[index]), indices: strongest.order, weakestWin: strongest.weakest },
    isIntransitive: cycles.length > 0,
    everyDieIsBeaten: bestCounters.every((counter) => counter.counter !== null),
    bestCounters,
  };
}

/** Every pair whose relation at `later` differs from `base`, reported from the earlier die's side. */
function matchupReversals(names: string[], base: SetLevelAnalysis, later: SetLevelAnalysis): MatchupReversal[] {
  const reversals: MatchupReversal[] = [];
  for (let i = 0; i < names.length; i += 1) {
    for (let j = i + 1; j < names.length; j += 1) {
      const before = base.matrix[i][j]!.relation;
      const after = later.matrix[i][j]!.relation;
      if (before === after) continue;
      reversals.push({
        first: names[i],
        second: names[j],
        firstIndex: i,
        secondIndex: j,
        fromDicePerPlayer: base.dicePerPlayer,
        toDicePerPlayer: later.dicePerPlayer,
        before,
        after,
        kind: before !== "even" && after !== "even" ? "reversed" : "changed",
      });
    }
  }
  return reversals;
}
