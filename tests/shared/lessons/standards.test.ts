import { describe, expect, it } from "vitest";
import { curriculumStandardByCode, curriculumStandardCodes, curriculumStandards } from "@shared/curriculum/standards";
import { emptyLessonInput, lessonInputSchema, lessonObjectiveSchema, LESSON_PHASES } from "@shared/schemas/lessons";

describe("built-in curriculum standards", () => {
  it("holds the Common Core probability codes 7.SP.C.5–8 and HSS-CP.A.1–B.9", () => {
    // Code list of the Common Core State Standards for Mathematics, grade 7 SP cluster C and high-school S-CP (from memory).
    const wanted = [
      "7.SP.C.5",
      "7.SP.C.6",
      "7.SP.C.7",
      "7.SP.C.7a",
      "7.SP.C.7b",
      "7.SP.C.8",
      "7.SP.C.8a",
      "7.SP.C.8b",
      "7.SP.C.8c",
      "HSS-CP.A.1",
      "HSS-CP.A.2",
      "HSS-CP.A.3",
      "HSS-CP.A.4",
      "HSS-CP.A.5",
      "HSS-CP.B.6",
      "HSS-CP.B.7",
      "HSS-CP.B.8",
      "HSS-CP.B.9",
    ];
    for (const code of wanted) expect(curriculumStandardByCode(code)?.label, code).toBe(code);
  });

  it("labels England's statements by key stage only", () => {
    const england = curriculumStandards.filter((standard) => standard.framework === "england-national-curriculum");
    expect(new Set(england.map((standard) => standard.label))).toEqual(new Set(["KS3", "KS4"]));
    expect(england.filter((standard) => standard.label === "KS3").length).toBeGreaterThanOrEqual(4);
  });

  it("has unique codes and a short summary for each", () => {
    expect(new Set(curriculumStandardCodes).size).toBe(curriculumStandardCodes.length);
    for (const standard of curriculumStandards) expect(standard.summary.length).toBeGreaterThan(20);
  });

  it("lets an objective carry a known code or none, and refuses an unknown one", () => {
    expect(lessonObjectiveSchema.safeParse({ text: "Estimate", curriculumCode: "EN-KS4-P5" }).success).toBe(true);
    expect(lessonObjectiveSchema.safeParse({ text: "Estimate" }).success).toBe(true);
    expect(lessonObjectiveSchema.safeParse({ text: "Estimate", curriculumCode: "7.SP.C.9" }).success).toBe(false);
  });
});

describe("lessonInputSchema", () => {
  const valid = { ...emptyLessonInput(), title: "Trio" };

  it("accepts the starting values once titled", () => {
    expect(lessonInputSchema.safeParse(valid).success).toBe(true);
  });

  it("wants all six phases in glossary order", () => {
    const swapped = [...valid.phases];
    [swapped[0], swapped[1]] = [swapped[1], swapped[0]];
    expect(lessonInputSchema.safeParse({ ...valid, phases: swapped }).success).toBe(false);
    expect(valid.phases.map((entry) => entry.phase)).toEqual([...LESSON_PHASES]);
  });

  it("wants at least as many pupils in a group as players", () => {
    const result = lessonInputSchema.safeParse({ ...valid, mode: { dicePerPlayer: 1, players: 3 }, pupilsPerGroup: 2 });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(["pupilsPerGroup"]);
  });

  it("takes only the engine's tie rule strings", () => {
    expect(lessonInputSchema.safeParse({ ...valid, tieRule: "ties-score-half" }).success).toBe(true);
    expect(lessonInputSchema.safeParse({ ...valid, tieRule: "ties-win" }).success).toBe(false);
  });
});
