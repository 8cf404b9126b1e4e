// Browser case for the Roll pad: opens /pad/CODE in headless chromium at 390 × 844 as a pupil's phone would, and prints
// the bytes of JavaScript and CSS on the wire and the time until the nickname field is usable, first and second visit,
// with and without a throttled phone profile (4× CPU slowdown, 1.6 Mbps down, 750 kbps up, 150 ms round trip, through
// the Chrome DevTools Protocol). Builds the client, seeds a database of its own on the bench cluster and starts the real
// server. Run by `npm run bench`; prints, asserts nothing.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { chromium } from "playwright-core";
import { openPadTestRun } from "../../tests/helpers/pad-run-fixtures";

const baseUrl = process.env.BENCH_DATABASE_URL;
if (!baseUrl) {
  console.error("Set BENCH_DATABASE_URL (npm run bench does) to a throwaway PostgreSQL database.");
  process.exit(1);
}
const ROUNDS = Number(process.env.BENCH_PAD_ROUNDS ?? 5);
const throttled = { latency: 150, downloadThroughput: (1.6e6 / 8) * 0.9, uploadThroughput: (750e3 / 8) * 0.9, cpuRate: 4 };

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

type Visit = { bytes: number; ms: number };

/** One phone: a fresh chromium profile, a first visit and a second (from its caches), each timed to the nickname field. */
async function phone(url: string, profile: typeof throttled | null): Promise<{ first: Visit; second: Visit }> {
  const dir = mkdtempSync(path.join(tmpdir(), "outroll-pad-bench-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    viewport: { width: 390, height: 844 },
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
    ],
  });
  try {
    const visit = async (): Promise<Visit> => {
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      await cdp.send("Network.enable");
      if (profile) {
        await cdp.send("Network.emulateNetworkConditions", {
          offline: false,
          latency: profile.latency,
          downloadThroughput: profile.downloadThroughput,
          uploadThroughput: profile.uploadThroughput,
        });
        await cdp.send("Emulation.setCPUThrottlingRate", { rate: profile.cpuRate });
      }
      const kinds = new Map<string, string>();
      let bytes = 0;
      cdp.on("Network.responseReceived", (event) => kinds.set(event.requestId, event.type));
      cdp.on("Network.loadingFinished", (event) => {
        const kind = kinds.get(event.requestId);
        if (kind === "Script" || kind === "Stylesheet") bytes += event.encodedDataLength;
      });
      const started = performance.now();
      await page.goto(url, { waitUntil: "commit" });
      const field = page.getByLabel("Group nickname", { exact: true });
      await field.waitFor({ state: "visible", timeout: 60_000 });
      await page.waitForFunction(() => {
        const input = document.querySelector<HTMLInputElement>("input[autocomplete=off][maxlength]");
        return input !== null && !input.disabled;
      });
      const ms = performance.now() - started;
      // Count everything the page loads, including what it fetches after the field is usable (socket.io, the worker's helper).
      await page.waitForLoadState("networkidle");
      await page.close();
      return { bytes, ms };
    };
    const first = await visit();
    const second = await visit();
    return { first, second };
  } finally {
    await context.close();
    rmSync(dir, { recursive: true, force: true });
  }
}

const range = (values: number[], format: (value: number) => string) => {
  const sorted = [...values].sort((a, b) => a - b);
  if (sorted[0] === sorted[sorted.length - 1]) return format(sorted[0]);
  return `${format(sorted[0])}–${format(sorted[sorted.length - 1])} (median ${format(sorted[Math.floor(sorted.length / 2)])})`;
};
const kb = (bytes: number) => `${(bytes / 1024).toFixed(0)} KB`;
const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

async function main() {
  const clientDir = mkdtempSync(path.join(tmpdir(), "outroll-pad-client-"));
  console.log("building the client…");
  execFileSync("npx", ["vite", "build", "--logLevel", "error", "--outDir", clientDir, "--emptyOutDir"], {
    stdio: "inherit",
    env: { ...process.env, NODE_ENV: "production" },
  });

  const name = "outroll_bench_pad";
  const admin = new pg.Client({ connectionString: baseUrl });
  await admin.connect();
  await admin.query(`drop database if exists ${name} with (force)`);
  await admin.query(`create database ${name}`);
  await admin.end();
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: baseUrl!.replace(/\/[^/]+$/, `/${name}`),
    PORT: String(port),
    APP_ORIGIN: appUrl,
    CLIENT_DIR: clientDir,
    NODE_ENV: "production",
    LOG_LEVEL: "warn",
    DATA_DIR: process.env.BENCH_DATA_DIR ?? path.join(tmpdir(), "outroll-bench-data"),
    BETTER_AUTH_SECRET: "bench-secret-for-the-roll-pad-case-only-0123456789",
  };
  execFileSync("node", ["--import", "tsx", "seed/index.ts"], { stdio: "ignore", env });
  const server: ChildProcess = spawn("node", ["--import", "tsx", "server/index.ts"], { env, stdio: ["ignore", "ignore", "inherit"] });
  try {
    for (let tries = 0; ; tries += 1) {
      try {
        if ((await fetch(`${appUrl}/api/health`)).ok) break;
      } catch {
        // not listening yet
      }
      if (tries > 240) throw new Error("the server did not start");
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
    const run = await openPadTestRun(appUrl);
    const url = `${appUrl}/pad/${run.joinCode}`;
    const rows: string[][] = [];
    for (const [label, profile] of [
      ["throttled phone (4× CPU, 1.6 Mbps, 150 ms RTT)", throttled],
      ["no throttling", null],
    ] as const) {
      const visits: { first: Visit; second: Visit }[] = [];
      for (let round = 0; round < ROUNDS; round += 1) visits.push(await phone(url, profile));
      rows.push([
        label,
        "first visit",
        range(
          visits.map((v) => v.first.bytes),
          kb,
        ),
        range(
          visits.map((v) => v.first.ms),
          seconds,
        ),
      ]);
      rows.push([
        label,
        "second visit (cached)",
        range(
          visits.map((v) => v.second.bytes),
          kb,
        ),
        range(
          visits.map((v) => v.second.ms),
          seconds,
        ),
      ]);
    }
    await run.teacher.dispose();
    console.log(`\nRoll pad at 390 × 844, ${ROUNDS} fresh phones per profile (before this change: 641–680 KB, 5.4–6.6 s throttled)`);
    console.log("| profile | visit | JS + CSS on the wire | nickname field usable |");
    console.log("| --- | --- | --- | --- |");
    for (const row of rows) console.log(`| ${row.join(" | ")} |`);
  } finally {
    server.kill("SIGTERM");
    rmSync(clientDir, { recursive: true, force: true });
  }
}

await main();
