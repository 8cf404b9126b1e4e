import type { RateLimiterAbstract } from "rate-limiter-flexible";
import { env } from "./env";
import { sharedLimiter } from "./limits/shared-limiter";

/**
 * Wrong passwords per account, whatever the address they come from: after SIGN_IN_FAILURES_PER_ACCOUNT within
 * SIGN_IN_FAILURE_MINUTES the account's sign-ins wait until the window ends. Counted in PostgreSQL (sharedLimiter),
 * so every app process behind the proxy counts the same failures.
 */
export const accountSignInFailures: RateLimiterAbstract = sharedLimiter({
  keyPrefix: "sign-in-failures",
  points: env.SIGN_IN_FAILURES_PER_ACCOUNT,
  duration: env.SIGN_IN_FAILURE_MINUTES * 60,
});

/** The limiter key of an account: its e-mail address as better-auth stores it. */
export const accountKey = (email: string) => email.trim().toLowerCase();
