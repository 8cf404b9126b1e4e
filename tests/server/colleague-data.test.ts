import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { db } from "../../server/db/client";
import { diceSet, lesson, shelfProposal } from "../../server/db/schema/index";
import { createLessonFor } from "../helpers/class-run-fixtures";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let department: DepartmentFixture;

const sharedSet = (name: string) => ({
  name,
  description: "Shared with the department.",
  visibility: "department",
  dice: [
    { name: "Fulmar", faces: [2, 2, 6, 6, 7, 7], colour: "teal", pattern: "dots" },
    { name: "Gannet", faces: [1, 5, 5, 5, 5, 9], colour: "amber", pattern: "stripes" },
    { name: "Skua", faces: [3, 3, 3, 4, 8, 8], colour: "plum", pattern: "checks" },
  ],
});

beforeAll(async () => {
  app = await startTestApp();
  department = await createDepartment(app.baseUrl, "colleague-data", 2);
});
afterAll(() => app.close());

/** A colleague's lesson on the shared set, made through the API as the Lessons screen would. */
async function colleagueLessonOn(setId: string, title: string) {
  const colleague = department.teachers[1];
  const created = await colleague.agent.post("/api/lessons", { ...emptyLessonInput(), title, classGroup: "9M", diceSetId: setId });
  expect(created.status, created.text).toBe(201);
  return created.body.lesson.id as string;
}

describe("a dice set a colleague's lesson uses", () => {
  it("refuses to delete it, naming the colleague's lessons, and leaves set and lesson as they were", async () => {
    const owner = department.teachers[0].agent;
    const set = await owner.post("/api/dice-sets", sharedSet("Breakwater trio"));
    expect(set.status).toBe(201);
    const lessonId = await colleagueLessonOn(set.body.id, "Breakwater starter");
    const refused = await owner.delete(`/api/dice-sets/${set.body.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("set_in_use");
    expect(refused.body.error.message).toContain("“Breakwater starter”");
    expect(await db.query.diceSet.findFirst({ where: eq(diceSet.id, set.body.id) })).toBeDefined();
    expect((await db.query.lesson.findFirst({ where: eq(lesson.id, lessonId) }))?.diceSetId).toBe(set.body.id);
    // Taking the set private would cut the colleague off just the same.
    const madePrivate = await owner.put(`/api/dice-sets/${set.body.id}`, {
      ...sharedSet("Breakwater trio"),
      visibility: "private",
      version: set.body.version,
    });
    expect(madePrivate.status).toBe(409);
    expect(madePrivate.body.error.code).toBe("set_in_use");
  });

  it("still deletes a set only the owner's own lessons use", async () => {
    const owner = department.teachers[0].agent;
    const set = await owner.post("/api/dice-sets", sharedSet("Groyne pair"));
    const own = await owner.post("/api/lessons", {
      ...emptyLessonInput(),
      title: "Groyne lesson",
      classGroup: "8K",
      diceSetId: set.body.id,
    });
    expect(own.status).toBe(201);
    expect((await owner.delete(`/api/dice-sets/${set.body.id}`)).status).toBe(204);
  });
});

describe("shelf proposals", () => {
  it("withdraws a lesson's pending proposal when the lesson is deleted, so the head's queue holds no untitled entry", async () => {
    const teacher = department.teachers[1];
    const lessonId = await createLessonFor(teacher.email);
    expect((await teacher.agent.post("/api/shelf/proposals", { lessonId })).status).toBe(201);
    expect((await teacher.agent.delete(`/api/lessons/${lessonId}`)).status).toBe(204);
    const queue = await department.head.get("/api/shelf/proposals");
    expect(queue.status).toBe(200);
    expect(queue.body.proposals.some((proposal: { lessonId: string }) => proposal.lessonId === lessonId)).toBe(false);
    expect(await db.select().from(shelfProposal).where(eq(shelfProposal.lessonId, lessonId))).toEqual([]);
  });

  it("accepts one of several simultaneous proposals of one lesson and refuses the rest", async () => {
    const teacher = department.teachers[0];
    const lessonId = await createLessonFor(teacher.email);
    const answers = await Promise.all(
      Array.from({ length: 6 }, () => teacher.agent.post("/api/shelf/proposals", { lessonId, note: "Twice?" })),
    );
    expect(answers.map((answer) => answer.status).sort()).toEqual([201, 409, 409, 409, 409, 409]);
    const pending = await db
      .select()
      .from(shelfProposal)
      .where(and(eq(shelfProposal.lessonId, lessonId), eq(shelfProposal.status, "pending")));
    expect(pending).toHaveLength(1);
  });
});
