import { createHmac, timingSafeEqual } from "node:crypto";
import { z } from "zod";
import { env } from "../env";

const claimsSchema = z.object({ v: z.literal(1), run: z.uuid(), group: z.uuid() });
export type GuestClaims = { runId: string; groupId: string };

function signature(body: string): Buffer {
  // A purpose prefix keeps these signatures apart from anything else signed with the same secret.
  return createHmac("sha256", env.authSecret).update(`outroll-guest-token:${body}`).digest();
}

/** A pupil group's token: its run and group, HMAC-SHA256 signed with the server's secret; no account behind it. */
export function signGuestToken(claims: GuestClaims): string {
  const body = Buffer.from(JSON.stringify({ v: 1, run: claims.runId, group: claims.groupId })).toString("base64url");
  return `${body}.${signature(body).toString("base64url")}`;
}

// Every roll carries its token; remembering the tokens already checked saves an HMAC per roll.
const verified = new Map<string, GuestClaims>();
const VERIFIED_MAX = 20_000;

/** The run and group a token names, or null when it is malformed or its signature does not match. */
export function verifyGuestToken(token: string): GuestClaims | null {
  const known = verified.get(token);
  if (known) return known;
  const claims = checkGuestToken(token);
  if (claims) {
    if (verified.size >= VERIFIED_MAX) verified.clear();
    verified.set(token, claims);
  }
  return claims;
}

function checkGuestToken(token: string): GuestClaims | null {
  const [body, signed, extra] = token.split(".");
  if (!body || !signed || extra !== undefined) return null;
  const expected = signature(body);
  const given = Buffer.from(signed, "base64url");
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  try {
    const claims = claimsSchema.parse(JSON.parse(Buffer.from(body, "base64url").toString("utf8")));
    return { runId: claims.run, groupId: claims.group };
  } catch {
    return null;
  }
}
