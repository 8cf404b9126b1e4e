import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyLessonInput, type Lesson, type LessonInput } from "@shared/schemas/lessons";
import type { TemplateDetail, TemplateSummary } from "@shared/schemas/shelf";
import { db } from "../../server/db/client";
import { lessonTemplateVersion, proposalDigest } from "../../server/db/schema/index";
import { sendProposalDigests } from "../../server/services/proposal-digest.service";
import { env } from "../../server/env";
import { createDepartment, type DepartmentFixture } from "../helpers/department-fixtures";
import { linkIn, mailFor, waitForMail } from "../helpers/mailbox";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let ours: DepartmentFixture;
let quiet: DepartmentFixture;

const day = 24 * 60 * 60 * 1000;

async function createLesson(agent: HttpAgent, overrides: Partial<LessonInput> = {}): Promise<Lesson> {
  const response = await agent.post("/api/lessons", { ...emptyLessonInput(), classGroup: "9M", status: "ready", ...overrides });
  expect(response.status, response.text).toBe(201);
  return response.body.lesson;
}

async function propose(agent: HttpAgent, title: string, note = "") {
  const own = await createLesson(agent, { title });
  const response = await agent.post("/api/shelf/proposals", { lessonId: own.id, note });
  expect(response.status, response.text).toBe(201);
  return response.body.id as string;
}

async function waiting(agent: HttpAgent) {
  const response = await agent.get("/api/shelf/proposals/waiting");
  expect(response.status, response.text).toBe(200);
  return response.body as { waiting: number; scope: string };
}

beforeAll(async () => {
  app = await startTestApp({ signInLimitPerMinute: 1000 });
  ours = await createDepartment(app.baseUrl, "credit-ours", 2);
  quiet = await createDepartment(app.baseUrl, "credit-quiet", 1);
});
afterAll(() => app.close());

describe("credit for the proposing teacher", () => {
  it("credits the teacher on a template approved from their proposal, beside the head who published it", async () => {
    const [teacher] = ours.teachers;
    const proposalId = await propose(teacher.agent, "Credit: three players");
    const approved = await ours.head.post(`/api/shelf/proposals/${proposalId}/approve`, {
      target: "new",
      changeNote: "First version, from a 9M lesson",
    });
    expect(approved.status, approved.text).toBe(200);
    const detail = approved.body.template as TemplateDetail;
    expect(detail.template).toMatchObject({ publishedByName: "Rowan Head", proposedByName: "Teacher 1" });
    expect(detail.versions[0]).toMatchObject({ version: 1, publishedByName: "Rowan Head", proposedByName: "Teacher 1" });
    expect(detail.shown.proposedByName).toBe("Teacher 1");

    // A colleague browsing the shelf sees the credit too, and it is stored against the teacher's account.
    const shelf = await ours.teachers[1].agent.get("/api/shelf/templates");
    const listed = (shelf.body.templates as TemplateSummary[]).find((t) => t.id === detail.template.id);
    expect(listed?.proposedByName).toBe("Teacher 1");
    const [stored] = await db.select().from(lessonTemplateVersion).where(eq(lessonTemplateVersion.templateId, detail.template.id));
    expect(stored.proposedById).toBe(teacher.userId);
    expect(stored.publishedById).not.toBe(teacher.userId);
  });

  it("credits each version to its own proposer: the head's own version has none, a teacher's next version has theirs", async () => {
    const headLesson = await createLesson(ours.head, { title: "Credit: head's own" });
    const published = await ours.head.post("/api/shelf/templates", { lessonId: headLesson.id, changeNote: "First version" });
    expect(published.status, published.text).toBe(201);
    const templateId = (published.body as TemplateDetail).template.id;
    expect((published.body as TemplateDetail).template.proposedByName).toBeNull();

    const proposalId = await propose(ours.teachers[1].agent, "Credit: more rolls");
    const approved = await ours.head.post(`/api/shelf/proposals/${proposalId}/approve`, {
      target: "version",
      templateId,
      changeNote: "More rolls",
    });
    expect(approved.status, approved.text).toBe(200);
    const detail = (await ours.teachers[0].agent.get(`/api/shelf/templates/${templateId}`)).body as TemplateDetail;
    expect(detail.versions.map((v) => [v.version, v.publishedByName, v.proposedByName])).toEqual([
      [2, "Rowan Head", "Teacher 2"],
      [1, "Rowan Head", null],
    ]);
    const first = (await ours.teachers[0].agent.get(`/api/shelf/templates/${templateId}/versions/1`)).body as TemplateDetail;
    expect(first.shown.proposedByName).toBeNull();
  });
});

describe("the count of proposals waiting", () => {
  it("gives the head the department's queue and each teacher their own, and follows every decision", async () => {
    const dept = await createDepartment(app.baseUrl, "count", 2);
    const [first, second] = dept.teachers.map((t) => t.agent);
    const other = await createDepartment(app.baseUrl, "count-other", 1);
    expect(await waiting(dept.head)).toEqual({ waiting: 0, scope: "department" });

    const a = await propose(first, "Count A");
    const b = await propose(first, "Count B");
    const c = await propose(second, "Count C");
    await propose(other.teachers[0].agent, "Another department's");
    expect(await waiting(dept.head)).toEqual({ waiting: 3, scope: "department" });
    expect(await waiting(first)).toEqual({ waiting: 2, scope: "mine" });
    expect(await waiting(second)).toEqual({ waiting: 1, scope: "mine" });
    expect(await waiting(other.head)).toEqual({ waiting: 1, scope: "department" });

    expect((await dept.head.post(`/api/shelf/proposals/${a}/approve`, { target: "new", changeNote: "First version" })).status).toBe(200);
    expect(await waiting(dept.head)).toEqual({ waiting: 2, scope: "department" });
    expect((await dept.head.post(`/api/shelf/proposals/${c}/decline`, { note: "Add a Prove phase" })).status).toBe(200);
    expect(await waiting(dept.head)).toEqual({ waiting: 1, scope: "department" });
    expect(await waiting(second)).toEqual({ waiting: 0, scope: "mine" });
    expect((await first.delete(`/api/shelf/proposals/${b}`)).status).toBe(204);
    expect(await waiting(dept.head)).toEqual({ waiting: 0, scope: "department" });
  });

  it("answers 401 signed out and 403 without a department", async () => {
    const visitor = new HttpAgent(app.baseUrl);
    const signedOut = await visitor.get("/api/shelf/proposals/waiting");
    expect(signedOut.status).toBe(401);
    expect(signedOut.body.error.code).toBe("unauthenticated");
    const lone = new HttpAgent(app.baseUrl);
    await lone.post("/api/auth/sign-up/email", {
      name: "Lone Teacher",
      email: `lone-${crypto.randomUUID().slice(0, 8)}@outroll-tests.test`,
      password: "a-long-password",
    });
    const noDepartment = await lone.get("/api/shelf/proposals/waiting");
    expect(noDepartment.status).toBe(403);
    expect(noDepartment.body.error.code).toBe("forbidden");
  });
});

describe("the daily proposal digest, over SMTP to the local fake mail server", () => {
  it("mails the head once a day while proposals wait, marks the new ones, and stops when none wait", async () => {
    const dept = await createDepartment(app.baseUrl, "digest", 2);
    const headEmail = dept.headEmail;
    const [first, second] = dept.teachers.map((t) => t.agent);
    await propose(first, "Digest: shorter Prove", "Tried with 8K");
    const today = new Date();

    const round1 = await sendProposalDigests(today);
    expect(round1.sent).toContainEqual({ to: headEmail, departmentId: dept.departmentId, proposals: 1 });
    const message1 = await waitForMail(headEmail, /proposal waits for your decision/);
    expect(message1.subject).toBe(`1 proposal waits for your decision on the Maths, digest School shelf`);
    expect(message1.text).toContain("Digest: shorter Prove, proposed by Teacher 1");
    expect(message1.text).toContain("(new)");
    expect(message1.text).toContain("Note: Tried with 8K");
    expect(linkIn(message1, "/app/shelf/proposals").origin).toBe(new URL(env.appOrigin).origin);
    expect(message1.html).toContain("Decide on the proposals");

    // A second call the same day (another scheduler tick or process) sends nothing more.
    const sentBefore = (await mailFor(headEmail)).length;
    const round2 = await sendProposalDigests(new Date(today.getTime() + 60_000));
    expect(round2.alreadySent).toContainEqual({ to: headEmail, departmentId: dept.departmentId });
    expect(round2.sent.map((s) => s.to)).not.toContain(headEmail);
    expect((await mailFor(headEmail)).length).toBe(sentBefore);

    // The department without waiting proposals: its head gets nothing.
    expect(round1.sent.map((s) => s.to)).not.toContain(quiet.headEmail);
    expect(await mailFor(quiet.headEmail)).toEqual([]);

    // Next day: the older one is still waiting (not new), a proposal made since is new.
    await propose(second, "Digest: three players");
    const round3 = await sendProposalDigests(new Date(today.getTime() + day));
    expect(round3.sent).toContainEqual({ to: headEmail, departmentId: dept.departmentId, proposals: 2 });
    const message3 = await waitForMail(headEmail, /2 proposals wait/);
    const lines = message3.text.split("\n");
    expect(lines.find((line) => line.includes("Digest: shorter Prove"))).not.toContain("(new)");
    expect(lines.find((line) => line.includes("Digest: three players"))).toContain("proposed by Teacher 2");
    expect(lines.find((line) => line.includes("Digest: three players"))).toContain("(new)");
    expect(message3.text).toContain("1 new since the last digest.");

    // Once every proposal is decided, the following day sends nothing.
    for (const proposal of (await dept.head.get("/api/shelf/proposals")).body.proposals as { id: string }[]) {
      expect((await dept.head.post(`/api/shelf/proposals/${proposal.id}/decline`, { note: "Not this term" })).status).toBe(200);
    }
    const round4 = await sendProposalDigests(new Date(today.getTime() + 2 * day));
    expect(round4.sent.map((s) => s.to)).not.toContain(headEmail);
    const days = await db.select().from(proposalDigest).where(eq(proposalDigest.departmentId, dept.departmentId));
    expect(days.map((row) => row.proposalCount).sort()).toEqual([1, 2]);
  });
});
