// Several app processes behind Debian's nginx on loopback, on a PostgreSQL cluster of their own, as deploy/ runs them.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "../../server/db/schema/index";
import { guardPool, type Database } from "../../server/db/client";

export function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

export const sleep = (milliseconds: number) => new Promise((resolve) => setTimeout(resolve, milliseconds));

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
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), HOST: "127.0.0.1", APP_ORIGIN: appOrigin, LOG_LEVEL: "warn", ...extraEnv },
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

/**
 * nginx in front of the given app ports, as deploy/nginx/outroll.conf (without TLS): WebSocket upgrade, round robin,
 * and a process that refuses connections is skipped for the next two seconds.
 */
export async function startNginx(folder: string, appPorts: number[]): Promise<{ url: string; stop: () => Promise<void> }> {
  const binary = ["/usr/sbin/nginx", "/usr/bin/nginx"].find((candidate) => existsSync(candidate)) ?? "nginx";
  const port = await freePort();
  const prefix = path.join(folder, "nginx");
  mkdirSync(path.join(prefix, "logs"), { recursive: true });
  const config = path.join(prefix, "nginx.conf");
  writeFileSync(
    config,
    `daemon off;
worker_processes 1;
pid ${prefix}/nginx.pid;
error_log ${prefix}/logs/error.log warn;
events { worker_connections 1024; }
http {
  access_log off;
  client_body_temp_path ${prefix}/body;
  proxy_temp_path ${prefix}/proxy;
  fastcgi_temp_path ${prefix}/fastcgi;
  uwsgi_temp_path ${prefix}/uwsgi;
  scgi_temp_path ${prefix}/scgi;
  map $http_upgrade $connection_upgrade { default upgrade; '' close; }
  upstream outroll {
${appPorts.map((appPort) => `    server 127.0.0.1:${appPort} max_fails=1 fail_timeout=2s;`).join("\n")}
  }
  server {
    listen 127.0.0.1:${port};
    location / {
      proxy_pass http://outroll;
      proxy_http_version 1.1;
      proxy_set_header Upgrade $http_upgrade;
      proxy_set_header Connection $connection_upgrade;
      proxy_set_header Host $host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      proxy_read_timeout 120s;
      proxy_next_upstream error timeout http_502 http_503;
      proxy_connect_timeout 2s;
    }
  }
}
`,
  );
  const child = spawn(binary, ["-c", config, "-p", prefix], { stdio: ["ignore", "ignore", "inherit"] });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 15_000;
  for (;;) {
    try {
      await fetch(`${url}/api/health`);
      break;
    } catch {
      if (Date.now() > deadline) throw new Error("nginx did not start within 15 s");
      await sleep(100);
    }
  }
  return {
    url,
    stop: async () => {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once("exit", resolve));
      child.kill("SIGQUIT");
      await exited;
    },
  };
}

/** A scratch folder the postgres user can reach (the tests may run as root from a private clone). */
export function scratchFolder(label: string): { path: string; remove: () => void } {
  const folder = mkdtempSync(`/tmp/outroll-${label}-`);
  chmodSync(folder, 0o755);
  return { path: folder, remove: () => rmSync(folder, { recursive: true, force: true }) };
}
