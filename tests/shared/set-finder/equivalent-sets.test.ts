import { describe, expect, it } from "vitest";
import { type FoundSet, type SetFinderRequest, type SetFinderRequestInput, setFinderRequestSchema } from "@shared/schemas/set-finder";
import { askedMatchups, collapseEquivalentSets } from "@shared/set-finder/equivalent-sets";
import { setKey } from "@shared/set-finder/ranking";
import { searchDiceSets } from "@shared/set-finder/search-dice-sets";
import { naiveEnumeration } from "../../../scripts/bench/naive";

const request = (input: Partial<SetFinderRequestInput>): SetFinderRequest =>
  setFinderRequestSchema.parse({
    diceCount: 3,
    facesPerDie: 4,
    faceValues: { kind: "range", min: 1, max: 5 },
    property: "one-cycle",
    allowTies: true,
    objective: "strongest-cycle",
    maxResults: 50,
    ...input,
  });

/** Outcome counts of a against b by visiting every joint roll (scripts/bench/naive.ts), independent of the engine's convolution. */
function naiveCounts(a: number[], b: number[], dicePerPlayer: number): string {
  const tally = naiveEnumeration([a, b], dicePerPlayer);
  return `${tally.pairwiseWins[0][1]}/${tally.pairwiseWins[1][0]}`;
}

/** Brute-force equivalence: some rotation of one cycle plays every asked matchup of the other with the same joint-roll counts. */
function bruteEquivalent(property: SetFinderRequest["property"], x: number[][], y: number[][]): boolean {
  const n = x.length;
  const asked = askedMatchups(property, n);
  return Array.from({ length: n }, (_unused, shift) => shift).some((shift) =>
    asked.every(
      ([first, second, dicePerPlayer]) =>
        naiveCounts(x[first], x[second], dicePerPlayer) === naiveCounts(y[(first + shift) % n], y[(second + shift) % n], dicePerPlayer),
    ),
  );
}

/** Classes of the found sets under the brute-force equivalence, in order of their first member. */
function bruteClasses(property: SetFinderRequest["property"], found: FoundSet[]): FoundSet[][] {
  const classes: FoundSet[][] = [];
  for (const result of found) {
    const faces = result.dice.map((die) => die.faces);
    const home = classes.find((members) =>
      bruteEquivalent(
        property,
        members[0].dice.map((die) => die.faces),
        faces,
      ),
    );
    if (home) home.push(result);
    else classes.push([result]);
  }
  return classes;
}

describe("collapseEquivalentSets against a brute-force equivalence", { timeout: 120_000 }, () => {
  it.each([
    ["three four-faced dice, values 1 to 5, one cycle", request({})],
    [
      "three four-faced dice, values 1 to 6, reversing with two dice each",
      request({ property: "reversing-cycle", faceValues: { kind: "range", min: 1, max: 6 } }),
    ],
    ["four four-faced dice, values 1 to 5, one cycle", request({ diceCount: 4 })],
  ])("keeps one set per class, the best of it, with the rest counted as variants: %s", (_label, search) => {
    const every = searchDiceSets(search, undefined, undefined, { collapseVariants: false }).results;
    const classes = bruteClasses(search.property, every);
    expect(classes.some((members) => members.length > 1)).toBe(true);
    const collapsed = collapseEquivalentSets(search.property, every);
    expect(collapsed.map((result) => setKey(result.dice.map((die) => die.faces)))).toEqual(
      classes.map((members) => setKey(members[0].dice.map((die) => die.faces))),
    );
    expect(collapsed.map((result) => result.variants)).toEqual(classes.map((members) => members.length - 1));
  });

  it("gives a search's results no two sets that play every asked matchup alike", () => {
    const search = request({ maxResults: 8 });
    const outcome = searchDiceSets(search);
    expect(outcome.results.length).toBe(8);
    for (const [index, result] of outcome.results.entries()) {
      for (const later of outcome.results.slice(index + 1)) {
        expect(
          bruteEquivalent(
            search.property,
            result.dice.map((die) => die.faces),
            later.dice.map((die) => die.faces),
          ),
        ).toBe(false);
      }
    }
    expect(outcome.results.some((result) => (result.variants ?? 0) > 0)).toBe(true);
  });
});

describe("refusing dice whose faces are all equal", { timeout: 60_000 }, () => {
  const hasEqualFacedDie = (dice: { faces: number[] }[]) => dice.some((die) => die.faces.every((face) => face === die.faces[0]));

  const search = (refuseAllEqualFaces?: boolean) =>
    request({
      diceCount: 4,
      facesPerDie: 6,
      faceValues: { kind: "range", min: 1, max: 7 },
      maxResults: 10,
      ...(refuseAllEqualFaces === undefined ? {} : { refuseAllEqualFaces }),
    });

  it("leaves such dice out by default", () => {
    expect(search().refuseAllEqualFaces).toBe(true);
    const outcome = searchDiceSets(search());
    expect(outcome.results.length).toBeGreaterThan(0);
    for (const result of outcome.results) expect(hasEqualFacedDie(result.dice)).toBe(false);
  });

  it("finds them when the teacher allows them: Efron's four dice, shifted, then come first", () => {
    // Efron's dice (Gardner, Scientific American, December 1970; faces from memory): one die shows 3 on every face.
    const outcome = searchDiceSets(search(false));
    expect(outcome.results[0].figures.weakestCycleWin).toBe("2/3");
    expect(hasEqualFacedDie(outcome.results[0].dice)).toBe(true);
  });
});
