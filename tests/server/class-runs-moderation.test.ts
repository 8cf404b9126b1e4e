import { and, eq, sql } from "drizzle-orm";
import { io as connect, type Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  EVENTS,
  type BoardSnapshotAck,
  type GroupJoinAck,
  type GroupRemovedBroadcast,
  type GroupResumeAck,
  type GroupUpdateBroadcast,
  type RollRecordAck,
  type VoteCastAck,
} from "@shared/events";
import type { ClassRun } from "@shared/schemas/class-runs";
import type { RunResults } from "@shared/schemas/results";
import { keyValueOutboxStore, recordOperation, RollOutbox } from "../../src/features/class-runs/delivery/roll-outbox";
import { socketOutboxTransport } from "../../src/features/class-runs/delivery/socket-transport";
import { db } from "../../server/db/client";
import { classRun, roll as rollTable, runGroup } from "../../server/db/schema/index";
import { sweepIdleRuns } from "../../server/realtime/class-run-events";
import { runRollCeiling } from "../../server/limits/room-limits";
import { env } from "../../server/env";
import { createLessonFor, randomRollOf, rollOf, sessionCookie, type TestPupil } from "../helpers/class-run-fixtures";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { startTestApp, type HttpAgent, type TestApp } from "../helpers/test-app";

let app: TestApp;
let department: DepartmentFixture;
let teacher: HttpAgent;
let teacherEmail: string;
const sockets: Socket[] = [];

beforeAll(async () => {
  // Behind a pretend proxy on loopback, so each test phone can come from its own school address (X-Forwarded-For).
  app = await startTestApp({ trustProxy: ["loopback"] });
  department = await createDepartment(app.baseUrl, "room-moderation", 1);
  teacher = department.teachers[0].agent;
  teacherEmail = department.teachers[0].email;
});
afterAll(async () => {
  for (const socket of sockets) socket.disconnect();
  await app.close();
});

/** A documentation address block (RFC 5737), one per test, so each test's per-address limits start fresh. */
let nextAddress = 1;
const schoolAddress = () => `198.51.100.${nextAddress++}`;

/** A phone's socket, as if behind the school's one address (X-Forwarded-For, trusted from this loopback proxy). */
async function phoneSocket(address: string): Promise<Socket> {
  const socket = connect(app.baseUrl, {
    path: "/socket.io",
    transports: ["websocket"],
    forceNew: true,
    reconnection: false,
    extraHeaders: { "x-forwarded-for": address },
  });
  sockets.push(socket);
  await new Promise<void>((resolve, reject) => {
    socket.once("connect", () => resolve());
    socket.once("connect_error", reject);
  });
  return socket;
}

async function openRun(options: Parameters<typeof createLessonFor>[1] & { groupCap?: number } = {}): Promise<ClassRun> {
  const lessonId = await createLessonFor(teacherEmail, options);
  const response = await teacher.post("/api/class-runs", { lessonId, ...(options.groupCap ? { groupCap: options.groupCap } : {}) });
  expect(response.status).toBe(201);
  return response.body;
}

async function moveTo(run: ClassRun, phase: string) {
  const response = await teacher.post(`/api/class-runs/${run.id}/phase`, { phase });
  expect(response.status).toBe(200);
}

async function join(run: ClassRun, nickname: string, address: string, attemptId?: string): Promise<TestPupil> {
  const socket = await phoneSocket(address);
  const ack: GroupJoinAck = await socket.emitWithAck(EVENTS.groupJoin, {
    code: run.joinCode,
    nickname,
    ...(attemptId ? { attemptId } : {}),
  });
  if (!ack.ok) throw new Error(`join failed: ${ack.error.code} ${ack.error.message}`);
  return { socket, token: ack.token, state: ack.state };
}

/** Records a legal roll of the pupil's matchup (the faces asked for where they fit its dice, else random ones). */
function record(pupil: TestPupil, faces: number[][]): Promise<RollRecordAck> {
  const { run, group } = pupil.state;
  const fits = faces.every((seatFaces, seat) => seatFaces.every((face) => run.dice[group.matchup![seat]].faces.includes(face)));
  return pupil.socket.emitWithAck(EVENTS.rollRecord, { token: pupil.token, roll: fits ? rollOf(pupil, faces) : randomRollOf(pupil) });
}

async function boardSnapshot(run: ClassRun) {
  const board = connect(app.baseUrl, {
    path: "/socket.io",
    transports: ["websocket"],
    forceNew: true,
    extraHeaders: { cookie: await sessionCookie(app.baseUrl, teacherEmail, "a-long-password") },
  });
  sockets.push(board);
  const ack: BoardSnapshotAck = await board.emitWithAck(EVENTS.boardSnapshot, { runId: run.id });
  if (!ack.ok) throw new Error(ack.error.message);
  return ack.snapshot;
}

/** The data lines of a CSV download (its header and blank lines not counted). */
const csvRows = (text: string) => text.split("\r\n").filter((line) => line.trim() !== "").length - 1;

const keptRolls = async (runId: string) => (await db.select().from(rollTable).where(eq(rollTable.runId, runId))).length;

describe("phases govern the pads", () => {
  it("refuses a roll in Guess, Pool, Prove and Reflect as not_roll_phase, the outbox keeps it, and sends it once the run is back in Roll", async () => {
    const run = await openRun();
    expect(run.phase).toBe("Guess");
    const pupil = await join(run, "Rockpool Rangers", schoolAddress());
    const memory = new Map<string, string>();
    const store = keyValueOutboxStore(
      { getItem: (key) => memory.get(key) ?? null, setItem: (key, value) => void memory.set(key, value) },
      "outbox",
    );
    const outbox = new RollOutbox(
      store,
      socketOutboxTransport(pupil.socket, () => pupil.token, 2_000),
      { retryDelayMs: 100 },
    );
    const refusals: string[] = [];
    outbox.subscribe((event) => {
      if (event.type === "refused") refusals.push(event.error.code);
    });

    for (const phase of ["Guess", "Pool", "Prove", "Reflect"]) {
      if (phase !== "Guess") await moveTo(run, phase);
      const answer = await record(pupil, [[5], [3]]);
      expect(answer).toMatchObject({ ok: false, error: { code: "not_roll_phase", retryAfterMs: expect.any(Number) } });
    }
    // The outbox of the phone keeps a roll refused for the phase, without showing it as refused.
    outbox.add(recordOperation(rollOf(pupil, [[6], [2]])));
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(outbox.pending()).toHaveLength(1);
    expect(refusals).toEqual([]);
    expect(await keptRolls(run.id)).toBe(0);

    await moveTo(run, "Roll");
    const deadline = Date.now() + 10_000;
    while (outbox.pending().length > 0 && Date.now() < deadline) {
      outbox.flush();
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    outbox.stop();
    expect(outbox.pending()).toHaveLength(0);
    expect(await keptRolls(run.id)).toBe(1);
  });

  it("refuses a vote outside Guess", async () => {
    const run = await openRun({ phases: ["Guess", "Roll"] });
    const pupil = await join(run, "Gull Patrol", schoolAddress());
    expect((await pupil.socket.emitWithAck(EVENTS.voteCast, { token: pupil.token, dieIndex: 1 })).ok).toBe(true);
    await moveTo(run, "Roll");
    const late: VoteCastAck = await pupil.socket.emitWithAck(EVENTS.voteCast, { token: pupil.token, dieIndex: 2 });
    expect(late).toMatchObject({ ok: false, error: { code: "voting_closed" } });
  });
});

describe("joining is safe to repeat", () => {
  it("answers a retried join whose acknowledgement was lost with the same group and a working token, leaving one group", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const address = schoolAddress();
    const attemptId = uuidv4();
    // The first attempt reaches the server, but the phone drops off before the answer arrives.
    const lost = await phoneSocket(address);
    lost.emit(EVENTS.groupJoin, { code: run.joinCode, nickname: "Harbour Seals", attemptId }, () => undefined);
    await expect.poll(async () => (await db.select().from(runGroup).where(eq(runGroup.runId, run.id))).length, { timeout: 5_000 }).toBe(1);
    lost.disconnect();

    const retried = await join(run, "Harbour Seals", address, attemptId);
    const again = await join(run, "Harbour Seals", address, attemptId);
    expect(again.state.group.id).toBe(retried.state.group.id);
    expect((await record(retried, [[5], [3]])).ok).toBe(true);
    const groups = await db.select().from(runGroup).where(eq(runGroup.runId, run.id));
    expect(groups.map((group) => group.nickname)).toEqual(["Harbour Seals"]);

    // Another phone choosing the same nickname with its own attempt is still refused.
    const other = await phoneSocket(address);
    const taken: GroupJoinAck = await other.emitWithAck(EVENTS.groupJoin, {
      code: run.joinCode,
      nickname: "Harbour Seals",
      attemptId: uuidv4(),
    });
    expect(taken).toMatchObject({ ok: false, error: { code: "nickname_taken" } });
  });

  it("refuses a look-alike of another group's nickname and the virtual class's names", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const address = schoolAddress();
    await join(run, "Kelp Crew", address);
    const phone = await phoneSocket(address);
    // Cyrillic es (U+0441) for the Latin c, and a capital I for the small l.
    const lookalike: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "KeIp \u0441rew" });
    expect(lookalike).toMatchObject({ ok: false, error: { code: "nickname_taken" } });
    const reserved: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "Virtual group 1" });
    expect(reserved).toMatchObject({ ok: false, error: { code: "invalid_input" } });
  });
});

describe("moderation on the Run board", () => {
  it("removes a group: it leaves the board and the figures, its phone is told, and its token is dead for every event", async () => {
    const run = await openRun({ phases: ["Roll", "Pool"] });
    const address = schoolAddress();
    const keep = await join(run, "Tide Turners", address);
    const gone = await join(run, "Spam Spam", address);
    for (let index = 0; index < 3; index += 1) expect((await record(keep, [[5], [3]])).ok).toBe(true);
    for (let index = 0; index < 4; index += 1) expect((await record(gone, [[4], [4]])).ok).toBe(true);
    const before = await boardSnapshot(run);
    expect(before.tallies[0].pooled.totals.rolls).toBe(7);

    const told = new Promise<GroupRemovedBroadcast>((resolve) => gone.socket.once(EVENTS.groupRemoved, resolve));
    const removed = await teacher.delete(`/api/class-runs/${run.id}/groups/${gone.state.group.id}`);
    expect(removed.status).toBe(200);
    expect(await told).toEqual({ runId: run.id, groupId: gone.state.group.id });

    const after = await boardSnapshot(run);
    expect(after.groups.map((group) => group.nickname)).toEqual(["Tide Turners"]);
    expect(after.tallies[0].pooled.totals.rolls).toBe(3);
    expect(after.version).toBeGreaterThan(before.version);

    const resumed: GroupResumeAck = await gone.socket.emitWithAck(EVENTS.groupResume, { token: gone.token });
    expect(resumed).toMatchObject({ ok: false, error: { code: "group_removed" } });
    expect(await record(gone, [[4], [4]])).toMatchObject({ ok: false, error: { code: "group_removed" } });
    expect(await gone.socket.emitWithAck(EVENTS.rollUndo, { token: gone.token, rollId: uuidv4() })).toMatchObject({
      ok: false,
      error: { code: "group_removed" },
    });
    expect(await gone.socket.emitWithAck(EVENTS.voteCast, { token: gone.token, dieIndex: 0 })).toMatchObject({
      ok: false,
      error: { code: "group_removed" },
    });
    // Nothing is deleted: the rows stay, marked.
    expect(await keptRolls(run.id)).toBe(7);
    const [row] = await db.select().from(runGroup).where(eq(runGroup.id, gone.state.group.id));
    expect(row.removedAt).not.toBeNull();
  });

  it("renames a group: the pad is told with group:update and reads its new nickname; a look-alike or rude name is refused", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const address = schoolAddress();
    const pupil = await join(run, "Tide Pool", address);
    await join(run, "Gull Patrol", address);
    const told = new Promise<GroupUpdateBroadcast>((resolve) => pupil.socket.once(EVENTS.groupUpdate, resolve));
    const renamed = await teacher.patch(`/api/class-runs/${run.id}/groups/${pupil.state.group.id}`, { nickname: "Lighthouse Lot" });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ id: pupil.state.group.id, nickname: "Lighthouse Lot" });
    expect(await told).toEqual({ runId: run.id, groupId: pupil.state.group.id });
    const resumed: GroupResumeAck = await pupil.socket.emitWithAck(EVENTS.groupResume, { token: pupil.token });
    expect(resumed.ok && resumed.state.group.nickname).toBe("Lighthouse Lot");

    const lookalike = await teacher.patch(`/api/class-runs/${run.id}/groups/${pupil.state.group.id}`, { nickname: "GuII Patrol" });
    expect(lookalike.status).toBe(409);
    expect(lookalike.body.error.code).toBe("nickname_taken");
    const rude = await teacher.patch(`/api/class-runs/${run.id}/groups/${pupil.state.group.id}`, { nickname: "Sh1t Kickers" });
    expect(rude.status).toBe(400);
  });

  it("leaves a group's rolls out of the board, the results, every export and the class list, and counts them again when asked", async () => {
    const run = await openRun({ phases: ["Roll", "Pool"] });
    const address = schoolAddress();
    const counted = await join(run, "North Pier", address);
    const leftOut = await join(run, "South Pier", address);
    for (let index = 0; index < 5; index += 1) expect(await record(counted, [[5], [3]])).toMatchObject({ ok: true });
    for (let index = 0; index < 2; index += 1) expect(await record(leftOut, [[1], [7]])).toMatchObject({ ok: true });

    const response = await teacher.put(`/api/class-runs/${run.id}/groups/${leftOut.state.group.id}/left-out`, { leftOut: true });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ leftOut: true });
    // A left-out group may go on recording; its rolls are stored but counted nowhere.
    expect(await record(leftOut, [[1], [7]])).toMatchObject({ ok: true });
    expect(await keptRolls(run.id)).toBe(8);

    const board = await boardSnapshot(run);
    expect(board.tallies[0].pooled.totals.rolls).toBe(5);
    expect(board.groups.find((group) => group.id === leftOut.state.group.id)).toMatchObject({ leftOut: true, rolls: 3 });

    const results: RunResults = (await teacher.get(`/api/results/runs/${run.id}`)).body;
    expect(results.pooled.totals.rolls).toBe(5);
    expect(results.groups.find((group) => group.id === leftOut.state.group.id)).toMatchObject({ leftOut: true, rolls: 0 });
    const rollsCsv = (await teacher.get(`/api/results/runs/${run.id}/rolls.csv`)).text;
    expect(csvRows(rollsCsv)).toBe(5);
    expect(rollsCsv).not.toContain("South Pier");
    const summaryCsv = (await teacher.get(`/api/results/runs/${run.id}/summary.csv`)).text;
    expect(summaryCsv).not.toContain("South Pier");
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await teacher.get(`/api/results/runs/${run.id}/results.xlsx`)).bytes as unknown as ArrayBuffer);
    expect(workbook.getWorksheet("Rolls")!.rowCount).toBe(1 + 5);
    const list = (await teacher.get("/api/class-runs")).body.runs.find((entry: { id: string }) => entry.id === run.id);
    expect(list.rollCount).toBe(5);

    const asked = (await teacher.get(`/api/results/runs/${run.id}/rolls.csv?includeLeftOut=true`)).text;
    expect(csvRows(asked)).toBe(8);
    await teacher.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    const pooled = await teacher.get(`/api/results/pooled?runIds=${run.id}`);
    expect(pooled.status).toBe(200);
    expect(pooled.body.contributions[0].matchups.reduce((sum: number, entry: { rolls: number }) => sum + entry.rolls, 0)).toBe(5);

    const again = await teacher.put(`/api/class-runs/${run.id}/groups/${leftOut.state.group.id}/left-out`, { leftOut: false });
    expect(again.status).toBe(409);
  });

  it("counts a left-out group again, and the board's version keeps growing through both changes", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const pupil = await join(run, "East Jetty", schoolAddress());
    for (let index = 0; index < 4; index += 1) expect((await record(pupil, [[5], [3]])).ok).toBe(true);
    const first = await boardSnapshot(run);
    await teacher.put(`/api/class-runs/${run.id}/groups/${pupil.state.group.id}/left-out`, { leftOut: true });
    const out = await boardSnapshot(run);
    await teacher.put(`/api/class-runs/${run.id}/groups/${pupil.state.group.id}/left-out`, { leftOut: false });
    const back = await boardSnapshot(run);
    expect([first.tallies[0].pooled.totals.rolls, out.tallies[0].pooled.totals.rolls, back.tallies[0].pooled.totals.rolls]).toEqual([
      4, 0, 4,
    ]);
    expect(out.version).toBeGreaterThan(first.version);
    expect(back.version).toBeGreaterThan(out.version);
  });

  it("locks joining and caps the groups the teacher allowed, while a retried join still gets its group", async () => {
    const run = await openRun({ phases: ["Roll"], groupCap: 2 });
    expect(run.groupCap).toBe(2);
    const address = schoolAddress();
    const attemptId = uuidv4();
    const first = await join(run, "West Slip", address, attemptId);
    const locked = await teacher.put(`/api/class-runs/${run.id}/joining`, { locked: true });
    expect(locked.body).toMatchObject({ joiningLocked: true });
    const phone = await phoneSocket(address);
    expect(await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "Boat Yard" })).toMatchObject({
      ok: false,
      error: { code: "joining_locked" },
    });
    expect((await join(run, "West Slip", address, attemptId)).state.group.id).toBe(first.state.group.id);
    await teacher.put(`/api/class-runs/${run.id}/joining`, { locked: false });
    await join(run, "Boat Yard", address);
    expect(await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "Sea Shanties" })).toMatchObject({
      ok: false,
      error: { code: "run_full" },
    });
    // A removed group frees its place.
    await teacher.delete(`/api/class-runs/${run.id}/groups/${first.state.group.id}`);
    expect((await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "Sea Shanties" })).ok).toBe(true);
  });

  it("lets the head of department watch but not rename, remove, leave out or lock (403)", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const pupil = await join(run, "Listening Lot", schoolAddress());
    const head = department.head;
    const path = `/api/class-runs/${run.id}/groups/${pupil.state.group.id}`;
    expect((await head.get(`/api/class-runs/${run.id}/board`)).status).toBe(200);
    for (const response of [
      await head.patch(path, { nickname: "Renamed Lot" }),
      await head.delete(path),
      await head.put(`${path}/left-out`, { leftOut: true }),
      await head.put(`/api/class-runs/${run.id}/joining`, { locked: true }),
    ]) {
      expect(response.status).toBe(403);
      expect(response.body.error.code).toBe("forbidden");
    }
    expect((await teacher.put(`/api/class-runs/${run.id}/joining`, { locked: "yes" })).status).toBe(400);
    expect((await teacher.delete(`/api/class-runs/${run.id}/groups/${uuidv4()}`)).status).toBe(404);
  });
});

describe("abuse limits", () => {
  it("limits a flood from one connection without touching 30 well-behaved groups behind the same school address", async () => {
    const run = await openRun({ phases: ["Roll"], groupCap: 60 });
    const address = schoolAddress();
    const started = Date.now();

    // One phone tries to make 60 groups as fast as it can.
    const flooder = await phoneSocket(address);
    const floodJoins: GroupJoinAck[] = await Promise.all(
      Array.from({ length: 60 }, (_, index) =>
        flooder.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: `Flood ${index + 1}` }),
      ),
    );
    const floodTokens = floodJoins.flatMap((ack) => (ack.ok ? [{ token: ack.token, state: ack.state }] : []));
    const floodRefusals = floodJoins.filter((ack) => !ack.ok && ack.error.code === "rate_limited");

    // The class: 30 groups, one phone each, all behind the school's address.
    const nicknames = Array.from(
      { length: 30 },
      (_, index) =>
        `${["North", "South", "East", "West", "Upper", "Lower"][index % 6]} ${["Kites", "Gulls", "Crabs", "Seals", "Terns"][Math.floor(index / 6)]}`,
    );
    const classGroups = await Promise.all(nicknames.map((nickname) => join(run, nickname, address)));

    // The flooder sends 400 rolls through its tokens from its one connection while each group records 20.
    const floodRolls = await Promise.all(
      Array.from({ length: 400 }, (_, index) => {
        const owner = floodTokens[index % floodTokens.length];
        return flooder.emitWithAck(EVENTS.rollRecord, {
          token: owner.token,
          roll: randomRollOf({ socket: flooder, ...owner }),
        }) as Promise<RollRecordAck>;
      }),
    );
    const classAcks = (
      await Promise.all(classGroups.map((group) => Promise.all(Array.from({ length: 20 }, () => record(group, [[5], [3]])))))
    ).flat();
    const seconds = (Date.now() - started) / 1000;

    const floodSaved = floodRolls.filter((ack) => ack.ok).length;
    console.log(
      `flood: ${floodTokens.length} of 60 groups made, ${floodSaved} of 400 rolls saved in ${seconds.toFixed(1)} s; class: ${classAcks.filter((ack) => ack.ok).length} of ${classAcks.length} rolls saved`,
    );
    expect(floodTokens.length).toBe(env.JOINS_PER_CONNECTION_PER_MINUTE);
    expect(floodRefusals.length).toBe(60 - env.JOINS_PER_CONNECTION_PER_MINUTE);
    expect(floodRefusals[0]).toMatchObject({ ok: false, error: { retryAfterMs: expect.any(Number) } });
    // One connection gets one group's allowance: the burst and the steady rate for the time it took.
    expect(floodSaved).toBeLessThanOrEqual(env.ROLL_BURST_PER_GROUP + Math.ceil(seconds * env.ROLL_RATE_PER_GROUP));
    expect(floodRolls.some((ack) => !ack.ok && ack.error.code === "rate_limited")).toBe(true);
    expect(classAcks.every((ack) => ack.ok)).toBe(true);
    expect(await keptRolls(run.id)).toBe(floodSaved + 600);

    // The board flags the groups whose phone flooded.
    const board = await boardSnapshot(run);
    expect(board.groups.filter((group) => group.floodedAt !== null).length).toBeGreaterThan(0);
    expect(board.groups.filter((group) => nicknames.includes(group.nickname)).every((group) => group.floodedAt === null)).toBe(true);
  });

  it("slows join-code guessing per connection, per address and over HTTP, answering rate_limited with the wait", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const address = schoolAddress();
    const guesser = await phoneSocket(address);
    const answers: GroupJoinAck[] = [];
    for (let index = 0; index < env.CODE_GUESSES_PER_CONNECTION_PER_MINUTE + 2; index += 1) {
      answers.push(
        await guesser.emitWithAck(EVENTS.groupJoin, {
          code: `ZZZZ${"23456789"[index % 8]}${"ABCDEFGH"[Math.floor(index / 8)]}`,
          nickname: "Guessers",
        }),
      );
    }
    expect(answers.slice(0, env.CODE_GUESSES_PER_CONNECTION_PER_MINUTE).every((ack) => !ack.ok && ack.error.code === "unknown_code")).toBe(
      true,
    );
    const slowed = answers.at(-1)!;
    expect(slowed).toMatchObject({ ok: false, error: { code: "rate_limited", retryAfterMs: expect.any(Number) } });
    if (!slowed.ok) expect(slowed.error.retryAfterMs!).toBeGreaterThan(1_000);
    // Once slowed, even the right code waits; another phone at the school joins.
    expect(await guesser.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname: "Guessers" })).toMatchObject({
      ok: false,
      error: { code: "rate_limited" },
    });
    await join(run, "Honest Lot", address);

    // Per address: many connections from one address share CODE_GUESSES_PER_ADDRESS_PER_MINUTE wrong codes.
    const elsewhere = schoolAddress();
    let wrong = 0;
    let limited: GroupJoinAck | null = null;
    for (let connection = 0; limited === null && connection < 30; connection += 1) {
      const phone = await phoneSocket(elsewhere);
      for (let index = 0; index < 5; index += 1) {
        const ack: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: "YYYYY2", nickname: "Guessers" });
        if (!ack.ok && ack.error.code === "rate_limited") {
          limited = ack;
          break;
        }
        wrong += 1;
      }
      phone.disconnect();
    }
    expect(wrong).toBe(env.CODE_GUESSES_PER_ADDRESS_PER_MINUTE);
    expect(limited).toMatchObject({ ok: false, error: { code: "rate_limited" } });
    const overHttp = await fetch(`${app.baseUrl}/api/pad/${run.joinCode}`, { headers: { "x-forwarded-for": elsewhere } });
    expect(overHttp.status).toBe(429);
    expect((await overHttp.json()).error.code).toBe("rate_limited");
    expect((await fetch(`${app.baseUrl}/api/pad/${run.joinCode}`, { headers: { "x-forwarded-for": schoolAddress() } })).status).toBe(200);
  });

  it("stops a run at its roll ceiling and raises the flag on the board", async () => {
    const run = await openRun({ phases: ["Roll"] });
    const pupil = await join(run, "Ceiling Crew", schoolAddress());
    // As if the run's phones had already sent all but two rolls of the ceiling (the count starts once per run and process).
    runRollCeiling.start(run.id, runRollCeiling.ceiling - 2);
    expect(await record(pupil, [[5], [3]])).toMatchObject({ ok: true });
    expect(await record(pupil, [[5], [3]])).toMatchObject({ ok: true });
    expect(await record(pupil, [[5], [3]])).toMatchObject({ ok: false, error: { code: "run_roll_ceiling" } });
    expect(await keptRolls(run.id)).toBe(2);
    await expect.poll(async () => (await boardSnapshot(run)).run.rollCeilingReachedAt, { timeout: 5_000 }).not.toBeNull();
  });

  it("closes runs left idle, once, whichever process sweeps, and leaves a run with recent rolls open", async () => {
    const idle = await openRun({ phases: ["Roll"] });
    const busy = await openRun({ phases: ["Roll"] });
    const pupil = await join(busy, "Boat Yard", schoolAddress());
    expect((await record(pupil, [[5], [3]])).ok).toBe(true);
    const longAgo = sql`now() - interval '5 hours'`;
    await db
      .update(classRun)
      .set({ lastChangeAt: longAgo })
      .where(and(eq(classRun.id, idle.id)));
    await db
      .update(classRun)
      .set({ lastChangeAt: longAgo })
      .where(and(eq(classRun.id, busy.id)));

    const [first, second] = await Promise.all([sweepIdleRuns(180), sweepIdleRuns(180)]);
    expect([...first, ...second].filter((id) => id === idle.id)).toHaveLength(1);
    expect([...first, ...second]).not.toContain(busy.id);
    const [idleRow] = await db.select().from(classRun).where(eq(classRun.id, idle.id));
    const [busyRow] = await db.select().from(classRun).where(eq(classRun.id, busy.id));
    expect(idleRow.status).toBe("closed");
    expect(idleRow.closedAt).not.toBeNull();
    expect(busyRow.status).toBe("open");
    expect(await sweepIdleRuns(0)).toEqual([]);
  });
});
