import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import { eq } from "drizzle-orm";
import { io as connect, type Socket } from "socket.io-client";
import { afterAll, describe, expect, it } from "vitest";
import { EVENTS, type GroupJoinAck, type PadState } from "@shared/events";
import { mulberry32 } from "@shared/probability/index";
import { keyValueOutboxStore, recordOperation, RollOutbox } from "../../src/features/class-runs/delivery/roll-outbox";
import { socketOutboxTransport } from "../../src/features/class-runs/delivery/socket-transport";
import { db } from "../../server/db/client";
import { roll as rollTable } from "../../server/db/schema/index";
import { createLessonFor } from "../helpers/class-run-fixtures";
import { createDepartment } from "../helpers/department-fixtures";

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

const sleep = (milliseconds: number) => new Promise((resolve) => setTimeout(resolve, milliseconds));

/** The real server as its own process, as `npm start` runs it. */
function startServer(port: number): ChildProcess {
  const child = spawn("node", ["--import", "tsx", "server/index.ts"], {
    env: { ...process.env, PORT: String(port), HOST: "127.0.0.1", APP_ORIGIN: `http://127.0.0.1:${port}`, LOG_LEVEL: "warn" },
    stdio: ["ignore", "ignore", "inherit"],
  });
  return child;
}

async function waitForHealth(baseUrl: string) {
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error("the server did not start within 60 s");
    await sleep(150);
  }
}

/** A phone: its socket (reconnecting by itself), its token and state, and the Roll pad's own outbox over an in-memory store. */
type Phone = { socket: Socket; state: PadState; outbox: RollOutbox; recorded: string[]; random: () => number };

let server: ChildProcess | undefined;
const phones: Phone[] = [];
afterAll(async () => {
  for (const phone of phones) {
    phone.outbox.stop();
    phone.socket.disconnect();
  }
  if (server && server.exitCode === null) {
    const exited = new Promise((resolve) => server!.once("exit", resolve));
    server.kill("SIGTERM");
    await exited;
  }
});

describe("a server killed in the middle of a class run", () => {
  it("loses no roll and stores none twice once the phones reconnect and empty their outboxes", { timeout: 120_000 }, async () => {
    const port = await freePort();
    const baseUrl = `http://127.0.0.1:${port}`;
    server = startServer(port);
    await waitForHealth(baseUrl);

    const department = await createDepartment(baseUrl, "fault-run", 1);
    const teacher = department.teachers[0];
    const lessonId = await createLessonFor(teacher.email, { phases: ["Roll", "Pool"] });
    const opened = await teacher.agent.post("/api/class-runs", { lessonId });
    expect(opened.status).toBe(201);
    const run = opened.body;

    for (let index = 0; index < 6; index += 1) {
      const socket = connect(baseUrl, { transports: ["websocket"], forceNew: true, reconnectionDelay: 150, reconnectionDelayMax: 400 });
      await new Promise<void>((resolve) => socket.once("connect", () => resolve()));
      const ack: GroupJoinAck = await socket.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: `Fault Group ${index + 1}` });
      if (!ack.ok) throw new Error(ack.error.message);
      const memory = new Map<string, string>();
      const store = keyValueOutboxStore(
        { getItem: (key) => memory.get(key) ?? null, setItem: (key, value) => void memory.set(key, value) },
        "outbox",
      );
      const outbox = new RollOutbox(
        store,
        socketOutboxTransport(socket, () => ack.token, 1_500),
        { maxInFlight: 4, retryDelayMs: 300 },
      );
      // As on the phone: whatever is kept goes again on every reconnect.
      socket.on("connect", () => outbox.flush());
      const source = mulberry32(1000 + index);
      phones.push({ socket, state: ack.state, outbox, recorded: [], random: () => source() / 2 ** 32 });
    }

    let recording = true;
    const recorders = phones.map(async (phone) => {
      const { run: padRun, group } = phone.state;
      while (recording) {
        const faces = group.matchup!.map((dieIndex) => {
          const die = padRun.dice[dieIndex].faces;
          return [die[Math.floor(phone.random() * die.length)]];
        });
        const roll = { id: crypto.randomUUID(), tally: padRun.tally, matchup: group.matchup!, faces, recordedAt: new Date().toISOString() };
        phone.recorded.push(roll.id);
        phone.outbox.add(recordOperation(roll));
        await sleep(180);
      }
    });

    await sleep(1_500);
    const savedBeforeKill = (await db.select({ id: rollTable.id }).from(rollTable).where(eq(rollTable.runId, run.id))).length;
    server.kill("SIGKILL");
    await new Promise((resolve) => server!.once("exit", resolve));
    await sleep(1_500);
    const keptWhileDown = phones.reduce((sum, phone) => sum + phone.outbox.pending().length, 0);
    server = startServer(port);
    await waitForHealth(baseUrl);
    await sleep(1_500);
    recording = false;
    await Promise.all(recorders);

    const deadline = Date.now() + 30_000;
    while (phones.some((phone) => phone.outbox.pending().length > 0 || phone.outbox.inFlightCount() > 0)) {
      if (Date.now() > deadline) throw new Error("the outboxes did not empty within 30 s");
      for (const phone of phones) phone.outbox.flush();
      await sleep(200);
    }

    const recorded = phones.flatMap((phone) => phone.recorded);
    console.log(
      `fault test: ${recorded.length} rolls recorded, ${savedBeforeKill} stored before the kill, ${keptWhileDown} kept in outboxes while the server was down`,
    );
    const stored = await db.select({ id: rollTable.id, groupId: rollTable.groupId }).from(rollTable).where(eq(rollTable.runId, run.id));
    expect(savedBeforeKill).toBeGreaterThan(0);
    expect(keptWhileDown).toBeGreaterThan(0);
    expect(stored).toHaveLength(recorded.length);
    expect(new Set(stored.map((row) => row.id))).toEqual(new Set(recorded));
    for (const phone of phones) {
      const mine = stored
        .filter((row) => row.groupId === phone.state.group.id)
        .map((row) => row.id)
        .sort();
      expect(mine).toEqual([...phone.recorded].sort());
    }
  });
});
