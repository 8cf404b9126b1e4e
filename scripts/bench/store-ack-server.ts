// A second yardstick for the class-run load case: socket.io plus PostgreSQL and nothing else. Each roll message goes
// through the server's own group commit (RollBatcher, with the server's window, batch size and concurrency) into a bare
// table with a primary key, and is acknowledged after its commit: no validation, no tokens, no run checks, no boards.
import { createServer } from "node:http";
import pg from "pg";
import { Server } from "socket.io";
import type { RollWriteOutcome } from "../../server/db/queries/class-runs";
import { RollBatcher } from "../../server/realtime/roll-batcher";

const port = Number(process.env.PORT ?? 0);
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
await pool.query("create table if not exists bench_store_roll (id uuid primary key, body jsonb not null)");

type BareRoll = { id: string; body: string };
const batcher = new RollBatcher<BareRoll>(
  async (rolls) => {
    await pool.query("insert into bench_store_roll (id, body) select * from unnest($1::uuid[], $2::jsonb[]) on conflict (id) do nothing", [
      rolls.map((entry) => entry.id),
      rolls.map((entry) => entry.body),
    ]);
    return new Map(rolls.map((entry): [string, RollWriteOutcome] => [entry.id, "stored"]));
  },
  { windowMs: Number(process.env.ROLL_BATCH_MS ?? 15), maxBatch: 500, concurrency: 3 },
);

const server = createServer();
const io = new Server(server, { path: "/socket.io", serveClient: false, maxHttpBufferSize: 64 * 1024 });
io.on("connection", (socket) => {
  socket.on("group:join", (_payload: unknown, acknowledge: (answer: unknown) => void) =>
    acknowledge({ ok: true, token: "store", state: null }),
  );
  socket.on("roll:record", (payload: { roll: { id: string } }, acknowledge: (answer: unknown) => void) => {
    batcher.submit({ id: payload.roll.id, body: JSON.stringify(payload.roll) }).then(
      () => acknowledge({ ok: true, id: payload.roll.id, duplicate: false }),
      (error: unknown) => acknowledge({ ok: false, error: { code: "server_error", message: String(error) } }),
    );
  });
});
server.listen(port, "127.0.0.1", () => console.log("store-and-acknowledge socket.io server listening"));
process.on("SIGTERM", () => {
  io.close();
  server.close(() => void pool.end().then(() => process.exit(0)));
});
