// Vitest global set-up for browser tests: a fresh database with demo data and the real server process serving the built client.
import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import pg from "pg";
import type { TestProject } from "vitest/node";

declare module "vitest" {
  export interface ProvidedContext {
    appUrl: string;
    e2eDatabaseUrl: string;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

let server: ChildProcess | undefined;

export async function setup(project: TestProject) {
  const clientDir = process.env.CLIENT_DIR ?? "dist/client";
  if (!existsSync(`${clientDir}/index.html`)) {
    execFileSync("npx", ["vite", "build", "--logLevel", "warn", "--outDir", clientDir], {
      stdio: "inherit",
      env: { ...process.env, NODE_ENV: "production" },
    });
  }
  const base = process.env.DATABASE_URL!;
  const name = "outroll_e2e";
  const admin = new pg.Client({ connectionString: base });
  await admin.connect();
  await admin.query(`drop database if exists ${name} with (force)`);
  await admin.query(`create database ${name}`);
  await admin.end();
  const databaseUrl = base.replace(/\/[^/]+$/, `/${name}`);
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    PORT: String(port),
    APP_ORIGIN: appUrl,
    NODE_ENV: "test",
    // The privacy notice's controller, as an operator would set it (the demo school's own invented address).
    PRIVACY_CONTROLLER_NAME: "Harbourside Academy",
    PRIVACY_CONTROLLER_EMAIL: "privacy@harbourside.test",
    PRIVACY_CONTROLLER_ADDRESS: "Data protection lead, Harbourside Academy, Quay Road",
  };
  execFileSync("node", ["--import", "tsx", "seed/index.ts"], { stdio: "inherit", env });
  server = spawn("node", ["--import", "tsx", "server/index.ts"], { env, stdio: ["ignore", "inherit", "inherit"] });
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      const response = await fetch(`${appUrl}/api/health`);
      if (response.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error("the app server did not start within 60 s");
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  project.provide("appUrl", appUrl);
  project.provide("e2eDatabaseUrl", databaseUrl);
}

export async function teardown() {
  if (!server || server.exitCode !== null) return;
  const exited = new Promise((resolve) => server!.once("exit", resolve));
  server.kill("SIGTERM");
  await exited;
}
