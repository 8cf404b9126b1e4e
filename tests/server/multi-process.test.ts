import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { decodeBoardUpdate, EVENTS, type BoardSnapshotAck, type BoardUpdateMessage, type RollRecordAck } from "@shared/events";
import type { SetFinderJob, SetFinderRequestInput, SetFinderSearchSummary } from "@shared/schemas/set-finder";
import { freePort, sleep, startAppProcess, stopAppProcess, waitUntilReady, type AppProcess } from "../helpers/app-cluster";
import {
  createLessonFor,
  joinAsPupil,
  openSocket,
  randomRollOf,
  record,
  sessionCookie,
  type TestPupil,
} from "../helpers/class-run-fixtures";
import { signUpAgent } from "../helpers/department-fixtures";
import { HttpAgent } from "../helpers/test-app";

// Two real server processes on the test database, each reached directly (no proxy needed to tell them apart).
let a: AppProcess;
let b: AppProcess;
const SIGN_IN_LIMIT = 10;
const ROLL_BURST = 10;
const cleanups: (() => void)[] = [];

beforeAll(async () => {
  const settings = {
    SIGN_IN_LIMIT_PER_MINUTE: String(SIGN_IN_LIMIT),
    ROLL_BURST_PER_GROUP: String(ROLL_BURST),
    ROLL_RATE_PER_GROUP: "0.25",
  };
  const [portA, portB] = [await freePort(), await freePort()];
  a = startAppProcess(portA, process.env.DATABASE_URL!, `http://127.0.0.1:${portA}`, settings);
  b = startAppProcess(portB, process.env.DATABASE_URL!, `http://127.0.0.1:${portB}`, settings);
  await Promise.all([waitUntilReady(a.url), waitUntilReady(b.url)]);
}, 90_000);

afterAll(async () => {
  for (const cleanup of cleanups) cleanup();
  await Promise.all([stopAppProcess(a), stopAppProcess(b)]);
});

/** The same session on the other process: the cookie is signed with the shared secret, the session row is in the shared database. */
function agentWithCookieOn(baseUrl: string, cookie: string): HttpAgent {
  const agent = new HttpAgent(baseUrl);
  const original = agent.request.bind(agent);
  agent.request = (method, path, body, headers = {}) => original(method, path, body, { cookie, ...headers });
  return agent;
}

describe("several app processes on one database", () => {
  it("holds the sign-in limit for one address across both processes", async () => {
    // A forwarded address (trusted from loopback) of the documentation range, so no other test shares its count.
    const address = { "x-forwarded-for": `203.0.113.${Math.floor(Math.random() * 200) + 20}` };
    // A new address each time, so only the per-address limit counts (an account's own wrong passwords are limited too).
    let attempts = 0;
    const attempt = (app: AppProcess) =>
      new HttpAgent(app.url).request(
        "POST",
        "/api/auth/sign-in/email",
        { email: `nobody-${Date.now()}-${(attempts += 1)}@outroll-tests.test`, password: "not-the-password" },
        address,
      );
    const answers: number[] = [];
    for (let index = 0; index < SIGN_IN_LIMIT; index += 1) answers.push((await attempt(index % 2 === 0 ? a : b)).status);
    expect(answers.every((status) => status === 401)).toBe(true);
    const refusedOnA = await attempt(a);
    const refusedOnB = await attempt(b);
    expect([refusedOnA.status, refusedOnB.status]).toEqual([429, 429]);
    expect(refusedOnB.body.error.code).toBe("too_many_attempts");
  });

  it("holds one group's roll limit across both processes, and a board on one process sees rolls recorded through the other", async () => {
    const teacher = await signUpAgent(a.url, "two-process", "Kit Quay");
    const { db } = await import("../../server/db/client");
    const lessonId = await createLessonFor(teacher.email, { phases: ["Roll", "Pool"] }, db);
    const opened = await teacher.agent.post("/api/class-runs", { lessonId });
    expect(opened.status).toBe(201);
    const board = await openSocket(a.url, await sessionCookie(a.url, teacher.email, "a-long-password"));
    cleanups.push(() => board.disconnect());
    let boardRolls = -1;
    board.on(EVENTS.boardUpdate, (message: BoardUpdateMessage) => {
      boardRolls = decodeBoardUpdate(message).tallies[0].pooled.totals.rolls;
    });
    const snapshot: BoardSnapshotAck = await board.emitWithAck(EVENTS.boardSnapshot, { runId: opened.body.id });
    if (!snapshot.ok) throw new Error(snapshot.error.message);
    expect(snapshot.snapshot.tallies[0].pooled.totals.rolls).toBe(0);

    // Rolls through process B only: process A's batcher commits none of them.
    const pupil = await joinAsPupil(b.url, opened.body.joinCode, "Quay Steps");
    cleanups.push(() => pupil.socket.disconnect());
    const onB: RollRecordAck[] = [];
    for (let index = 0; index < 4; index += 1) onB.push(await record(pupil, randomRollOf(pupil)));
    expect(onB.every((ack) => ack.ok)).toBe(true);
    const deadline = Date.now() + 10_000;
    while (boardRolls !== 4 && Date.now() < deadline) await sleep(100);
    expect(boardRolls).toBe(4);

    // The same group through process A too (a second phone, or a reconnect that landed elsewhere): one limit for both.
    const samePupilOnA: TestPupil = { ...pupil, socket: await openSocket(a.url) };
    cleanups.push(() => samePupilOnA.socket.disconnect());
    const answers: RollRecordAck[] = [];
    for (let index = 0; index < 8; index += 1) {
      answers.push(await record(samePupilOnA, randomRollOf(pupil)));
      answers.push(await record(pupil, randomRollOf(pupil)));
    }
    const accepted = onB.length + answers.filter((ack) => ack.ok).length;
    const refused = answers.filter((ack) => !ack.ok);
    expect(accepted).toBeLessThanOrEqual(ROLL_BURST);
    expect(refused.length).toBeGreaterThan(0);
    expect(refused.every((ack) => !ack.ok && ack.error.code === "rate_limited")).toBe(true);
  });

  it("cancels through one process a Set finder search started through the other, and lists it among the teacher's recent searches", async () => {
    const teacher = await signUpAgent(a.url, "two-process-finder", "Ren Finder");
    const cookie = await sessionCookie(a.url, teacher.email, "a-long-password");
    const onB = agentWithCookieOn(b.url, cookie);
    const large: SetFinderRequestInput = {
      diceCount: 6,
      facesPerDie: 12,
      faceValues: { kind: "range", min: 1, max: 30 },
      property: "two-cycles",
      allowTies: false,
      objective: "strongest-cycle",
      timeBudgetSeconds: 120,
      seed: 11,
    };
    const started = await teacher.agent.post("/api/set-finder/searches", large);
    expect(started.status).toBe(202);
    const until = Date.now() + 30_000;
    let running: SetFinderJob;
    for (;;) {
      const response = await onB.get(`/api/set-finder/searches/${started.body.id}`);
      expect(response.status).toBe(200);
      running = response.body;
      if ((running.status === "running" && running.progress.examined > 0) || Date.now() > until) break;
      await sleep(200);
    }
    expect(running.status).toBe("running");

    const cancelled = await onB.delete(`/api/set-finder/searches/${started.body.id}`);
    expect(cancelled.status).toBe(200);
    const job = cancelled.body.job as SetFinderJob;
    expect(job.status).toBe("cancelled");
    expect(job.message).toMatch(/^Cancelled\./);
    // The share examined before the stop, not "100% · N of N".
    expect(job.progress.fraction).toBeLessThan(1);
    expect(job.progress.total).toBeGreaterThan(0);
    expect(job.progress.examined).toBeLessThan(job.progress.total);

    const recent = (await teacher.agent.get("/api/set-finder/searches")).body as SetFinderSearchSummary[];
    expect(recent[0]).toMatchObject({ id: started.body.id, status: "cancelled" });
    expect(recent[0]).not.toHaveProperty("results");
  });

  it("drains on SIGTERM: rolls sent as it stops are acknowledged, readiness turns 503, and phones are left to reconnect elsewhere", async () => {
    const teacher = await signUpAgent(a.url, "two-process-drain", "Lee Drain");
    const { db } = await import("../../server/db/client");
    const lessonId = await createLessonFor(teacher.email, { phases: ["Roll", "Pool"] }, db);
    const opened = await teacher.agent.post("/api/class-runs", { lessonId });
    const pupil = await joinAsPupil(b.url, opened.body.joinCode, "Slipway");
    cleanups.push(() => pupil.socket.disconnect());
    const reasons: string[] = [];
    pupil.socket.on("disconnect", (reason) => reasons.push(reason));
    const rolls = [randomRollOf(pupil), randomRollOf(pupil), randomRollOf(pupil)];
    const answers = Promise.all(rolls.map((roll) => record(pupil, roll)));
    b.child.kill("SIGTERM");
    const readiness: number[] = [];
    for (let index = 0; index < 5; index += 1) {
      const answer = await fetch(`${b.url}/api/ready`).then(
        (response) => response.status,
        () => 0,
      );
      readiness.push(answer);
      if (answer !== 200) break;
      await sleep(20);
    }
    expect((await answers).every((ack) => ack.ok)).toBe(true);
    if (b.child.exitCode === null && b.child.signalCode === null) await new Promise((resolve) => b.child.once("exit", resolve));
    expect(b.child.exitCode).toBe(0);
    // A transport close, not socket.io's "io server disconnect" (after which a client would not reconnect by itself).
    expect(reasons[0]).toBe("transport close");
    expect(readiness.at(-1)).not.toBe(200);
    const { roll: rollTable } = await import("../../server/db/schema/index");
    const { inArray } = await import("drizzle-orm");
    const stored = await db
      .select({ id: rollTable.id })
      .from(rollTable)
      .where(
        inArray(
          rollTable.id,
          rolls.map((roll) => roll.id),
        ),
      );
    expect(stored).toHaveLength(3);
  });
});
