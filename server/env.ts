import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { z } from "zod";

/** The folder holding package.json: two levels up from server/env.ts, or from dist/server/ in the built server. */
function findProjectRoot(start: string): string {
  for (let folder = start; ; folder = path.dirname(folder)) {
    if (existsSync(path.join(folder, "package.json")) && existsSync(path.join(folder, "drizzle"))) return folder;
    if (path.dirname(folder) === folder) return path.resolve(start, "..");
  }
}

const projectRoot = findProjectRoot(import.meta.dirname);

const flag = z.enum(["1", "0", "true", "false", "yes", "no"]).transform((value) => value === "1" || value === "true" || value === "yes");

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url().default("postgres://postgres@127.0.0.1:54329/outroll"),
  APP_ORIGIN: z.string().url().optional(),
  BETTER_AUTH_SECRET: z.string().min(32).optional(),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  // Which reverse proxy may set X-Forwarded-For (Express's "trust proxy"): unset or "false" trusts none, so a client
  // cannot choose its own address; "loopback", a comma-separated list of addresses or subnets, or a number of hops.
  TRUST_PROXY: z
    .string()
    .trim()
    .default("false")
    .refine(
      (value) => !/^true$/i.test(value),
      "TRUST_PROXY=true would let any client choose its address; name the proxy instead, e.g. loopback or 10.0.0.5.",
    )
    .transform((value): boolean | number | string[] => {
      if (value === "" || /^false$/i.test(value)) return false;
      if (/^\d+$/.test(value)) return Number(value);
      return value
        .split(",")
        .map((part) => part.trim())
        .filter(Boolean);
    }),
  // Wrong passwords one account may take in SIGN_IN_FAILURE_MINUTES before its sign-ins wait (any address).
  SIGN_IN_FAILURES_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
  SIGN_IN_FAILURE_MINUTES: z.coerce.number().int().positive().default(15),
  DATA_DIR: z.string().default(path.join(projectRoot, ".data")),
  // Where the built client is served from; test runs build into a folder of their own.
  CLIENT_DIR: z.string().default(path.join(projectRoot, "dist/client")),
  // Without SMTP_URL the app starts its own local fake mail server (server/mail/fake-smtp-server.ts).
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).default("Outroll <no-reply@outroll.test>"),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  // The local fake mail server: on by default in development and tests, never started by a production server on its own.
  FAKE_SMTP: flag.optional(),
  // Which proxies' X-Forwarded-* headers Express believes (its "trust proxy" setting): "loopback", a hop count, or addresses.
  // Database connections per process, and Set finder searches one process runs at once (each takes a core).
  DATABASE_POOL_SIZE: z.coerce.number().int().min(2).max(100).default(10),
  SET_FINDER_SEARCHES_PER_PROCESS: z.coerce.number().int().min(0).max(16).default(2),
  // Seconds a stopping process waits for its rolls to be written and its phones to move before it exits anyway.
  SHUTDOWN_GRACE_SECONDS: z.coerce.number().int().min(1).max(120).default(10),
  // Sign-in attempts per address per minute, kept in PostgreSQL so every process counts the same attempts.
  SIGN_IN_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(20),
  // Class runs: rolls a group may send per second after a burst (a stuck button cannot flood), and the batch window.
  ROLL_RATE_PER_GROUP: z.coerce.number().positive().default(4),
  ROLL_BURST_PER_GROUP: z.coerce.number().int().positive().default(60),
  ROLL_BATCH_MS: z.coerce.number().int().min(0).max(200).default(15),
  BOARD_UPDATE_MS: z.coerce.number().int().min(50).max(5000).default(500),
  // Department shelf: the hour (UTC) from which heads of department get the day's proposal digest, or "off".
  PROPOSAL_DIGEST_HOUR_UTC: z.union([z.literal("off"), z.coerce.number().int().min(0).max(23)]).default(7),
  // The privacy notice's controller: the school or organisation responsible for the data this Outroll holds.
  PRIVACY_CONTROLLER_NAME: z.string().trim().min(2).max(200).optional(),
  PRIVACY_CONTROLLER_EMAIL: z.email().optional(),
  PRIVACY_CONTROLLER_ADDRESS: z.string().trim().min(2).max(500).optional(),
  // Abuse limits (docs/operations.md): figures a class of 30 groups behind one school address never reaches.
  JOINS_PER_CONNECTION_PER_MINUTE: z.coerce.number().int().positive().default(10),
  JOINS_PER_RUN_PER_MINUTE: z.coerce.number().int().positive().default(120),
  CODE_GUESSES_PER_CONNECTION_PER_MINUTE: z.coerce.number().int().positive().default(10),
  CODE_GUESSES_PER_ADDRESS_PER_MINUTE: z.coerce.number().int().positive().default(100),
  ROLL_CEILING_PER_RUN: z.coerce.number().int().positive().default(20_000),
  // A run with no change and no roll for this long closes itself (0 keeps runs open); the sweep runs every RUN_IDLE_SWEEP_SECONDS.
  RUN_IDLE_CLOSE_MINUTES: z.coerce.number().min(0).default(180),
  RUN_IDLE_SWEEP_SECONDS: z.coerce.number().int().min(1).default(300),
});

export type Env = z.infer<typeof envSchema> & {
  appOrigin: string;
  authSecret: string;
  projectRoot: string;
  /** Whether the app is reached over HTTPS (APP_ORIGIN starts with https:): secure cookies and HSTS. */
  https: boolean;
  /** Whether this process may start the local fake mail server. */
  fakeMail: boolean;
  /** Express's "trust proxy" value made from TRUST_PROXY. */
  trustProxy: boolean | number | string[];
};

/** A secret generated once per machine and kept under .data/, so sessions survive restarts without any set-up. */
function localAuthSecret(dataDir: string): string {
  const file = path.join(dataDir, "auth-secret");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString("hex");
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

/** Reads and checks the environment once; a bad value stops the process with a clear message. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `  ${issue.path.join(".")}: ${issue.message}`).join("\n");
    throw new Error(`Outroll cannot start: the environment is not valid.\n${problems}`);
  }
  const values = parsed.data;
  const appOrigin = values.APP_ORIGIN ?? `http://127.0.0.1:${values.PORT}`;
  return {
    ...values,
    projectRoot,
    appOrigin,
    https: appOrigin.startsWith("https:"),
    fakeMail: !values.SMTP_URL && (values.FAKE_SMTP ?? values.NODE_ENV !== "production"),
    trustProxy: values.TRUST_PROXY,
    authSecret: values.BETTER_AUTH_SECRET ?? localAuthSecret(values.DATA_DIR),
  };
}

export const env = loadEnv();
