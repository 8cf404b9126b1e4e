import { and, eq, isNull, sql } from "drizzle-orm";
import type { Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  decodeBoardUpdate,
  EVENTS,
  RETRYABLE_ERROR_CODES,
  type BoardSnapshotAck,
  type BoardUpdateMessage,
  type GroupJoinAck,
  type GroupResumeAck,
  type RollUndoAck,
  type VoteCastAck,
} from "@shared/events";
import type { BoardSnapshot, ClassRun } from "@shared/schemas/class-runs";
import { mulberry32 } from "@shared/probability/index";
import { db } from "../../server/db/client";
import { roll as rollTable, guessVote } from "../../server/db/schema/index";
import { signGuestToken } from "../../server/services/guest-token";
import {
  createLessonFor,
  joinAsPupil,
  openSocket,
  randomRollOf,
  record,
  rollOf,
  sessionCookie,
  testDice,
  type TestPupil,
} from "../helpers/class-run-fixtures";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { startTestApp, type HttpAgent, type TestApp } from "../helpers/test-app";

let app: TestApp;
let department: DepartmentFixture;
let teacher: HttpAgent;
let teacherEmail: string;
const sockets: Socket[] = [];

beforeAll(async () => {
  app = await startTestApp();
  department = await createDepartment(app.baseUrl, "socket-runs", 1);
  teacher = department.teachers[0].agent;
  teacherEmail = department.teachers[0].email;
});
afterAll(async () => {
  for (const socket of sockets) socket.disconnect();
  await app.close();
});

async function openRun(options: Parameters<typeof createLessonFor>[1] = {}): Promise<ClassRun> {
  const lessonId = await createLessonFor(teacherEmail, options);
  const response = await teacher.post("/api/class-runs", { lessonId });
  expect(response.status).toBe(201);
  return response.body;
}

/** A run whose lesson starts in the Roll phase (the phase that takes rolls), with a Twist to come. */
function openRollingRun(): Promise<ClassRun> {
  return openRun({ phases: ["Roll", "Pool", "Twist", "Reflect"] });
}

async function pupil(run: ClassRun, nickname: string): Promise<TestPupil> {
  const joined = await joinAsPupil(app.baseUrl, run.joinCode, nickname);
  sockets.push(joined.socket);
  return joined;
}

async function storedRolls(runId: string) {
  return db.select().from(rollTable).where(eq(rollTable.runId, runId));
}

describe("joining a class run from a phone", () => {
  it("joins with a nickname, gets a signed token and an assigned matchup, and rejoins the same group with it", async () => {
    const run = await openRun();
    const first = await pupil(run, "Rockpool Rangers");
    expect(first.token).toMatch(/^[\w-]+\.[\w-]+$/);
    expect(first.state.group).toMatchObject({ nickname: "Rockpool Rangers", matchup: [0, 1] });
    expect(first.state.run).toMatchObject({ id: run.id, phase: "Guess", status: "open", tally: 1, players: 2, dicePerPlayer: 1 });
    const second = await pupil(run, "Gull Patrol");
    expect(second.state.group.matchup).toEqual([1, 2]);

    // A reload: a new connection with the stored token is the same group.
    const phone = await openSocket(app.baseUrl);
    sockets.push(phone);
    const resumed: GroupResumeAck = await phone.emitWithAck(EVENTS.groupResume, { token: first.token });
    expect(resumed.ok && resumed.state.group.id).toBe(first.state.group.id);
  });

  it("refuses a nickname another group has, whatever its case", async () => {
    const run = await openRun();
    await pupil(run, "Kelp Crew");
    const phone = await openSocket(app.baseUrl);
    sockets.push(phone);
    const ack: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode.toLowerCase(), nickname: "kelp crew" });
    expect(ack).toEqual({
      ok: false,
      error: { code: "nickname_taken", message: "Another group in this run is already called “kelp crew”. Choose another nickname." },
    });
  });

  it.each([
    ["x", "at least 2 characters"],
    ["sam@school.test", "e-mail address"],
    ["07700 900123", "phone number"],
    ["Sh1t Kickers", "friendlier nickname"],
  ])("refuses the nickname %j with a clear reason", async (nickname, reason) => {
    const run = await openRun();
    const phone = await openSocket(app.baseUrl);
    sockets.push(phone);
    const ack: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: run.joinCode, nickname });
    expect(ack.ok).toBe(false);
    if (!ack.ok) {
      expect(ack.error.code).toBe("invalid_input");
      expect(ack.error.message).toContain(reason);
    }
  });

  it("refuses an unknown code", async () => {
    const phone = await openSocket(app.baseUrl);
    sockets.push(phone);
    const ack: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: "ZZZZZZ", nickname: "Lost Group" });
    expect(ack.ok).toBe(false);
    if (!ack.ok) expect(ack.error.code).toBe("unknown_code");
  });
});

describe("Guess votes", () => {
  it("keeps one vote per group, replaced by a new one, and refuses votes after the Guess phase", async () => {
    const run = await openRun();
    const group = await pupil(run, "Harbour Seals");
    const vote = (dieIndex: number): Promise<VoteCastAck> => group.socket.emitWithAck(EVENTS.voteCast, { token: group.token, dieIndex });
    expect(await vote(2)).toEqual({ ok: true, dieIndex: 2 });
    expect(await vote(0)).toEqual({ ok: true, dieIndex: 0 });
    const votes = await db.select().from(guessVote).where(eq(guessVote.runId, run.id));
    expect(votes.map((entry) => entry.dieIndex)).toEqual([0]);
    expect((await vote(7)).ok).toBe(false);

    await teacher.post(`/api/class-runs/${run.id}/phase`, { phase: "Roll" });
    const late = await vote(1);
    expect(late).toMatchObject({ ok: false, error: { code: "voting_closed" } });
  });
});

describe("recording rolls", () => {
  it("acknowledges a roll only once it is committed, with the totals and winner worked out by the server", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Tide Turners");
    const roll = rollOf(group, [[5], [3]]);
    const ack = await record(group, roll);
    expect(ack).toEqual({ ok: true, id: roll.id, duplicate: false });
    const [stored] = await storedRolls(run.id);
    expect(stored).toMatchObject({
      id: roll.id,
      groupId: group.state.group.id,
      tally: 1,
      matchup: [0, 1],
      faces: [[5], [3]],
      totals: [5, 3],
      winnerSeat: 0,
      source: "phone",
    });
  });

  it("stores a retried roll id once and acknowledges every copy, even two copies in the same batch", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Lighthouse Lot");
    const roll = rollOf(group, [[1], [7]]);
    const [a, b] = await Promise.all([record(group, roll), record(group, roll)]);
    expect(a.ok && b.ok).toBe(true);
    expect([a, b].filter((ack) => ack.ok && ack.duplicate)).toHaveLength(1);
    const again = await record(group, roll);
    expect(again).toEqual({ ok: true, id: roll.id, duplicate: true });
    expect(await storedRolls(run.id)).toHaveLength(1);
  });

  it("refuses a face the die does not have, naming the die and its faces", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Sea Shanties");
    const ack = await record(group, rollOf(group, [[3], [3]]));
    expect(ack).toEqual({ ok: false, error: { code: "bad_faces", message: "3 is not a face of Auk: its faces are 1, 1, 5, 5, 6, 6." } });
    const shape = await record(
      group,
      rollOf(group, [
        [5, 5],
        [3, 3],
      ]),
    );
    expect(shape).toMatchObject({ ok: false, error: { code: "wrong_mode" } });
    const other = await record(group, rollOf(group, [[5], [4]], { matchup: [2, 0] }));
    expect(other).toMatchObject({ ok: false, error: { code: "wrong_matchup" } });
    const malformed = await group.socket.emitWithAck(EVENTS.rollRecord, { token: group.token, roll: { id: "not-a-uuid" } });
    expect(malformed).toMatchObject({ ok: false, error: { code: "invalid_input" } });
    expect(await storedRolls(run.id)).toHaveLength(0);
  });

  it("refuses a token for another run, a forged token and a token naming a group of another run", async () => {
    const runA = await openRollingRun();
    const runB = await openRollingRun();
    const inA = await pupil(runA, "Group Alpha");
    const inB = await pupil(runB, "Group Beta");
    const mixed = signGuestToken({ runId: runB.id, groupId: inA.state.group.id });
    const mixedAck = await inA.socket.emitWithAck(EVENTS.rollRecord, { token: mixed, roll: rollOf(inA, [[5], [3]]) });
    expect(mixedAck).toMatchObject({ ok: false, error: { code: "bad_token" } });
    const [body, signature] = inA.token.split(".");
    const claims = JSON.parse(Buffer.from(body, "base64url").toString());
    const forgedBody = Buffer.from(JSON.stringify({ ...claims, run: runB.id, group: inB.state.group.id })).toString("base64url");
    const forged = await inA.socket.emitWithAck(EVENTS.rollRecord, { token: `${forgedBody}.${signature}`, roll: rollOf(inB, [[3], [4]]) });
    expect(forged).toMatchObject({ ok: false, error: { code: "bad_token" } });
    // Run B's roll cannot be undone with run A's token.
    const inBRoll = rollOf(inB, [[6], [2]]);
    expect((await record(inB, inBRoll)).ok).toBe(true);
    const undo: RollUndoAck = await inA.socket.emitWithAck(EVENTS.rollUndo, { token: inA.token, rollId: inBRoll.id });
    expect(undo).toMatchObject({ ok: false, error: { code: "not_found" } });
    expect(await storedRolls(runA.id)).toHaveLength(0);
  });

  it("undoes a roll by marking it, and a late resend of the same id does not bring it back", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Undo Crew");
    const roll = rollOf(group, [[6], [2]]);
    await record(group, roll);
    const undo: RollUndoAck = await group.socket.emitWithAck(EVENTS.rollUndo, { token: group.token, rollId: roll.id });
    expect(undo).toEqual({ ok: true, id: roll.id });
    expect(await record(group, roll)).toEqual({ ok: true, id: roll.id, duplicate: true });
    const [stored] = await storedRolls(run.id);
    expect(stored.undoneAt).not.toBeNull();
    const resumed: GroupResumeAck = await group.socket.emitWithAck(EVENTS.groupResume, { token: group.token });
    expect(resumed.ok && resumed.state.savedRolls).toBe(0);
  });

  it("refuses rolls while paused (to be sent again) and after closing (for good)", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Pause Pals");
    expect((await teacher.post(`/api/class-runs/${run.id}/status`, { status: "paused" })).status).toBe(200);
    const paused = await record(group, rollOf(group, [[1], [2]]));
    expect(paused).toMatchObject({ ok: false, error: { code: "run_paused", retryAfterMs: 3000 } });
    if (!paused.ok) expect(paused.error.message).toContain("kept on the phone");
    await teacher.post(`/api/class-runs/${run.id}/status`, { status: "open" });
    expect((await record(group, rollOf(group, [[1], [2]]))).ok).toBe(true);
    await teacher.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    const closed = await record(group, rollOf(group, [[5], [2]]));
    expect(closed).toEqual({
      ok: false,
      error: { code: "run_closed", message: "This class run is closed: it takes no more rolls. Thank you for playing!" },
    });
    expect(await storedRolls(run.id)).toHaveLength(1);
  });

  it("slows a stuck button: past the burst a group is told to wait, and loses nothing it was told was saved", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Stuck Button");
    const acks = await Promise.all(Array.from({ length: 75 }, () => record(group, rollOf(group, [[6], [2]]))));
    const limited = acks.filter((ack) => !ack.ok && ack.error.code === "rate_limited");
    const saved = acks.filter((ack) => ack.ok);
    expect(limited.length).toBeGreaterThan(0);
    expect(limited[0]).toMatchObject({ ok: false, error: { retryAfterMs: expect.any(Number) } });
    expect(await storedRolls(run.id)).toHaveLength(saved.length);
  });

  it("starts a fresh tally at Twist and refuses a late roll of the first tally as not_roll_phase, which the phone keeps", async () => {
    const run = await openRollingRun();
    const group = await pupil(run, "Twisty Lot");
    const early = rollOf(group, [[5], [4]]);
    const twist = await teacher.post(`/api/class-runs/${run.id}/phase`, { phase: "Twist", twist: "two-dice-each" });
    expect(twist.body).toMatchObject({ currentTally: 2, dicePerPlayer: 2, players: 2 });
    const late = await record(group, early);
    expect(late).toMatchObject({ ok: false, error: { code: "not_roll_phase" } });
    expect(RETRYABLE_ERROR_CODES).toContain("not_roll_phase");
    const resumed: GroupResumeAck = await group.socket.emitWithAck(EVENTS.groupResume, { token: group.token });
    if (!resumed.ok) throw new Error(resumed.error.message);
    const twisted = { ...group, state: resumed.state };
    expect((await record(twisted, rollOf(twisted, [[5], [4]]))).ok).toBe(false);
    expect(
      (
        await record(
          twisted,
          rollOf(twisted, [
            [5, 1],
            [4, 7],
          ]),
        )
      ).ok,
    ).toBe(true);
    const tallies = await db
      .select({ tally: rollTable.tally, dice: rollTable.dicePerPlayer })
      .from(rollTable)
      .where(eq(rollTable.runId, run.id));
    expect(tallies).toEqual([{ tally: 2, dice: 2 }]);
  });
});

describe("the Run board over socket.io", () => {
  it("answers a snapshot whose pooled counts equal a direct COUNT from the database, after several pupils record at once", async () => {
    const run = await openRun({ phases: ["Roll", "Pool", "Reflect"] });
    const groups = await Promise.all(["North Pier", "South Pier", "East Jetty", "West Slip", "Boat Yard"].map((name) => pupil(run, name)));
    const source = mulberry32(99);
    const random = () => source() / 2 ** 32;
    await Promise.all(
      groups.map(async (group) => {
        for (let index = 0; index < 30; index += 1) {
          const ack = await record(group, randomRollOf(group, random));
          expect(ack.ok ? "saved" : ack.error.message).toBe("saved");
        }
      }),
    );
    // Groups join at once, so which matchup each got varies: the undone roll is drawn from its own dice.
    const undone = randomRollOf(groups[0], random);
    expect(await record(groups[0], undone)).toMatchObject({ ok: true });
    expect(await groups[0].socket.emitWithAck(EVENTS.rollUndo, { token: groups[0].token, rollId: undone.id })).toEqual({
      ok: true,
      id: undone.id,
    });

    const board = await openSocket(app.baseUrl, await sessionCookie(app.baseUrl, teacherEmail, "a-long-password"));
    sockets.push(board);
    const ack: BoardSnapshotAck = await board.emitWithAck(EVENTS.boardSnapshot, { runId: run.id });
    if (!ack.ok) throw new Error(ack.error.message);
    const pooled = ack.snapshot.tallies[0].pooled;

    const counted = await db
      .select({
        matchup: sql<string>`${rollTable.matchup}::text`,
        rolls: sql<number>`count(*)::int`,
        firstSeatWins: sql<number>`count(*) filter (where ${rollTable.winnerSeat} = 0)::int`,
        ties: sql<number>`count(*) filter (where ${rollTable.winnerSeat} is null)::int`,
      })
      .from(rollTable)
      .where(and(eq(rollTable.runId, run.id), isNull(rollTable.undoneAt)))
      .groupBy(rollTable.matchup);
    expect(pooled.totals.rolls).toBe(150);
    for (const row of counted) {
      const matchup = JSON.parse(row.matchup) as number[];
      // The board pools each matchup with its dice in ascending order; [2, 0] is shown as Auk v Guillemot, seats swapped.
      const entry = pooled.matchups.find((candidate) => candidate.matchup.join() === [...matchup].sort().join())!;
      const firstSeat = matchup[0] < matchup[1] ? 0 : 1;
      expect(entry.rolls).toBe(row.rolls);
      expect(entry.seats[firstSeat].wins).toBe(row.firstSeatWins);
      expect(entry.seats[0].ties).toBe(row.ties);
    }
    expect(ack.snapshot.undoneRolls).toBe(1);
    expect(ack.snapshot.groups.map((group) => group.rolls).sort()).toEqual([30, 30, 30, 30, 30]);
  });

  it("pushes throttled updates with rising versions, far fewer than the rolls, ending at the database's figures", async () => {
    const run = await openRun({ phases: ["Roll", "Pool"] });
    const group = await pupil(run, "Fast Hands");
    const board = await openSocket(app.baseUrl, await sessionCookie(app.baseUrl, teacherEmail, "a-long-password"));
    sockets.push(board);
    const first: BoardSnapshotAck = await board.emitWithAck(EVENTS.boardSnapshot, { runId: run.id });
    if (!first.ok) throw new Error(first.error.message);
    const updates: BoardSnapshot[] = [];
    board.on(EVENTS.boardUpdate, (message: BoardUpdateMessage) => updates.push(decodeBoardUpdate(message)));
    for (let index = 0; index < 40; index += 1) expect((await record(group, rollOf(group, [[6], [3]]))).ok).toBe(true);
    await new Promise((resolve) => setTimeout(resolve, 800));
    expect(updates.length).toBeGreaterThan(0);
    expect(updates.length).toBeLessThan(40);
    const versions = updates.map((update) => update.version);
    expect(versions).toEqual([...versions].sort((x, y) => x - y));
    expect(versions[0]).toBeGreaterThan(first.snapshot.version);
    expect(updates.at(-1)!.tallies[0].pooled.totals.rolls).toBe(40);
  });

  it("refuses a board to a signed-out socket and to a teacher of another department", async () => {
    const run = await openRun();
    const anonymous = await openSocket(app.baseUrl);
    sockets.push(anonymous);
    expect(await anonymous.emitWithAck(EVENTS.boardSnapshot, { runId: run.id })).toMatchObject({
      ok: false,
      error: { code: "unauthenticated" },
    });
    const other = await createDepartment(app.baseUrl, "socket-other", 0);
    const cookie = await sessionCookie(app.baseUrl, other.headEmail, "a-long-password");
    const stranger = await openSocket(app.baseUrl, cookie);
    sockets.push(stranger);
    expect(await stranger.emitWithAck(EVENTS.boardSnapshot, { runId: run.id })).toMatchObject({ ok: false, error: { code: "not_found" } });
    expect(await stranger.emitWithAck(EVENTS.boardSnapshot, { runId: uuidv4() })).toMatchObject({
      ok: false,
      error: { code: "not_found" },
    });
  });

  it("sends run:phase and run:status to the run's phones", async () => {
    const run = await openRun();
    const group = await pupil(run, "Listening Lot");
    const phase = new Promise((resolve) => group.socket.once(EVENTS.runPhase, resolve));
    await teacher.post(`/api/class-runs/${run.id}/phase`, { phase: "Roll" });
    expect(await phase).toMatchObject({ runId: run.id, phase: "Roll", tally: 1 });
    const status = new Promise((resolve) => group.socket.once(EVENTS.runStatus, resolve));
    await teacher.post(`/api/class-runs/${run.id}/status`, { status: "paused" });
    expect(await status).toEqual({ runId: run.id, status: "paused" });
  });

  it("keeps the dice the run copied, whatever the set says later", async () => {
    const run = await openRun();
    expect(run.dice.map((die) => die.name)).toEqual(testDice.map((die) => die.name));
  });
});
