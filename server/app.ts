import { randomUUID } from "node:crypto";
import { existsSync } from "node:fs";
import type { ServerResponse } from "node:http";
import express from "express";
import expressStaticGzip from "express-static-gzip";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import { toNodeHandler } from "better-auth/node";
import { authRequestHandler } from "./auth";
import { env } from "./env";
import { logger } from "./logger";
import { errorHandler, notFoundHandler } from "./middleware/error-handler";
import { refuseNulCharacters } from "./middleware/refuse-nul-characters";
import { requireSameOrigin } from "./middleware/same-origin";
import { classRunsRouter, padRouter } from "./routes/class-runs.routes";
import { departmentsRouter } from "./routes/departments.routes";
import { devMailRouter } from "./routes/dev-mail.routes";
import { invitationsRouter } from "./routes/invitations.routes";
import { shelfRouter } from "./routes/shelf.routes";
import { diceSetsRouter } from "./routes/dice-sets.routes";
import { healthRouter, metricsRouter } from "./routes/health.routes";
import { isLimitRefusal, sharedLimiter } from "./limits/shared-limiter";
import { lessonsRouter } from "./routes/lessons.routes";
import { meRouter } from "./routes/me.routes";
import { privacyRouter } from "./routes/privacy.routes";
import { setFinderRouter } from "./routes/set-finder.routes";
import { resultsRouter } from "./routes/results.routes";

export type AppOptions = {
  signInLimitPerMinute?: number;
  serveClient?: boolean;
  /** Overrides TRUST_PROXY (tests start apps behind a pretend proxy). */
  trustProxy?: boolean | number | string[];
};

/** The largest request body the account routes (sign-up, sign-in, update-user…) read. */
const AUTH_BODY_LIMIT = "16kb";

/** Builds the Express app: security headers, auth, JSON API routes, the built client, one error shape. */
export function createApp(options: AppOptions = {}) {
  const app = express();
  app.disable("x-powered-by");
  // Forwarded addresses count only from the configured proxy; otherwise a client could pick its own rate-limit key.
  app.set("trust proxy", options.trustProxy ?? env.TRUST_PROXY);
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === "/api/health" || req.url === "/api/ready" || !req.url?.startsWith("/api") },
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );
  // On a school network pupils' phones reach the app over plain http: HSTS only when APP_ORIGIN is https.
  app.use(
    helmet({
      strictTransportSecurity: env.https ? { maxAge: 180 * 24 * 60 * 60, includeSubDomains: false } : false,
      contentSecurityPolicy: {
        directives: {
          "img-src": ["'self'", "data:", "blob:"],
          "connect-src": ["'self'", "ws:", "wss:"],
          "upgrade-insecure-requests": null,
        },
      },
    }),
  );

  // Counted in PostgreSQL, so every app process behind the proxy refuses the same address after the same attempts.
  const signInLimit = options.signInLimitPerMinute ?? env.SIGN_IN_LIMIT_PER_MINUTE;
  // An app given its own limit (a test's) counts apart from every other app, so tests running at once never share a count.
  const signInPrefix = options.signInLimitPerMinute === undefined ? `sign-in-${signInLimit}` : `sign-in-${signInLimit}-${randomUUID()}`;
  const signInCounts = sharedLimiter({ keyPrefix: signInPrefix, points: signInLimit, duration: 60 });
  const signInLimiter: express.RequestHandler = (req, res, next) => {
    signInCounts.consume(req.ip ?? "unknown").then(
      (counted) => {
        res.setHeader("RateLimit-Policy", `${signInLimit};w=60`);
        res.setHeader("RateLimit-Remaining", String(counted.remainingPoints));
        next();
      },
      (refusal: unknown) => {
        if (!isLimitRefusal(refusal)) return next(refusal);
        res.setHeader("Retry-After", String(Math.ceil(refusal.msBeforeNext / 1000)));
        res.status(429).json({ error: { code: "too_many_attempts", message: "Too many sign-in attempts. Wait a minute and try again." } });
      },
    );
  };
  app.use("/api", requireSameOrigin);
  app.use(["/api/auth/sign-in", "/api/auth/sign-up", "/api/auth/request-password-reset"], signInLimiter);
  // better-auth takes a body already read (better-call's node adapter), so the size limit and the NUL check come first.
  app.use(
    "/api/auth",
    express.json({ limit: AUTH_BODY_LIMIT }),
    express.urlencoded({ limit: AUTH_BODY_LIMIT, extended: false }),
    express.text({ type: () => true, limit: AUTH_BODY_LIMIT }),
    refuseNulCharacters,
  );
  app.all("/api/auth/*splat", toNodeHandler(authRequestHandler));

  app.use(express.json({ limit: "200kb" }));
  app.use("/api", refuseNulCharacters);
  app.use("/api", healthRouter);
  app.use("/api/me", meRouter);
  app.use("/api/privacy", privacyRouter);
  app.use("/api/departments", departmentsRouter);
  app.use("/api/dice-sets", diceSetsRouter);
  app.use("/api/set-finder", setFinderRouter);
  app.use("/api/lessons", lessonsRouter);
  app.use("/api/shelf", shelfRouter);
  app.use("/api/invitations", invitationsRouter);
  app.use("/api/dev", devMailRouter);
  app.use("/api/results", resultsRouter);
  app.use("/api/class-runs", classRunsRouter);
  app.use("/api/pad", padRouter);
  app.use("/api", notFoundHandler);
  app.use("/metrics", metricsRouter);

  const clientDir = env.CLIENT_DIR;
  if ((options.serveClient ?? true) && existsSync(clientDir)) {
    const serveClient = clientFiles(clientDir);
    // Source maps and the build's manifests stay beside the build for operators and tests; they are never served.
    app.get("/{*splat}", (req, res, next) =>
      req.path.endsWith(".map") || req.path.startsWith("/.vite/") ? notFoundHandler(req, res, next) : next(),
    );
    app.use(serveClient);
    // The Roll pad is a page of its own; every other address is the teachers' app, whose router shows its pages.
    app.get(["/pad", "/pad/{*splat}"], (req, res, next) => {
      req.url = "/pad.html";
      serveClient(req, res, next);
    });
    app.get("/{*splat}", (req, res, next) => {
      req.url = "/index.html";
      serveClient(req, res, next);
    });
  }
  app.use(errorHandler);
  return app;
}

/** Vite writes only hashed files (name-HASH.ext) into assets/: they never change, so browsers keep them for a year. */
const HASHED_ASSET = /[\\/]assets[\\/][^\\/]+$/;

/**
 * The built client: the brotli or gzip file Vite wrote beside each one when the browser accepts it, hashed assets
 * cached for a year as immutable, everything else (the two pages, the pad's service worker and manifest) revalidated
 * on every load with `no-cache`.
 */
function clientFiles(clientDir: string) {
  return expressStaticGzip(clientDir, {
    enableBrotli: true,
    orderPreference: ["br", "gz"],
    index: false,
    serveStatic: {
      index: false,
      setHeaders: (res: ServerResponse, filePath: string) => {
        res.setHeader("Cache-Control", HASHED_ASSET.test(filePath) ? "public, max-age=31536000, immutable" : "no-cache");
      },
    },
  });
}
