import { eq } from "drizzle-orm";
import { v4 as uuidv4 } from "uuid";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { JOIN_CODE_ALPHABET } from "@shared/schemas/class-runs";
import { db } from "../../server/db/client";
import { classRun, guessVote, lesson, roll as rollTable, runGroup } from "../../server/db/schema/index";
import { demoRunLesson } from "../../seed/demo-scenario";
import { demoRunGroups, seedClassRuns } from "../../seed/seed-class-runs";
import { generateJoinCode } from "../../server/services/join-code";
import { createLessonFor, testDice } from "../helpers/class-run-fixtures";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let home: DepartmentFixture;
let elsewhere: DepartmentFixture;
let owner: HttpAgent;
let ownerEmail: string;
let colleague: HttpAgent;

beforeAll(async () => {
  app = await startTestApp();
  home = await createDepartment(app.baseUrl, "runs-home", 2);
  elsewhere = await createDepartment(app.baseUrl, "runs-away", 1);
  owner = home.teachers[0].agent;
  ownerEmail = home.teachers[0].email;
  colleague = home.teachers[1].agent;
});
afterAll(() => app.close());

async function openRun(options: Parameters<typeof createLessonFor>[1] = {}) {
  const lessonId = await createLessonFor(ownerEmail, options);
  const response = await owner.post("/api/class-runs", { lessonId });
  expect(response.status, response.text).toBe(201);
  return response.body;
}

describe("opening a class run", () => {
  it("copies the lesson's set, mode, tie rule and the phases it keeps, with a join code from the look-alike-free alphabet", async () => {
    const run = await openRun({
      mode: { dicePerPlayer: 1, players: 2 },
      tieRule: "ties-score-half",
      phases: ["Guess", "Roll", "Prove", "Reflect"],
    });
    expect(run).toMatchObject({
      status: "open",
      phase: "Guess",
      phases: ["Guess", "Roll", "Prove", "Reflect"],
      tieRule: "ties-score-half",
      dicePerPlayer: 1,
      players: 2,
      currentTally: 1,
      diceSetName: "Cliff-top three",
      isOwner: true,
    });
    expect(run.dice).toEqual(testDice);
    expect(run.joinCode).toMatch(new RegExp(`^[${JOIN_CODE_ALPHABET}]{6}$`));
    expect(run.joinPath).toBe(`/pad/${run.joinCode}`);
    expect(run.tallies).toEqual([{ tally: 1, dicePerPlayer: 1, players: 2, startedAt: expect.any(String) }]);
  });

  it("never draws 0, O, 1, I or L for a join code", () => {
    const drawn = Array.from({ length: 2000 }, generateJoinCode).join("");
    expect(drawn).not.toMatch(/[0O1IL]/);
    expect(new Set(drawn).size).toBe(JOIN_CODE_ALPHABET.length);
  });

  it("refuses a lesson of a colleague (403), of another department (404), one without a dice set (422), and bad input (400)", async () => {
    const lessonId = await createLessonFor(ownerEmail);
    const byColleague = await colleague.post("/api/class-runs", { lessonId });
    expect(byColleague.status).toBe(403);
    expect(byColleague.body.error.message).toContain("Only the teacher who owns a lesson");
    expect((await elsewhere.teachers[0].agent.post("/api/class-runs", { lessonId })).status).toBe(404);
    const bare = await createLessonFor(ownerEmail, { withoutSet: true });
    const notReady = await owner.post("/api/class-runs", { lessonId: bare });
    expect(notReady.status).toBe(422);
    expect(notReady.body.error).toEqual({ code: "lesson_not_ready", message: "Choose a dice set for the lesson first." });
    const bad = await owner.post("/api/class-runs", { lessonId: "not-a-lesson" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.lessonId).toEqual(["Pick one of your lessons."]);
    expect((await owner.post("/api/class-runs", { lessonId: uuidv4() })).status).toBe(404);
  });

  it("lists the teacher's lessons with the run still open for each", async () => {
    const run = await openRun();
    const response = await owner.get("/api/class-runs/lessons");
    expect(response.status).toBe(200);
    const listed = response.body.lessons.find((entry: { id: string }) => entry.id === run.lessonId);
    expect(listed).toMatchObject({ diceSetName: "Cliff-top three", problem: null, openRunId: run.id });
    const runs = await owner.get("/api/class-runs");
    expect(runs.body.runs.find((entry: { id: string }) => entry.id === run.id)).toMatchObject({
      status: "open",
      groupCount: 0,
      rollCount: 0,
    });
  });
});

describe("who may see and change a run", () => {
  it("answers 401 without a session, in the shared error shape", async () => {
    const run = await openRun();
    const anonymous = new HttpAgent(app.baseUrl);
    for (const [method, path] of [
      ["GET", "/api/class-runs"],
      ["GET", `/api/class-runs/${run.id}`],
      ["GET", `/api/class-runs/${run.id}/board`],
      ["POST", `/api/class-runs/${run.id}/status`],
    ] as const) {
      const response = await anonymous.request(method, path, method === "POST" ? { status: "paused" } : undefined);
      expect(response.status, `${method} ${path}`).toBe(401);
      expect(response.body).toEqual({ error: { code: "unauthenticated", message: "Sign in to continue." } });
    }
  });

  it("lets the owner see and change it, the head of department see it only, and keeps it from colleagues and other departments", async () => {
    const run = await openRun();
    expect((await owner.get(`/api/class-runs/${run.id}`)).status).toBe(200);
    const headView = await home.head.get(`/api/class-runs/${run.id}/board`);
    expect(headView.status).toBe(200);
    expect(headView.body.run.isOwner).toBe(false);
    expect((await home.head.post(`/api/class-runs/${run.id}/status`, { status: "paused" })).status).toBe(403);
    const colleagueView = await colleague.get(`/api/class-runs/${run.id}`);
    expect(colleagueView.status).toBe(403);
    expect(colleagueView.body.error.message).toBe("This class run belongs to another teacher.");
    expect((await colleague.post(`/api/class-runs/${run.id}/phase`, { phase: "Roll" })).status).toBe(403);
    expect((await elsewhere.head.get(`/api/class-runs/${run.id}`)).status).toBe(404);
    expect(
      (await elsewhere.teachers[0].agent.post(`/api/class-runs/${run.id}/simulated-groups`, { groups: 1, rollsPerGroup: 5 })).status,
    ).toBe(404);
    const list = await colleague.get("/api/class-runs");
    expect(list.body.runs.some((entry: { id: string }) => entry.id === run.id)).toBe(false);
  });
});

describe("status and phases", () => {
  it("pauses, resumes and closes, and a closed run stays closed", async () => {
    const run = await openRun();
    expect((await owner.post(`/api/class-runs/${run.id}/status`, { status: "paused" })).body.status).toBe("paused");
    expect((await owner.post(`/api/class-runs/${run.id}/status`, { status: "open" })).body.status).toBe("open");
    const closed = await owner.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    expect(closed.body).toMatchObject({ status: "closed", closedAt: expect.any(String) });
    const reopen = await owner.post(`/api/class-runs/${run.id}/status`, { status: "open" });
    expect(reopen.status).toBe(409);
    expect(reopen.body.error.code).toBe("run_closed");
    expect((await owner.post(`/api/class-runs/${run.id}/status`, { status: "finished" })).status).toBe(400);
  });

  it("frees a closed run's join code for new runs (unique among runs not closed)", async () => {
    const run = await openRun();
    await owner.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    const another = await openRun();
    // Reusing the closed run's code is allowed by the partial unique index; a second open run with the same code is not.
    await db.update(classRun).set({ joinCode: run.joinCode }).where(eq(classRun.id, another.id));
    const third = await openRun();
    await expect(db.update(classRun).set({ joinCode: run.joinCode }).where(eq(classRun.id, third.id))).rejects.toThrow();
  });

  it("moves only to phases the lesson keeps, and the first Twist starts tally 2 with new matchups for three players", async () => {
    const run = await openRun({ phases: ["Roll", "Pool", "Twist", "Reflect"] });
    const skipped = await owner.post(`/api/class-runs/${run.id}/phase`, { phase: "Prove" });
    expect(skipped.status).toBe(422);
    expect(skipped.body.error.message).toBe("This lesson skips the Prove phase.");
    const [group] = await db
      .insert(runGroup)
      .values({ runId: run.id, nickname: "Cliff Watchers", matchup: [0, 1] })
      .returning();
    const twist = await owner.post(`/api/class-runs/${run.id}/phase`, { phase: "Twist", twist: "three-players" });
    expect(twist.body).toMatchObject({ phase: "Twist", currentTally: 2, players: 3, dicePerPlayer: 1 });
    expect(twist.body.tallies.map((tally: { tally: number; players: number }) => [tally.tally, tally.players])).toEqual([
      [1, 2],
      [2, 3],
    ]);
    const [after] = await db.select().from(runGroup).where(eq(runGroup.id, group.id));
    expect(after.matchup).toEqual([0, 1, 2]);
    const back = await owner.post(`/api/class-runs/${run.id}/phase`, { phase: "Pool" });
    expect(back.body).toMatchObject({ phase: "Pool", currentTally: 2 });
    const again = await owner.post(`/api/class-runs/${run.id}/phase`, { phase: "Twist" });
    expect(again.body.currentTally).toBe(2);
  });

  it("assigns a group's matchup, checking it fits the mode and the set", async () => {
    const run = await openRun();
    const [group] = await db
      .insert(runGroup)
      .values({ runId: run.id, nickname: "Matchup Makers", matchup: [0, 1] })
      .returning();
    const assigned = await owner.put(`/api/class-runs/${run.id}/groups/${group.id}/matchup`, { matchup: [2, 0] });
    expect(assigned.status).toBe(200);
    expect(assigned.body.matchup).toEqual([2, 0]);
    expect((await owner.put(`/api/class-runs/${run.id}/groups/${group.id}/matchup`, { matchup: [1, 1] })).status).toBe(400);
    expect((await owner.put(`/api/class-runs/${run.id}/groups/${group.id}/matchup`, { matchup: [0, 1, 2] })).body.error.code).toBe(
      "wrong_mode",
    );
    expect((await owner.put(`/api/class-runs/${run.id}/groups/${group.id}/matchup`, { matchup: [0, 5] })).status).toBe(422);
  });
});

describe("the virtual class", () => {
  it("adds simulated groups whose seeded rolls are marked simulated and pooled apart as well as together", async () => {
    const run = await openRun({ phases: ["Roll", "Pool"] });
    const response = await owner.post(`/api/class-runs/${run.id}/simulated-groups`, { groups: 3, rollsPerGroup: 400, seed: 42 });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ seed: 42, rolls: 1200 });
    expect(response.body.groups.map((group: { nickname: string }) => group.nickname)).toEqual([
      "Virtual group 1",
      "Virtual group 2",
      "Virtual group 3",
    ]);
    const rolls = await db.select().from(rollTable).where(eq(rollTable.runId, run.id));
    expect(rolls).toHaveLength(1200);
    expect(new Set(rolls.map((entry) => entry.source))).toEqual(new Set(["simulated"]));
    for (const entry of rolls) {
      entry.faces.forEach((faces, seat) => expect(testDice[entry.matchup[seat]].faces).toContain(faces[0]));
    }
    const board = await owner.get(`/api/class-runs/${run.id}/board`);
    const tally = board.body.tallies[0];
    expect(tally.pooled.totals.bySource.simulated).toBe(1200);
    expect(tally.withoutSimulated.totals.rolls).toBe(0);
    expect(board.body.groups.every((group: { source: string }) => group.source === "simulated")).toBe(true);

    const same = await openRun({ phases: ["Roll", "Pool"] });
    await owner.post(`/api/class-runs/${same.id}/simulated-groups`, { groups: 3, rollsPerGroup: 400, seed: 42 });
    const repeat = await owner.get(`/api/class-runs/${same.id}/board`);
    expect(repeat.body.tallies[0].pooled.matchups.map((entry: { seats: unknown }) => entry.seats)).toEqual(
      tally.pooled.matchups.map((entry: { seats: unknown }) => entry.seats),
    );
  });

  it("refuses too many simulated rolls at once and any on a closed run", async () => {
    const run = await openRun();
    const tooMany = await owner.post(`/api/class-runs/${run.id}/simulated-groups`, { groups: 20, rollsPerGroup: 5000 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields.rollsPerGroup).toEqual(["Simulate at most 20000 rolls at once."]);
    await owner.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    expect((await owner.post(`/api/class-runs/${run.id}/simulated-groups`, { groups: 1, rollsPerGroup: 10 })).status).toBe(409);
  });
});

describe("the Roll pad's code lookup", () => {
  it("finds an open run by its code without an account, forgiving case and spaces, and not a closed one", async () => {
    const run = await openRun();
    const anonymous = new HttpAgent(app.baseUrl);
    const spaced = `${run.joinCode.slice(0, 3).toLowerCase()} ${run.joinCode.slice(3)}`;
    const found = await anonymous.get(`/api/pad/${encodeURIComponent(spaced)}`);
    expect(found.status).toBe(200);
    expect(found.body).toEqual({
      runId: run.id,
      title: run.title,
      classGroup: "8K",
      status: "open",
      phase: "Guess",
      joinCode: run.joinCode,
    });
    expect((await anonymous.get("/api/pad/AB0DEF")).body.error.fields.code).toEqual([
      "A join code uses letters and the digits 2 to 9 only.",
    ]);
    await owner.post(`/api/class-runs/${run.id}/status`, { status: "closed" });
    const gone = await anonymous.get(`/api/pad/${run.joinCode}`);
    expect(gone.status).toBe(404);
    expect(gone.body.error.code).toBe("unknown_code");
  });
});

describe("the demo class run", () => {
  it("is one closed run of the demo lesson with six groups, their votes and 300 seeded rolls, and seeding again adds nothing", async () => {
    const [demoLesson] = await db.select().from(lesson).where(eq(lesson.title, demoRunLesson.title));
    const runsOf = () => db.select().from(classRun).where(eq(classRun.lessonId, demoLesson.id));
    const [run] = await runsOf();
    expect(run).toMatchObject({ status: "closed", title: demoRunLesson.title, classGroup: "8K", phase: "Reflect" });
    const groups = await db.select().from(runGroup).where(eq(runGroup.runId, run.id));
    expect(groups.map((group) => group.nickname).sort()).toEqual([...demoRunGroups].sort());
    expect(await db.select().from(guessVote).where(eq(guessVote.runId, run.id))).toHaveLength(6);
    const rolls = await db.select().from(rollTable).where(eq(rollTable.runId, run.id));
    expect(rolls).toHaveLength(300);
    for (const entry of rolls) entry.faces.forEach((faces, seat) => expect(run.dice[entry.matchup[seat]].faces).toContain(faces[0]));

    await seedClassRuns(db);
    expect(await runsOf()).toHaveLength(1);
    expect(await db.select().from(rollTable).where(eq(rollTable.runId, run.id))).toHaveLength(300);
  });
});
