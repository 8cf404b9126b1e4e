import { mulberry32, randomBelow, type RandomSource } from "../probability/seeded-random";
import type { SetFinderRequest } from "../schemas/set-finder";
import { oneDieWinCount } from "./fast-counts";
import { propertyTemplates } from "./property-templates";
import { setKey, type TopList } from "./ranking";
import { matchTemplates } from "./set-evaluation";

/** How the randomized search is going. */
export interface RandomizedTally {
  /** Sets evaluated (one per move tried). */
  evaluated: number;
  /** Fresh starts so far. */
  restarts: number;
}

const STARTING_TEMPERATURE = 0.03;
const FINAL_TEMPERATURE = 0.0003;
const COOLING = 0.99985;

/**
 * Simulated annealing (Kirkpatrick, Gelatt and Vecchi, 1983) over sets of dice in cycle order, with random restarts.
 * A move changes one face to a random allowed value, nudges it to a neighbouring value, or (when ties are allowed) swaps faces
 * between two dice; when ties are barred a move may only use values no other die carries, so every state is tie-free.
 * Sets that fail the property score by how far their weakest needed matchup is from even; sets that meet it score by the objective.
 * Every set met that meets the property is offered to `top` after canonicalising (lowest die first in the cycle; for a range,
 * shifted down to the lowest value). Runs until `shouldStop` answers true.
 */
export function randomizedSearch(
  request: SetFinderRequest,
  values: number[],
  shiftsAllowed: boolean,
  top: TopList,
  hooks: { shouldStop: () => boolean; onTick: (tally: RandomizedTally) => void; seed: number },
): RandomizedTally {
  const n = request.diceCount;
  const f = request.facesPerDie;
  const valueCount = values.length;
  const fourth = f ** 4;
  const templates = propertyTemplates(request.property, n);
  const strongest = request.objective === "strongest-cycle";
  const random: RandomSource = mulberry32(hooks.seed);
  const tally: RandomizedTally = { evaluated: 0, restarts: 0 };
  const offsets = values.map((value) => value - values[0]);
  const span = offsets[valueCount - 1];
  const sumLength = 2 * span + 1;

  const dice: Int32Array[] = Array.from({ length: n }, () => new Int32Array(f));
  // carried[d·v + x]: faces of die d showing value index x, so a barred tie is seen at once.
  const carried = new Int32Array(n * valueCount);
  const twoDiceSums = Array.from({ length: n }, () => new Int32Array(sumLength));
  const twoDiceBelow = Array.from({ length: n }, () => new Int32Array(sumLength));
  const oneDie = Array.from({ length: n }, () => new Int32Array(n));
  const twoDice = Array.from({ length: n }, () => new Int32Array(n));
  const fresh = new Array<boolean>(n).fill(false);
  const counts = { oneDie: (a: number, b: number) => oneDie[a][b], twoDice: (a: number, b: number) => twoDice[a][b] };

  const twoDiceWins = (a: number, b: number) => {
    const sums = twoDiceSums[a];
    const below = twoDiceBelow[b];
    let wins = 0;
    for (let sum = 0; sum < sumLength; sum += 1) wins += sums[sum] * below[sum];
    return wins;
  };

  const refreshDie = (die: number) => {
    const faces = dice[die];
    faces.sort();
    const sums = twoDiceSums[die];
    sums.fill(0);
    for (let first = 0; first < f; first += 1)
      for (let second = 0; second < f; second += 1) sums[offsets[faces[first]] + offsets[faces[second]]] += 1;
    const below = twoDiceBelow[die];
    let running = 0;
    for (let sum = 0; sum < sumLength; sum += 1) {
      below[sum] = running;
      running += sums[sum];
    }
    fresh[die] = true;
    for (let other = 0; other < n; other += 1) {
      if (other === die || !fresh[other]) continue;
      oneDie[die][other] = oneDieWinCount(faces, dice[other]);
      oneDie[other][die] = oneDieWinCount(dice[other], faces);
      twoDice[die][other] = twoDiceWins(die, other);
      twoDice[other][die] = twoDiceWins(other, die);
    }
  };

  const setFace = (die: number, face: number, value: number) => {
    carried[die * valueCount + dice[die][face]] -= 1;
    dice[die][face] = value;
    carried[die * valueCount + value] += 1;
  };

  /** Whether die `die` may show value index `value` without tying another die (always, when ties are allowed). */
  const mayShow = (die: number, value: number) => {
    if (request.allowTies) return true;
    for (let other = 0; other < n; other += 1) if (other !== die && carried[other * valueCount + value] > 0) return false;
    return true;
  };

  /** A random value the die may show: any, or with ties barred its own or one no die shows. */
  const showableValue = (die: number): number => {
    if (request.allowTies) return randomBelow(random, valueCount);
    let choices = 0;
    for (let value = 0; value < valueCount; value += 1) if (mayShow(die, value)) showable[choices++] = value;
    return showable[randomBelow(random, choices)];
  };
  const showable = new Int32Array(valueCount);

  /** The next value up or down that the die may show, or the value itself when there is none. */
  const neighbourValue = (die: number, value: number): number => {
    const step = randomBelow(random, 2) === 0 ? -1 : 1;
    for (let next = value + step; next >= 0 && next < valueCount; next += step) if (mayShow(die, next)) return next;
    return value;
  };

  const spans = () => {
    let low = valueCount;
    for (const die of dice) if (die[0] < low) low = die[0];
    const shift = shiftsAllowed ? low : 0;
    let largestSpan = 0;
    let totalSpan = 0;
    for (const die of dice) {
      largestSpan = Math.max(largestSpan, offsets[die[f - 1] - shift]);
      for (const face of die) totalSpan += offsets[face - shift];
    }
    return { shift, largestSpan, totalSpan };
  };

  /** Higher is better: above 1 when the property holds (with no repeated die), otherwise at most 0. */
  const evaluate = (): number => {
    tally.evaluated += 1;
    const match = matchTemplates(templates, f, counts);
    let repeats = 0;
    for (let a = 0; a < n; a += 1) {
      for (let b = a + 1; b < n; b += 1) {
        if (oneDie[a][b] + oneDie[b][a] === 0 && dice[a].every((face, index) => face === dice[b][index])) repeats += 1;
      }
    }
    if (request.refuseAllEqualFaces) for (const die of dice) if (die[0] === die[f - 1]) repeats += 1;
    if (!match.holds || repeats > 0) return -match.shortfall / fourth - 0.05 * repeats;
    const { shift, largestSpan, totalSpan } = spans();
    offer(match.strength, match.secondCycle, shift, largestSpan, totalSpan);
    if (strongest) return 1 + match.strength / fourth;
    return 2 - (0.6 * largestSpan) / span - (0.3 * totalSpan) / (n * f * span) + (0.1 * match.strength) / fourth;
  };

  const offer = (strength: number, secondCycle: number[] | null, shift: number, largestSpan: number, totalSpan: number) => {
    if (!top.couldEnter(strength, largestSpan, totalSpan)) return;
    const faces = dice.map((die) => Array.from(die, (index) => values[index - shift]));
    let start = 0;
    for (let position = 1; position < n; position += 1) if (lexicallyBefore(faces[position], faces[start])) start = position;
    const rotated = faces.map((_, position) => faces[(position + start) % n]);
    const rotatedSecond = secondCycle === null ? null : rotateCycle(secondCycle.map((position) => (position - start + n) % n));
    top.offer({ faces: rotated, secondCycle: rotatedSecond, strength, largestSpan, totalSpan, key: setKey(rotated) });
  };

  const restart = () => {
    tally.restarts += 1;
    carried.fill(0);
    fresh.fill(false);
    // Deal the values out so each die owns some: with ties barred a die only ever shows its own values.
    const order = Array.from({ length: valueCount }, (_, index) => index);
    for (let index = valueCount - 1; index > 0; index -= 1) {
      const swap = randomBelow(random, index + 1);
      [order[index], order[swap]] = [order[swap], order[index]];
    }
    const owned: number[][] = Array.from({ length: n }, () => []);
    order.forEach((value, index) => owned[index < n ? index : randomBelow(random, n)].push(value));
    for (let die = 0; die < n; die += 1) {
      for (let face = 0; face < f; face += 1) {
        const value = request.allowTies ? randomBelow(random, valueCount) : owned[die][randomBelow(random, owned[die].length)];
        dice[die][face] = value;
        carried[die * valueCount + value] += 1;
      }
    }
    for (let die = 0; die < n; die += 1) refreshDie(die);
  };

  const saved = dice.map((die) => new Int32Array(die));
  restart();
  let current = evaluate();
  let temperature = STARTING_TEMPERATURE;
  let lastTick = 0;
  while ((tally.evaluated & 255) !== 0 || !hooks.shouldStop()) {
    const first = randomBelow(random, n);
    const second = (first + 1 + randomBelow(random, n - 1)) % n;
    const face = randomBelow(random, f);
    const move = randomBelow(random, 4);
    saved[first].set(dice[first]);
    saved[second].set(dice[second]);
    let swapped = false;
    if (move === 0 && request.allowTies) {
      const other = randomBelow(random, f);
      const held = dice[first][face];
      setFace(first, face, dice[second][other]);
      setFace(second, other, held);
      swapped = true;
    } else {
      const value = move === 1 ? neighbourValue(first, dice[first][face]) : showableValue(first);
      if (value === dice[first][face]) continue;
      setFace(first, face, value);
    }
    if (swapped) refreshDie(second);
    refreshDie(first);
    const next = evaluate();
    const accept = next >= current || Math.exp((next - current) / temperature) * 2 ** 32 > random();
    if (accept) {
      current = next;
    } else {
      restoreDie(first);
      if (swapped) restoreDie(second);
      if (swapped) refreshDie(second);
      refreshDie(first);
    }
    temperature *= COOLING;
    if (temperature < FINAL_TEMPERATURE) {
      restart();
      current = evaluate();
      temperature = STARTING_TEMPERATURE;
    }
    if (tally.evaluated - lastTick >= 2000) {
      lastTick = tally.evaluated;
      hooks.onTick(tally);
    }
  }
  return tally;

  function restoreDie(die: number) {
    for (const value of dice[die]) carried[die * valueCount + value] -= 1;
    dice[die].set(saved[die]);
    for (const value of dice[die]) carried[die * valueCount + value] += 1;
  }
}

function lexicallyBefore(a: readonly number[], b: readonly number[]): boolean {
  for (let index = 0; index < a.length; index += 1) if (a[index] !== b[index]) return a[index] < b[index];
  return false;
}

/** A cycle of positions written from position 0, as the templates write it. */
function rotateCycle(cycle: number[]): number[] {
  const zero = cycle.indexOf(0);
  return cycle.map((_, index) => cycle[(index + zero) % cycle.length]);
}
