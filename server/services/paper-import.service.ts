import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import Papa from "papaparse";
import { v5 as uuidv5 } from "uuid";
import { checkPaperImportHeader, checkPaperImportRows, type CheckedPaperRoll, type PaperImportRecord } from "@shared/results/paper-import-check";
import { paperImportColumns, type PaperImportColumn } from "@shared/schemas/paper-import";
import { PAPER_IMPORT_MAX_ROWS, type PaperImportOptions, type PaperImportResult, type ResultsTally } from "@shared/schemas/results";
import { db } from "../db/client";
import { findPaperImportByHash, findRollsByIds, insertPaperImport, listRunGroups, type NewPaperRoll, type ResultsRunListRecord } from "../db/queries/results";
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
  const codeOf = (value: unknown) => (typeof value === "object" && value !== null && "code" in value ? (value as { code: unknown }).code : undefined);
  return codeOf(error) === "23505" || codeOf((error as { cause?: unknown } | null)?.cause) === "23505";
}

/** The uploaded file as the service receives it from multer. */
export type PaperUpload = { originalName: string; buffer: Buffer };

const invalidFile = (message: string) => new HttpError(422, "invalid_paper_import", message);

/** Reads the upload as CSV text: refuses binary files (a workbook, a PDF, a photo) and text that is not UTF-8. */
async function csvText(upload: PaperUpload): Promise<string> {
  if (upload.buffer.length === 0) throw invalidFile("The file is empty. Type the rolls into a spreadsheet and save it as CSV.");
  const detected = await fileTypeFromBuffer(upload.buffer);
  if (detected) {
    throw new HttpError(
      415,
      "not_csv",
      `This file is ${detected.ext.toUpperCase()} (${detected.mime}), not CSV. In your spreadsheet choose “Save as” → “CSV UTF-8” and upload that file.`,
    );
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(upload.buffer).replace(/^\ufeff/, "");
  } catch {
    throw invalidFile("The file is not UTF-8 text. In your spreadsheet choose “Save as” → “CSV UTF-8” and upload again.");
  }
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
  if (!header || header.every((cell) => cell.trim() === "")) throw invalidFile(`The first row must name the columns: ${paperImportColumns.join(", ")}.`);
  const { positions, messages } = checkPaperImportHeader(header, players);
  if (messages.length > 0) throw invalidFile(messages.join(" "));
  const records: PaperImportRecord[] = [];
  lines.forEach((cells, index) => {
    if (cells.every((cell) => cell.trim() === "")) return;
    const entries = (Object.entries(positions) as [PaperImportColumn, number][]).map(([column, position]) => [column, cells[position] ?? ""]);
    records.push({ row: index + 2, cells: Object.fromEntries(entries) });
  });
  if (records.length === 0) throw invalidFile("The file has a header row but no rolls under it.");
  if (records.length > PAPER_IMPORT_MAX_ROWS) throw invalidFile(`The file has ${records.length} rolls; one upload takes at most ${PAPER_IMPORT_MAX_ROWS}. Split it into several files.`);
  return { records, errors: [...errors.entries()].map(([row, list]) => ({ row, messages: list })) };
}

type PreparedImport = {
  run: ResultsRunListRecord;
  mode: ResultsTally;
  fileHash: string;
  rolls: CheckedPaperRoll[];
  result: PaperImportResult;
};

/** Checks an upload against the run and compares it with what is stored, without writing anything. */
async function prepare(teacher: TeacherContext, runId: string, upload: PaperUpload, options: PaperImportOptions): Promise<PreparedImport> {
  const run = await visibleRun(teacher, runId);
  assertOwnsRun(teacher, run, "import rolls into it");
  const text = await csvText(upload);
  const fileHash = createHash("sha256").update(upload.buffer).digest("hex");
  const mode = runTallies(run).find((entry) => entry.tally === options.tally);
  if (!mode) throw invalidFile(`This run has no tally ${options.tally}; its rolls belong to tally ${runTallies(run).map((entry) => entry.tally).join(" or ")}.`);
  const { records, errors: parseErrors } = parseCsv(text, mode.players);
  // Removed groups too: a sheet naming one files its rolls under it (set aside like the rest), not under a clashing new group.
  const groups = await listRunGroups(db, runId, { withRemoved: true });
  const check = checkPaperImportRows({ dice: run.dice, dicePerPlayer: mode.dicePerPlayer, players: mode.players, groups, createGroups: options.createGroups }, records);
  const errorsByRow = new Map<number, string[]>();
  for (const entry of [...parseErrors, ...check.errors]) errorsByRow.set(entry.row, [...(errorsByRow.get(entry.row) ?? []), ...entry.messages]);
  const errors = [...errorsByRow.entries()].sort(([a], [b]) => a - b).map(([row, messages]) => ({ row, messages }));

  const ids = check.rolls.map((entry) => paperRollId(run.id, mode.tally, entry.group, entry.rollNumber));
  const stored = new Map((await findRollsByIds(db, ids)).map((entry) => [entry.id, entry]));
  const names = run.dice.map((die) => die.name);
  const newGroupKeys = new Set(check.newGroups.map((nickname) => nickname.toLowerCase()));
  let newRows = 0;
  let duplicateRows = 0;
  const rows = check.rolls.map((entry, index) => {
    const existing = stored.get(ids[index]);
    const same = existing !== undefined && JSON.stringify(existing.matchup) === JSON.stringify(entry.matchup) && JSON.stringify(existing.faces) === JSON.stringify(entry.faces);
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
      fileName: upload.originalName,
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
export async function previewPaperImport(teacher: TeacherContext, runId: string, upload: PaperUpload, options: PaperImportOptions): Promise<PaperImportResult> {
  return (await prepare(teacher, runId, upload, options)).result;
}

/**
 * Imports every row in one transaction, or none: a file with any bad row is refused whole (422, each row's problems
 * in `fields` under "row N"); the same file again, or rows already stored, add nothing.
 */
export async function commitPaperImport(teacher: TeacherContext, runId: string, upload: PaperUpload, options: PaperImportOptions): Promise<PaperImportResult> {
  const prepared = await prepare(teacher, runId, upload, options);
  const { result, run, mode } = prepared;
  if (result.errors.length > 0) {
    const count = result.errors.length;
    throw new HttpError(
      422,
      "paper_import_invalid",
      `${count} ${count === 1 ? "row has" : "rows have"} problems, so nothing was imported. Correct ${count === 1 ? "it" : "them"} and upload the file again.`,
      Object.fromEntries(result.errors.map((entry) => [`row ${entry.row}`, entry.messages])),
    );
  }
  if (result.alreadyImportedAt !== null) return result;
  const start = Date.now();
  const outcome = await insertPaperImport(db, {
    runId: run.id,
    fileHash: prepared.fileHash,
    fileName: upload.originalName.slice(0, 200),
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
    throw new HttpError(409, "import_conflict", "The run's groups changed while this file was imported, so nothing was stored. Check the file again.");
  }
  if (outcome.duplicateFile) return { ...result, alreadyImportedAt: new Date().toISOString() };
  return { ...result, newRows: outcome.inserted, duplicateRows: prepared.rolls.length - outcome.inserted, imported: true };
}
