import type { SetFinderRequest } from "../schemas/set-finder";
import { type DicePool, orderedChoices, poolDieFaces } from "./candidate-dice";
import { twoDiceCounts, type TwoDiceCounts, twoDiceWinCount } from "./fast-counts";
import { mainCycleTwoDice, propertyTemplates } from "./property-templates";
import { setKey, smallFacesKey, type TopList } from "./ranking";
import { matchTemplates } from "./set-evaluation";

/** How the exhaustive search is going, counted in candidate cycles (a set of dice in cyclic order, up to rotation). */
export interface ExhaustiveTally {
  /** Candidate cycles settled: checked one by one or ruled out together by a bound or a failed matchup. */
  settled: number;
  /** Candidate cycles in the space after symmetry pruning. */
  total: number;
  /** Complete cycles checked one by one against the property. */
  checked: number;
}

/** Hooks the search calls from its loop: the clock, whether to stop, and a progress report. */
export interface SearchHooks {
  shouldStop: () => boolean;
  /** Called now and then with the tally; cheap calls, the caller throttles. */
  onTick: (tally: ExhaustiveTally) => void;
}

/**
 * The candidate cycles an exhaustive search covers: the first die is the lowest-numbered in the pool (rotation),
 * and for a range of values it carries the lowest value (value shifts); the others are any distinct later dice, in order.
 */
export function exhaustiveSpaceSize(pool: DicePool, diceCount: number, shiftsPruned: boolean): number {
  const firstDice = shiftsPruned ? pool.withLowestValue : pool.size;
  let total = 0;
  for (let first = 0; first < firstDice; first += 1) total += orderedChoices(pool.size - 1 - first, diceCount - 1);
  return total;
}

/** Outcomes (out of f²) in which die i of the pool beats die j, for every pair: a face table per die, then one pass per pair. */
export function oneDieWinTable(pool: DicePool): Uint8Array {
  const { size, facesPerDie, faceIndices } = pool;
  const valueCount = pool.values.length;
  // above[i·v + x]: faces of die i above value index x.
  const above = new Uint8Array(size * valueCount);
  for (let die = 0; die < size; die += 1) {
    for (let value = 0; value < valueCount; value += 1) {
      let count = 0;
      for (let face = 0; face < facesPerDie; face += 1) if (faceIndices[die * facesPerDie + face] > value) count += 1;
      above[die * valueCount + value] = count;
    }
  }
  const table = new Uint8Array(size * size);
  for (let winner = 0; winner < size; winner += 1) {
    const row = winner * valueCount;
    for (let loser = 0; loser < size; loser += 1) {
      let wins = 0;
      const base = loser * facesPerDie;
      for (let face = 0; face < facesPerDie; face += 1) wins += above[row + faceIndices[base + face]];
      table[winner * size + loser] = wins;
    }
  }
  return table;
}

/**
 * Exhaustive branch-and-bound search over the pool. The cycle is built die by die; a step is tried only if the die beats the next
 * with one die each (and keeps or reverses with two dice each as the property needs), shares no face with the chosen dice when ties
 * are barred, and could still rank among the kept results. Each die's beaten dice are tried strongest first, so the bound soon bites.
 * Answers whether the whole space was covered.
 */
export function exhaustiveSearch(
  request: SetFinderRequest,
  pool: DicePool,
  shiftsPruned: boolean,
  top: TopList,
  hooks: SearchHooks,
): { complete: boolean; tally: ExhaustiveTally } {
  const n = request.diceCount;
  const f = request.facesPerDie;
  const scale = f * f;
  const size = pool.size;
  const lowest = pool.values[0];
  const strongest = request.objective === "strongest-cycle";
  const templates = propertyTemplates(request.property, n);
  const twoDiceRule = mainCycleTwoDice(request.property);
  const needsTwoDice = request.property !== "one-cycle";

  const win = oneDieWinTable(pool);
  const largest = new Int32Array(size);
  const faceTotal = new Int32Array(size);
  const facesOf: number[][] = [];
  // 1 for a die the request refuses: every face the same value.
  const refused = new Uint8Array(size);
  for (let die = 0; die < size; die += 1) {
    const faces = poolDieFaces(pool, die);
    facesOf.push(faces);
    if (request.refuseAllEqualFaces && faces[0] === faces[f - 1]) refused[die] = 1;
    largest[die] = faces[f - 1] - lowest;
    faceTotal[die] = faces.reduce((sum, face) => sum + face - lowest, 0);
  }

  // Each die's beaten dice, strongest win first, packed as (255 − wins)·65536 + index so a numeric sort orders them.
  const beatenStart = new Int32Array(size + 1);
  for (let a = 0; a < size; a += 1) {
    let count = 0;
    for (let b = 0; b < size; b += 1) if (win[a * size + b] > win[b * size + a]) count += 1;
    beatenStart[a + 1] = beatenStart[a] + count;
  }
  const beaten = new Uint32Array(beatenStart[size]);
  for (let a = 0; a < size; a += 1) {
    let at = beatenStart[a];
    for (let b = 0; b < size; b += 1) if (win[a * size + b] > win[b * size + a]) beaten[at++] = (255 - win[a * size + b]) * 65536 + b;
    beaten.subarray(beatenStart[a], beatenStart[a + 1]).sort();
  }
  for (let at = 0; at < beaten.length; at += 1) beaten[at] &= 0xffff;

  const twoDice: TwoDiceCounts[] = needsTwoDice ? facesOf.map((faces) => twoDiceCounts(faces)) : [];
  const twoDiceCache = needsTwoDice ? new Int16Array(size * size).fill(-1) : new Int16Array(0);
  const twoDiceWin = (a: number, b: number): number => {
    let value = twoDiceCache[a * size + b];
    if (value < 0) {
      value = twoDiceWinCount(twoDice[a], twoDice[b]);
      twoDiceCache[a * size + b] = value;
    }
    return value;
  };

  const order = new Int32Array(n);
  const counts = {
    oneDie: (winner: number, loser: number) => win[order[winner] * size + order[loser]],
    twoDice: (winner: number, loser: number) => twoDiceWin(order[winner], order[loser]),
  };
  const tally: ExhaustiveTally = { settled: 0, total: exhaustiveSpaceSize(pool, n, shiftsPruned), checked: 0 };
  let stopped = false;
  let steps = 0;

  /** Whether step a → b passes the two-dice rule and could still beat the kept results; a → b already beats with one die each. */
  const stepPasses = (a: number, b: number): boolean => {
    if (twoDiceRule === "any") return true;
    const forward = twoDiceWin(a, b);
    const backward = twoDiceWin(b, a);
    const needed = twoDiceRule === "keep" ? forward : backward;
    if (twoDiceRule === "keep" ? forward <= backward : backward <= forward) return false;
    return !(strongest && top.full && needed < top.worstStrength);
  };

  const sharesFace = (die: number, depth: number): boolean => {
    for (let chosen = 0; chosen < depth; chosen += 1) {
      const other = order[chosen];
      if (win[die * size + other] + win[other * size + die] !== scale) return true;
    }
    return false;
  };

  const leaf = (largestSoFar: number, totalSoFar: number) => {
    tally.checked += 1;
    const match = matchTemplates(templates, f, counts);
    if (!match.holds || !top.couldEnter(match.strength, largestSoFar, totalSoFar)) return;
    const faces = Array.from(order, (die) => facesOf[die]);
    top.offer({
      faces,
      secondCycle: match.secondCycle,
      strength: match.strength,
      largestSpan: largestSoFar,
      totalSpan: totalSoFar,
      key: setKey(faces),
    });
  };

  const extend = (depth: number, largestSoFar: number, totalSoFar: number) => {
    const first = order[0];
    const previous = order[depth - 1];
    for (let at = beatenStart[previous]; at < beatenStart[previous + 1]; at += 1) {
      if ((++steps & 0x3fff) === 0 && hooks.shouldStop()) stopped = true;
      if (stopped) return;
      const die = beaten[at];
      const wins = win[previous * size + die];
      if (strongest && top.full && wins * scale < top.worstStrength) break;
      if (die <= first || refused[die] === 1) continue;
      let repeated = false;
      for (let chosen = 1; chosen < depth; chosen += 1) if (order[chosen] === die) repeated = true;
      if (repeated) continue;
      if (!request.allowTies && sharesFace(die, depth)) continue;
      const nextLargest = largestSoFar > largest[die] ? largestSoFar : largest[die];
      const nextTotal = totalSoFar + faceTotal[die];
      if (!strongest && top.full && smallFacesKey(nextLargest, nextTotal) > top.worstSmallKey) continue;
      if (!stepPasses(previous, die)) continue;
      order[depth] = die;
      if (depth === n - 1) {
        const closing = win[die * size + first];
        if (closing <= win[first * size + die]) continue;
        if (strongest && top.full && closing * scale < top.worstStrength) continue;
        if (!stepPasses(die, first)) continue;
        leaf(nextLargest, nextTotal);
      } else {
        extend(depth + 1, nextLargest, nextTotal);
      }
      if (depth === 1) {
        tally.settled += orderedChoices(size - first - 2, n - 2);
        hooks.onTick(tally);
      }
    }
  };

  const firstDice = shiftsPruned ? pool.withLowestValue : size;
  for (let first = 0; first < firstDice && !stopped; first += 1) {
    const settledBefore = tally.settled;
    order[0] = first;
    if (refused[first] === 0) extend(1, largest[first], faceTotal[first]);
    if (stopped) break;
    tally.settled = settledBefore + orderedChoices(size - 1 - first, n - 1);
    hooks.onTick(tally);
    if (hooks.shouldStop()) stopped = true;
  }
  return { complete: !stopped, tally };
}
