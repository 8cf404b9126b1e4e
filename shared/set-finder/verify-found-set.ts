import Fraction from "fraction.js";
import { analyzeSet, type SetLevelAnalysis } from "../probability/analyze-set";
import { fractionToNumber, fractionToString } from "../probability/format";
import type { FoundSet, SetFinderRequest } from "../schemas/set-finder";
import { allowedFaceValues } from "./candidate-dice";
import { propertyTemplates } from "./property-templates";
import { candidateScore, type Candidate } from "./ranking";

/** Names for found dice, in cycle order; the teacher renames them when saving. */
export const FOUND_DIE_NAMES = ["A", "B", "C", "D", "E", "F"];

/**
 * Re-checks a candidate with the exact engine (analyzeSet, one and two dice each) and computes its figures from the engine's fractions:
 * the faces are allowed, some template of the property holds, ties are absent when barred, and the engine's weakest needed win equals
 * the search's. Answers the verified set, or null when any check fails.
 */
export function verifyFoundSet(request: SetFinderRequest, candidate: Candidate): FoundSet | null {
  const n = request.diceCount;
  const allowed = new Set(allowedFaceValues(request.faceValues));
  if (candidate.faces.length !== n) return null;
  if (candidate.faces.some((faces) => faces.length !== request.facesPerDie || faces.some((face) => !allowed.has(face)))) return null;
  if (request.refuseAllEqualFaces && candidate.faces.some(allFacesEqual)) return null;
  const dice = candidate.faces.map((faces, index) => ({ name: FOUND_DIE_NAMES[index], faces: [...faces] }));
  const analysis = analyzeSet(dice, { dicePerPlayer: 2 });
  const [oneDie, twoDice] = analysis.levels;
  const levelFor = (dicePerPlayer: 1 | 2) => (dicePerPlayer === 1 ? oneDie : twoDice);

  let best: { weakest: Fraction; template: ReturnType<typeof propertyTemplates>[number] } | null = null;
  for (const template of propertyTemplates(request.property, n)) {
    const holds = template.requirements.every((need) => levelFor(need.dicePerPlayer).matrix[need.winner][need.loser]!.relation === "beats");
    if (!holds) continue;
    const weakest = template.requirements
      .map((need) => levelFor(need.dicePerPlayer).matrix[need.winner][need.loser]!.win)
      .reduce((least, win) => (win.lt(least) ? win : least));
    if (best === null || weakest.gt(best.weakest)) best = { weakest, template };
  }
  if (best === null) return null;
  if (!best.weakest.equals(new Fraction(candidate.strength, request.facesPerDie ** 4))) return null;
  const hasTies = pairs(n).some(([a, b]) => !oneDie.matrix[a][b]!.tie.equals(0));
  if (hasTies && !request.allowTies) return null;
  if (new Set(candidate.faces.map((faces) => faces.join(","))).size !== n) return null;

  const cycleOrder = Array.from({ length: n }, (_, index) => index);
  const cycleWins = cycleOrder.map((position) => oneDie.matrix[position][(position + 1) % n]!.win);
  const weakestCycleWin = cycleWins.reduce((least, win) => (win.lt(least) ? win : least));
  const twoDiceNeeds = best.template.requirements.filter((need) => need.dicePerPlayer === 2);
  const weakestTwoDice =
    twoDiceNeeds.length === 0
      ? null
      : twoDiceNeeds.map((need) => twoDice.matrix[need.winner][need.loser]!.win).reduce((least, win) => (win.lt(least) ? win : least));
  const faces = candidate.faces.flat();
  return {
    dice,
    figures: {
      weakestCycleWin: fractionToString(weakestCycleWin),
      weakestCycleWinDecimal: fractionToNumber(weakestCycleWin),
      cycleOrder,
      cycleWins: cycleWins.map(fractionToString),
      reversesWithTwoDice: cycleOrder.every((position) => twoDice.matrix[(position + 1) % n][position]!.relation === "beats"),
      secondCycleOrder: best.template.secondCycle,
      weakestTwoDiceWin: weakestTwoDice === null ? null : fractionToString(weakestTwoDice),
      weakestTwoDiceWinDecimal: weakestTwoDice === null ? null : fractionToNumber(weakestTwoDice),
      hasTies,
      beatsAnyTwoOpponents: beatsAnyTwo(n, [oneDie, twoDice]),
      largestFace: Math.max(...faces),
      smallestFace: Math.min(...faces),
      faceTotal: faces.reduce((sum, face) => sum + face, 0),
    },
    score: candidateScore(request.objective, candidate, request.facesPerDie),
  };
}

/** True when every face of a die shows the same value. */
export function allFacesEqual(faces: readonly number[]): boolean {
  return faces.every((face) => face === faces[0]);
}

function pairs(n: number): [number, number][] {
  const list: [number, number][] = [];
  for (let a = 0; a < n; a += 1) for (let b = a + 1; b < n; b += 1) list.push([a, b]);
  return list;
}

/** For every pair of opponents' dice, some other die beats both head to head at one of the levels (one or two dice each). */
function beatsAnyTwo(n: number, levels: SetLevelAnalysis[]): boolean {
  if (n < 3) return false;
  return pairs(n).every(([x, y]) =>
    levels.some((level) =>
      Array.from({ length: n }, (_, z) => z).some(
        (z) => z !== x && z !== y && level.matrix[z][x]!.relation === "beats" && level.matrix[z][y]!.relation === "beats",
      ),
    ),
  );
}
