import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import Fraction from "fraction.js";
import { compareDice } from "@shared/probability/index";
import type { SetFinderJob, SetFinderRequestInput } from "@shared/schemas/set-finder";
import { stopSearchQueue } from "../../server/set-finder/search-queue";
import { signUpAgent } from "../helpers/department-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let teacher: HttpAgent;
let otherTeacher: HttpAgent;

const smallSearch: SetFinderRequestInput = {
  diceCount: 3,
  facesPerDie: 4,
  faceValues: { kind: "range", min: 1, max: 6 },
  property: "reversing-cycle",
  allowTies: true,
  objective: "strongest-cycle",
  maxResults: 5,
  timeBudgetSeconds: 30,
};

/** The search's state once `done` holds; fails the test if it does not within `seconds`. */
async function pollUntil(agent: HttpAgent, id: string, done: (job: SetFinderJob) => boolean, seconds = 40): Promise<SetFinderJob> {
  return vi.waitFor(
    async () => {
      const response = await agent.get(`/api/set-finder/searches/${id}`);
      expect(response.status).toBe(200);
      const job = response.body as SetFinderJob;
      if (!done(job)) throw new Error(`search ${id} is still ${job.status} after ${seconds} s`);
      return job;
    },
    { timeout: seconds * 1000, interval: 150 },
  );
}

beforeAll(async () => {
  app = await startTestApp();
  teacher = (await signUpAgent(app.baseUrl, "set-finder", "Sam Finder")).agent;
  otherTeacher = (await signUpAgent(app.baseUrl, "set-finder-other", "Alex Other")).agent;
});
afterAll(async () => {
  await stopSearchQueue();
  await app.close();
});

describe("Set finder API", () => {
  it("answers 401 without a session", async () => {
    expect((await new HttpAgent(app.baseUrl).post("/api/set-finder/searches", smallSearch)).status).toBe(401);
  });

  it("refuses a request outside the limits with a message per field", async () => {
    const response = await teacher.post("/api/set-finder/searches", {
      ...smallSearch,
      diceCount: 7,
      facesPerDie: 3,
      faceValues: { kind: "range", min: 1, max: 60 },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toMatchObject({
      diceCount: ["The Set finder looks for at most 6 dice."],
      facesPerDie: ["Each die needs at least 4 faces."],
      "faceValues.max": ["Allow at most 40 face values (for example 1 to 40)."],
    });
    const twoCycles = await teacher.post("/api/set-finder/searches", { ...smallSearch, property: "two-cycles" });
    expect(twoCycles.body.error.fields.diceCount).toEqual(["Two cycles that share no matchup need at least 5 dice."]);
  });

  it("runs a small search in a worker and returns results the exact engine confirms", async () => {
    const started = await teacher.post("/api/set-finder/searches", smallSearch);
    expect(started.status).toBe(202);
    expect(started.body.id).toMatch(/^[0-9a-f-]{36}$/);
    const job = await pollUntil(teacher, started.body.id, (current) => current.status !== "running" && current.status !== "queued");
    expect(job.status).toBe("finished");
    expect(job.mode).toBe("exhaustive");
    expect(job.complete).toBe(true);
    expect(job.progress.fraction).toBe(1);
    expect(job.progress.examined).toBe(job.progress.total);
    expect(job.results.length).toBeGreaterThan(0);
    for (const found of job.results) {
      const faces = found.dice.map((die) => die.faces);
      // Re-checked here with the engine's compareDice, independently of the figures the search reports.
      for (let step = 0; step < 3; step += 1) {
        const [winner, loser] = [faces[step], faces[(step + 1) % 3]];
        const oneDie = compareDice(winner, loser);
        expect(oneDie.win.gt(oneDie.loss)).toBe(true);
        const twoDice = compareDice(winner, loser, { dicePerPlayer: 2 });
        expect(twoDice.loss.gt(twoDice.win)).toBe(true);
      }
      const weakest = [0, 1, 2].map((step) => compareDice(faces[step], faces[(step + 1) % 3]).win).reduce((a, b) => (a.lt(b) ? a : b));
      expect(found.figures.weakestCycleWin).toBe(weakest.toFraction());
      expect(found.figures.reversesWithTwoDice).toBe(true);
      expect(faces.flat().every((face) => face >= 1 && face <= 6)).toBe(true);
      expect(Math.min(...faces.flat())).toBe(1);
      expect(new Fraction(found.figures.weakestCycleWin).valueOf()).toBeCloseTo(found.figures.weakestCycleWinDecimal, 12);
    }
    const scores = job.results.map((found) => found.score);
    expect([...scores].sort((a, b) => b - a)).toEqual(scores);
  });

  it("keeps a teacher's search from other teachers", async () => {
    const started = await teacher.post("/api/set-finder/searches", { ...smallSearch, property: "one-cycle" });
    expect((await otherTeacher.get(`/api/set-finder/searches/${started.body.id}`)).status).toBe(404);
    expect((await otherTeacher.delete(`/api/set-finder/searches/${started.body.id}`)).status).toBe(404);
    expect((await teacher.get("/api/set-finder/searches/not-an-id")).status).toBe(400);
    await pollUntil(teacher, started.body.id, (current) => current.status !== "running" && current.status !== "queued");
  });

  it("reports progress while a large search runs and stops it on cancel", async () => {
    const large: SetFinderRequestInput = {
      diceCount: 6,
      facesPerDie: 12,
      faceValues: { kind: "range", min: 1, max: 30 },
      property: "two-cycles",
      allowTies: false,
      objective: "strongest-cycle",
      timeBudgetSeconds: 120,
      seed: 7,
    };
    const started = await teacher.post("/api/set-finder/searches", large);
    expect(started.status).toBe(202);
    const running = await pollUntil(teacher, started.body.id, (current) => current.progress.examined > 0);
    expect(running.status).toBe("running");
    expect(running.mode).toBe("randomized");
    expect(running.message).toMatch(/randomized local search/);
    expect(running.progress.fraction).toBeGreaterThan(0);
    expect(running.progress.fraction).toBeLessThan(1);
    expect(running.progress.etaSeconds).toBeGreaterThan(0);

    const cancelled = await teacher.delete(`/api/set-finder/searches/${started.body.id}`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe("cancelled");
    const after = (await teacher.get(`/api/set-finder/searches/${started.body.id}`)).body as SetFinderJob;
    expect(after.status).toBe("cancelled");
    await new Promise((resolve) => setTimeout(resolve, 700));
    const later = (await teacher.get(`/api/set-finder/searches/${started.body.id}`)).body as SetFinderJob;
    expect(later.progress.examined).toBe(after.progress.examined);
    expect(later.finishedAt).not.toBeNull();
  });

  it("limits how many searches one teacher runs at once", async () => {
    const long = { ...smallSearch, diceCount: 6, facesPerDie: 12, faceValues: { kind: "range", min: 1, max: 30 }, timeBudgetSeconds: 60 };
    const first = await teacher.post("/api/set-finder/searches", long);
    const second = await teacher.post("/api/set-finder/searches", long);
    const third = await teacher.post("/api/set-finder/searches", long);
    expect([first.status, second.status]).toEqual([202, 202]);
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe("too_many_searches");
    await teacher.delete(`/api/set-finder/searches/${first.body.id}`);
    await teacher.delete(`/api/set-finder/searches/${second.body.id}`);
  });
});
