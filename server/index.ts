import { pool } from "./db/client";
import { runMigrations } from "./db/migrate";
import { env } from "./env";
import { createHttpServer } from "./http-server";
import { startDraining } from "./lifecycle";
import { logger } from "./logger";
import { clearExpiredLimits } from "./limits/shared-limiter";
import { startMailDelivery, stopMailDelivery } from "./mail/mailer";
import { scheduleProposalDigests } from "./services/proposal-digest.service";
import { drainRolls } from "./realtime/class-run-events";
import { startSearchQueue, stopSearchQueue } from "./set-finder/search-queue";

await runMigrations(pool);
const mail = await startMailDelivery();
// Set finder searches are optional to a lesson: a queue that cannot start is logged, and the page says searches cannot start.
await startSearchQueue().catch((error: unknown) => logger.error({ err: error }, "the Set finder queue did not start"));

const { server, io } = createHttpServer();
const stopProposalDigests = scheduleProposalDigests();
// Expired limit counts are rewritten when their key comes back; this only keeps the table small.
setInterval(() => void clearExpiredLimits().catch(() => undefined), 60 * 60 * 1000).unref();

server.listen(env.PORT, env.HOST, () => {
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : env.PORT;
  logger.info({ port, pid: process.pid }, "listening");
  const local = `http://${env.HOST}:${port}`;
  console.log(`\nOutroll is running at ${local}${env.appOrigin !== local ? ` (reached as ${env.appOrigin})` : ""}`);
  if (mail.fakeServer) {
    console.log(`E-mail goes to the local fake mail server on 127.0.0.1:${mail.fakeServer.port}; read it at ${env.appOrigin}/dev/mail`);
  } else if (!env.SMTP_URL) {
    console.log("No SMTP_URL is set: invitations and password resets cannot be e-mailed (docs/operations.md).");
  }
  console.log("Press Ctrl-C to stop.");
});

let stopping = false;
/**
 * Graceful drain: readiness turns 503 and the listener closes (the proxy sends new connections to other processes),
 * every queued roll is written and acknowledged, then phones' connections are closed without a socket.io "disconnect",
 * so their clients reconnect by themselves (through the proxy, to another process) and resend whatever they still hold.
 */
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, "draining before exit");
  const forced = setTimeout(() => {
    logger.warn("drain took longer than SHUTDOWN_GRACE_SECONDS; exiting anyway");
    process.exit(1);
  }, env.SHUTDOWN_GRACE_SECONDS * 1000);
  forced.unref();
  stopProposalDigests();
  startDraining();
  server.close();
  await drainRolls(io).catch((error: unknown) =>
    logger.warn({ err: error }, "some rolls could not be written; phones keep and resend them"),
  );
  // A transport close, unlike io.close()'s "server shutting down" packet, makes socket.io clients reconnect on their own.
  io.engine.close();
  await stopSearchQueue().catch((error: unknown) => logger.warn({ err: error }, "the Set finder queue did not stop cleanly"));
  io.close();
  server.closeAllConnections();
  await stopMailDelivery().catch(() => undefined);
  await pool.end().catch(() => undefined);
  logger.info("stopped");
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
