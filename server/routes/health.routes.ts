import { Router } from "express";
import { pool } from "../db/client";
import { migrationsApplied } from "../db/migrate";
import { isDraining } from "../lifecycle";
import { databasePoolGauge, metricsRegistry } from "../metrics";

export const healthRouter = Router();

/** Liveness: the process answers. It does not ask the database, so a database restart never gets the process killed. */
healthRouter.get("/health", (_req, res) => {
  res.json({ ok: true });
});

/** Readiness: the database answers and has every migration, and the process is not stopping. 503 otherwise, with why. */
healthRouter.get("/ready", async (_req, res) => {
  if (isDraining()) {
    res.status(503).json({ ok: false, db: "unknown", migrations: "unknown", draining: true });
    return;
  }
  try {
    const applied = await migrationsApplied(pool);
    res.status(applied ? 200 : 503).json({ ok: applied, db: "up", migrations: applied ? "applied" : "pending", draining: false });
  } catch {
    res.status(503).json({ ok: false, db: "down", migrations: "unknown", draining: false });
  }
});

export const metricsRouter = Router();

/** Prometheus metrics of this process. */
metricsRouter.get("/", async (_req, res) => {
  databasePoolGauge.set({ state: "total" }, pool.totalCount);
  databasePoolGauge.set({ state: "idle" }, pool.idleCount);
  databasePoolGauge.set({ state: "waiting" }, pool.waitingCount);
  res.type(metricsRegistry.contentType).send(await metricsRegistry.metrics());
});
