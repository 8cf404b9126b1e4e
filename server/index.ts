import { pool } from "./db/client";
import { runMigrations } from "./db/migrate";
import { env } from "./env";
import { createHttpServer } from "./http-server";
import { logger } from "./logger";
import { startMailDelivery, stopMailDelivery } from "./mail/mailer";
import { scheduleProposalDigests } from "./services/proposal-digest.service";

await runMigrations(pool);
const mail = await startMailDelivery();

const { server, io } = createHttpServer();
const stopProposalDigests = scheduleProposalDigests();

server.listen(env.PORT, env.HOST, () => {
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : env.PORT;
  console.log(`\nOutroll is running at http://${env.HOST}:${port}`);
  console.log("Demo sign-ins are listed by the seed step above (README: Demo sign-ins).");
  if (mail.fakeServer) {
    console.log(`E-mail goes to the local fake mail server on 127.0.0.1:${mail.fakeServer.port}; read it at ${env.appOrigin}/dev/mail`);
  }
  console.log("Press Ctrl-C to stop.");
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, "shutting down");
  const forced = setTimeout(() => process.exit(1), 10_000);
  forced.unref();
  stopProposalDigests();
  io.close();
  server.close(async () => {
    await stopMailDelivery().catch(() => undefined);
    await pool.end().catch(() => undefined);
    process.exit(0);
  });
  server.closeAllConnections();
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
