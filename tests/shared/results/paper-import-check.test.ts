import { describe, expect, it } from "vitest";
import {
  checkPaperImportHeader,
  checkPaperImportRows,
  winnerSeatOfTotals,
  type PaperImportContext,
} from "@shared/results/paper-import-check";
import { paperImportColumns } from "@shared/schemas/paper-import";

const dice = [
  { name: "Skua", faces: [1, 5, 10, 12, 13, 15] },
  { name: "Tern", faces: [4, 7, 8, 9, 11, 18] },
  { name: "Gannet", faces: [2, 3, 6, 14, 16, 17] },
];
const context: PaperImportContext = {
  dice,
  dicePerPlayer: 1,
  players: 2,
  groups: [{ id: "g1", nickname: "Puffins" }],
  createGroups: false,
};
const row = (cells: string[], number = 2) => ({
  row: number,
  cells: Object.fromEntries(paperImportColumns.map((column, index) => [column, cells[index] ?? ""])),
});

describe("checkPaperImportHeader", () => {
  it("accepts the sheet's columns, also written with capitals and spaces, and gives each one's position", () => {
    const { positions, messages } = checkPaperImportHeader(["Group", "Roll", "Die 1", "Faces 1", "die_2", "faces_2"], 2);
    expect(messages).toEqual([]);
    expect(positions).toEqual({ group: 0, roll: 1, die_1: 2, faces_1: 3, die_2: 4, faces_2: 5 });
  });

  it.each([
    [["group", "roll", "die_1", "faces_1", "die_2"], 2, "missing faces_2"],
    [["group", "roll", "die_1", "faces_1", "die_2", "faces_2"], 3, "missing die_3, faces_3"],
    [["group", "roll", "die_1", "faces_1", "die_2", "faces_2", "pupil"], 2, 'Column "pupil" is not part'],
    [["group", "group", "roll", "die_1", "faces_1", "die_2", "faces_2"], 2, "group appears twice"],
  ])("refuses header %j with %i players: %s", (header, players, message) => {
    expect(checkPaperImportHeader(header, players).messages.join(" ")).toContain(message);
  });
});

describe("checkPaperImportRows", () => {
  it("turns a good row into a roll with the run's die indexes, totals and winner", () => {
    const { rolls, errors } = checkPaperImportRows(context, [row(["puffins", "1", "tern", "11", "Skua", "10"])]);
    expect(errors).toEqual([]);
    expect(rolls).toEqual([
      { row: 2, group: "Puffins", groupId: "g1", rollNumber: 1, matchup: [1, 0], faces: [[11], [10]], totals: [11, 10], winnerSeat: 0 },
    ]);
  });

  it.each([
    [["Puffins", "1", "Kestrel", "10", "Tern", "9"], '"Kestrel" is not a die'],
    [["Puffins", "1", "Skua", "7", "Tern", "9"], "Skua has no face 7 (its faces are 1, 5, 10, 12, 13, 15)"],
    [["Puffins", "1", "Skua", "10+12", "Tern", "9"], "write 1 face; found 2"],
    [["Puffins", "1", "Skua", "10", "Skua", "12"], "a matchup needs different dice"],
    [["Puffins", "1", "Skua", "10", "Tern", "9", "Gannet", "2"], "This run has two players"],
    [["Herons", "1", "Skua", "10", "Tern", "9"], 'This run has no group "Herons" (its groups: Puffins)'],
    [["Puffins", "0", "Skua", "10", "Tern", "9"], "Rolls count from 1"],
    [["Puffins", "1", "Skua", "ten", "Tern", "9"], "whole numbers joined by +"],
    [["", "1", "Skua", "10", "Tern", "9"], "Write the group's nickname"],
  ])("refuses %j: %s", (cells, message) => {
    const { rolls, errors } = checkPaperImportRows(context, [row(cells, 7)]);
    expect(rolls).toEqual([]);
    expect(errors).toHaveLength(1);
    expect(errors[0].row).toBe(7);
    expect(errors[0].messages.join(" ")).toContain(message);
  });

  it("creates a group only when asked, once, with the spelling of its first row", () => {
    const rows = [row(["Herons", "1", "Skua", "10", "Tern", "9"], 2), row(["herons", "2", "Skua", "1", "Tern", "9"], 3)];
    const check = checkPaperImportRows({ ...context, createGroups: true }, rows);
    expect(check.errors).toEqual([]);
    expect(check.newGroups).toEqual(["Herons"]);
    expect(check.rolls.map((entry) => [entry.group, entry.groupId])).toEqual([
      ["Herons", null],
      ["Herons", null],
    ]);
  });

  it("names both rows of a roll number repeated within a group", () => {
    const rows = [row(["Puffins", "3", "Skua", "10", "Tern", "9"], 2), row(["PUFFINS", "3", "Skua", "1", "Tern", "9"], 5)];
    const { errors } = checkPaperImportRows(context, rows);
    expect(errors).toEqual([{ row: 5, messages: ["roll: Group PUFFINS has roll 3 twice in this file (rows 2 and 5)."] }]);
  });

  it("checks two dice each and three players against the run's mode", () => {
    const three = { ...context, players: 3, dicePerPlayer: 2 };
    const good = checkPaperImportRows(three, [row(["Puffins", "1", "Skua", "10+15", "Tern", "9 + 18", "Gannet", "2+3"])]);
    expect(good.errors).toEqual([]);
    expect(good.rolls[0]).toMatchObject({
      faces: [
        [10, 15],
        [9, 18],
        [2, 3],
      ],
      totals: [25, 27, 5],
      winnerSeat: 1,
    });
    const missing = checkPaperImportRows(three, [row(["Puffins", "1", "Skua", "10+15", "Tern", "9+18"])]);
    expect(missing.errors[0].messages.join(" ")).toContain("This run has three players");
  });
});

describe("winnerSeatOfTotals", () => {
  it.each([
    [[5, 3], 0],
    [[3, 5], 1],
    [[4, 4], null],
    [[2, 6, 6], null],
    [[2, 6, 5], 1],
  ])("totals %j → seat %s", (totals, seat) => {
    expect(winnerSeatOfTotals(totals)).toBe(seat);
  });
});
