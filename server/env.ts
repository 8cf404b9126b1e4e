import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { z } from "zod";

const projectRoot = path.resolve(import.meta.dirname, "..");

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url().default("postgres://postgres@127.0.0.1:54329/outroll"),
  APP_ORIGIN: z.string().url().optional(),
  BETTER_AUTH_SECRET: z.string().min(32).optional(),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  SIGN_IN_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(20),
  DATA_DIR: z.string().default(path.join(projectRoot, ".data")),
  // Where the built client is served from; test runs build into a folder of their own.
  CLIENT_DIR: z.string().default(path.join(projectRoot, "dist/client")),
  // Without SMTP_URL the app starts its own local fake mail server (server/mail/fake-smtp-server.ts).
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).default("Outroll <no-reply@outroll.test>"),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  // Class runs: rolls a group may send per second after a burst (a stuck button cannot flood), and the batch window.
  ROLL_RATE_PER_GROUP: z.coerce.number().positive().default(4),
  ROLL_BURST_PER_GROUP: z.coerce.number().int().positive().default(60),
  ROLL_BATCH_MS: z.coerce.number().int().min(0).max(200).default(15),
  BOARD_UPDATE_MS: z.coerce.number().int().min(50).max(5000).default(500),
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

export type Env = z.infer<typeof envSchema> & { appOrigin: string; authSecret: string; projectRoot: string };

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
  return {
    ...values,
    projectRoot,
    appOrigin: values.APP_ORIGIN ?? `http://127.0.0.1:${values.PORT}`,
    authSecret: values.BETTER_AUTH_SECRET ?? localAuthSecret(values.DATA_DIR),
  };
}

export const env = loadEnv();
