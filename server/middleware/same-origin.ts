import type { IncomingHttpHeaders } from "node:http";
import type { RequestHandler } from "express";
import { env } from "../env";
import { HttpError } from "../http-error";

/** Origins the app is served from besides its own Host: APP_ORIGIN, its localhost twin and Vite's dev server. */
export const trustedOrigins: string[] = Array.from(
  new Set([env.appOrigin, env.appOrigin.replace("127.0.0.1", "localhost"), "http://127.0.0.1:5173", "http://localhost:5173"]),
);

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

const firstHeader = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

/**
 * Why a browser request comes from another site, or null when it may go on. Fetch Metadata first: `Sec-Fetch-Site`
 * must be `same-origin` (or `none`, typed by the user); without it, an `Origin` header must be a trusted origin or
 * the request's own host. A request with neither header is not from a browser page (curl, a test client) and carries
 * no ambient risk. (W3C Fetch Metadata Request Headers; OWASP CSRF Prevention Cheat Sheet, "Verifying Origin".)
 */
export function crossOriginProblem(headers: IncomingHttpHeaders): string | null {
  const site = firstHeader(headers["sec-fetch-site"])?.toLowerCase();
  if (site !== undefined)
    return site === "same-origin" || site === "none"
      ? null
      : `the request came from ${site === "same-site" ? "another page on this machine or domain" : "another website"}`;
  const origin = firstHeader(headers.origin);
  if (origin === undefined) return null;
  if (trustedOrigins.includes(origin)) return null;
  const host = firstHeader(headers.host);
  try {
    if (host !== undefined && new URL(origin).host === host) return null;
  } catch {
    return "the request's Origin header is not an address";
  }
  return `the request came from ${origin}`;
}

const refusal = (problem: string) =>
  new HttpError(
    403,
    "cross_origin",
    `Outroll refused this change because ${problem}, not from Outroll's own pages. Open Outroll at its own address and try again.`,
  );

/** 403 `cross_origin` for a state-changing request (anything but GET, HEAD, OPTIONS) sent from another origin. */
export const requireSameOrigin: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const problem = crossOriginProblem(req.headers);
  next(problem ? refusal(problem) : undefined);
};

/** socket.io's `allowRequest`: the handshake of a board or a phone from another origin is refused before it connects. */
export function allowSocketHandshake(
  request: { headers: IncomingHttpHeaders },
  answer: (error: string | null | undefined, success: boolean) => void,
) {
  const problem = crossOriginProblem(request.headers);
  answer(problem ? `cross_origin: Outroll refused this connection because ${problem}.` : null, problem === null);
}
