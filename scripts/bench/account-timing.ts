// Answer times of sign-up and password-reset requests for an address with an account and for an unknown one, against
// the real app on a database of its own: the two columns should match (docs/security.md, "No account finding").
//   BENCH_PG_PORT=… npx tsx scripts/bench/account-timing.ts
import { randomBytes } from "node:crypto";
import type { AddressInfo } from "node:net";
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";

const ROUNDS = Number(process.env.BENCH_ACCOUNT_ROUNDS ?? 30);
const port = process.env.BENCH_PG_PORT;
if (!port) {
  console.error("Set BENCH_PG_PORT (scripts/bench.sh starts a throwaway cluster and sets it).");
  process.exit(1);
}
const databaseName = "outroll_bench_accounts";
const admin = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${port}/postgres` });
await admin.connect();
await admin.query(`drop database if exists ${databaseName} with (force)`);
await admin.query(`create database ${databaseName}`);
await admin.end();
process.env.DATABASE_URL = `postgres://postgres@127.0.0.1:${port}/${databaseName}`;
process.env.BETTER_AUTH_SECRET ??= randomBytes(24).toString("hex");
process.env.DATA_DIR ??= process.env.BENCH_DATA_DIR ?? (await mkdtemp(path.join(tmpdir(), "outroll-bench-data-")));
process.env.LOG_LEVEL = "silent";

// Imported after the environment is set: the server's modules read it once, at import.
const { pool } = await import("../../server/db/client");
const { runMigrations } = await import("../../server/db/migrate");
const { createHttpServer } = await import("../../server/http-server");
await runMigrations(pool);
const { server, io } = createHttpServer({ serveClient: false, signInLimitPerMinute: 1_000_000 });
await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

const password = "tidal-pool-lantern-42";
async function post(pathName: string, body: unknown): Promise<number> {
  const started = performance.now();
  const response = await fetch(`${baseUrl}${pathName}`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  await response.arrayBuffer();
  return performance.now() - started;
}
const fresh = () => `bench-${randomBytes(6).toString("hex")}@outroll-bench.test`;
const existing = fresh();
await post("/api/auth/sign-up/email", { name: "Bench Teacher", email: existing, password });

const times: Record<string, number[]> = { "sign-up, existing": [], "sign-up, new": [], "reset, existing": [], "reset, unknown": [] };
for (let round = 0; round < ROUNDS; round += 1) {
  times["sign-up, existing"].push(await post("/api/auth/sign-up/email", { name: "Someone Else", email: existing, password }));
  times["sign-up, new"].push(await post("/api/auth/sign-up/email", { name: "Someone Else", email: fresh(), password }));
  times["reset, existing"].push(await post("/api/auth/request-password-reset", { email: existing, redirectTo: "/reset-password" }));
  times["reset, unknown"].push(await post("/api/auth/request-password-reset", { email: fresh(), redirectTo: "/reset-password" }));
}

const quantile = (values: number[], q: number) =>
  [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(q * values.length))];
console.log(`\n${ROUNDS} requests each, milliseconds (answers are held to a steady time; the columns should match):`);
console.log("| request | median | 90th percentile | slowest |\n| --- | --- | --- | --- |");
for (const [name, values] of Object.entries(times)) {
  console.log(
    `| ${name} | ${quantile(values, 0.5).toFixed(1)} | ${quantile(values, 0.9).toFixed(1)} | ${Math.max(...values).toFixed(1)} |`,
  );
}
io.close();
server.close();
await pool.end();
// The fake mail server and the zxcvbn lists keep nothing worth waiting for.
process.exit(0);
