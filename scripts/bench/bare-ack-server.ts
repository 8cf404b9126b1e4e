// The ceiling for the class-run load case: a bare socket.io server on the same port set-up that only acknowledges
// each message (no validation, no database). Run by scripts/bench/class-run-load.ts as its own process.
import { createServer } from "node:http";
import { Server } from "socket.io";

const port = Number(process.env.PORT ?? 0);
const server = createServer();
const io = new Server(server, { path: "/socket.io", serveClient: false, maxHttpBufferSize: 64 * 1024 });
io.on("connection", (socket) => {
  socket.on("group:join", (_payload: unknown, acknowledge: (answer: unknown) => void) =>
    acknowledge({ ok: true, token: "bare", state: null }),
  );
  socket.on("roll:record", (payload: { roll: { id: string } }, acknowledge: (answer: unknown) => void) =>
    acknowledge({ ok: true, id: payload.roll.id, duplicate: false }),
  );
});
server.listen(port, "127.0.0.1", () => console.log("bare socket.io server listening"));
process.on("SIGTERM", () => {
  io.close();
  server.close(() => process.exit(0));
});
