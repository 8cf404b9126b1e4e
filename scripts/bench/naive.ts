import Fraction from "fraction.js";

/** Outcome tallies of a naive enumeration; `complete` is false when the time budget ran out first. */
export interface NaiveTally {
  /** tallies[i]: joint outcomes where player i is strictly highest. */
  highest: number[];
  /** tallies[i][j]: joint outcomes where player i's total beats player j's. */
  pairwiseWins: number[][];
  outcomesDone: number;
  outcomesTotal: number;
  complete: boolean;
}

/**
 * Naive baseline: visits every joint outcome of all dice rolled (each player rolls `dicePerPlayer` copies of their die)
 * one by one with an odometer, totals each player's faces from scratch and tallies who is highest and every pairwise win.
 */
export function naiveEnumeration(players: number[][], dicePerPlayer: number, budgetMilliseconds = Infinity): NaiveTally {
  const dice = players.flatMap((faces, player) => Array.from({ length: dicePerPlayer }, () => ({ faces, player })));
  const indices = new Array<number>(dice.length).fill(0);
  const totals = new Array<number>(players.length).fill(0);
  const highest = new Array<number>(players.length).fill(0);
  const pairwiseWins = players.map(() => new Array<number>(players.length).fill(0));
  const outcomesTotal = dice.reduce((product, die) => product * die.faces.length, 1);
  const deadline = performance.now() + budgetMilliseconds;
  let outcomesDone = 0;
  for (;;) {
    totals.fill(0);
    for (let die = 0; die < dice.length; die += 1) totals[dice[die].player] += dice[die].faces[indices[die]];
    for (let i = 0; i < totals.length; i += 1) {
      let strictlyHighest = true;
      for (let j = 0; j < totals.length; j += 1) {
        if (i === j) continue;
        if (totals[i] > totals[j]) pairwiseWins[i][j] += 1;
        else strictlyHighest = false;
      }
      if (strictlyHighest) highest[i] += 1;
    }
    outcomesDone += 1;
    if ((outcomesDone & 0xfffff) === 0 && performance.now() > deadline) break;
    let position = dice.length - 1;
    while (position >= 0 && indices[position] === dice[position].faces.length - 1) {
      indices[position] = 0;
      position -= 1;
    }
    if (position < 0) break;
    indices[position] += 1;
  }
  return { highest, pairwiseWins, outcomesDone, outcomesTotal, complete: outcomesDone === outcomesTotal };
}

/** Naive exact matchup of `a` against `b` by enumerating every joint outcome. */
export function naiveMatchup(a: number[], b: number[], dicePerPlayer = 1): { win: Fraction; tie: Fraction; loss: Fraction } {
  const tally = naiveEnumeration([a, b], dicePerPlayer);
  const win = tally.pairwiseWins[0][1];
  const loss = tally.pairwiseWins[1][0];
  const total = tally.outcomesTotal;
  return { win: new Fraction(win, total), tie: new Fraction(total - win - loss, total), loss: new Fraction(loss, total) };
}

/** Naive exact P(pick strictly beats every opponent) by enumerating every joint outcome. */
export function naiveBeatAll(pick: number[], opponents: number[][], dicePerPlayer = 1): Fraction {
  const tally = naiveEnumeration([pick, ...opponents], dicePerPlayer);
  return new Fraction(tally.highest[0], tally.outcomesTotal);
}

/** Naive exact distribution of the sum of `count` copies of a die, by listing every roll. */
export function naiveSumDistribution(faces: number[], count: number): Map<number, Fraction> {
  const tally = new Map<number, number>();
  const visit = (depth: number, total: number): void => {
    if (depth === count) {
      tally.set(total, (tally.get(total) ?? 0) + 1);
      return;
    }
    for (const face of faces) visit(depth + 1, total + face);
  };
  visit(0, 0);
  const outcomes = faces.length ** count;
  return new Map([...tally.entries()].sort(([x], [y]) => x - y).map(([value, ways]) => [value, new Fraction(ways, outcomes)]));
}

/**
 * Naive analysis of a dice set: every pairwise matchup at each dice-per-player count, and every three-player pick
 * (two different opponents' dice, each remaining die, 1 or 2 dice each), each by full enumeration.
 */
export function naiveSetAnalysis(dice: number[][], counts: number[] = [1, 2, 3]): { matrices: Fraction[][][]; picks: Fraction[] } {
  const matrices = counts.map((count) => {
    const matrix = dice.map(() => dice.map(() => new Fraction(0)));
    for (let i = 0; i < dice.length; i += 1) {
      for (let j = i + 1; j < dice.length; j += 1) {
        const result = naiveMatchup(dice[i], dice[j], count);
        matrix[i][j] = result.win;
        matrix[j][i] = result.loss;
      }
    }
    return matrix;
  });
  const picks: Fraction[] = [];
  for (let first = 0; first < dice.length; first += 1) {
    for (let second = first + 1; second < dice.length; second += 1) {
      for (const count of [1, 2]) {
        dice.forEach((pick, index) => {
          if (index !== first && index !== second) picks.push(naiveBeatAll(pick, [dice[first], dice[second]], count));
        });
      }
    }
  }
  return { matrices, picks };
}
