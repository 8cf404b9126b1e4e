import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import Papa from "papaparse";
import { v5 as uuidv5 } from "uuid";
import { unescapeFormulaCell } from "@shared/results/csv-text";
import {
  checkPaperImportHeader,
  checkPaperImportRows,
  type CheckedPaperRoll,
  type PaperImportRecord,
} from "@shared/results/paper-import-check";
import { paperImportColumns, type PaperImportColumn } from "@shared/schemas/paper-import";
import type { TallyGridRollsInput } from "@shared/schemas/tally-grid";
import { PAPER_IMPORT_MAX_ROWS, type PaperImportOptions, type PaperImportResult, type ResultsTally } from "@shared/schemas/results";
import { db } from "../db/client";
import {
  findPaperImportByHash,
  findRollsByIds,
  insertPaperImport,
  listRunGroups,
  type NewPaperRoll,
  type ResultsRunListRecord,
} from "../db/queries/results";
import { HttpError } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";
import { assertOwnsRun, runTallies, visibleRun } from "./results.service";

/** Namespace of Outroll's Paper import roll ids (UUID version 5, RFC 9562), fixed once so ids stay the same across uploads. */
const PAPER_ROLL_NAMESPACE = "bb1ac581-cfc2-4071-84d9-316f8ea454da";

/** The same roll of the same group in the same tally of a run always gets this id, so an edited re-upload cannot store it twice. */
export function paperRollId(runId: string, tally: number, nickname: string, rollNumber: number): string {
  return uuidv5(`${runId}/${tally}/${nickname.trim().toLowerCase()}/${rollNumber}`, PAPER_ROLL_NAMESPACE);
}

function isUniqueViolation(error: unknown): boolean {
  const codeOf = (value: unknown) =>
    typeof value === "object" && value !== null && "code" in value ? (value as { code: unknown }).code : undefined;
  return codeOf(error) === "23505" || codeOf((error as { cause?: unknown } | null)?.cause) === "23505";
}

/** The uploaded file as the service receives it from multer. */
export type PaperUpload = { originalName: string; buffer: Buffer };

const invalidFile = (message: string) => new HttpError(422, "invalid_paper_import", message);

/**
 * The text encoding of an upload from its byte order mark (UTF-8, UTF-16 LE or BE), or from the zero bytes UTF-16
 * puts beside every ASCII character when a spreadsheet saved "Unicode text" without one; otherwise UTF-8.
 */
function textEncodingOf(bytes: Buffer): { encoding: "utf-8" | "utf-16le" | "utf-16be"; bomLength: number } {
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return { encoding: "utf-8", bomLength: 3 };
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return { encoding: "utf-16le", bomLength: 2 };
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return { encoding: "utf-16be", bomLength: 2 };
  if (bytes.length >= 4 && bytes[0] !== 0 && bytes[1] === 0 && bytes[2] !== 0 && bytes[3] === 0)
    return { encoding: "utf-16le", bomLength: 0 };
  if (bytes.length >= 4 && bytes[0] === 0 && bytes[1] !== 0 && bytes[2] === 0 && bytes[3] !== 0)
    return { encoding: "utf-16be", bomLength: 0 };
  return { encoding: "utf-8", bomLength: 0 };
}

const unreadableText = () =>
  new HttpError(
    400,
    "invalid_input",
    "The file's text could not be read: it is not saved as UTF-8 or UTF-16. In your spreadsheet choose “Save as” → “CSV UTF-8” and upload again.",
  );

/** Reads the upload as CSV text (UTF-8 with or without a byte order mark, or UTF-16); refuses binary files (a workbook, a PDF, a photo). */
async function csvText(upload: PaperUpload): Promise<string> {
  if (upload.buffer.length === 0) throw invalidFile("The file is empty. Type the rolls into a spreadsheet and save it as CSV.");
  const { encoding, bomLength } = textEncodingOf(upload.buffer);
  // Sniffing a binary type only makes sense for bytes that are not UTF-16 text: its zero bytes look like audio to file-type.
  const detected = encoding === "utf-8" && bomLength === 0 ? await fileTypeFromBuffer(upload.buffer) : undefined;
  if (detected) {
    throw new HttpError(
      415,
      "not_csv",
      `This file is ${detected.ext.toUpperCase()} (${detected.mime}), not CSV. In your spreadsheet choose “Save as” → “CSV UTF-8” and upload that file.`,
    );
  }
  let text: string;
  try {
    text = new TextDecoder(encoding, { fatal: true }).decode(upload.buffer.subarray(bomLength));
  } catch {
    throw unreadableText();
  }
  if (text.includes("\u0000")) throw unreadableText();
  return text;
}

/** Parses the CSV with papaparse (RFC 4180; comma, semicolon or tab) into a header and numbered records. */
function parseCsv(text: string, players: number): { records: PaperImportRecord[]; errors: PaperImportResult["errors"] } {
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false, delimitersToGuess: [",", ";", "\t"] });
  const errors = new Map<number, string[]>();
  for (const problem of parsed.errors) {
    if (problem.code === "UndetectableDelimiter") continue;
    const row = (problem.row ?? 0) + 1;
    errors.set(row, [...(errors.get(row) ?? []), `The CSV is malformed here: ${problem.message}.`]);
  }
  const [header, ...lines] = parsed.data;
  if (!header || header.every((cell) => cell.trim() === ""))
    throw invalidFile(`The first row must name the columns: ${paperImportColumns.join(", ")}.`);
  const { positions, messages } = checkPaperImportHeader(header, players);
  if (messages.length > 0) throw invalidFile(messages.join(" "));
  const records: PaperImportRecord[] = [];
  lines.forEach((cells, index) => {
    if (cells.every((cell) => cell.trim() === "")) return;
    const entries = (Object.entries(positions) as [PaperImportColumn, number][]).map(([column, position]) => [
      column,
      unescapeFormulaCell(cells[position] ?? ""),
    ]);
    records.push({ row: index + 2, cells: Object.fromEntries(entries) });
  });
  if (records.length === 0) throw invalidFile("The file has a header row but no rolls under it.");
  if (records.length > PAPER_IMPORT_MAX_ROWS)
    throw invalidFile(
      `The file has ${records.length} rolls; one upload takes at most ${PAPER_IMPORT_MAX_ROWS}. Split it into several files.`,
    );
  return { records, errors: [...errors.entries()].map(([row, list]) => ({ row, messages: list })) };
}

type PreparedImport = {
  run: ResultsRunListRecord;
  mode: ResultsTally;
  fileHash: string;
  rolls: CheckedPaperRoll[];
  result: PaperImportResult;
};

/** The run, if the teacher owns it, and the mode of the tally asked for. */
async function runAndMode(teacher: TeacherContext, runId: string, tally: number) {
  const run = await visibleRun(teacher, runId);
  assertOwnsRun(teacher, run, "import rolls into it");
  const mode = runTallies(run).find((entry) => entry.tally === tally);
  if (!mode)
    throw invalidFile(
      `This run has no tally ${tally}; its rolls belong to tally ${runTallies(run)
        .map((entry) => entry.tally)
        .join(" or ")}.`,
    );
  return { run, mode };
}

/** Checks an upload against the run and compares it with what is stored, without writing anything. */
async function prepare(teacher: TeacherContext, runId: string, upload: PaperUpload, options: PaperImportOptions): Promise<PreparedImport> {
  const { run, mode } = await runAndMode(teacher, runId, options.tally);
  const text = await csvText(upload);
  const fileHash = createHash("sha256").update(upload.buffer).digest("hex");
  const { records, errors: parseErrors } = parseCsv(text, mode.players);
  return prepareRecords(run, mode, records, parseErrors, { fileHash, fileName: upload.originalName, createGroups: options.createGroups });
}

/** Checks numbered records (from a CSV file or the tally grid) against the run and compares them with what is stored. */
async function prepareRecords(
  run: ResultsRunListRecord,
  mode: ResultsTally,
  records: PaperImportRecord[],
  parseErrors: PaperImportResult["errors"],
  source: { fileHash: string; fileName: string; createGroups: boolean },
): Promise<PreparedImport> {
  const { fileHash } = source;
  const options = { createGroups: source.createGroups };
  const runId = run.id;
  // Removed groups too: a sheet naming one files its rolls under it (set aside like the rest), not under a clashing new group.
  const groups = await listRunGroups(db, runId, { withRemoved: true });
  const check = checkPaperImportRows(
    { dice: run.dice, dicePerPlayer: mode.dicePerPlayer, players: mode.players, groups, createGroups: options.createGroups },
    records,
  );
  const errorsByRow = new Map<number, string[]>();
  for (const entry of [...parseErrors, ...check.errors])
    errorsByRow.set(entry.row, [...(errorsByRow.get(entry.row) ?? []), ...entry.messages]);
  const errors = [...errorsByRow.entries()].sort(([a], [b]) => a - b).map(([row, messages]) => ({ row, messages }));

  const ids = check.rolls.map((entry) => paperRollId(run.id, mode.tally, entry.group, entry.rollNumber));
  const stored = new Map((await findRollsByIds(db, ids)).map((entry) => [entry.id, entry]));
  const names = run.dice.map((die) => die.name);
  const newGroupKeys = new Set(check.newGroups.map((nickname) => nickname.toLowerCase()));
  let newRows = 0;
  let duplicateRows = 0;
  const rows = check.rolls.map((entry, index) => {
    const existing = stored.get(ids[index]);
    const same =
      existing !== undefined &&
      JSON.stringify(existing.matchup) === JSON.stringify(entry.matchup) &&
      JSON.stringify(existing.faces) === JSON.stringify(entry.faces);
    const status = existing === undefined ? ("new" as const) : same ? ("present" as const) : ("present-but-different" as const);
    if (status === "new") newRows += 1;
    else duplicateRows += 1;
    return {
      row: entry.row,
      group: entry.group,
      rollNumber: entry.rollNumber,
      dieNames: entry.matchup.map((dieIndex) => names[dieIndex]),
      faces: entry.faces,
      totals: entry.totals,
      winner: entry.winnerSeat === null ? null : names[entry.matchup[entry.winnerSeat]],
      newGroup: newGroupKeys.has(entry.group.toLowerCase()),
      status,
    };
  });
  const earlier = await findPaperImportByHash(db, run.id, fileHash);
  return {
    run,
    mode,
    fileHash,
    rolls: check.rolls,
    result: {
      fileName: source.fileName,
      rows,
      errors,
      newRows,
      duplicateRows,
      newGroups: check.newGroups,
      alreadyImportedAt: earlier?.createdAt.toISOString() ?? null,
      imported: false,
    },
  };
}

/** The Paper import preview: every row checked, errors by row number, and how many rows are new or already stored. */
export async function previewPaperImport(
  teacher: TeacherContext,
  runId: string,
  upload: PaperUpload,
  options: PaperImportOptions,
): Promise<PaperImportResult> {
  return (await prepare(teacher, runId, upload, options)).result;
}

/**
 * Imports every row in one transaction, or none: a file with any bad row is refused whole (422, each row's problems
 * in `fields` under "row N"); the same file again, or rows already stored, add nothing.
 */
export async function commitPaperImport(
  teacher: TeacherContext,
  runId: string,
  upload: PaperUpload,
  options: PaperImportOptions,
): Promise<PaperImportResult> {
  return commitPrepared(teacher, await prepare(teacher, runId, upload, options), upload.originalName);
}

/**
 * Stores rolls typed into the tally grid: the rows go through the same checks and ids as a Paper import file, all
 * stored in one transaction or none (422 with each row's problems), and rows already stored add nothing.
 */
export async function commitTallyGridRolls(teacher: TeacherContext, runId: string, input: TallyGridRollsInput): Promise<PaperImportResult> {
  const { run, mode } = await runAndMode(teacher, runId, input.tally);
  // Rows are numbered as the grid shows them: by the roll's line number, or its place in the list when that is not a number.
  const records: PaperImportRecord[] = input.rows.map((cells, index) => ({
    row: /^\d+$/.test(cells.roll.trim()) ? Number(cells.roll) : index + 1,
    cells,
  }));
  const fileHash = createHash("sha256").update(JSON.stringify(input.rows)).digest("hex");
  const prepared = await prepareRecords(run, mode, records, [], { fileHash, fileName: "tally grid", createGroups: input.createGroups });
  return commitPrepared(teacher, prepared, "tally grid", "save again");
}

async function commitPrepared(
  teacher: TeacherContext,
  prepared: PreparedImport,
  fileName: string,
  again = "upload the file again",
): Promise<PaperImportResult> {
  const { result, run, mode } = prepared;
  if (result.errors.length > 0) {
    const count = result.errors.length;
    throw new HttpError(
      422,
      "paper_import_invalid",
      `${count} ${count === 1 ? "row has" : "rows have"} problems, so nothing was imported. Correct ${count === 1 ? "it" : "them"} and ${again}.`,
      Object.fromEntries(result.errors.map((entry) => [`row ${entry.row}`, entry.messages])),
    );
  }
  if (result.alreadyImportedAt !== null) return result;
  const start = Date.now();
  const outcome = await insertPaperImport(db, {
    runId: run.id,
    fileHash: prepared.fileHash,
    fileName: fileName.slice(0, 200),
    rowCount: prepared.rolls.length,
    importedById: teacher.user.id,
    newGroups: result.newGroups,
    rollsFor: (createdGroupIds): NewPaperRoll[] =>
      prepared.rolls.map((entry, index) => ({
        id: paperRollId(run.id, mode.tally, entry.group, entry.rollNumber),
        groupId: entry.groupId ?? createdGroupIds.get(entry.group.toLowerCase())!,
        tally: mode.tally,
        dicePerPlayer: mode.dicePerPlayer,
        matchup: entry.matchup,
        faces: entry.faces,
        totals: entry.totals,
        winnerSeat: entry.winnerSeat,
        // Sheets carry no times: the import time, one millisecond apart, keeps the sheet's order in the convergence chart.
        recordedAt: new Date(start + index),
      })),
  }).catch((error: unknown) => {
    // A group of the same nickname made meanwhile (another tab, a phone joining) breaks the unique nickname index.
    if (isUniqueViolation(error)) return "conflict" as const;
    throw error;
  });
  if (outcome === "conflict") {
    throw new HttpError(
      409,
      "import_conflict",
      "The run's groups changed while this file was imported, so nothing was stored. Check the file again.",
    );
  }
  if (outcome.duplicateFile) return { ...result, alreadyImportedAt: new Date().toISOString() };
  return { ...result, newRows: outcome.inserted, duplicateRows: prepared.rolls.length - outcome.inserted, imported: true };
}
