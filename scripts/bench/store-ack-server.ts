// A second yardstick for the class-run load case: socket.io plus PostgreSQL and nothing else. Each roll message is
// queued, written in group commits (one multi-row INSERT per 15 ms window, up to 3 in flight) to a bare table with a
// primary key, and acknowledged after its commit: no validation, no tokens, no run checks, no boards.
import { createServer } from "node:http";
import pg from "pg";
import { Server } from "socket.io";

const port = Number(process.env.PORT ?? 0);
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
await pool.query("create table if not exists bench_store_roll (id uuid primary key, body jsonb not null)");

type Pending = { id: string; body: string; acknowledge: (answer: unknown) => void };
let queue: Pending[] = [];
let writing = 0;
let timer: NodeJS.Timeout | null = null;
async function flush() {
  timer = null;
  if (queue.length === 0 || writing >= 3) return;
  const batch = queue.splice(0, 500);
  writing += 1;
  try {
    await pool.query("insert into bench_store_roll (id, body) select * from unnest($1::uuid[], $2::jsonb[]) on conflict (id) do nothing", [
      batch.map((entry) => entry.id),
      batch.map((entry) => entry.body),
    ]);
    for (const entry of batch) entry.acknowledge({ ok: true, id: entry.id, duplicate: false });
  } catch (error) {
    for (const entry of batch) entry.acknowledge({ ok: false, error: { code: "server_error", message: String(error) } });
  } finally {
    writing -= 1;
    if (queue.length && !timer) timer = setTimeout(flush, 15);
  }
}

const server = createServer();
const io = new Server(server, { path: "/socket.io", serveClient: false, maxHttpBufferSize: 64 * 1024 });
io.on("connection", (socket) => {
  socket.on("group:join", (_payload: unknown, acknowledge: (answer: unknown) => void) => acknowledge({ ok: true, token: "store", state: null }));
  socket.on("roll:record", (payload: { roll: { id: string } }, acknowledge: (answer: unknown) => void) => {
    queue.push({ id: payload.roll.id, body: JSON.stringify(payload.roll), acknowledge });
    if (!timer) timer = setTimeout(flush, 15);
  });
});
server.listen(port, "127.0.0.1", () => console.log("store-and-acknowledge socket.io server listening"));
process.on("SIGTERM", () => {
  io.close();
  server.close(() => void pool.end().then(() => process.exit(0)));
});
