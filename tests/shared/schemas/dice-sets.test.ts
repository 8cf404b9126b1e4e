import { describe, expect, it } from "vitest";
import { checkDiceSetFile } from "@shared/schemas/dice-set-file";
import { diePalette, paletteEntryForName, setDieSchema } from "@shared/schemas/dice-sets";

// The palette as it was before the usual dice colours joined it: stored sets and set files carry these pairs.
const originalPalette = [
  ["teal", "dots"],
  ["amber", "stripes"],
  ["plum", "checks"],
  ["slate", "waves"],
  ["coral", "triangles"],
  ["moss", "crosses"],
  ["ocean", "rings"],
  ["sand", "zigzags"],
];

describe("the die palette", () => {
  it("still accepts every colour and pattern of the original palette, so old sets and files load", () => {
    for (const [colour, pattern] of originalPalette)
      expect(setDieSchema.safeParse({ name: "Gannet", faces: [1, 2, 3], colour, pattern }).success).toBe(true);
    const oldFile = {
      format: "outroll-dice-set",
      version: 1,
      name: "Tern ladder",
      dice: originalPalette.map(([colour, pattern], index) => ({
        name: `Tern ${index + 1}`,
        faces: [index, index + 2, index + 4],
        colour,
        pattern,
      })),
    };
    const checked = checkDiceSetFile(oldFile);
    expect(checked.ok).toBe(true);
  });

  it("offers the usual dice colours", () => {
    const colours = diePalette.map((entry) => entry.colour);
    for (const usual of ["red", "blue", "green", "yellow", "white", "black", "orange", "purple", "pink", "grey"])
      expect(colours).toContain(usual);
  });

  it("gives every colour a pattern of its own, so no die is told apart by colour alone", () => {
    expect(new Set(diePalette.map((entry) => entry.pattern)).size).toBe(diePalette.length);
    expect(new Set(diePalette.map((entry) => entry.colour)).size).toBe(diePalette.length);
  });

  it.each([
    ["Red", "red"],
    ["big RED die", "red"],
    ["Gray", "grey"],
    ["Violet", "purple"],
    ["Teal", "teal"],
    ["Blue-green", "blue"],
  ])("suggests the colour the name %s asks for (%s)", (name, colour) => {
    expect(paletteEntryForName(name)?.colour).toBe(colour);
  });

  it.each(["Gannet", "Redshank", "Die 3", ""])("suggests no colour for %j", (name) => {
    expect(paletteEntryForName(name)).toBeNull();
  });
});
