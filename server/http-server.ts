import { createServer, type IncomingMessage } from "node:http";
import proxyAddr from "proxy-addr";
import { createApp, type AppOptions } from "./app";
import { attachRealtime } from "./realtime/attach-realtime";

/** The HTTP server with the Express app and socket.io on the same port; used by index.ts and by tests. */
export function createHttpServer(options: AppOptions = {}) {
  const app = createApp(options);
  const server = createServer(app);
  const io = attachRealtime(server);
  // Sockets read the client's address with the app's own "trust proxy" rule, so X-Forwarded-For counts only from TRUST_PROXY.
  const trust = app.get("trust proxy fn") as (address: string, hop: number) => boolean;
  io.use((socket, next) => {
    socket.data.address = proxyAddr(socket.request as IncomingMessage, trust);
    next();
  });
  return { app, server, io };
}
