// One export of one run in a process whose heap is capped (started by results-export.ts with --max-old-space-size):
// finishing shows the export's memory does not grow with the run. Env: DATABASE_URL, RUN_ID, OWNER_ID, TASK.
import { Writable } from "node:stream";

process.env.LOG_LEVEL = "silent";
const { pool, db } = await import("../../server/db/client");
const { roll } = await import("../../server/db/schema/index");
const { eq } = await import("drizzle-orm");
const Papa = (await import("papaparse")).default;
const { rollsCsvDownload, workbookDownload } = await import("../../server/services/results-export.service");

const runId = process.env.RUN_ID!;
const teacher = {
  user: { id: process.env.OWNER_ID!, name: "Bench Teacher", email: "bench@outroll-bench.test" },
  department: null,
  role: null,
};
let bytes = 0;
const sink = new Writable({
  write(chunk: Buffer, _encoding, done) {
    bytes += chunk.length;
    setImmediate(done);
  },
});

const task = process.env.TASK;
if (task === "rolls.csv" || task === "results.xlsx") {
  const download = task === "rolls.csv" ? await rollsCsvDownload(teacher, runId, true) : await workbookDownload(teacher, runId, true);
  await download.write(sink);
} else {
  const all = await db.select().from(roll).where(eq(roll.runId, runId));
  bytes = Papa.unparse(
    all.map((entry) => ({ ...entry, faces: JSON.stringify(entry.faces), matchup: JSON.stringify(entry.matchup) })),
  ).length;
}
await pool.end();
console.log(`${task}: ${bytes} bytes`);
