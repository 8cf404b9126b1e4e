import type { Server as HttpServer } from "node:http";
import { Server } from "socket.io";
import { allowSocketHandshake, trustedOrigins } from "../middleware/same-origin";
import { registerClassRunEvents } from "./class-run-events";

export type RealtimeServer = Server;

/** Each feature's socket.io handlers, registered on one server. */
const featureHandlers: ((io: Server) => void)[] = [];
featureHandlers.push(registerClassRunEvents);

/** socket.io on the app's own HTTP server; pupils' phones and the Run board share it. */
export function attachRealtime(server: HttpServer): Server {
  const io = new Server(server, {
    path: "/socket.io",
    serveClient: false,
    maxHttpBufferSize: 64 * 1024,
    cors: { origin: trustedOrigins, credentials: true },
    // Boards and phones alike: a page of another origin may neither read a Run board nor record rolls.
    allowRequest: allowSocketHandshake,
  });
  for (const register of featureHandlers) register(io);
  return io;
}
