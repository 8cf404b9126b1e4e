import { existsSync } from "node:fs";
import type { ServerResponse } from "node:http";
import express from "express";
import expressStaticGzip from "express-static-gzip";
import helmet from "helmet";
import { rateLimit } from "express-rate-limit";
import { pinoHttp } from "pino-http";
import { toNodeHandler } from "better-auth/node";
import { auth } from "./auth";
import { env } from "./env";
import { logger } from "./logger";
import { errorHandler, notFoundHandler } from "./middleware/error-handler";
import { classRunsRouter, padRouter } from "./routes/class-runs.routes";
import { departmentsRouter } from "./routes/departments.routes";
import { devMailRouter } from "./routes/dev-mail.routes";
import { invitationsRouter } from "./routes/invitations.routes";
import { shelfRouter } from "./routes/shelf.routes";
import { diceSetsRouter } from "./routes/dice-sets.routes";
import { healthRouter } from "./routes/health.routes";
import { lessonsRouter } from "./routes/lessons.routes";
import { meRouter } from "./routes/me.routes";
import { setFinderRouter } from "./routes/set-finder.routes";
import { resultsRouter } from "./routes/results.routes";

export type AppOptions = { signInLimitPerMinute?: number; serveClient?: boolean };

/** Builds the Express app: security headers, auth, JSON API routes, the built client, one error shape. */
export function createApp(options: AppOptions = {}) {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
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
    handler: (_req, res) => {
      res.status(429).json({ error: { code: "too_many_attempts", message: "Too many sign-in attempts. Wait a minute and try again." } });
    },
  });
  app.use(["/api/auth/sign-in", "/api/auth/sign-up", "/api/auth/request-password-reset"], signInLimiter);
  // better-auth reads its own request bodies, so it is mounted before express.json().
  app.all("/api/auth/*splat", toNodeHandler(auth));

  app.use(express.json({ limit: "200kb" }));
  app.use("/api/health", healthRouter);
  app.use("/api/me", meRouter);
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
    const serveClient = clientFiles(clientDir);
    // Source maps and the build's manifests stay beside the build for operators and tests; they are never served.
    app.get("/{*splat}", (req, res, next) => (req.path.endsWith(".map") || req.path.startsWith("/.vite/") ? notFoundHandler(req, res, next) : next()));
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
