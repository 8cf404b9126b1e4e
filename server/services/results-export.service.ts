import type { Writable } from "node:stream";
import ExcelJS from "exceljs";
import { RollPool, type PooledResults } from "@shared/class-results/pooled-results";
import type { TieRule } from "@shared/probability/index";
import { csvLines } from "@shared/results/csv-text";
import { groupInterval } from "@shared/results/group-interval";
import { rollsExportColumns, summaryExportColumns, type RollsExportRow, type SummaryExportRow } from "@shared/results/export-columns";
import { db } from "../db/client";
import { listRunGroups, streamRunRolls, type ResultsRunListRecord, type StreamedRoll } from "../db/queries/results";
import type { TeacherContext } from "../middleware/require-teacher";
import { poolableRoll, poolRunCounts, poolRunRolls, visibleRun } from "./results.service";

/** A download the route can send: its name, its type, and how to write it to the response. */
export type ResultsDownload = { fileName: string; contentType: string; write: (out: Writable) => Promise<void> };

function slug(text: string): string {
  return (
    text
      .normalize("NFKD")
      .replace(/[\u0300-\u036f]/g, "")
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 48) || "run"
  );
}

/** "no-best-die-the-kittiwake-trio_8K_2026-03-12_rolls.csv": the lesson, the class and the day the run was taught. */
export function exportFileName(
  run: { title: string; classGroup: string; createdAt: Date },
  kind: "rolls" | "summary" | "results",
  extension: "csv" | "xlsx",
): string {
  const day = run.createdAt.toISOString().slice(0, 10);
  const parts = [slug(run.title), run.classGroup ? slug(run.classGroup) : "no-class", day, kind];
  return `${parts.join("_")}.${extension}`;
}

/** Writes a chunk, waiting while the receiver is full; a closed connection stops the export. */
async function writeChunk(out: Writable, chunk: string): Promise<void> {
  if (out.destroyed) throw new Error("The download was closed before it finished.");
  if (!out.write(chunk)) await waitForDrain(out);
}

/** Waits for the receiver to take more, removing both listeners afterwards so long exports do not pile them up. */
function waitForDrain(out: Writable): Promise<void> {
  if (out.destroyed) return Promise.reject(new Error("The download was closed before it finished."));
  return new Promise((resolve, reject) => {
    const onDrain = () => {
      out.off("close", onClose);
      resolve();
    };
    const onClose = () => {
      out.off("drain", onDrain);
      reject(new Error("The download was closed before it finished."));
    };
    out.once("drain", onDrain);
    out.once("close", onClose);
  });
}

/** One die's face stays a number; two dice each are written "3+5" (text, escaped in CSV when it starts with "-"). */
function facesCell(faces: number[] | undefined): string | number {
  if (!faces) return "";
  return faces.length === 1 ? faces[0] : faces.join("+");
}

/** One stored roll as a row of the rolls export (both the CSV and the workbook's Rolls sheet). */
function rollsRow(stored: StreamedRoll, names: string[], nicknames: Map<string, string>): RollsExportRow {
  const seat = (index: number) => ({
    die: stored.matchup[index] === undefined ? "" : names[stored.matchup[index]],
    faces: facesCell(stored.faces[index]),
    total: stored.totals[index] ?? null,
  });
  const [first, second, third] = [seat(0), seat(1), seat(2)];
  const winner = stored.winnerSeat === null ? "" : names[stored.matchup[stored.winnerSeat]];
  return {
    roll_time: stored.recordedAt.toISOString(),
    group: nicknames.get(stored.groupId) ?? "",
    tally: stored.tally,
    matchup: stored.matchup.map((index) => names[index]).join(" v "),
    dice_per_player: stored.dicePerPlayer,
    die_1: first.die,
    faces_1: first.faces,
    total_1: first.total,
    die_2: second.die,
    faces_2: second.faces,
    total_2: second.total,
    die_3: third.die,
    faces_3: third.faces,
    total_3: third.total,
    outcome: stored.winnerSeat === null ? "tie" : `${winner} wins`,
    winning_die: winner,
    source: stored.source,
    simulated: stored.source === "simulated" ? "yes" : "no",
    roll_id: stored.id,
  };
}

/** Whether a summary row's rolls were recorded one by one, typed as counts, or both. */
function enteredAs(rolls: number, countedRolls: number): string {
  if (countedRolls === 0) return "rolls";
  return countedRolls === rolls ? "counts" : "rolls and counts";
}

const round = (value: number | null | undefined, places = 4) =>
  value === null || value === undefined ? null : Number(value.toFixed(places));

/** The summary export: one row per matchup, then one per group and matchup, all from poolRolls. */
export function summaryRows(pooled: PooledResults): SummaryExportRow[] {
  const rows: SummaryExportRow[] = [];
  const byKey = new Map(pooled.matchups.map((entry) => [entry.key, entry]));
  for (const entry of pooled.matchups) {
    const first = entry.seats[0];
    const exact = entry.exact.underTieRule;
    rows.push({
      section: "matchup",
      group: "",
      matchup: entry.label,
      dice_per_player: entry.dicePerPlayer,
      players: entry.players,
      rolls: entry.rolls,
      decided_rolls: entry.decidedRolls,
      first_die: first.dieName,
      first_die_wins: first.wins,
      first_die_ties: first.ties,
      first_die_losses: first.losses,
      tie_rule: pooled.tieRule,
      relative_frequency: round(entry.frequencyUnderTieRule),
      exact_fraction: exact?.fraction ?? "",
      exact_decimal: exact?.decimal ?? "",
      wilson_95_lower: round(entry.interval?.lower),
      wilson_95_upper: round(entry.interval?.upper),
      binomial_p_value: null,
      implausible: "",
      entered_as: enteredAs(entry.rolls, entry.countedRolls),
      rolls_from_counts: entry.countedRolls,
    });
  }
  for (const group of pooled.groups) {
    const first = group.seats[0];
    const exact = byKey.get(group.matchupKey)?.exact.underTieRule;
    const interval = groupInterval(group, pooled.tieRule);
    rows.push({
      section: "group",
      group: group.groupNickname ?? "",
      matchup: group.label,
      dice_per_player: group.dicePerPlayer,
      players: group.players,
      rolls: group.rolls,
      decided_rolls: group.decidedRolls,
      first_die: first.dieName,
      first_die_wins: first.wins,
      first_die_ties: first.ties,
      first_die_losses: first.losses,
      tie_rule: pooled.tieRule,
      relative_frequency: round(group.frequencyUnderTieRule),
      exact_fraction: exact?.fraction ?? "",
      exact_decimal: exact?.decimal ?? "",
      wilson_95_lower: round(interval?.lower),
      wilson_95_upper: round(interval?.upper),
      binomial_p_value: round(group.test.pValue, 6),
      implausible: group.test.implausible ? "yes" : "no",
      entered_as: enteredAs(group.rolls, group.countedRolls),
      rolls_from_counts: group.countedRolls,
    });
  }
  return rows;
}

// The Excel-friendly byte order mark; papaparse and most readers skip it.
const BYTE_ORDER_MARK = "\ufeff";

/** Number columns written with a fixed number of decimals in every row of the summary CSV. */
const summaryDecimals = { relative_frequency: 4, wilson_95_lower: 4, wilson_95_upper: 4, binomial_p_value: 6 };

async function runContext(teacher: TeacherContext, runId: string) {
  const run = await visibleRun(teacher, runId);
  const groups = await listRunGroups(db, runId);
  return { run, names: run.dice.map((die) => die.name), nicknames: new Map(groups.map((group) => [group.id, group.nickname])) };
}

/** The rolls CSV: one row per roll that counts, streamed from a cursor in batches (RFC 4180, UTF-8, header row). */
export async function rollsCsvDownload(
  teacher: TeacherContext,
  runId: string,
  includeSimulated: boolean,
  includeLeftOut = false,
): Promise<ResultsDownload> {
  const { run, names, nicknames } = await runContext(teacher, runId);
  return {
    fileName: exportFileName(run, "rolls", "csv"),
    contentType: "text/csv; charset=utf-8",
    write: async (out) => {
      await writeChunk(out, BYTE_ORDER_MARK + csvLines(rollsExportColumns, [], { header: true }));
      for await (const batch of streamRunRolls(run.id, { includeSimulated, includeLeftOut })) {
        await writeChunk(
          out,
          csvLines(
            rollsExportColumns,
            batch.map((stored) => rollsRow(stored, names, nicknames)),
            { header: false },
          ),
        );
      }
    },
  };
}

/** Pools a run's rolls from the cursor for the summary, keeping no roll and no convergence series: memory stays flat. */
async function pooledForSummary(
  run: ResultsRunListRecord,
  nicknames: Map<string, string>,
  includeSimulated: boolean,
  includeLeftOut: boolean,
): Promise<PooledResults> {
  const pool = new RollPool(run.dice, run.tieRule as TieRule, { series: false });
  await poolRunRolls(run.id, [pool], { includeSimulated, includeLeftOut, nicknames });
  return pool.result();
}

/** The summary CSV: per matchup and per group, counts, relative frequency, exact fraction and decimal, Wilson 95% interval. */
export async function summaryCsvDownload(
  teacher: TeacherContext,
  runId: string,
  includeSimulated: boolean,
  includeLeftOut = false,
): Promise<ResultsDownload> {
  const { run, nicknames } = await runContext(teacher, runId);
  return {
    fileName: exportFileName(run, "summary", "csv"),
    contentType: "text/csv; charset=utf-8",
    write: async (out) => {
      const pooled = await pooledForSummary(run, nicknames, includeSimulated, includeLeftOut);
      const rows = summaryRows(pooled);
      await writeChunk(out, BYTE_ORDER_MARK + csvLines(summaryExportColumns, rows, { header: true, decimals: summaryDecimals }));
    },
  };
}

/**
 * The workbook: a Rolls sheet streamed row by row through exceljs's streaming WorkbookWriter, each roll counted on the
 * way into a RollPool (without a convergence series, so memory stays flat), then the Summary sheet from that pool.
 */
export async function workbookDownload(
  teacher: TeacherContext,
  runId: string,
  includeSimulated: boolean,
  includeLeftOut = false,
): Promise<ResultsDownload> {
  const { run, names, nicknames } = await runContext(teacher, runId);
  return {
    fileName: exportFileName(run, "results", "xlsx"),
    contentType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    write: async (out) => {
      // Without styles the writer is nearly twice as fast (measured); the frozen header row still marks the columns.
      const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: false, useSharedStrings: false });
      workbook.creator = "Outroll";
      workbook.created = new Date();
      const rollsSheet = workbook.addWorksheet("Rolls", { views: [{ state: "frozen", ySplit: 1 }] });
      rollsSheet.columns = rollsExportColumns.map((key) => ({
        header: key,
        key,
        width: key === "roll_id" ? 38 : key === "roll_time" ? 26 : 14,
      }));
      rollsSheet.getRow(1).commit();
      const pool = new RollPool(run.dice, run.tieRule as TieRule, { series: false });
      for await (const batch of streamRunRolls(run.id, { includeSimulated, includeLeftOut })) {
        for (const stored of batch) {
          rollsSheet.addRow(rollsRow(stored, names, nicknames)).commit();
          pool.addOne(poolableRoll(stored, nicknames));
        }
        if (out.writableNeedDrain) await waitForDrain(out);
      }
      rollsSheet.commit();
      // Counts have no rows on the Rolls sheet; they join the Summary only, which says so per row.
      await poolRunCounts(run.id, [pool], { nicknames, includeLeftOut });
      const pooled = pool.result();
      const summarySheet = workbook.addWorksheet("Summary", { views: [{ state: "frozen", ySplit: 1 }] });
      summarySheet.columns = summaryExportColumns.map((key) => ({ header: key, key, width: key === "matchup" ? 24 : 14 }));
      summarySheet.getRow(1).commit();
      for (const row of summaryRows(pooled)) summarySheet.addRow(row).commit();
      summarySheet.commit();
      await workbook.commit();
    },
  };
}
