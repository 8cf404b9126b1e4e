import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyLessonInput, type Lesson, type LessonInput } from "@shared/schemas/lessons";
import type { TemplateDetail } from "@shared/schemas/shelf";
import { db } from "../../server/db/client";
import { lesson, lessonTemplate, lessonTemplateVersion } from "../../server/db/schema/index";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { demoTemplates, seedShelf } from "../../seed/seed-shelf";
import { seedTeachers } from "../../seed/seed-teachers";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let ours: DepartmentFixture;
let theirs: DepartmentFixture;
let head: HttpAgent;
let teacher: HttpAgent;
let colleague: HttpAgent;
let outsider: HttpAgent;
let visitor: HttpAgent;

// Faces chosen for this file only; it checks roles, versions and copies, not the maths of the set.
const testDice = [
  { name: "Tern", faces: [1, 1, 4, 4, 4, 7], colour: "teal", pattern: "dots" },
  { name: "Auk", faces: [2, 2, 2, 5, 5, 8], colour: "amber", pattern: "stripes" },
  { name: "Shag", faces: [3, 3, 3, 3, 6, 6], colour: "plum", pattern: "checks" },
];

function lessonInput(overrides: Partial<LessonInput> = {}): LessonInput {
  return { ...emptyLessonInput(), title: "Shelf test lesson", classGroup: "8K", status: "ready", ...overrides };
}

async function createSet(agent: HttpAgent, visibility: "private" | "department", name = "Test seabirds") {
  const response = await agent.post("/api/dice-sets", { name, description: "", visibility, dice: testDice });
  expect(response.status, response.text).toBe(201);
  return response.body.id as string;
}

async function createLesson(agent: HttpAgent, overrides: Partial<LessonInput> = {}): Promise<Lesson> {
  const response = await agent.post("/api/lessons", lessonInput(overrides));
  expect(response.status, response.text).toBe(201);
  return response.body.lesson;
}

async function editLesson(agent: HttpAgent, id: string, change: Partial<LessonInput>): Promise<Lesson> {
  const current = (await agent.get(`/api/lessons/${id}`)).body.lesson as Lesson & Record<string, unknown>;
  const input = Object.fromEntries(Object.keys(emptyLessonInput()).map((key) => [key, current[key]]));
  const response = await agent.put(`/api/lessons/${id}`, { ...input, ...change, version: current.version });
  expect(response.status, response.text).toBe(200);
  return response.body.lesson;
}

async function publish(agent: HttpAgent, lessonId: string, changeNote = "First version"): Promise<TemplateDetail> {
  const response = await agent.post("/api/shelf/templates", { lessonId, changeNote });
  expect(response.status, response.text).toBe(201);
  return response.body;
}

beforeAll(async () => {
  app = await startTestApp({ signInLimitPerMinute: 1000 });
  ours = await createDepartment(app.baseUrl, "shelf-ours", 2);
  theirs = await createDepartment(app.baseUrl, "shelf-theirs", 1);
  head = ours.head;
  [teacher, colleague] = ours.teachers.map((t) => t.agent);
  outsider = theirs.teachers[0].agent;
  visitor = new HttpAgent(app.baseUrl);
});
afterAll(() => app.close());

describe("who may use each shelf route", () => {
  let templateId: string;
  let proposalId: string;
  let headLessonId: string;
  let teacherLessonId: string;

  beforeAll(async () => {
    const setId = await createSet(head, "private");
    headLessonId = (await createLesson(head, { title: "Matrix lesson", diceSetId: setId })).id;
    templateId = (await publish(head, headLessonId)).template.id;
    teacherLessonId = (await createLesson(teacher, { title: "Matrix proposal" })).id;
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: teacherLessonId, note: "For the matrix" });
    expect(proposed.status, proposed.text).toBe(201);
    proposalId = proposed.body.id;
  });

  const routes = () =>
    [
      { name: "list templates", method: "GET", path: "/api/shelf/templates" },
      { name: "read a template", method: "GET", path: `/api/shelf/templates/${templateId}` },
      { name: "read a version", method: "GET", path: `/api/shelf/templates/${templateId}/versions/1` },
      { name: "publish", method: "POST", path: "/api/shelf/templates", body: { lessonId: headLessonId, changeNote: "Again" } },
      {
        name: "new version",
        method: "POST",
        path: `/api/shelf/templates/${templateId}/versions`,
        body: { lessonId: headLessonId, changeNote: "Next" },
      },
      { name: "retire", method: "POST", path: `/api/shelf/templates/${templateId}/retire`, body: {} },
      { name: "restore", method: "POST", path: `/api/shelf/templates/${templateId}/restore`, body: {} },
      { name: "copy", method: "POST", path: `/api/shelf/templates/${templateId}/copy`, body: {} },
      { name: "list proposals", method: "GET", path: "/api/shelf/proposals" },
      { name: "propose", method: "POST", path: "/api/shelf/proposals", body: { lessonId: teacherLessonId } },
      { name: "withdraw", method: "DELETE", path: `/api/shelf/proposals/${proposalId}` },
      {
        name: "approve",
        method: "POST",
        path: `/api/shelf/proposals/${proposalId}/approve`,
        body: { target: "new", changeNote: "Approved" },
      },
      { name: "decline", method: "POST", path: `/api/shelf/proposals/${proposalId}/decline`, body: { note: "Not yet" } },
    ] as { name: string; method: string; path: string; body?: unknown }[];

  it("answers 401 to a signed-out visitor on every route", async () => {
    for (const route of routes()) {
      const response = await visitor.request(route.method, route.path, route.body);
      expect(response.status, route.name).toBe(401);
      expect(response.body.error.code).toBe("unauthenticated");
    }
  });

  it("answers 403 to a teacher on the head of department's routes", async () => {
    for (const name of ["publish", "new version", "retire", "restore", "approve", "decline"]) {
      const route = routes().find((r) => r.name === name)!;
      const response = await colleague.request(route.method, route.path, route.body);
      expect(response.status, name).toBe(403);
      expect(response.body.error.code).toBe("forbidden");
    }
  });

  it("answers 403 to the head of department on the teachers' proposal routes", async () => {
    for (const name of ["propose", "withdraw"]) {
      const route = routes().find((r) => r.name === name)!;
      expect((await head.request(route.method, route.path, route.body)).status, name).toBe(403);
    }
  });

  it("keeps another department's teacher and head away from our templates and proposals", async () => {
    for (const name of ["read a template", "read a version", "copy"]) {
      const route = routes().find((r) => r.name === name)!;
      expect((await outsider.request(route.method, route.path, route.body)).status, name).toBe(404);
    }
    for (const name of ["read a template", "new version", "retire", "restore", "copy", "approve", "decline"]) {
      const route = routes().find((r) => r.name === name)!;
      expect((await theirs.head.request(route.method, route.path, route.body)).status, `their head: ${name}`).toBe(404);
    }
    // Publishing our head's lesson from another department: the lesson is not theirs, so it is not found.
    const publishOurs = await theirs.head.post("/api/shelf/templates", { lessonId: headLessonId, changeNote: "Taken" });
    expect(publishOurs.status).toBe(404);
    const theirShelf = await outsider.get("/api/shelf/templates");
    expect(theirShelf.status).toBe(200);
    expect(theirShelf.body.templates.map((t: { id: string }) => t.id)).not.toContain(templateId);
    const theirQueue = await theirs.head.get("/api/shelf/proposals");
    expect(theirQueue.body.proposals.map((p: { id: string }) => p.id)).not.toContain(proposalId);
    expect((await outsider.request("DELETE", `/api/shelf/proposals/${proposalId}`)).status).toBe(404);
  });

  it("lets every member browse, read and copy, and only the head list retired templates", async () => {
    for (const agent of [head, teacher, colleague]) {
      expect((await agent.get("/api/shelf/templates")).status).toBe(200);
      expect((await agent.get(`/api/shelf/templates/${templateId}`)).status).toBe(200);
      expect((await agent.get(`/api/shelf/templates/${templateId}/versions/1`)).status).toBe(200);
      expect((await agent.post(`/api/shelf/templates/${templateId}/copy`, {})).status).toBe(201);
    }
    expect((await head.get("/api/shelf/templates?status=retired")).status).toBe(200);
    expect((await teacher.get("/api/shelf/templates?status=retired")).status).toBe(403);
  });

  it("answers 403 to a signed-in teacher with no department", async () => {
    const lone = new HttpAgent(app.baseUrl);
    await lone.post("/api/auth/sign-up/email", {
      name: "Lone",
      email: `lone-${crypto.randomUUID().slice(0, 6)}@outroll-tests.test`,
      password: "a-long-password",
    });
    expect((await lone.get("/api/shelf/templates")).status).toBe(403);
    expect((await lone.post(`/api/shelf/templates/${templateId}/copy`, {})).status).toBe(403);
  });

  it("refuses bad input with field errors and leaves the shelf as it was", async () => {
    const before = (await head.get("/api/shelf/templates")).body.templates.length;
    const noNote = await head.post("/api/shelf/templates", { lessonId: headLessonId, changeNote: " " });
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.fields.changeNote[0]).toMatch(/change note/);
    const badId = await head.post("/api/shelf/templates", { lessonId: "not-a-uuid", changeNote: "First version" });
    expect(badId.status).toBe(400);
    expect(badId.body.error.fields.lessonId).toBeDefined();
    expect((await head.get("/api/shelf/templates/not-a-uuid")).status).toBe(400);
    expect((await head.post(`/api/shelf/templates/${templateId}/copy`, { version: "two" })).status).toBe(400);
    expect((await head.get("/api/shelf/templates")).body.templates.length).toBe(before);
  });
});

describe("template versions", () => {
  it("publishes a frozen copy as version 1, adds version 2 with its change note and keeps version 1 as it was", async () => {
    const setId = await createSet(head, "private", "Versioned seabirds");
    const source = await createLesson(head, { title: "Tern, Auk, Shag", diceSetId: setId, rollsPerGroup: 20 });
    const first = await publish(head, source.id, "First version: twenty rolls a group");
    expect(first.template).toMatchObject({
      title: "Tern, Auk, Shag",
      status: "published",
      currentVersion: 1,
      diceSetName: "Versioned seabirds",
    });
    expect(first.versions).toHaveLength(1);
    expect(first.shown.snapshot.lesson.rollsPerGroup).toBe(20);
    expect(first.shown.snapshot.diceSet?.dice.map((d) => d.faces)).toEqual(testDice.map((d) => d.faces));

    // Editing the lesson afterwards does not touch the published version: it is a frozen copy.
    await editLesson(head, source.id, { rollsPerGroup: 36, title: "Tern, Auk, Shag (longer)" });
    const stillFirst = await teacher.get(`/api/shelf/templates/${first.template.id}`);
    expect(stillFirst.body.shown.snapshot.lesson.rollsPerGroup).toBe(20);

    const second = await head.post(`/api/shelf/templates/${first.template.id}/versions`, {
      lessonId: source.id,
      changeNote: "Thirty-six rolls a group, so the pooled result is convincing",
    });
    expect(second.status, second.text).toBe(201);
    expect(second.body.template).toMatchObject({ currentVersion: 2, title: "Tern, Auk, Shag (longer)" });
    expect(second.body.versions.map((v: { version: number; changeNote: string }) => [v.version, v.changeNote])).toEqual([
      [2, "Thirty-six rolls a group, so the pooled result is convincing"],
      [1, "First version: twenty rolls a group"],
    ]);
    expect(second.body.shown.snapshot.lesson.rollsPerGroup).toBe(36);

    const old = await teacher.get(`/api/shelf/templates/${first.template.id}/versions/1`);
    expect(old.status).toBe(200);
    expect(old.body.shown.version).toBe(1);
    expect(old.body.shown.snapshot.lesson.rollsPerGroup).toBe(20);
    expect((await teacher.get(`/api/shelf/templates/${first.template.id}/versions/3`)).status).toBe(404);

    const stored = await db.select().from(lessonTemplateVersion).where(eq(lessonTemplateVersion.templateId, first.template.id));
    expect(stored.map((row) => row.version).sort()).toEqual([1, 2]);
  });

  it("refuses to publish another teacher's lesson directly (it goes through a proposal)", async () => {
    const theirLesson = await createLesson(teacher, { title: "Not the head's" });
    const response = await head.post("/api/shelf/templates", { lessonId: theirLesson.id, changeNote: "First version" });
    expect(response.status).toBe(404);
  });

  it("retires a template: teachers no longer see or copy it, the head can restore it", async () => {
    const source = await createLesson(head, { title: "Soon retired" });
    const { template } = await publish(head, source.id);
    const retired = await head.post(`/api/shelf/templates/${template.id}/retire`);
    expect(retired.status).toBe(200);
    expect(retired.body.template.status).toBe("retired");

    const shelf = await teacher.get("/api/shelf/templates");
    expect(shelf.body.templates.map((t: { id: string }) => t.id)).not.toContain(template.id);
    expect((await teacher.get(`/api/shelf/templates/${template.id}`)).status).toBe(404);
    expect((await teacher.post(`/api/shelf/templates/${template.id}/copy`, {})).status).toBe(404);
    const headCopy = await head.post(`/api/shelf/templates/${template.id}/copy`, {});
    expect(headCopy.status).toBe(409);
    expect(headCopy.body.error.code).toBe("template_retired");
    const newVersion = await head.post(`/api/shelf/templates/${template.id}/versions`, {
      lessonId: source.id,
      changeNote: "While retired",
    });
    expect(newVersion.status).toBe(409);
    const retiredList = await head.get("/api/shelf/templates?status=retired");
    expect(retiredList.body.templates.map((t: { id: string }) => t.id)).toContain(template.id);

    expect((await head.post(`/api/shelf/templates/${template.id}/restore`)).body.template.status).toBe("published");
    expect((await teacher.get(`/api/shelf/templates/${template.id}`)).status).toBe(200);
  });
});

describe("copying a template into one's own lessons", () => {
  it("inserts a real draft copy of the chosen version, with its own dice set when the head's set is private", async () => {
    const setId = await createSet(head, "private", "Private seabirds");
    const source = await createLesson(head, {
      title: "Copy me",
      diceSetId: setId,
      rollsPerGroup: 24,
      exitTicket: "Which die would you pick second?",
    });
    const { template } = await publish(head, source.id, "First version");
    await editLesson(head, source.id, { rollsPerGroup: 40 });
    await head.post(`/api/shelf/templates/${template.id}/versions`, { lessonId: source.id, changeNote: "Forty rolls" });

    const copied = await teacher.post(`/api/shelf/templates/${template.id}/copy`, {});
    expect(copied.status, copied.text).toBe(201);
    expect(copied.body).toMatchObject({ title: "Copy me", fromTemplateId: template.id, fromTemplateVersion: 2 });

    const read = await teacher.get(`/api/lessons/${copied.body.lessonId}`);
    expect(read.status).toBe(200);
    const copy = read.body.lesson as Lesson;
    expect(copy).toMatchObject({ isOwner: true, status: "draft", fromTemplateId: template.id, fromTemplateVersion: 2, rollsPerGroup: 40 });
    expect(copy.exitTicket).toBe("Which die would you pick second?");
    expect(copy.diceSetId).not.toBe(setId);
    expect(read.body.diceSet.dice.map((d: { faces: number[] }) => d.faces)).toEqual(testDice.map((d) => d.faces));
    const ownSet = await teacher.get(`/api/dice-sets/${copy.diceSetId}`);
    expect(ownSet.status).toBe(200);
    expect(ownSet.body).toMatchObject({ name: "Private seabirds", visibility: "private", isOwner: true });

    const older = await teacher.post(`/api/shelf/templates/${template.id}/copy`, { version: 1 });
    expect(older.status).toBe(201);
    const olderCopy = (await teacher.get(`/api/lessons/${older.body.lessonId}`)).body.lesson as Lesson;
    expect(olderCopy).toMatchObject({ fromTemplateVersion: 1, rollsPerGroup: 24 });
    // The second copy reuses the teacher's copy of the dice set rather than making another.
    expect(olderCopy.diceSetId).toBe(copy.diceSetId);

    // The copy is the teacher's own: editing it changes neither the template nor the head's lesson.
    const edited = await editLesson(teacher, copy.id, { rollsPerGroup: 12 });
    expect(edited.rollsPerGroup).toBe(12);
    expect((await teacher.get(`/api/shelf/templates/${template.id}`)).body.shown.snapshot.lesson.rollsPerGroup).toBe(40);
    expect((await head.get(`/api/lessons/${source.id}`)).body.lesson.rollsPerGroup).toBe(40);
    const rows = await db.select().from(lesson).where(eq(lesson.fromTemplateId, template.id));
    expect(rows.length).toBe(2);
  });

  it("uses the department's shared dice set as it is when its dice have not changed", async () => {
    const sharedSetId = await createSet(head, "department", "Shared seabirds");
    const source = await createLesson(head, { title: "Shared set lesson", diceSetId: sharedSetId });
    const { template } = await publish(head, source.id);
    const copied = await colleague.post(`/api/shelf/templates/${template.id}/copy`, {});
    const copy = (await colleague.get(`/api/lessons/${copied.body.lessonId}`)).body.lesson as Lesson;
    expect(copy.diceSetId).toBe(sharedSetId);
  });

  it("answers 404 for a version that does not exist and copies nothing", async () => {
    const source = await createLesson(head, { title: "One version only" });
    const { template } = await publish(head, source.id);
    const response = await teacher.post(`/api/shelf/templates/${template.id}/copy`, { version: 5 });
    expect(response.status).toBe(404);
    expect(await db.select().from(lesson).where(eq(lesson.fromTemplateId, template.id))).toEqual([]);
  });
});

describe("proposals", () => {
  it("lets a teacher propose their lesson and the head approve it as a new template", async () => {
    const own = await createLesson(teacher, { title: "Proposed: three players", mode: { dicePerPlayer: 1, players: 3 } });
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: own.id, note: "Worked well with 9M" });
    expect(proposed.status, proposed.text).toBe(201);
    expect(proposed.body).toMatchObject({
      status: "pending",
      lessonTitle: "Proposed: three players",
      isMine: true,
      note: "Worked well with 9M",
    });

    const twice = await teacher.post("/api/shelf/proposals", { lessonId: own.id });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe("already_proposed");

    const queue = await head.get("/api/shelf/proposals");
    const waiting = queue.body.proposals.find((p: { id: string }) => p.id === proposed.body.id);
    expect(waiting).toMatchObject({ status: "pending", isMine: false });
    expect(waiting.preview.lesson.mode).toEqual({ dicePerPlayer: 1, players: 3 });
    const colleagueView = await colleague.get("/api/shelf/proposals");
    expect(colleagueView.body.proposals.map((p: { id: string }) => p.id)).not.toContain(proposed.body.id);

    const approved = await head.post(`/api/shelf/proposals/${proposed.body.id}/approve`, {
      target: "new",
      changeNote: "First version, from a 9M lesson",
    });
    expect(approved.status, approved.text).toBe(200);
    expect(approved.body.proposal).toMatchObject({
      status: "approved",
      decisionNote: "First version, from a 9M lesson",
      decidedByName: "Rowan Head",
    });
    expect(approved.body.template.template).toMatchObject({
      title: "Proposed: three players",
      currentVersion: 1,
      publishedByName: "Rowan Head",
    });
    const stored = await db.select().from(lessonTemplate).where(eq(lessonTemplate.id, approved.body.template.template.id));
    expect(stored[0].sourceLessonId).toBe(own.id);

    const again = await head.post(`/api/shelf/proposals/${proposed.body.id}/decline`, { note: "Changed my mind" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("already_decided");
    const mine = await teacher.get("/api/shelf/proposals");
    expect(mine.body.proposals.find((p: { id: string }) => p.id === proposed.body.id).status).toBe("approved");
  });

  it("lets the head approve a proposal as the next version of an existing template", async () => {
    const headLesson = await createLesson(head, { title: "Base for a teacher's update" });
    const { template } = await publish(head, headLesson.id);
    const own = await createLesson(teacher, { title: "Better version", rollsPerGroup: 44 });
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: own.id });
    const approved = await head.post(`/api/shelf/proposals/${proposed.body.id}/approve`, {
      target: "version",
      templateId: template.id,
      changeNote: "More rolls, from a teacher's proposal",
    });
    expect(approved.status, approved.text).toBe(200);
    expect(approved.body.template.template).toMatchObject({ id: template.id, currentVersion: 2, title: "Better version" });
    expect(approved.body.template.shown.snapshot.lesson.rollsPerGroup).toBe(44);
  });

  it("lets the head decline with a note the teacher reads, and refuses a decline with no note", async () => {
    const own = await createLesson(teacher, { title: "Not quite ready" });
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: own.id });
    const bare = await head.post(`/api/shelf/proposals/${proposed.body.id}/decline`, { note: "" });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields.note).toBeDefined();
    const declined = await head.post(`/api/shelf/proposals/${proposed.body.id}/decline`, { note: "Add a Prove phase first" });
    expect(declined.status).toBe(200);
    const mine = (await teacher.get("/api/shelf/proposals")).body.proposals.find((p: { id: string }) => p.id === proposed.body.id);
    expect(mine).toMatchObject({ status: "declined", decisionNote: "Add a Prove phase first", preview: null });
    // Declined, the lesson may be proposed again.
    expect((await teacher.post("/api/shelf/proposals", { lessonId: own.id })).status).toBe(201);
  });

  it("lets a teacher withdraw their own waiting proposal, not a colleague's, and not propose a colleague's lesson", async () => {
    const own = await createLesson(teacher, { title: "Withdraw me" });
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: own.id });
    expect((await colleague.delete(`/api/shelf/proposals/${proposed.body.id}`)).status).toBe(404);
    expect((await teacher.delete(`/api/shelf/proposals/${proposed.body.id}`)).status).toBe(204);
    expect((await head.post(`/api/shelf/proposals/${proposed.body.id}/approve`, { target: "new", changeNote: "Too late" })).status).toBe(
      404,
    );
    expect((await colleague.post("/api/shelf/proposals", { lessonId: own.id })).status).toBe(404);
  });

  it("answers 404 to approving a proposal whose lesson was deleted: the pending proposal went with the lesson", async () => {
    const own = await createLesson(teacher, { title: "Deleted after proposing" });
    const proposed = await teacher.post("/api/shelf/proposals", { lessonId: own.id });
    expect((await teacher.delete(`/api/lessons/${own.id}`)).status).toBe(204);
    const response = await head.post(`/api/shelf/proposals/${proposed.body.id}/approve`, { target: "new", changeNote: "First version" });
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe("not_found");
  });
});

describe("the demo department's shelf", () => {
  it("holds two templates published by Priya Castellanos, one with two versions and change notes, and seeding again adds none", async () => {
    const priya = new HttpAgent(app.baseUrl);
    await priya.signIn(demoTeachers.find((t) => t.role === "head")!.email, demoPassword);
    const tomasz = new HttpAgent(app.baseUrl);
    await tomasz.signIn(demoTeachers.find((t) => t.role === "teacher")!.email, demoPassword);
    const shelf = await tomasz.get("/api/shelf/templates");
    expect(shelf.status).toBe(200);
    const byTitle = new Map(shelf.body.templates.map((t: { title: string }) => [t.title, t]));
    for (const demo of demoTemplates) expect(byTitle.has(demo.lessonTitle), demo.lessonTitle).toBe(true);
    expect(shelf.body.templates.every((t: { publishedByName: string }) => t.publishedByName === "Priya Castellanos")).toBe(true);

    const twoVersions = shelf.body.templates.find((t: { title: string }) => t.title === demoTemplates[0].lessonTitle);
    const detail = (await tomasz.get(`/api/shelf/templates/${twoVersions.id}`)).body as TemplateDetail;
    expect(detail.versions.map((v) => [v.version, v.changeNote])).toEqual([
      [2, demoTemplates[0].changeNote],
      [1, demoTemplates[0].earlier[0].changeNote],
    ]);
    const first = (await tomasz.get(`/api/shelf/templates/${twoVersions.id}/versions/1`)).body as TemplateDetail;
    expect(first.shown.snapshot.lesson.rollsPerGroup).not.toBe(detail.shown.snapshot.lesson.rollsPerGroup);

    const teachers = await seedTeachers(db);
    const before = (await db.select().from(lessonTemplate).where(eq(lessonTemplate.departmentId, teachers.departmentId))).length;
    await seedShelf(db, teachers);
    const after = (await db.select().from(lessonTemplate).where(eq(lessonTemplate.departmentId, teachers.departmentId))).length;
    expect(after).toBe(before);
  });
});
