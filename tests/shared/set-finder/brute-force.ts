import Fraction from "fraction.js";
import { compareDice } from "@shared/probability/index";
import type { SetFinderRequest } from "@shared/schemas/set-finder";

/** One qualifying set found by brute force: its dice as a set key, and its best weakest needed win over every ordering. */
export type BruteForceSet = { key: string; strength: Fraction; faces: number[][] };

function allDice(values: number[], faces: number): number[][] {
  const dice: number[][] = [];
  const build = (start: number, current: number[]) => {
    if (current.length === faces) return void dice.push([...current]);
    for (let index = start; index < values.length; index += 1) build(index, [...current, values[index]]);
  };
  build(0, []);
  return dice;
}

function combinations(count: number, size: number): number[][] {
  const result: number[][] = [];
  const build = (start: number, current: number[]) => {
    if (current.length === size) return void result.push([...current]);
    for (let index = start; index < count; index += 1) build(index + 1, [...current, index]);
  };
  build(0, []);
  return result;
}

function permutations<T>(items: T[]): T[][] {
  if (items.length <= 1) return [items];
  return items.flatMap((item, index) => permutations([...items.slice(0, index), ...items.slice(index + 1)]).map((rest) => [item, ...rest]));
}

const keyOf = (faces: number[][]) =>
  faces
    .map((die) => die.join(","))
    .sort()
    .join(" | ");

/**
 * Every set of distinct dice meeting the request's property, by brute force: all dice, all sets, all cyclic orders, every matchup
 * through the engine's compareDice, dice with every face equal left out when the request refuses them. Sets that are value shifts of
 * each other count once (shifted down so the lowest face is the range's minimum).
 */
export function bruteForceSets(request: SetFinderRequest): BruteForceSet[] {
  const values =
    request.faceValues.kind === "range"
      ? Array.from(
          { length: request.faceValues.max - request.faceValues.min + 1 },
          (_, index) => (request.faceValues as { min: number }).min + index,
        )
      : [...request.faceValues.values].sort((a, b) => a - b);
  const dice = allDice(values, request.facesPerDie).filter((die) => !request.refuseAllEqualFaces || die.some((face) => face !== die[0]));
  const size = dice.length;
  const one = dice.map((a) => dice.map((b) => compareDice(a, b)));
  const two = request.property === "one-cycle" ? [] : dice.map((a) => dice.map((b) => compareDice(a, b, { dicePerPlayer: 2 })));
  // Flags first, so the loops below compare bytes; the fractions are read only for sets that qualify.
  const beatsOne = new Uint8Array(size * size);
  const beatsTwo = new Uint8Array(size * size);
  const tiesOne = new Uint8Array(size * size);
  for (let a = 0; a < size; a += 1) {
    for (let b = 0; b < size; b += 1) {
      beatsOne[a * size + b] = one[a][b].win.gt(one[a][b].loss) ? 1 : 0;
      tiesOne[a * size + b] = one[a][b].tie.equals(0) ? 0 : 1;
      if (two.length > 0) beatsTwo[a * size + b] = two[a][b].win.gt(two[a][b].loss) ? 1 : 0;
    }
  }
  const n = request.diceCount;
  const tails = permutations(Array.from({ length: n - 1 }, (_, index) => index + 1));
  const found = new Map<string, BruteForceSet>();
  const order = new Array<number>(n);
  for (const chosen of combinations(size, n)) {
    if (!request.allowTies && chosen.some((a) => chosen.some((b) => a !== b && tiesOne[a * size + b] === 1))) continue;
    for (const tail of tails) {
      order[0] = chosen[0];
      for (let position = 1; position < n; position += 1) order[position] = chosen[tail[position - 1]];
      let ok = true;
      for (let position = 0; position < n && ok; position += 1) {
        const a = order[position];
        const b = order[(position + 1) % n];
        if (!beatsOne[a * size + b]) ok = false;
        else if (request.property === "reversing-cycle" && !beatsTwo[b * size + a]) ok = false;
        else if (request.property === "two-cycles" && !beatsTwo[a * size + b]) ok = false;
      }
      if (!ok) continue;
      const steps = order.map((die, position) => [die, order[(position + 1) % n]]);
      const wins: Fraction[] = steps.map(([a, b]) => one[a][b].win);
      if (request.property === "reversing-cycle") wins.push(...steps.map(([a, b]) => two[b][a].win));
      let strength: Fraction | null = null;
      if (request.property === "two-cycles") {
        wins.push(...steps.map(([a, b]) => two[a][b].win));
        const onMain = (a: number, b: number) => steps.some(([x, y]) => (x === a && y === b) || (x === b && y === a));
        for (const secondTail of tails) {
          const second = [order[0], ...secondTail.map((position) => order[position])];
          const secondSteps = second.map((die, position) => [die, second[(position + 1) % n]]);
          if (secondSteps.some(([a, b]) => onMain(a, b))) continue;
          if (!secondSteps.every(([a, b]) => beatsOne[a * size + b] && beatsTwo[b * size + a])) continue;
          const all = [...wins, ...secondSteps.map(([a, b]) => one[a][b].win), ...secondSteps.map(([a, b]) => two[b][a].win)];
          const weakest = all.reduce((least, win) => (win.lt(least) ? win : least));
          if (strength === null || weakest.gt(strength)) strength = weakest;
        }
        if (strength === null) continue;
      } else {
        strength = wins.reduce((least, win) => (win.lt(least) ? win : least));
      }
      const faces = order.map((die) => dice[die]);
      const shift = request.faceValues.kind === "range" ? Math.min(...faces.flat()) - values[0] : 0;
      const shifted = faces.map((die) => die.map((face) => face - shift));
      const key = keyOf(shifted);
      const known = found.get(key);
      if (!known || strength.gt(known.strength)) found.set(key, { key, strength, faces: shifted });
    }
  }
  return [...found.values()];
}
