import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { db } from "../../server/db/client";
import { classRun, lesson, roll } from "../../server/db/schema/index";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { createLessonFor, testDice } from "../helpers/class-run-fixtures";
import { insertFixtureRun } from "../helpers/results-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let teacher: HttpAgent;
const [tomasz] = demoTeachers.filter((entry) => entry.role === "teacher");
// A unique marker keeps these runs apart from any other file's runs in the shared test database.
const marker = `W${crypto.randomUUID().slice(0, 6)}`;

beforeAll(async () => {
  app = await startTestApp();
  teacher = new HttpAgent(app.baseUrl);
  await teacher.signIn(tomasz.email, demoPassword);
});
afterAll(() => app.close());

async function lessonWithSet(fields: Record<string, unknown>) {
  const set = await teacher.post("/api/dice-sets", { name: `${marker} set`, description: "", visibility: "private", dice: testDice });
  expect(set.status, set.text).toBe(201);
  const created = await teacher.post("/api/lessons", {
    ...emptyLessonInput(),
    title: `${marker} lesson`,
    classGroup: "8K",
    status: "ready",
    diceSetId: set.body.id,
    ...fields,
  });
  expect(created.status, created.text).toBe(201);
  return created.body.lesson;
}

describe("what a class run copies from its lesson for the Wall view", () => {
  it("keeps the lesson's hide-exact setting, prompts and exit ticket, unchanged by later lesson edits", async () => {
    const prompts = ["Which die would you pick against Auk?", "Did the class's figures settle down?"];
    const created = await lessonWithSet({
      hideExactUntilProve: false,
      discussionPrompts: prompts,
      exitTicket: "Name a die that beats Razorbill.",
    });
    expect(created.hideExactUntilProve).toBe(false);
    const opened = await teacher.post("/api/class-runs", { lessonId: created.id });
    expect(opened.status, opened.text).toBe(201);
    expect(opened.body).toMatchObject({
      hideExactUntilProve: false,
      discussionPrompts: prompts,
      exitTicket: "Name a die that beats Razorbill.",
    });

    const stored = { body: (await teacher.get(`/api/lessons/${created.id}`)).body.lesson };
    const edited = await teacher.put(`/api/lessons/${created.id}`, {
      ...emptyLessonInput(),
      title: stored.body.title,
      classGroup: "8K",
      status: "ready",
      diceSetId: stored.body.diceSetId,
      hideExactUntilProve: true,
      discussionPrompts: ["A new prompt"],
      exitTicket: "A new exit ticket",
      version: stored.body.version,
    });
    expect(edited.status, edited.text).toBe(200);
    const board = await teacher.get(`/api/class-runs/${opened.body.id}/board`);
    expect(board.status).toBe(200);
    expect(board.body.run).toMatchObject({
      hideExactUntilProve: false,
      discussionPrompts: prompts,
      exitTicket: "Name a die that beats Razorbill.",
    });
  });

  it("hides exact values by default, also for a lesson saved before the setting existed", async () => {
    const created = await lessonWithSet({});
    expect(created.hideExactUntilProve).toBe(true);
    const older = await createLessonFor(tomasz.email);
    const [row] = await db.select({ plan: lesson.plan }).from(lesson).where(eq(lesson.id, older));
    const { hideExactUntilProve: _dropped, ...planWithout } = row.plan as Record<string, unknown>;
    await db.update(lesson).set({ plan: planWithout }).where(eq(lesson.id, older));
    const opened = await teacher.post("/api/class-runs", { lessonId: older });
    expect(opened.status, opened.text).toBe(201);
    expect(opened.body.hideExactUntilProve).toBe(true);
  });

  it("refuses a setting that is not true or false with a clear message", async () => {
    const refused = await teacher.post("/api/lessons", { ...emptyLessonInput(), title: `${marker} bad`, hideExactUntilProve: "sometimes" });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.hideExactUntilProve).toEqual(["Say whether the Wall hides exact values until Prove."]);
  });
});

describe("a run with a Twist in Results", () => {
  it("is listed, headed and reported by its main mode, with the Twist as a second tally pooled on its own", async () => {
    const { runId, groupIds } = await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `${marker} Twisted run`,
      classGroup: "8K",
      groups: [{ nickname: "Crabs", matchup: [0, 1], rolls: 12 }],
    });
    // The Twist moved the run's current mode to two dice each, as changeRunPhase does; its tally has 3 rolls.
    await db
      .update(classRun)
      .set({
        currentTally: 2,
        dicePerPlayer: 2,
        tallies: [
          { tally: 1, dicePerPlayer: 1, players: 2, startedAt: new Date().toISOString() },
          { tally: 2, dicePerPlayer: 2, players: 2, startedAt: new Date().toISOString() },
        ],
      })
      .where(eq(classRun.id, runId));
    await db.insert(roll).values(
      [
        [
          [1, 5],
          [2, 3],
        ],
        [
          [6, 6],
          [7, 7],
        ],
        [
          [5, 1],
          [4, 3],
        ],
      ].map((faces) => ({
        id: crypto.randomUUID(),
        runId,
        groupId: groupIds[0],
        tally: 2,
        dicePerPlayer: 2,
        matchup: [0, 1],
        faces,
        totals: faces.map((seat) => seat[0] + seat[1]),
        winnerSeat: null,
        source: "phone" as const,
        recordedAt: new Date(),
      })),
    );

    const list = await teacher.get(`/api/results/runs?lesson=${encodeURIComponent(marker)}`);
    expect(list.status).toBe(200);
    const listed = list.body.runs.find((entry: { id: string }) => entry.id === runId);
    expect(listed).toMatchObject({ dicePerPlayer: 1, players: 2, twist: { tally: 2, dicePerPlayer: 2, players: 2 } });

    const results = await teacher.get(`/api/results/runs/${runId}`);
    expect(results.status).toBe(200);
    expect(results.body.run).toMatchObject({ dicePerPlayer: 1, players: 2 });
    const [main, twist] = results.body.tallies;
    expect(main.tally.tally).toBe(1);
    expect(main.pooled.totals.rolls).toBe(12);
    expect(main.pooled.matchups.map((entry: { key: string }) => entry.key)).toEqual(["1:0-1"]);
    expect(twist.tally).toEqual({ tally: 2, dicePerPlayer: 2, players: 2 });
    expect(twist.pooled.totals.rolls).toBe(3);
    expect(twist.pooled.matchups.map((entry: { key: string }) => entry.key)).toEqual(["2:0-1"]);
    expect(results.body.pooled.totals.rolls).toBe(15);
    // The main matchup is the main tally's, even were the Twist busier.
    expect(results.body.mainMatchupKey).toBe("1:0-1");
    const stored = await db
      .select({ tally: roll.tally })
      .from(roll)
      .where(and(eq(roll.runId, runId), eq(roll.tally, 2)));
    expect(stored).toHaveLength(3);
  });
});
