import { createHash } from "node:crypto";
import Fraction from "fraction.js";
import { describe, expect, it } from "vitest";
import { analyzeSet, compareDice } from "@shared/probability/index";
import { demoDiceSetNames } from "../../../seed/demo-scenario";
import { demoDiceSets } from "../../../seed/seed-dice-sets";

const setNamed = (name: string) => demoDiceSets.find((demo) => demo.input.name === name)!.input;
const facesOf = (name: string) => setNamed(name).dice.map((die) => die.faces);
const win = (a: number[], b: number[], dicePerPlayer = 1) => compareDice(a, b, { dicePerPlayer });
const beats = (a: number[], b: number[], dicePerPlayer = 1) => {
  const result = win(a, b, dicePerPlayer);
  return result.win.gt(result.loss);
};
const noTies = (faces: number[][]) => faces.every((a, i) => faces.every((b, j) => i === j || compareDice(a, b).tie.equals(0)));

/**
 * Published or sold dice sets the demo must not copy (faces from memory): Efron's four dice (Scientific American,
 * December 1970), two commercially sold sets of five and three dice, the three-dice examples found in many probability
 * texts, and Schwenk's three dice. Only salted digests of each die's shape (sorted faces shifted to start at 0) are kept,
 * so this file carries none of those sets itself.
 */
const publishedDieDigests = new Set([
  "f9300521ff8798d6f4e27673",
  "2a38466e97fbcf14351377aa",
  "d84e8ff60c9e2b6794446071",
  "d447331a08bd2261bfa60744",
  "32640ab90ff441fe716da4cd",
  "07b9627fb22094b5fb540889",
  "6dcb2268f39578657523db6f",
  "89907734dbdf3e6f6dad3a0c",
  "f9ca4cd60c8467372cf00665",
  "8c564b7783b26adc99312035",
  "c180a2f2bc1e255da955a2eb",
  "002a0fd7d2cd23bf19e2b521",
  "61aa61287f5b30f2c71013e7",
  "98fc9a075ca5bbb3115e7e99",
  "a3fc4015988d0045837b0b5e",
  "58796106ad78bb50c37d0658",
  "ca914653ae153640471d9841",
  "c1058335f98cce25f103da6d",
  "a331957cae891be2fee31398",
  "9324d13622805f97ceeb9c39",
  "dfe72c6a468c01a1143e26d6",
]);

/** Digest of a die up to adding a constant to every face, matching publishedDieDigests. */
function dieShapeDigest(faces: number[]): string {
  const sorted = [...faces].sort((a, b) => a - b);
  const shape = sorted.map((face) => face - sorted[0]).join(",");
  return createHash("sha256").update(`outroll-published-die:${shape}`).digest("hex").slice(0, 24);
}

describe("demo dice sets", () => {
  it("Kittiwake trio: three six-faced dice in one cycle, each win 7/12, never a tie", () => {
    const [puffin, gannet, skua] = facesOf(demoDiceSetNames.threeDice);
    for (const [a, b] of [
      [puffin, gannet],
      [gannet, skua],
      [skua, puffin],
    ])
      expect(win(a, b).win.equals(new Fraction(7, 12))).toBe(true);
    expect(noTies([puffin, gannet, skua])).toBe(true);
    const level = analyzeSet(setNamed(demoDiceSetNames.threeDice).dice, { dicePerPlayer: 1 }).levels[0];
    expect(level.hamiltonianCycles.map((cycle) => cycle.dice)).toEqual([["Puffin", "Gannet", "Skua"]]);
    expect(level.everyDieIsBeaten).toBe(true);
  });

  it("Shearwater swap: a cycle with one die each that turns round with two dice each", () => {
    const dice = facesOf(demoDiceSetNames.reversing);
    const [fulmar, tern, guillemot] = dice;
    expect([win(fulmar, tern).win, win(tern, guillemot).win, win(guillemot, fulmar).win].map(String)).toEqual(["0.(6)", "0.(6)", "0.(5)"]);
    for (const [a, b] of [
      [fulmar, tern],
      [tern, guillemot],
      [guillemot, fulmar],
    ]) {
      expect(beats(a, b)).toBe(true);
      expect(beats(b, a, 2)).toBe(true);
    }
    expect(noTies(dice)).toBe(true);
    const analysis = analyzeSet(setNamed(demoDiceSetNames.reversing).dice, { dicePerPlayer: 2 });
    expect(analysis.reversals.filter((reversal) => reversal.kind === "reversed")).toHaveLength(3);
  });

  it("Petrel five: one cycle keeps and another turns round with two dice each, so some die beats any two opponents", () => {
    const dice = facesOf(demoDiceSetNames.fiveDice);
    const keeps = [0, 1, 2, 3, 4];
    const turns = [0, 2, 4, 1, 3];
    for (let step = 0; step < 5; step += 1) {
      const [a, b] = [dice[keeps[step]], dice[keeps[(step + 1) % 5]]];
      expect(beats(a, b) && beats(a, b, 2)).toBe(true);
      const [c, d] = [dice[turns[step]], dice[turns[(step + 1) % 5]]];
      expect(beats(c, d) && beats(d, c, 2)).toBe(true);
    }
    expect(noTies(dice)).toBe(true);
    for (let x = 0; x < 5; x += 1) {
      for (let y = x + 1; y < 5; y += 1) {
        const answer = [0, 1, 2, 3, 4].some(
          (z) => z !== x && z !== y && [1, 2].some((k) => beats(dice[z], dice[x], k) && beats(dice[z], dice[y], k)),
        );
        expect(answer, `against ${x} and ${y}`).toBe(true);
      }
    }
  });

  it("Gull starter: three four-faced dice in a cycle with faces no higher than 6", () => {
    const [gull, booby, noddy] = facesOf("Gull starter (four faces)");
    expect([win(gull, booby).win, win(booby, noddy).win, win(noddy, gull).win].map((f) => f.toFraction())).toEqual(["9/16", "5/8", "5/8"]);
    expect(Math.max(...[gull, booby, noddy].flat())).toBe(6);
  });

  it("copies no die of a published or sold set, even shifted", () => {
    for (const demo of demoDiceSets) {
      for (const die of demo.input.dice) {
        expect(publishedDieDigests.has(dieShapeDigest(die.faces)), `${die.name} ${die.faces}`).toBe(false);
      }
    }
  });

  it("names dice after sea birds and gives each its own colour and pattern", () => {
    for (const demo of demoDiceSets) {
      const colours = demo.input.dice.map((die) => die.colour);
      expect(new Set(colours).size).toBe(colours.length);
      for (const die of demo.input.dice)
        expect(die.name).not.toMatch(/^(teal|amber|plum|slate|coral|moss|ocean|sand|red|blue|green|yellow)/i);
    }
  });
});
