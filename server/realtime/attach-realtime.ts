import type { Server as HttpServer } from "node:http";
import { createAdapter } from "@socket.io/postgres-adapter";
import pg from "pg";
import { Server } from "socket.io";
import { allowSocketHandshake, trustedOrigins } from "../middleware/same-origin";
import { guardPool } from "../db/client";
import { env } from "../env";
import { logger } from "../logger";
import { registerClassRunEvents } from "./class-run-events";

export type RealtimeServer = Server;

/** Each feature's socket.io handlers, registered on one server. */
const featureHandlers: ((io: Server) => void)[] = [];
featureHandlers.push(registerClassRunEvents);

/**
 * socket.io on the app's own HTTP server; pupils' phones and the Run board share it. Every process's socket.io joins the
 * others through @socket.io/postgres-adapter (LISTEN/NOTIFY on the app's database, on a small pool of its own that
 * reconnects after a database restart), so a broadcast to a run's pads reaches phones on any process.
 */
export function attachRealtime(server: HttpServer): Server {
  const io = new Server(server, {
    path: "/socket.io",
    serveClient: false,
    maxHttpBufferSize: 64 * 1024,
    cors: { origin: trustedOrigins, credentials: true },
    // Boards and phones alike: a page of another origin may neither read a Run board nor record rolls.
    allowRequest: allowSocketHandshake,
  });
  const adapterPool = guardPool(
    new pg.Pool({ connectionString: env.DATABASE_URL, max: 3, connectionTimeoutMillis: 5_000 }),
    "socket.io adapter",
  );
  io.adapter(
    createAdapter(adapterPool, { errorHandler: (error) => logger.warn({ err: error }, "socket.io adapter could not reach the database") }),
  );
  // The adapter publishes its goodbye while io.close() runs, so its pool ends only after that.
  const closeIo = io.close.bind(io);
  io.close = (done?: (error?: Error) => void) =>
    closeIo((error?: Error) => {
      void adapterPool.end().catch(() => undefined);
      done?.(error);
    });
  for (const register of featureHandlers) register(io);
  return io;
}
