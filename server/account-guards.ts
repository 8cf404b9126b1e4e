import { APIError, createAuthMiddleware } from "better-auth/api";
import { RateLimiterRes } from "rate-limiter-flexible";
import { passwordSchema, teacherNameSchema } from "@shared/schemas/account";
import { env } from "./env";
import { logger } from "./logger";
import { sendMail } from "./mail/mailer";
import { existingAccountMail } from "./mail/templates";
import { passwordWeakness } from "./password-strength";
import { accountKey, accountSignInFailures } from "./sign-in-limits";

/** Paths whose answer must not tell an existing account from an unknown address, by content or by time. */
const STEADY_ANSWER_PATHS = new Set(["/api/auth/sign-up/email", "/api/auth/request-password-reset"]);
/** Both answers of those paths wait until this long after the request arrived (longer than either path's own work). */
export const STEADY_ANSWER_MS = 500;

const refuse = (code: string, message: string) => new APIError("BAD_REQUEST", { code, message });

function checkName(name: unknown) {
  const parsed = teacherNameSchema.safeParse(name);
  if (!parsed.success) throw refuse("invalid_input", parsed.error.issues[0].message);
}

function checkNewPassword(password: unknown, personal: unknown[]) {
  if (typeof password !== "string") return;
  // Length first, here rather than in better-auth, so an existing address's sign-up is refused the same way.
  const length = passwordSchema.safeParse(password);
  if (!length.success) throw refuse("invalid_input", length.error.issues[0].message);
  const weakness = passwordWeakness(
    password,
    personal.filter((text): text is string => typeof text === "string"),
  );
  if (weakness) throw refuse("weak_password", weakness);
}

const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60_000));

/**
 * Before better-auth acts: the name rule on sign-up and account changes, the strength of every new password, the
 * per-account wait after repeated wrong passwords, and the sign-up of an address that already has an account, which
 * answers exactly as a new sign-up does and tells the account's owner by e-mail instead.
 */
const beforeAccountChange = createAuthMiddleware(async (ctx) => {
  const body = (ctx.body ?? {}) as Record<string, unknown>;
  if (ctx.path === "/sign-up/email") {
    checkName(body.name);
    checkNewPassword(body.password, [body.name, body.email]);
    if (typeof body.email !== "string" || typeof body.password !== "string") return;
    const email = accountKey(body.email);
    const existing = await ctx.context.internalAdapter.findUserByEmail(email);
    if (!existing) return;
    // The same work as a new account's password, so the answer takes as long.
    await ctx.context.password.hash(body.password);
    const owner = existing.user;
    sendMail(
      existingAccountMail({
        to: owner.email,
        name: owner.name,
        signInUrl: `${env.appOrigin}/sign-in`,
        resetUrl: `${env.appOrigin}/forgot-password`,
      }),
    ).catch((error: unknown) => logger.error({ err: error }, "existing-account e-mail not sent"));
    const now = new Date();
    return ctx.json({
      token: null,
      user: {
        id: crypto.randomUUID(),
        email,
        name: String(body.name).trim(),
        image: null,
        emailVerified: false,
        createdAt: now,
        updatedAt: now,
      },
    });
  }
  if (ctx.path === "/update-user" && "name" in body) checkName(body.name);
  if (ctx.path === "/reset-password" || ctx.path === "/change-password") checkNewPassword(body.newPassword, []);
  if (ctx.path === "/sign-in/email" && typeof body.email === "string") {
    const failures = await accountSignInFailures.get(accountKey(body.email));
    if (failures && failures.remainingPoints <= 0) {
      throw new APIError("TOO_MANY_REQUESTS", {
        code: "too_many_attempts",
        message: `Too many wrong passwords for this account. Wait ${minutes(failures.msBeforeNext)} minutes and try again, or choose a new password with “Forgot your password?”.`,
      });
    }
  }
});

/** After sign-up: the same answer as for an existing address. After sign-in: a wrong password counts against the account; a right one clears its count. */
const afterAccountChange = createAuthMiddleware(async (ctx) => {
  const returned = ctx.context.returned;
  // A new account's answer carries no session token in its body (the cookie signs in), like an existing address's.
  if (ctx.path === "/sign-up/email" && returned && typeof returned === "object" && "token" in returned && "user" in returned) {
    return ctx.json({ token: null, user: (returned as { user: unknown }).user });
  }
  if (ctx.path !== "/sign-in/email") return;
  const email = (ctx.body as { email?: unknown } | undefined)?.email;
  if (typeof email !== "string") return;
  if (returned instanceof APIError && returned.statusCode === 401) {
    await accountSignInFailures.consume(accountKey(email)).catch((refusal: unknown) => {
      if (!(refusal instanceof RateLimiterRes)) throw refusal;
    });
  } else if (!(returned instanceof APIError)) {
    await accountSignInFailures.delete(accountKey(email));
  }
});

export const accountHooks = { before: beforeAccountChange, after: afterAccountChange };

/**
 * better-auth's own refusals (`{ code, message }`) in Outroll's one error shape, `{ error: { code, message } }`,
 * with its upper-case codes in our lower case.
 */
async function inOurErrorShape(response: Response): Promise<Response> {
  if (response.status < 400 || !response.headers.get("content-type")?.includes("json")) return response;
  const body = (await response
    .clone()
    .json()
    .catch(() => null)) as { code?: unknown; message?: unknown; error?: unknown } | null;
  if (!body || body.error !== undefined || typeof body.message !== "string") return response;
  const code = typeof body.code === "string" ? body.code.toLowerCase() : "auth_refused";
  const headers = new Headers(response.headers);
  headers.delete("content-length");
  return new Response(JSON.stringify({ error: { code, message: body.message } }), { status: response.status, headers });
}

/**
 * Wraps better-auth's handler: the sign-up and password-reset answers wait to a fixed time after the request came,
 * whatever the address, and refusals come in our error shape.
 */
export function steadyAuthHandler(handler: (request: Request) => Promise<Response>) {
  return async (request: Request): Promise<Response> => {
    const started = performance.now();
    const response = await inOurErrorShape(await handler(request));
    if (STEADY_ANSWER_PATHS.has(new URL(request.url).pathname)) {
      const wait = STEADY_ANSWER_MS - (performance.now() - started);
      if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait));
    }
    return response;
  };
}
