import { describe, expect, it } from "vitest";
import {
  RECORDING_SHEET_ROWS_MAX,
  RECORDING_SHEET_ROWS_PER_PAGE,
  recordingSheetColumns,
  recordingSheetPages,
  recordingSheetPlanFromParams,
} from "@shared/results/recording-sheet-layout";

describe("the group recording sheet follows the lesson", () => {
  it.each([
    [2, 1, ["Roll", "Player 1 rolled", "Player 2 rolled", "Who won?"]],
    [3, 1, ["Roll", "Player 1 rolled", "Player 2 rolled", "Player 3 rolled", "Who won?"]],
    [2, 2, ["Roll", "Player 1 rolled", "Player 2 rolled", "Who won?"]],
  ])("has a column for each of %i players with %i dice each, under plain headings", (players, dicePerPlayer, headings) => {
    const columns = recordingSheetColumns({ players, dicePerPlayer });
    expect(columns.map((column) => column.heading)).toEqual(headings);
    // No spreadsheet names on a pupil's sheet.
    expect(columns.some((column) => /_/.test(column.heading))).toBe(false);
    expect(columns.filter((column) => column.csvColumn?.startsWith("faces_")).length).toBe(players);
  });

  it("asks for both numbers with two dice each", () => {
    expect(recordingSheetColumns({ players: 2, dicePerPlayer: 2 })[1].help).toContain("both numbers");
    expect(recordingSheetColumns({ players: 2, dicePerPlayer: 1 })[1].help).not.toContain("both");
  });

  it("numbers a line for every planned roll, continuing over pages", () => {
    expect(recordingSheetPages(20)).toEqual([Array.from({ length: 20 }, (_, index) => index + 1)]);
    const thirty = recordingSheetPages(30);
    expect(thirty.map((page) => page.length)).toEqual([RECORDING_SHEET_ROWS_PER_PAGE, 30 - RECORDING_SHEET_ROWS_PER_PAGE]);
    expect(thirty.flat()).toEqual(Array.from({ length: 30 }, (_, index) => index + 1));
    expect(recordingSheetPages(5000).flat().length).toBe(RECORDING_SHEET_ROWS_MAX);
  });

  it("reads the plan from the print address, ignoring values out of range", () => {
    expect(recordingSheetPlanFromParams(new URLSearchParams("rolls=30&players=3&dice=2"))).toEqual({
      rolls: 30,
      players: 3,
      dicePerPlayer: 2,
    });
    expect(recordingSheetPlanFromParams(new URLSearchParams("rolls=0&players=4&dice=x"))).toEqual({
      rolls: 20,
      players: 2,
      dicePerPlayer: 1,
    });
  });
});
