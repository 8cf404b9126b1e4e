// Benchmark of the Results exports on a 100,000-roll run: time and memory of the streamed CSV and XLSX exports, beside
// a naive baseline that loads every row first. Run by scripts/bench.sh with BENCH_PG_PORT (its throwaway cluster):
//   node --expose-gc --import tsx scripts/bench/results-export.ts
import { randomBytes, randomUUID } from "node:crypto";
import { execFile } from "node:child_process";
import { once } from "node:events";
import { createWriteStream } from "node:fs";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { Writable } from "node:stream";
import pg from "pg";

const ROLLS = 100_000;
const GROUPS = 20;

const port = process.env.BENCH_PG_PORT;
if (!port) {
  console.error("Set BENCH_PG_PORT (scripts/bench.sh starts a throwaway cluster and sets it).");
  process.exit(1);
}
// A database of its own on the bench cluster, so other benchmarks sharing the cluster are not disturbed.
const adminUrl = `postgres://postgres@127.0.0.1:${port}/postgres`;
const databaseName = "outroll_bench_results";
const admin = new pg.Client({ connectionString: adminUrl });
await admin.connect();
await admin.query(`drop database if exists ${databaseName} with (force)`);
await admin.query(`create database ${databaseName}`);
await admin.end();
process.env.DATABASE_URL = `postgres://postgres@127.0.0.1:${port}/${databaseName}`;
process.env.BETTER_AUTH_SECRET ??= randomBytes(24).toString("hex");
process.env.DATA_DIR ??= process.env.BENCH_DATA_DIR ?? (await mkdtemp(path.join(tmpdir(), "outroll-bench-data-")));
process.env.LOG_LEVEL = "silent";

// Imported after the environment is set: the server's modules read it once, at import.
const { db, pool } = await import("../../server/db/client");
const { runMigrations } = await import("../../server/db/migrate");
const { classRun, roll, runGroup, user } = await import("../../server/db/schema/index");
const { rollsCsvDownload, summaryCsvDownload, workbookDownload } = await import("../../server/services/results-export.service");
const { eq } = await import("drizzle-orm");
const Papa = (await import("papaparse")).default;
const ExcelJS = (await import("exceljs")).default;
const { mulberry32, randomBelow } = await import("../../shared/probability/index");

await runMigrations(pool);

// Invented dice for the benchmark only (sea birds, faces of our own).
const dice = [
  { name: "Skua", faces: [1, 5, 10, 12, 13, 15], colour: "teal", pattern: "dots" },
  { name: "Tern", faces: [4, 7, 8, 9, 11, 18], colour: "amber", pattern: "stripes" },
  { name: "Gannet", faces: [2, 3, 6, 14, 16, 17], colour: "plum", pattern: "checks" },
];
const teacherId = randomUUID();
await db.insert(user).values({ id: teacherId, name: "Bench Teacher", email: `bench-${teacherId.slice(0, 8)}@outroll-bench.test` });

/** A closed run of `size` one-die-each rolls from GROUPS groups, every tenth simulated; answers its id and the insert time. */
async function insertRun(size: number): Promise<{ runId: string; insertSeconds: number }> {
  const [run] = await db
    .insert(classRun)
    .values({
      ownerId: teacherId,
      title: `Bench: ${size} rolls`,
      classGroup: "9M",
      diceSetName: "Skerry trio",
      dice,
      phases: ["Roll", "Pool"],
      phase: "Pool",
      status: "closed",
      joinCode: "BENCH1",
      closedAt: new Date(),
    })
    .returning({ id: classRun.id });
  const groups = await db
    .insert(runGroup)
    .values(
      Array.from({ length: GROUPS }, (_, index) => ({
        runId: run.id,
        nickname: `Bench group ${index + 1}`,
        matchup: [index % 3, (index + 1) % 3],
      })),
    )
    .returning({ id: runGroup.id, matchup: runGroup.matchup });
  const insertStart = performance.now();
  const random = mulberry32(size);
  const start = Date.now() - size * 1000;
  for (let offset = 0; offset < size; offset += 2000) {
    const batch = Array.from({ length: Math.min(2000, size - offset) }, (_, index) => {
      const group = groups[(offset + index) % GROUPS];
      const matchup = group.matchup!;
      const faces = matchup.map((dieIndex) => [dice[dieIndex].faces[randomBelow(random, 6)]]);
      const totals = faces.map((list) => list[0]);
      return {
        id: randomUUID(),
        runId: run.id,
        groupId: group.id,
        dicePerPlayer: 1,
        matchup,
        faces,
        totals,
        winnerSeat: totals[0] === totals[1] ? null : totals[0] > totals[1] ? 0 : 1,
        source: (offset + index) % 10 === 0 ? ("simulated" as const) : ("phone" as const),
        recordedAt: new Date(start + (offset + index) * 1000),
      };
    });
    await db.insert(roll).values(batch);
  }
  return { runId: run.id, insertSeconds: (performance.now() - insertStart) / 1000 };
}

const teacher = { user: { id: teacherId, name: "Bench Teacher", email: "bench@outroll-bench.test" }, department: null, role: null };
const mebibytes = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);
const gc = (globalThis as { gc?: () => void }).gc;

/** A receiver that takes each chunk on the next turn of the event loop, as a network connection would, and counts bytes. */
function countingSink(): Writable & { bytes: number; lineBreaks: number } {
  const sink = new Writable({
    highWaterMark: 64 * 1024,
    write(chunk: Buffer, _encoding, done) {
      sink.bytes += chunk.length;
      for (const byte of chunk) if (byte === 10) sink.lineBreaks += 1;
      setImmediate(done);
    },
  }) as Writable & { bytes: number; lineBreaks: number };
  sink.bytes = 0;
  sink.lineBreaks = 0;
  return sink;
}

type Measured = { seconds: number; rssGrowth: number; heapGrowth: number | null };

/** Lets pending work settle and collects garbage, so each case starts from the same floor. */
async function settle() {
  gc?.();
  await new Promise((resolve) => setTimeout(resolve, 100));
  gc?.();
}

/**
 * One timed pass of `task`: wall time and the highest RSS above the start, sampled every 5 ms. With `liveHeap`, a second
 * pass reads the heap after a full garbage collection every 50 ms (needs --expose-gc): the most the task held at once,
 * leaving out garbage not yet collected. The second pass is separate because forced collections slow the task down.
 */
async function measure(task: () => Promise<void>, liveHeap: boolean): Promise<Measured> {
  await settle();
  const base = process.memoryUsage();
  let peakRss = base.rss;
  const rssTimer = setInterval(() => {
    peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }, 5);
  const begin = performance.now();
  await task();
  const seconds = (performance.now() - begin) / 1000;
  clearInterval(rssTimer);
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
  if (!liveHeap || !gc) return { seconds, rssGrowth: peakRss - base.rss, heapGrowth: null };
  await settle();
  const heapBase = process.memoryUsage().heapUsed;
  let peakHeap = heapBase;
  const heapTimer = setInterval(() => {
    gc!();
    peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed);
  }, 50);
  await task();
  clearInterval(heapTimer);
  return { seconds, rssGrowth: peakRss - base.rss, heapGrowth: peakHeap - heapBase };
}

/** For a baseline that holds everything at its end: the heap after a full collection, with `held` kept alive through it. */
let heldAtEnd = 0;
const keptAlive: unknown[][] = [];
function probeHeld(held: unknown[]) {
  keptAlive.push(held);
  gc?.();
  heldAtEnd = process.memoryUsage().heapUsed;
  keptAlive.length = 0;
}

const rows: string[][] = [];
const record = (name: string, measured: Measured, output: string) =>
  rows.push([
    name,
    measured.seconds.toFixed(2),
    measured.heapGrowth === null ? "—" : mebibytes(measured.heapGrowth),
    mebibytes(measured.rssGrowth),
    output,
  ]);

const folder = await mkdtemp(path.join(tmpdir(), "outroll-bench-xlsx-"));

/** The three streamed exports of one run. */
async function streamedCases(runId: string, label: string) {
  // Streamed rolls CSV (cursor in batches of 2,000).
  {
    let sink = countingSink();
    const measured = await measure(async () => {
      sink = countingSink();
      const download = await rollsCsvDownload(teacher, runId, true);
      await download.write(sink);
      await new Promise<void>((resolve) => sink.end(resolve));
    }, true);
    record(`rolls.csv, streamed (${label})`, measured, `${sink.lineBreaks - 1} rows, ${mebibytes(sink.bytes)} MiB`);
  }

  // Summary CSV (poolRolls over compact copies gathered from the cursor).
  {
    let sink = countingSink();
    const measured = await measure(async () => {
      sink = countingSink();
      const download = await summaryCsvDownload(teacher, runId, true);
      await download.write(sink);
      await new Promise<void>((resolve) => sink.end(resolve));
    }, true);
    record(`summary.csv (${label})`, measured, `${sink.lineBreaks - 1} rows`);
  }

  // Streamed workbook, written to a file, then read back row by row with exceljs's streaming reader.
  const file = path.join(folder, `results-${label}.xlsx`);
  {
    const measured = await measure(async () => {
      const download = await workbookDownload(teacher, runId, true);
      const out = createWriteStream(file);
      const closed = once(out, "close");
      await download.write(out);
      if (!out.writableEnded) out.end();
      await closed;
    }, true);
    let rollRows = 0;
    const reader = new ExcelJS.stream.xlsx.WorkbookReader(file, { worksheets: "emit", sharedStrings: "ignore" });
    for await (const sheet of reader) {
      for await (const _row of sheet) if ((sheet as unknown as { name: string }).name === "Rolls") rollRows += 1;
    }
    record(`results.xlsx, streamed (${label})`, measured, `${rollRows - 1} roll rows, ${mebibytes((await stat(file)).size)} MiB`);
  }
}

const small = await insertRun(ROLLS / 10);
const large = await insertRun(ROLLS);
await streamedCases(small.runId, "10,000 rolls");
await streamedCases(large.runId, "100,000 rolls");
const run = { id: large.runId };

// Naive baselines: every row loaded at once. Their live heap is read at the end, where they hold everything.
await settle();
const floor = process.memoryUsage().heapUsed;

// Naive baseline: every row loaded at once, then one unparse call.
{
  let lines = 0;
  const measured = await measure(async () => {
    const all = await db.select().from(roll).where(eq(roll.runId, run.id));
    const text = Papa.unparse(
      all.map((entry) => ({ ...entry, faces: entry.faces.map((list) => list.join("+")).join(" "), matchup: entry.matchup.join(" v ") })),
    );
    lines = text.split("\r\n").length - 1;
    probeHeld([all, text]);
  }, false);
  record("baseline (100,000 rolls): load every row, one unparse", { ...measured, heapGrowth: heldAtEnd - floor }, `${lines} rows`);
}

// Naive baseline for the workbook: exceljs's in-memory Workbook and writeBuffer.
{
  let bytes = 0;
  const measured = await measure(async () => {
    const all = await db.select().from(roll).where(eq(roll.runId, run.id));
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet("Rolls");
    for (const entry of all)
      sheet.addRow([
        entry.recordedAt,
        entry.groupId,
        entry.matchup.join(" v "),
        entry.faces[0].join("+"),
        entry.faces[1].join("+"),
        entry.winnerSeat,
        entry.source,
      ]);
    const buffer = await workbook.xlsx.writeBuffer();
    bytes = buffer.byteLength;
    probeHeld([all, workbook, buffer]);
  }, false);
  record("baseline (100,000 rolls): in-memory workbook", { ...measured, heapGrowth: heldAtEnd - floor }, `${mebibytes(bytes)} MiB`);
}

// The same exports in a process whose V8 heap is capped at HEAP_CAP_MIB: the streamed ones finish, the baseline cannot.
const HEAP_CAP_MIB = 96;
const capped: string[][] = [];
for (const task of ["rolls.csv", "results.xlsx", "baseline"]) {
  const outcome = await new Promise<string>((resolve) => {
    execFile(
      process.execPath,
      [`--max-old-space-size=${HEAP_CAP_MIB}`, "--import", "tsx", path.join(import.meta.dirname, "results-export-capped.ts")],
      { env: { ...process.env, RUN_ID: run.id, OWNER_ID: teacherId, TASK: task }, maxBuffer: 1024 * 1024 },
      (error, stdout, stderr) => {
        if (!error) resolve(`finished (${stdout.trim()})`);
        else
          resolve(
            /heap out of memory|Allocation failed/i.test(stderr) ? "ran out of memory" : `failed: ${stderr.trim().split("\n").pop()}`,
          );
      },
    );
  });
  capped.push([task === "baseline" ? "baseline: load every row, one unparse" : `${task}, streamed`, outcome]);
}

await rm(folder, { recursive: true, force: true });
await pool.end();
const cleanup = new pg.Client({ connectionString: adminUrl });
await cleanup.connect();
await cleanup.query(`drop database if exists ${databaseName} with (force)`);
await cleanup.end();

console.log(
  `Results exports of runs of 10,000 and ${ROLLS.toLocaleString("en-GB")} rolls (${GROUPS} groups; inserting the large run took ${large.insertSeconds.toFixed(1)} s)${gc ? "" : " — run with --expose-gc for live-heap figures"}`,
);
const header = ["case", "time (s)", "peak live heap growth (MiB)", "peak RSS growth (MiB)", "output"];
const widths = header.map((title, index) => Math.max(title.length, ...rows.map((row) => row[index].length)));
const line = (cells: string[]) => `| ${cells.map((cell, index) => cell.padEnd(widths[index])).join(" | ")} |`;
console.log(line(header));
console.log(`|${widths.map((width) => "-".repeat(width + 2)).join("|")}|`);
for (const row of rows) console.log(line(row));
console.log(`\nThe 100,000-roll exports again, each in a process with its heap capped at ${HEAP_CAP_MIB} MiB (--max-old-space-size):`);
for (const [name, outcome] of capped) console.log(`  ${name}: ${outcome}`);
