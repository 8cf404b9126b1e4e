import { describe, expect, it } from "vitest";
import { dieFacesSchema } from "@shared/probability/index";
import { faceErrorMessages, facesFromText } from "@/features/dice-bench/components/faces-field";
import { usableDice } from "@/features/dice-bench/hooks/use-set-analysis";

describe("typing a die's faces as one list", () => {
  it.each([
    ["1, 3, 3, 4", [1, 3, 3, 4]],
    ["1 3 3 4", [1, 3, 3, 4]],
    ["  1;3 ,, 3\t4 ", [1, 3, 3, 4]],
    ["-2, 0, +5", [-2, 0, 5]],
    ["", []],
  ])("reads %j as %j", (text, faces) => {
    expect(facesFromText(text).faces).toEqual(faces);
  });

  it("keeps a word or a decimal as a face the schema refuses, so the error can name it", () => {
    const { faces, tokens } = facesFromText("2, x, 3.5, 1e2");
    expect(tokens).toEqual(["2", "x", "3.5", "1e2"]);
    expect(faces[0]).toBe(2);
    expect(Number.isNaN(faces[1])).toBe(true);
    expect(faces[2]).toBe(3.5);
    expect(Number.isNaN(faces[3])).toBe(true);
  });
});

describe("naming what is wrong with a die's faces", () => {
  it("names each bad face by its position and what was typed, using the shared schema's messages", () => {
    const { faces, tokens } = facesFromText("2, x, 3.5");
    const result = dieFacesSchema.safeParse(faces);
    expect(result.success).toBe(false);
    // Rebuild the nested error shape react-hook-form's zod resolver gives: one entry per face index.
    const error: Record<number, { message: string }> = {};
    for (const issue of result.error!.issues) error[Number(issue.path[0])] = { message: issue.message };
    expect(faceErrorMessages(error, faces, tokens)).toEqual([
      "Face 2 (“x”): Each face value must be a number.",
      "Face 3 (“3.5”): Face values must be whole numbers; 3.5 is not.",
    ]);
  });

  it("puts a message about the whole die first", () => {
    expect(faceErrorMessages({ message: "A die needs at least 2 faces; this one has 1." }, [4])).toEqual([
      "A die needs at least 2 faces; this one has 1.",
    ]);
  });
});

describe("the dice the live analysis can use", () => {
  it("leaves out unnamed dice, dice with bad faces and a repeated name, keeping the rest in order", () => {
    const dice = usableDice([
      { name: "Gannet", faces: [1, 2, 3], colour: "teal", pattern: "dots" },
      { name: "  ", faces: [1, 2], colour: "amber", pattern: "stripes" },
      { name: "Eider", faces: [1, Number.NaN], colour: "plum", pattern: "checks" },
      { name: "gannet", faces: [4, 5], colour: "slate", pattern: "waves" },
      { name: " Shag ", faces: [6, 6], colour: "coral", pattern: "triangles" },
    ]);
    expect(dice).toEqual([
      { name: "Gannet", faces: [1, 2, 3], colour: "teal", pattern: "dots" },
      { name: "Shag", faces: [6, 6], colour: "coral", pattern: "triangles" },
    ]);
  });
});
