// Load case for class runs: simulated phones on loopback record rolls as fast as the server acknowledges, against the
// real server process and PostgreSQL: first the phones alone (the load case the targets are set for), then on a fresh
// server and fresh runs with a signed-in teacher's Run board watching each run, and on that server the same phones at
// a paced combined rate; then the same clients against two yardsticks: a bare socket.io server that only acknowledges,
// and one that only stores each roll in PostgreSQL before acknowledging. Run by `npm run bench` (scripts/bench.sh gives
// it a throwaway cluster in BENCH_DATABASE_URL). Then the phones alone behind nginx, against one process and against
// two processes on the same PostgreSQL, for the overhead ratio of several processes. Prints; asserts nothing.
import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import { cpus, loadavg } from "node:os";
import { io as connect, type Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import { scratchFolder, startNginx } from "../../tests/helpers/nginx-proxy";

const databaseUrl = process.env.BENCH_DATABASE_URL ?? process.env.DATABASE_URL;
if (!databaseUrl) {
  console.error("Set BENCH_DATABASE_URL (npm run bench does) to a throwaway PostgreSQL database.");
  process.exit(1);
}
const PHONES = Number(process.env.BENCH_PHONES ?? 300);
const RUNS = Number(process.env.BENCH_RUNS ?? 10);
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 10);
const WARM_UP_SECONDS = 2;
// BENCH_BOARDS=0 leaves out the case with Run boards watching.
const WITH_BOARDS = process.env.BENCH_BOARDS !== "0";
// The paced case: every phone records at a steady pace, so the class as a whole sends this many rolls a second.
const PACED_RATE = Number(process.env.BENCH_PACED_RATE ?? 1000);
// BENCH_TWO_PROCESSES=0 leaves out the cases behind nginx (one process, then two on the same PostgreSQL).
const WITH_TWO_PROCESSES = process.env.BENCH_TWO_PROCESSES !== "0";
const proxyFolder = scratchFolder("bench-proxy");
const dataDir = process.env.BENCH_DATA_DIR ?? "/tmp/outroll-bench-data";
// The load case measures the server, so the per-group limit for stuck buttons (default 4 rolls/s) is lifted.
const serverEnv = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  DATA_DIR: dataDir,
  NODE_ENV: "production",
  LOG_LEVEL: "warn",
  TRUST_PROXY: "loopback",
  ROLL_RATE_PER_GROUP: "100000",
  ROLL_BURST_PER_GROUP: "100000",
  // The abuse limits too: the load case's phones join and roll far beyond a class's figures on purpose.
  JOINS_PER_RUN_PER_MINUTE: "100000",
  ROLL_CEILING_PER_RUN: "100000000",
};
Object.assign(process.env, { DATABASE_URL: databaseUrl, DATA_DIR: dataDir, LOG_LEVEL: "warn" });

// Invented dice for the load case.
const dice = [
  { name: "Auk", faces: [1, 1, 5, 5, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [2, 3, 3, 4, 7, 7], colour: "amber", pattern: "stripes" },
  { name: "Guillemot", faces: [0, 4, 4, 4, 4, 8], colour: "plum", pattern: "checks" },
];

const sleep = (milliseconds: number) => new Promise((resolve) => setTimeout(resolve, milliseconds));

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

async function waitFor(url: string, check: () => Promise<boolean>) {
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (await check().catch(() => false)) return;
    if (Date.now() > deadline) throw new Error(`${url} did not start within 60 s`);
    await sleep(200);
  }
}

async function stop(child: ChildProcess) {
  if (child.exitCode !== null) return;
  const exited = new Promise((resolve) => child.once("exit", resolve));
  child.kill("SIGTERM");
  await exited;
}

function percentile(sorted: number[], share: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor(share * sorted.length))];
}

type Phone = { socket: Socket; token: string; matchup: number[] };
type Measured = {
  acked: string[];
  failed: number;
  latencies: number[];
  measuredAcks: number;
  seconds: number;
  failures: Map<string, number>;
};

function openPhoneSocket(baseUrl: string, cookie?: string): Promise<Socket> {
  const socket = connect(baseUrl, {
    transports: ["websocket"],
    forceNew: true,
    reconnection: false,
    extraHeaders: cookie ? { cookie } : undefined,
  });
  return new Promise((resolve, reject) => {
    socket.once("connect", () => resolve(socket));
    socket.once("connect_error", reject);
  });
}

/**
 * Every phone sends one roll, waits for its acknowledgement, and sends the next, until the time is up. With `paceMs`
 * a phone sends at most one roll every `paceMs` (phones start spread over the first interval); the next roll waits
 * for the acknowledgement of the last either way.
 */
async function load(phones: Phone[], paceMs = 0): Promise<Measured> {
  const acked: string[] = [];
  const latencies: number[] = [];
  const failures = new Map<string, number>();
  let failed = 0;
  let measuredAcks = 0;
  const start = performance.now();
  const measureFrom = start + WARM_UP_SECONDS * 1000;
  const end = measureFrom + SECONDS * 1000;
  await Promise.all(
    phones.map(async (phone, index) => {
      let step = index;
      let due = start + (paceMs * index) / phones.length;
      while (performance.now() < end) {
        if (paceMs > 0) {
          const wait = due - performance.now();
          if (wait > 0) await sleep(wait);
          due += paceMs;
          if (performance.now() >= end) break;
        }
        step += 1;
        const faces = phone.matchup.map((dieIndex) => [dice[dieIndex].faces[(step * 7 + dieIndex) % 6]]);
        const roll = { id: uuidv4(), tally: 1, matchup: phone.matchup, faces, recordedAt: new Date().toISOString() };
        const sent = performance.now();
        try {
          const ack = await phone.socket.timeout(10_000).emitWithAck("roll:record", { token: phone.token, roll });
          const done = performance.now();
          if (ack.ok) {
            acked.push(roll.id);
            if (sent >= measureFrom && done <= end) {
              measuredAcks += 1;
              latencies.push(done - sent);
            }
          } else {
            failed += 1;
            failures.set(ack.error.code, (failures.get(ack.error.code) ?? 0) + 1);
          }
        } catch {
          failed += 1;
          failures.set("timeout", (failures.get("timeout") ?? 0) + 1);
        }
      }
    }),
  );
  latencies.sort((x, y) => x - y);
  return { acked, failed, latencies, measuredAcks, seconds: SECONDS, failures };
}

type OutrollCase = {
  ours: Measured;
  paced: Measured | null;
  lost: number;
  duplicated: number;
  unacknowledged: number;
  rows: number;
  updatesPerRunPerSecond: number;
  phones: Phone[];
};

async function main() {
  console.log(
    `Class run load: ${PHONES} phones in ${RUNS} runs, ${SECONDS} s measured after ${WARM_UP_SECONDS} s warm-up; first the phones alone${WITH_BOARDS ? `, then with one Run board watching each run and paced at ${PACED_RATE} rolls/s in all` : ""}.`,
  );
  execFileSync("node", ["--import", "tsx", "seed/index.ts"], { env: serverEnv, stdio: ["ignore", "ignore", "inherit"] });

  const { db, pool } = await import("../../server/db/client");
  const { insertRunWithJoinCode } = await import("../../server/services/class-runs.service");
  const { user, roll } = await import("../../server/db/schema/index");
  const { eq, inArray, sql } = await import("drizzle-orm");
  const { demoPassword, demoTeachers } = await import("../../seed/demo-scenario");
  const owner = demoTeachers.find((teacher) => teacher.role === "teacher")!;
  const [ownerRow] = await db.select({ id: user.id }).from(user).where(eq(user.email, owner.email));

  /** One case against the real server: fresh runs, a fresh server process, the phones joined, then the load. */
  async function outrollCase(withBoards: boolean, label: string, processes = 1, viaProxy = false): Promise<OutrollCase> {
    const runs = [];
    for (let index = 0; index < RUNS; index += 1) {
      runs.push(
        await insertRunWithJoinCode(db, {
          ownerId: ownerRow.id,
          departmentId: null,
          lessonId: null,
          title: `Load run ${label} ${index + 1}`,
          classGroup: "8K",
          diceSetName: "Cliff-top three",
          dice,
          dicePerPlayer: 1,
          players: 2,
          tieRule: "re-roll-ties",
          matchupChoice: "assigned",
          phases: ["Roll"],
          phase: "Roll",
          status: "open",
          groupCap: 60,
          currentTally: 1,
          tallies: [{ tally: 1, dicePerPlayer: 1, players: 2, startedAt: new Date().toISOString() }],
        }),
      );
    }
    const ports = await Promise.all(Array.from({ length: processes }, () => freePort()));
    // Several processes (or one, for the like-for-like comparison) sit behind Debian's nginx, as deploy/ runs them.
    const proxyPort = viaProxy ? await freePort() : null;
    const baseUrl = proxyPort ? `http://127.0.0.1:${proxyPort}` : `http://127.0.0.1:${ports[0]}`;
    // BENCH_PROFILE_DIR=/some/folder writes a CPU profile of each server process there, to see where the time goes.
    const profile = process.env.BENCH_PROFILE_DIR ? ["--cpu-prof", `--cpu-prof-dir=${process.env.BENCH_PROFILE_DIR}`] : [];
    const servers = ports.map((port) =>
      spawn("node", [...profile, "--import", "tsx", "server/index.ts"], {
        env: { ...serverEnv, PORT: String(port), HOST: "127.0.0.1", APP_ORIGIN: baseUrl },
        stdio: ["ignore", "ignore", "inherit"],
      }),
    );
    for (const port of ports) await waitFor(`http://127.0.0.1:${port}`, async () => (await fetch(`http://127.0.0.1:${port}/api/ready`)).ok);
    const proxy = proxyPort ? await startNginx(proxyFolder.path, ports, proxyPort) : null;
    const phones: Phone[] = [];
    for (let index = 0; index < PHONES; index += 1) {
      const socket = await openPhoneSocket(baseUrl);
      const ack = await socket.emitWithAck("group:join", { code: runs[index % RUNS].joinCode, nickname: `Load group ${index + 1}` });
      if (!ack.ok) throw new Error(`join failed: ${ack.error.message}`);
      phones.push({ socket, token: ack.token, matchup: ack.state.group.matchup });
    }
    const boards: Socket[] = [];
    let boardUpdates = 0;
    if (withBoards) {
      const signIn = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: baseUrl },
        body: JSON.stringify({ email: owner.email, password: demoPassword }),
      });
      const cookie = signIn.headers
        .getSetCookie()
        .map((entry) => entry.split(";")[0])
        .join("; ");
      for (const run of runs) {
        const board = await openPhoneSocket(baseUrl, cookie);
        const ack = await board.emitWithAck("board:snapshot", { runId: run.id });
        if (!ack.ok) throw new Error(`board failed: ${ack.error.message}`);
        board.on("board:update", () => (boardUpdates += 1));
        boards.push(board);
      }
    }
    const ours = await load(phones);
    const updatesPerRunPerSecond = boards.length ? boardUpdates / boards.length / (SECONDS + WARM_UP_SECONDS) : 0;
    const paced = withBoards ? await load(phones, (PHONES / PACED_RATE) * 1000) : null;
    for (const socket of [...phones.map((phone) => phone.socket), ...boards]) socket.disconnect();
    for (const server of servers) await stop(server);
    await proxy?.stop();

    const runIds = runs.map((run) => run.id);
    const [{ rows, distinct }] = await db
      .select({ rows: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct ${roll.id})::int` })
      .from(roll)
      .where(inArray(roll.runId, runIds));
    const stored = new Set((await db.select({ id: roll.id }).from(roll).where(inArray(roll.runId, runIds))).map((row) => row.id));
    const acknowledged = [...ours.acked, ...(paced?.acked ?? [])];
    return {
      ours,
      paced,
      lost: acknowledged.filter((id) => !stored.has(id)).length,
      duplicated: rows - distinct,
      unacknowledged: rows - acknowledged.length,
      rows,
      updatesPerRunPerSecond,
      phones,
    };
  }

  const alone = await outrollCase(false, "phones");
  const watched = WITH_BOARDS ? await outrollCase(true, "boards") : null;
  // The same clients and runs behind nginx: one process, then two processes sharing the one PostgreSQL.
  const proxiedOne = WITH_TWO_PROCESSES ? await outrollCase(false, "one behind nginx", 1, true) : null;
  const proxiedTwo = WITH_TWO_PROCESSES ? await outrollCase(false, "two behind nginx", 2, true) : null;
  proxyFolder.remove();
  await pool.end();
  const phones = alone.phones;

  // The yardsticks: the same clients against a bare socket.io server that only acknowledges, and against one that only
  // stores each roll in PostgreSQL (group commit, acknowledged after commit) with no validation and no boards.
  const yardstick = async (script: string) => {
    const yardstickPort = await freePort();
    const yardstickUrl = `http://127.0.0.1:${yardstickPort}`;
    const child = spawn("node", ["--import", "tsx", script], {
      env: { ...process.env, PORT: String(yardstickPort) },
      stdio: ["ignore", "ignore", "inherit"],
    });
    await waitFor(yardstickUrl, async () => {
      const probe = await openPhoneSocket(yardstickUrl).catch(() => null);
      probe?.disconnect();
      return probe !== null;
    });
    const yardstickPhones: Phone[] = [];
    for (let index = 0; index < PHONES; index += 1) {
      const socket = await openPhoneSocket(yardstickUrl);
      yardstickPhones.push({ socket, token: phones[index].token, matchup: phones[index].matchup });
    }
    const measured = await load(yardstickPhones);
    for (const phone of yardstickPhones) phone.socket.disconnect();
    await stop(child);
    return measured;
  };
  const ceiling = await yardstick("scripts/bench/bare-ack-server.ts");
  const storeOnly = await yardstick("scripts/bench/store-ack-server.ts");

  const rate = (measured: Measured) => measured.measuredAcks / measured.seconds;
  const row = (name: string, measured: Measured, lostCount: string, duplicateCount: string) =>
    `| ${name} | ${PHONES} | ${measured.acked.length} | ${rate(measured).toFixed(0)} | ${percentile(measured.latencies, 0.5).toFixed(1)} | ${percentile(measured.latencies, 0.99).toFixed(1)} | ${measured.failed} | ${lostCount} | ${duplicateCount} |`;
  console.log("");
  console.log(
    "| case | phones | rolls acknowledged | rolls/s (measured window) | p50 ack ms | p99 ack ms | refused or timed out | lost | duplicated |",
  );
  console.log("| --- | --- | --- | --- | --- | --- | --- | --- | --- |");
  console.log(row("Outroll, phones alone: validation, batching, PostgreSQL", alone.ours, String(alone.lost), String(alone.duplicated)));
  if (watched) {
    console.log(row("Outroll, a Run board watching each run", watched.ours, String(watched.lost), String(watched.duplicated)));
    console.log(row(`Outroll, boards watching, paced at ${PACED_RATE} rolls/s in all`, watched.paced!, "(above)", "(above)"));
  }
  if (proxiedOne && proxiedTwo) {
    console.log(
      row("Outroll, phones alone, one process behind nginx", proxiedOne.ours, String(proxiedOne.lost), String(proxiedOne.duplicated)),
    );
    console.log(
      row("Outroll, phones alone, two processes behind nginx", proxiedTwo.ours, String(proxiedTwo.lost), String(proxiedTwo.duplicated)),
    );
  }
  console.log(row("yardstick: socket.io + PostgreSQL insert only", storeOnly, "n/a", "n/a"));
  console.log(row("bare socket.io, acknowledge only", ceiling, "n/a", "n/a"));
  console.log("");
  const spread = (measured: Measured) =>
    [0.9, 0.95, 0.999].map((share) => `p${share * 100} ${percentile(measured.latencies, share).toFixed(1)} ms`).join(", ");
  console.log(
    `Acknowledgement latency, phones alone: ${spread(alone.ours)}, max ${(alone.ours.latencies.at(-1) ?? Number.NaN).toFixed(1)} ms; insert only: ${spread(storeOnly)}; bare: ${spread(ceiling)}.`,
  );
  if (watched) console.log(`With boards: ${spread(watched.ours)}; paced: ${spread(watched.paced!)}.`);
  const share = (measured: Measured) =>
    `${((rate(measured) / rate(ceiling)) * 100).toFixed(0)}% of the bare ceiling and ${((rate(measured) / rate(storeOnly)) * 100).toFixed(0)}% of the insert-only yardstick`;
  console.log(
    `Phones alone: Outroll acknowledges ${share(alone.ours)} (aim: at least half the bare ceiling)${watched ? `; with boards, ${share(watched.ours)}` : ""}.`,
  );
  for (const [name, measured] of [
    ["phones alone", alone],
    ["with boards", watched],
  ] as const) {
    if (!measured) continue;
    const failures = [...measured.ours.failures, ...(measured.paced?.failures ?? [])];
    if (failures.length) console.log(`Refusals, ${name}: ${failures.map(([code, count]) => `${code} ${count}`).join(", ")}`);
    console.log(
      `Rows stored ${name}: ${measured.rows}, acknowledged ${measured.rows - measured.unacknowledged}: lost ${measured.lost}, duplicated ${measured.duplicated}, stored without an acknowledgement ${measured.unacknowledged}.`,
    );
  }
  if (proxiedOne && proxiedTwo) {
    const ratio = (measured: Measured, base: Measured) => (rate(measured) / rate(base)).toFixed(2);
    console.log(
      `Two processes behind nginx acknowledge ${ratio(proxiedTwo.ours, proxiedOne.ours)}× the rolls/s of one process behind nginx and ${ratio(proxiedTwo.ours, alone.ours)}× those of one process reached directly; p99 ${percentile(proxiedTwo.ours.latencies, 0.99).toFixed(1)} ms against ${percentile(proxiedOne.ours.latencies, 0.99).toFixed(1)} ms. Rows: two processes lost ${proxiedTwo.lost}, duplicated ${proxiedTwo.duplicated}; one behind nginx lost ${proxiedOne.lost}, duplicated ${proxiedOne.duplicated}.`,
    );
  }
  if (watched)
    console.log(
      `Run boards received ${watched.updatesPerRunPerSecond.toFixed(1)} updates per run per second (throttled; never one per roll).`,
    );
  const ratio = rate(alone.ours) / rate(ceiling);
  const targets = [
    [`${PHONES} connected phones`, PHONES >= 300],
    ["at least 1000 rolls/s acknowledged", rate(alone.ours) >= 1000],
    ["p99 under 100 ms", percentile(alone.ours.latencies, 0.99) < 100],
    ["0 lost", alone.lost === 0 && (watched?.lost ?? 0) === 0],
    ["0 duplicated", alone.duplicated === 0 && (watched?.duplicated ?? 0) === 0],
    ["half the bare ceiling", ratio >= 0.5],
  ] as const;
  console.log(
    `Machine load average (1, 5, 15 min) at the end: ${loadavg()
      .map((value) => value.toFixed(1))
      .join(", ")} on ${cpus().length} cores.`,
  );
  console.log(
    `Targets (phones alone; lost and duplicated over every case): ${targets.map(([name, met]) => `${met ? "met" : "NOT met"}: ${name}`).join("; ")}.`,
  );
  if (watched)
    console.log(
      `With a Run board watching each run, p99 is ${percentile(watched.ours.latencies, 0.99) < 100 ? "also" : "NOT"} under 100 ms.`,
    );
}

await main();
