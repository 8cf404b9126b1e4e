import { and, eq, isNull, sql } from "drizzle-orm";
import { io as connect, type Socket } from "socket.io-client";
import { afterAll, describe, expect, it } from "vitest";
import {
  decodeBoardUpdate,
  EVENTS,
  type BoardSnapshotAck,
  type BoardUpdateMessage,
  type GroupJoinAck,
  type PadState,
} from "@shared/events";
import { mulberry32 } from "@shared/probability/index";
import { keyValueOutboxStore, recordOperation, RollOutbox } from "../../src/features/class-runs/delivery/roll-outbox";
import { socketOutboxTransport } from "../../src/features/class-runs/delivery/socket-transport";
import { roll as rollTable } from "../../server/db/schema/index";
import {
  freePort,
  scratchFolder,
  sleep,
  startAppProcess,
  startNginx,
  startOwnCluster,
  stopAppProcess,
  waitUntilReady,
  type AppProcess,
  type OwnCluster,
} from "../helpers/app-cluster";
import { createLessonFor, sessionCookie } from "../helpers/class-run-fixtures";
import { signUpAgent } from "../helpers/department-fixtures";

/** A phone: its socket through nginx (reconnecting by itself), its state, and the Roll pad's own outbox over an in-memory store. */
type Phone = { socket: Socket; state: PadState; outbox: RollOutbox; recorded: string[]; random: () => number };

const PUPILS = 30;
const scratch = scratchFolder("fault");
let cluster: OwnCluster | undefined;
let nginx: { url: string; stop: () => Promise<void> } | undefined;
const apps: AppProcess[] = [];
const sockets: Socket[] = [];
const phones: Phone[] = [];

afterAll(async () => {
  for (const phone of phones) phone.outbox.stop();
  for (const socket of sockets) socket.disconnect();
  await Promise.all(apps.map((app) => stopAppProcess(app)));
  await nginx?.stop();
  await cluster?.stop();
  scratch.remove();
});

async function connectedSockets(app: AppProcess): Promise<number> {
  const text = await (await fetch(`${app.url}/metrics`)).text();
  return Number(/^outroll_connected_sockets (\d+)/m.exec(text)?.[1] ?? 0);
}

describe("two app processes behind nginx on one PostgreSQL", () => {
  it(
    "keeps every acknowledged roll exactly once through a kill -9 of one process and a PostgreSQL restart, and the board ends at the database's count",
    { timeout: 240_000 },
    async () => {
      cluster = await startOwnCluster(scratch.path);
      const [portA, portB, proxyPort] = [await freePort(), await freePort(), await freePort()];
      const origin = `http://127.0.0.1:${proxyPort}`;
      apps.push(startAppProcess(portA, cluster.url, origin), startAppProcess(portB, cluster.url, origin));
      await Promise.all(apps.map((app) => waitUntilReady(app.url)));
      nginx = await startNginx(scratch.path, [portA, portB], proxyPort);

      const teacher = await signUpAgent(origin, "fault-two", "Jo Harbour");
      const lessonId = await createLessonFor(teacher.email, { phases: ["Roll", "Pool"] }, cluster.db);
      const opened = await teacher.agent.post("/api/class-runs", { lessonId });
      expect(opened.status).toBe(201);
      const run = opened.body;

      // The Run board watches through process A only; most pupils' rolls reach it through the other process.
      const board = connect(apps[0].url, {
        transports: ["websocket"],
        forceNew: true,
        reconnectionDelay: 200,
        extraHeaders: { cookie: await sessionCookie(origin, teacher.email, "a-long-password") },
      });
      sockets.push(board);
      let boardRolls = -1;
      const watch = async () => {
        const ack: BoardSnapshotAck = await board.emitWithAck(EVENTS.boardSnapshot, { runId: run.id });
        if (!ack.ok) throw new Error(ack.error.message);
        boardRolls = ack.snapshot.tallies[0].pooled.totals.rolls;
      };
      board.on(EVENTS.boardUpdate, (message: BoardUpdateMessage) => {
        boardRolls = decodeBoardUpdate(message).tallies[0].pooled.totals.rolls;
      });
      board.on("connect", () => void watch().catch(() => undefined));
      await new Promise<void>((resolve) => (board.connected ? resolve() : board.once("connect", () => resolve())));
      await watch();

      for (let index = 0; index < PUPILS; index += 1) {
        const socket = connect(origin, { transports: ["websocket"], forceNew: true, reconnectionDelay: 200, reconnectionDelayMax: 600 });
        sockets.push(socket);
        await new Promise<void>((resolve) => socket.once("connect", () => resolve()));
        const ack: GroupJoinAck = await socket.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: `Harbour ${index + 1}` });
        if (!ack.ok) throw new Error(ack.error.message);
        const memory = new Map<string, string>();
        const store = keyValueOutboxStore(
          { getItem: (key) => memory.get(key) ?? null, setItem: (key, value) => void memory.set(key, value) },
          "outbox",
        );
        const outbox = new RollOutbox(
          store,
          socketOutboxTransport(socket, () => ack.token, 2_000),
          { maxInFlight: 4, retryDelayMs: 300 },
        );
        socket.on("connect", () => outbox.flush());
        const source = mulberry32(500 + index);
        phones.push({ socket, state: ack.state, outbox, recorded: [], random: () => source() / 2 ** 32 });
      }
      const [onA, onB] = await Promise.all(apps.map(connectedSockets));
      // nginx spreads the phones (websocket only, so no sticky sessions are needed) over both processes.
      expect(onA).toBeGreaterThan(1);
      expect(onB).toBeGreaterThan(1);

      let recording = true;
      const recorders = phones.map(async (phone) => {
        const { run: padRun, group } = phone.state;
        while (recording) {
          const faces = group.matchup!.map((dieIndex) => [
            padRun.dice[dieIndex].faces[Math.floor(phone.random() * padRun.dice[dieIndex].faces.length)],
          ]);
          const roll = {
            id: crypto.randomUUID(),
            tally: padRun.tally,
            matchup: group.matchup!,
            faces,
            recordedAt: new Date().toISOString(),
          };
          phone.recorded.push(roll.id);
          phone.outbox.add(recordOperation(roll));
          await sleep(350);
        }
      });

      await sleep(2_000);
      const countRolls = async () =>
        (
          await cluster!.db
            .select({ count: sql<number>`count(*)::int` })
            .from(rollTable)
            .where(and(eq(rollTable.runId, run.id), isNull(rollTable.undoneAt)))
        )[0].count;
      const beforeKill = await countRolls();
      apps[1].child.kill("SIGKILL");
      await new Promise((resolve) => apps[1].child.once("exit", resolve));
      // Its phones reconnect through nginx to process A by themselves; their outboxes resend what was not acknowledged.
      await sleep(2_500);
      const beforeRestart = await countRolls();
      cluster.restart();
      await sleep(2_500);
      recording = false;
      await Promise.all(recorders);

      const deadline = Date.now() + 45_000;
      while (phones.some((phone) => phone.outbox.pending().length > 0 || phone.outbox.inFlightCount() > 0)) {
        if (Date.now() > deadline) throw new Error("the outboxes did not empty within 45 s");
        for (const phone of phones) phone.outbox.flush();
        await sleep(250);
      }

      const recorded = phones.flatMap((phone) => phone.recorded);
      const stored = await cluster.db
        .select({ id: rollTable.id, groupId: rollTable.groupId })
        .from(rollTable)
        .where(eq(rollTable.runId, run.id));
      console.log(
        `two-process fault test: ${recorded.length} rolls recorded, ${beforeKill} stored before the kill, ${beforeRestart} before the PostgreSQL restart`,
      );
      expect(beforeKill).toBeGreaterThan(0);
      expect(beforeRestart).toBeGreaterThan(beforeKill);
      expect(stored).toHaveLength(recorded.length);
      expect(new Set(stored.map((row) => row.id))).toEqual(new Set(recorded));
      for (const phone of phones) {
        expect(
          stored
            .filter((row) => row.groupId === phone.state.group.id)
            .map((row) => row.id)
            .sort(),
        ).toEqual([...phone.recorded].sort());
      }
      // Process A was never restarted by hand: it came through the PostgreSQL restart by itself.
      expect(apps[0].child.exitCode).toBeNull();
      expect((await fetch(`${apps[0].url}/api/ready`)).status).toBe(200);

      const counted = await countRolls();
      const boardDeadline = Date.now() + 15_000;
      while (boardRolls !== counted && Date.now() < boardDeadline) await sleep(200);
      expect(boardRolls).toBe(counted);
    },
  );
});
