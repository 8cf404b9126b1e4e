import { createServer } from "node:http";
import { createApp, type AppOptions } from "./app";
import { attachRealtime } from "./realtime/attach-realtime";

/** The HTTP server with the Express app and socket.io on the same port; used by index.ts and by tests. */
export function createHttpServer(options: AppOptions = {}) {
  const app = createApp(options);
  const server = createServer(app);
  const io = attachRealtime(server);
  return { app, server, io };
}
