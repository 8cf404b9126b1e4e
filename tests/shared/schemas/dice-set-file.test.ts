import { describe, expect, it } from "vitest";
import { checkDiceSetFile, diceSetFileName, diceSetToFile, issuePathText } from "@shared/schemas/dice-set-file";

const set = {
  name: "Kittiwake trio",
  description: "",
  dice: [
    { name: "Puffin", faces: [1, 1, 6, 6, 7, 11], colour: "teal", pattern: "dots" },
    { name: "Gannet", faces: [3, 3, 4, 4, 5, 10], colour: "amber", pattern: "stripes" },
  ],
};

describe("dice set file", () => {
  it.each([
    [["dice", 2, "faces", 4], "dice[2].faces[4]"],
    [["name"], "name"],
    [[], ""],
    [["dice", 0], "dice[0]"],
  ] as const)("writes the path %j as %s", (path, text) => {
    expect(issuePathText(path)).toBe(text);
  });

  it("reads back what it writes", () => {
    const file = diceSetToFile(set, new Date("2026-03-02T10:00:00Z"));
    expect(file).toMatchObject({ format: "outroll-dice-set", version: 1, exportedAt: "2026-03-02T10:00:00.000Z" });
    const checked = checkDiceSetFile(JSON.parse(JSON.stringify(file)));
    expect(checked.ok && checked.file.dice).toEqual(set.dice);
  });

  it("lists every problem with where it is", () => {
    const checked = checkDiceSetFile({
      format: "outroll-dice-set",
      version: 2,
      name: "",
      dice: [{ name: "Puffin", faces: [1.5, 2], colour: "teal", pattern: "dots" }],
    });
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    expect(checked.issues).toEqual([
      'version: This file\'s version is not one Outroll reads: "version" must be 1.',
      "name: Name the dice set.",
      "dice[0].faces[0]: Face values must be whole numbers; 1.5 is not.",
    ]);
    const oneDie = checkDiceSetFile({ format: "outroll-dice-set", version: 1, name: "Lonely", dice: [set.dice[0]] });
    expect(!oneDie.ok && oneDie.issues).toEqual(["dice: A dice set needs at least 2 dice."]);
  });

  it("makes a file name from the set's name", () => {
    expect(diceSetFileName("Kittiwake trio")).toBe("kittiwake-trio.outroll-dice.json");
    expect(diceSetFileName("Año: 9M / Set #2")).toBe("ano-9m-set-2.outroll-dice.json");
    expect(diceSetFileName("???")).toBe("dice-set.outroll-dice.json");
  });
});
