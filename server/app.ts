import { existsSync } from "node:fs";
import path from "node:path";
import express from "express";
import helmet from "helmet";
import { rateLimit } from "express-rate-limit";
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
import { healthRouter } from "./routes/health.routes";
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
      autoLogging: { ignore: (req) => req.url === "/api/health" || !req.url?.startsWith("/api") },
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );
  // Pupils' phones reach the app over plain http on the school network, so no HTTPS upgrade or HSTS here.
  app.use(
    helmet({
      strictTransportSecurity: false,
      contentSecurityPolicy: {
        directives: {
          "img-src": ["'self'", "data:", "blob:"],
          "connect-src": ["'self'", "ws:", "wss:"],
          "upgrade-insecure-requests": null,
        },
      },
    }),
  );

  const signInLimiter = rateLimit({
    windowMs: 60_000,
    limit: options.signInLimitPerMinute ?? env.SIGN_IN_LIMIT_PER_MINUTE,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    // Without a trusted proxy a forwarded address is ignored on purpose (TRUST_PROXY), not a set-up mistake to warn about.
    validate: { xForwardedForHeader: false },
    handler: (_req, res) => {
      res.status(429).json({ error: { code: "too_many_attempts", message: "Too many sign-in attempts. Wait a minute and try again." } });
    },
  });
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
  app.use("/api/health", healthRouter);
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

  const clientDir = env.CLIENT_DIR;
  if ((options.serveClient ?? true) && existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    app.get("/{*splat}", (_req, res) => res.sendFile(path.join(clientDir, "index.html")));
  }
  app.use(errorHandler);
  return app;
}
