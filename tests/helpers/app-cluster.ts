// Several app processes behind Debian's nginx on loopback, on a PostgreSQL cluster of their own, as deploy/ runs them.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { chmodSync, mkdirSync, readdirSync } from "node:fs";
import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "../../server/db/schema/index";
import { guardPool, type Database } from "../../server/db/client";
import { freePort, sleep } from "./nginx-proxy";

export { freePort, scratchFolder, sleep, startNginx } from "./nginx-proxy";

function postgresBin(): string {
  const versions = readdirSync("/usr/lib/postgresql").sort((a, b) => Number(a) - Number(b));
  return `/usr/lib/postgresql/${versions.at(-1)}/bin`;
}

/** Runs a PostgreSQL tool as the cluster's owner: the postgres user when the tests run as root (initdb refuses root). */
function asOwner(command: string, args: string[]) {
  const root = process.getuid?.() === 0;
  execFileSync(root ? "runuser" : command, root ? ["-u", "postgres", "--", command, ...args] : args, { stdio: "ignore" });
}

export type OwnCluster = { url: string; db: Database; pool: pg.Pool; restart: () => void; stop: () => Promise<void> };

/** A throwaway PostgreSQL cluster, so restarting it disturbs no other test file. */
export async function startOwnCluster(folder: string): Promise<OwnCluster> {
  const bin = postgresBin();
  const dataDir = path.join(folder, "postgres");
  mkdirSync(dataDir, { recursive: true });
  chmodSync(dataDir, 0o700);
  if (process.getuid?.() === 0) execFileSync("chown", ["postgres:postgres", dataDir]);
  const port = await freePort();
  asOwner(`${bin}/initdb`, ["-D", dataDir, "-U", "postgres", "--auth=trust", "--encoding=UTF8", "--locale=C.UTF-8"]);
  const options = `-p ${port} -c listen_addresses=127.0.0.1 -c unix_socket_directories=${dataDir} -c max_connections=100 -c fsync=off`;
  asOwner(`${bin}/pg_ctl`, ["-D", dataDir, "-l", path.join(dataDir, "server.log"), "-w", "-t", "60", "-o", options, "start"]);
  asOwner(`${bin}/createdb`, ["-h", "127.0.0.1", "-p", String(port), "-U", "postgres", "outroll"]);
  const url = `postgres://postgres@127.0.0.1:${port}/outroll`;
  const pool = guardPool(new pg.Pool({ connectionString: url, max: 4 }), "test cluster");
  return {
    url,
    pool,
    db: drizzle(pool, { schema, casing: "snake_case" }) as unknown as Database,
    // A fast-mode restart: every connection is cut, the server comes back on the same port with the same options.
    restart: () => asOwner(`${bin}/pg_ctl`, ["-D", dataDir, "-m", "fast", "-w", "-t", "60", "restart"]),
    stop: async () => {
      await pool.end().catch(() => undefined);
      asOwner(`${bin}/pg_ctl`, ["-D", dataDir, "-m", "immediate", "-w", "stop"]);
    },
  };
}

export type AppProcess = { port: number; url: string; child: ChildProcess };

/** The real server as its own process (as systemd runs each of deploy/'s instances). */
export function startAppProcess(port: number, databaseUrl: string, appOrigin: string, extraEnv: Record<string, string> = {}): AppProcess {
  const child = spawn("node", ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      HOST: "127.0.0.1",
      APP_ORIGIN: appOrigin,
      LOG_LEVEL: "warn",
      TRUST_PROXY: "loopback",
      ...extraEnv,
    },
    stdio: ["ignore", "ignore", "inherit"],
  });
  return { port, url: `http://127.0.0.1:${port}`, child };
}

/** Waits until the process answers /api/ready (database reachable, migrations applied). */
export async function waitUntilReady(baseUrl: string, seconds = 60) {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    try {
      if ((await fetch(`${baseUrl}/api/ready`)).ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`${baseUrl} was not ready within ${seconds} s`);
    await sleep(150);
  }
}

export async function stopAppProcess(app: AppProcess | undefined) {
  if (!app || app.child.exitCode !== null || app.child.signalCode !== null) return;
  const exited = new Promise((resolve) => app.child.once("exit", resolve));
  app.child.kill("SIGTERM");
  await exited;
}
