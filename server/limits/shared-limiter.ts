import { RateLimiterMemory, RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { pool } from "../db/client";

export type SharedLimiterOptions = {
  /** Names the limit; counts are kept per prefix and key. */
  keyPrefix: string;
  /** How many points (attempts, rolls…) a key may spend per window. */
  points: number;
  /** The window, in seconds. */
  duration: number;
  /** Seconds a key stays refused once over the limit (0: until the window ends). */
  blockDuration?: number;
};

/**
 * A rate limit every app process shares: rate-limiter-flexible's RateLimiterPostgres over the app's database pool and
 * the `rate_limit` table (a migration creates it). While PostgreSQL cannot be reached, each process falls back to
 * counting in its own memory (the insurance limiter), so a database restart neither lifts nor breaks the limit.
 */
export function sharedLimiter(options: SharedLimiterOptions): RateLimiterPostgres {
  return new RateLimiterPostgres({
    storeClient: pool,
    storeType: "pool",
    tableName: "rate_limit",
    tableCreated: true,
    clearExpiredByTimeout: false,
    keyPrefix: options.keyPrefix,
    points: options.points,
    duration: options.duration,
    blockDuration: options.blockDuration ?? 0,
    insuranceLimiter: new RateLimiterMemory({ keyPrefix: options.keyPrefix, points: options.points, duration: options.duration }),
  });
}

/** The refusal a limiter rejects with, told apart from a real error. */
export function isLimitRefusal(error: unknown): error is RateLimiterRes {
  return error instanceof RateLimiterRes;
}

/** Removes expired counts (each process does so now and then; a key's row is rewritten when it comes back). */
export async function clearExpiredLimits(): Promise<void> {
  await pool.query("delete from rate_limit where expire < $1", [Date.now()]);
}
