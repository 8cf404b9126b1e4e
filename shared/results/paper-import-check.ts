import { paperImportColumns, paperImportRowSchema, type PaperImportColumn } from "../schemas/paper-import";

/** What a Paper import file is checked against: the run's own copy of the dice and mode, and its groups. */
export type PaperImportContext = {
  dice: readonly { name: string; faces: readonly number[] }[];
  dicePerPlayer: number;
  players: number;
  groups: readonly { id: string; nickname: string }[];
  /** When true, a nickname the run does not know becomes a new group; otherwise it is an error. */
  createGroups: boolean;
};

/** One data row of the file: its spreadsheet row number (header = row 1) and its cells by column name. */
export type PaperImportRecord = { row: number; cells: Partial<Record<PaperImportColumn, string>> };

/** A row that passed every check, ready to store as a roll. */
export type CheckedPaperRoll = {
  row: number;
  /** The nickname as stored: the existing group's spelling, or the file's for a new group. */
  group: string;
  /** The existing group's id; null for a group the import creates. */
  groupId: string | null;
  rollNumber: number;
  matchup: number[];
  faces: number[][];
  totals: number[];
  /** Seat with the single highest total; null when the highest total is shared (a tie). */
  winnerSeat: number | null;
};

export type PaperImportCheck = {
  rolls: CheckedPaperRoll[];
  errors: { row: number; messages: string[] }[];
  /** Nicknames of the groups the import would create, in file order. */
  newGroups: string[];
};

/** A header cell as a column name: trimmed, lower case, spaces and hyphens as underscores ("Die 1" → "die_1"). */
export function normaliseHeaderCell(cell: string): string {
  return cell
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, "_");
}

/**
 * Checks the header row against the Paper import columns (shared/schemas/paper-import.ts): every column the run's
 * player count needs, no unknown or repeated column. Answers each column's position, or the problems found.
 */
export function checkPaperImportHeader(
  header: readonly string[],
  players: number,
): { positions: Partial<Record<PaperImportColumn, number>>; messages: string[] } {
  const positions: Partial<Record<PaperImportColumn, number>> = {};
  const messages: string[] = [];
  const known = new Set<string>(paperImportColumns);
  header.forEach((cell, index) => {
    const name = normaliseHeaderCell(cell);
    if (name === "") return;
    if (!known.has(name)) {
      messages.push(`Column "${cell.trim()}" is not part of the Paper import format; the columns are ${paperImportColumns.join(", ")}.`);
      return;
    }
    const column = name as PaperImportColumn;
    if (positions[column] !== undefined) messages.push(`Column ${column} appears twice in the header row.`);
    else positions[column] = index;
  });
  const required = paperImportColumns.filter((column) => players === 3 || (column !== "die_3" && column !== "faces_3"));
  const missing = required.filter((column) => positions[column] === undefined);
  if (missing.length > 0)
    messages.push(`The header row is missing ${missing.join(", ")}. The first row must name the columns ${required.join(", ")}.`);
  return { positions, messages };
}

function distinctFaces(faces: readonly number[]): string {
  return [...new Set(faces)].sort((a, b) => a - b).join(", ");
}

/** Seat of the single highest total, or null when the highest total is shared. */
export function winnerSeatOfTotals(totals: readonly number[]): number | null {
  const highest = Math.max(...totals);
  const seats = totals.flatMap((total, seat) => (total === highest ? [seat] : []));
  return seats.length === 1 ? seats[0] : null;
}

/**
 * Checks every row of a Paper import against the run: the row's shape (paperImportRowSchema), a known group (or a new
 * one when allowed), dice of the run's set, distinct dice, the run's number of players and dice per player, faces that
 * exist on those dice, and no roll number repeated within a group. Each problem names its row.
 */
export function checkPaperImportRows(context: PaperImportContext, records: readonly PaperImportRecord[]): PaperImportCheck {
  const dieIndexByName = new Map(context.dice.map((die, index) => [die.name.trim().toLowerCase(), index]));
  const groupByNickname = new Map(context.groups.map((group) => [group.nickname.trim().toLowerCase(), group]));
  const setDieNames = context.dice.map((die) => die.name).join(", ");
  const newGroups = new Map<string, string>();
  const seenRolls = new Map<string, number>();
  const rolls: CheckedPaperRoll[] = [];
  const errors: PaperImportCheck["errors"] = [];
  const facesWord = context.dicePerPlayer === 1 ? "1 face" : `${context.dicePerPlayer} faces joined by +`;

  for (const record of records) {
    const messages: string[] = [];
    const parsed = paperImportRowSchema.safeParse({
      group: record.cells.group ?? "",
      roll: record.cells.roll ?? "",
      die_1: record.cells.die_1 ?? "",
      faces_1: record.cells.faces_1 ?? "",
      die_2: record.cells.die_2 ?? "",
      faces_2: record.cells.faces_2 ?? "",
      die_3: record.cells.die_3 ?? "",
      faces_3: record.cells.faces_3 ?? "",
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) messages.push(`${issue.path.join(".") || "row"}: ${issue.message}`);
      errors.push({ row: record.row, messages });
      continue;
    }
    const value = parsed.data;
    const seats: { die: string; faces: number[] | "" }[] = [
      { die: value.die_1, faces: value.faces_1 },
      { die: value.die_2, faces: value.faces_2 },
    ];
    const thirdGiven = value.die_3 !== "" || value.faces_3 !== "";
    if (context.players === 3) {
      if (value.die_3 === "") messages.push("die_3: This run has three players; name the third player's die.");
      if (value.faces_3 === "") messages.push("faces_3: This run has three players; write the face the third player rolled.");
      seats.push({ die: value.die_3, faces: value.faces_3 });
    } else if (thirdGiven) {
      messages.push("die_3: This run has two players; leave die_3 and faces_3 empty.");
    }

    const matchup: number[] = [];
    const faces: number[][] = [];
    seats.forEach((seat, position) => {
      const column = position + 1;
      if (seat.die === "" || seat.faces === "") return;
      const dieIndex = dieIndexByName.get(seat.die.trim().toLowerCase());
      if (dieIndex === undefined) {
        messages.push(`die_${column}: "${seat.die}" is not a die of this run's set (${setDieNames}).`);
        return;
      }
      const die = context.dice[dieIndex];
      if (matchup.includes(dieIndex)) {
        messages.push(`die_${column}: ${die.name} is already the die of another player in this row; a matchup needs different dice.`);
      }
      if (seat.faces.length !== context.dicePerPlayer) {
        messages.push(
          `faces_${column}: This run is ${context.dicePerPlayer === 1 ? "one die each" : `${context.dicePerPlayer} dice each`}: write ${facesWord}; found ${seat.faces.length}.`,
        );
      }
      const missingFaces = [...new Set(seat.faces.filter((face) => !die.faces.includes(face)))];
      for (const face of missingFaces) {
        messages.push(`faces_${column}: ${die.name} has no face ${face} (its faces are ${distinctFaces(die.faces)}).`);
      }
      matchup.push(dieIndex);
      faces.push(seat.faces);
    });

    const groupKey = value.group.toLowerCase();
    const known = groupByNickname.get(groupKey);
    let storedNickname = known?.nickname ?? newGroups.get(groupKey) ?? value.group;
    if (!known && !newGroups.has(groupKey)) {
      if (context.createGroups) {
        newGroups.set(groupKey, value.group);
        storedNickname = value.group;
      } else {
        const knownNames = context.groups.map((group) => group.nickname).join(", ");
        messages.push(
          `group: This run has no group "${value.group}"${knownNames ? ` (its groups: ${knownNames})` : " yet"}. Correct the nickname, or tick "Create groups that are new".`,
        );
      }
    }

    const rollKey = `${groupKey}\u0000${value.roll}`;
    const firstRow = seenRolls.get(rollKey);
    if (firstRow !== undefined)
      messages.push(`roll: Group ${value.group} has roll ${value.roll} twice in this file (rows ${firstRow} and ${record.row}).`);
    else seenRolls.set(rollKey, record.row);

    if (messages.length > 0 || faces.length !== seats.length) {
      errors.push({ row: record.row, messages });
      continue;
    }
    const totals = faces.map((list) => list.reduce((sum, face) => sum + face, 0));
    rolls.push({
      row: record.row,
      group: storedNickname,
      groupId: known?.id ?? null,
      rollNumber: value.roll,
      matchup,
      faces,
      totals,
      winnerSeat: winnerSeatOfTotals(totals),
    });
  }
  return { rolls, errors, newGroups: [...newGroups.values()] };
}
