import { RateLimiterMemory, RateLimiterRes, type RateLimiterAbstract } from "rate-limiter-flexible";
import { env } from "../env";
import { sharedLimiter } from "./shared-limiter";

/**
 * Every abuse limit of a class run, built in this one module. Limits on a run or an address are counted in PostgreSQL
 * (sharedLimiter), so every app process behind the proxy counts the same joins and guesses; limits on one socket
 * connection stay in the memory of the process that holds the connection. The figures are in docs/operations.md: a class of 30
 * groups behind one school address never reaches them.
 */
const MINUTE = 60;

/** Joins (successful or not) from one socket connection, per minute. */
const joinsPerConnection = new RateLimiterMemory({
  keyPrefix: "join-connection",
  points: env.JOINS_PER_CONNECTION_PER_MINUTE,
  duration: MINUTE,
});
/** Joins into one run, per minute: the 60-groups-in-a-second flood stops here even across many connections. */
const joinsPerRun = sharedLimiter({ keyPrefix: "join-run", points: env.JOINS_PER_RUN_PER_MINUTE, duration: MINUTE });
/** Wrong join codes from one connection, per minute; past it every join from the connection waits. */
const guessesPerConnection = new RateLimiterMemory({
  keyPrefix: "guess-connection",
  points: env.CODE_GUESSES_PER_CONNECTION_PER_MINUTE,
  duration: MINUTE,
});
/** Wrong join codes from one address (a whole school shares one), per minute, over sockets and GET /api/pad/:code. */
const guessesPerAddress = sharedLimiter({ keyPrefix: "guess-address", points: env.CODE_GUESSES_PER_ADDRESS_PER_MINUTE, duration: MINUTE });

/** How many milliseconds a key of a limiter must wait when it has used all its points this minute, else null. */
async function exhausted(limiter: RateLimiterAbstract, key: string): Promise<number | null> {
  const state = await limiter.get(key);
  return state && state.consumedPoints >= limiter.points ? state.msBeforeNext : null;
}

/** Takes one point, answering the wait when none is left (other errors are thrown on). */
async function take(limiter: RateLimiterAbstract, key: string): Promise<number | null> {
  try {
    await limiter.consume(key);
    return null;
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return rejection.msBeforeNext;
    throw rejection;
  }
}

/**
 * Before a join code is looked up: the wait in milliseconds when the address or the connection has guessed too many
 * wrong codes this minute (then even the right code waits, so persisting gains a guesser nothing), else null.
 */
export async function codeGuessingWait(address: string, connectionId: string | null): Promise<number | null> {
  const waits = await Promise.all([
    exhausted(guessesPerAddress, address),
    connectionId ? exhausted(guessesPerConnection, connectionId) : null,
  ]);
  const wait = Math.max(0, ...waits.map((entry) => entry ?? 0));
  return wait > 0 ? wait : null;
}

/** After a wrong join code: counts the guess against the address and the connection. */
export async function countWrongCode(address: string, connectionId: string | null): Promise<void> {
  await Promise.all([take(guessesPerAddress, address), connectionId ? take(guessesPerConnection, connectionId) : null]);
}

/** Before a join into a known run: one point from the connection's and the run's join allowances; the wait when either is spent. */
export async function joinWait(connectionId: string, runId: string): Promise<{ waitMs: number; busy: "connection" | "run" } | null> {
  const connectionWait = await take(joinsPerConnection, connectionId);
  if (connectionWait !== null) return { waitMs: connectionWait, busy: "connection" };
  const runWait = await take(joinsPerRun, runId);
  return runWait === null ? null : { waitMs: runWait, busy: "run" };
}

/** A token bucket per key: a stuck button cannot flood the run, while a phone emptying its outbox gets a burst. */
export class GroupRateLimiter {
  private readonly buckets = new Map<string, { tokens: number; at: number }>();
  constructor(
    private readonly perSecond: number,
    private readonly burst: number,
  ) {}

  /** Takes one token for the key, or answers how long to wait for the next. */
  take(key: string, now = Date.now()): { allowed: true } | { allowed: false; retryAfterMs: number } {
    const bucket = this.buckets.get(key) ?? { tokens: this.burst, at: now };
    bucket.tokens = Math.min(this.burst, bucket.tokens + ((now - bucket.at) / 1000) * this.perSecond);
    bucket.at = now;
    this.buckets.set(key, bucket);
    if (this.buckets.size > 10_000) this.forgetFull(now);
    if (bucket.tokens >= 1) {
      bucket.tokens -= 1;
      return { allowed: true };
    }
    return { allowed: false, retryAfterMs: Math.ceil(((1 - bucket.tokens) / this.perSecond) * 1000) };
  }

  private forgetFull(now: number) {
    for (const [key, bucket] of this.buckets)
      if (bucket.tokens + ((now - bucket.at) / 1000) * this.perSecond >= this.burst) this.buckets.delete(key);
  }
}

/**
 * The per-run roll ceiling (ROLL_CEILING_PER_RUN phone rolls): a count per run of the phone rolls this process has
 * stored, started from the database the first time the run is seen. Synchronous on the roll path, like the buckets.
 */
export class RollCeiling {
  private readonly stored = new Map<string, number>();
  constructor(readonly ceiling: number) {}

  /** Whether the run is known to be at its ceiling (false for a run not counted yet). */
  reached(runId: string): boolean {
    return (this.stored.get(runId) ?? 0) >= this.ceiling;
  }

  /** Whether the run has been counted in this process. */
  knows(runId: string): boolean {
    return this.stored.has(runId);
  }

  /** Starts a run's count from the database's (a count already kept is not replaced). */
  start(runId: string, storedSoFar: number): void {
    if (!this.stored.has(runId)) this.stored.set(runId, storedSoFar);
  }

  /** Adds rolls just stored; answers true when this addition reached the ceiling. */
  add(runId: string, rolls: number): boolean {
    const before = this.stored.get(runId) ?? 0;
    this.stored.set(runId, before + rolls);
    return before < this.ceiling && before + rolls >= this.ceiling;
  }

  forget(runId: string): void {
    this.stored.delete(runId);
  }
}

// Rolls are the hot path, which answers without a promise when it can; this token bucket answers synchronously, which
// rate-limiter-flexible's consume() (a promise per call) cannot. Per connection: one phone sending for many groups'
// tokens. (Per group, the limit is shared by every process: RollAllowance in server/limits/roll-allowance.ts.)
/** Rolls per socket connection, at the same figures as a group: a phone records for one group. */
export const rollsPerConnection = new GroupRateLimiter(env.ROLL_RATE_PER_GROUP, env.ROLL_BURST_PER_GROUP);

/** Phone rolls per run (ROLL_CEILING_PER_RUN). */
export const runRollCeiling = new RollCeiling(env.ROLL_CEILING_PER_RUN);
