import { describe, expect, it } from "vitest";
import { diceSetChecked, InvalidDieError } from "@shared/probability/index";

const petrel = { name: "Petrel", faces: [1, 1, 5, 5, 8, 8] };
const gannet = { name: "Gannet", faces: [3, 3, 3, 6, 6, 6] };

describe("diceSetChecked", () => {
  it("accepts two named dice", () => {
    expect(diceSetChecked([petrel, gannet]).map((die) => die.name)).toEqual(["Petrel", "Gannet"]);
  });

  it.each([
    ["a single die", [petrel], /at least 2 dice/],
    ["eleven dice", Array.from({ length: 11 }, (_, index) => ({ name: `D${index}`, faces: [1, 2] })), /at most 10 dice/],
    ["two dice with one name", [petrel, { ...gannet, name: "Petrel" }], /own name/],
    ["a die without a name", [petrel, { ...gannet, name: " " }], /needs a name/],
    ["a die with a bad face", [petrel, { ...gannet, faces: [1] }], /Die 2: .*at least 2 faces/],
  ])("refuses %s", (_, dice, pattern) => {
    expect(() => diceSetChecked(dice)).toThrow(InvalidDieError);
    expect(() => diceSetChecked(dice)).toThrow(pattern);
  });
});
