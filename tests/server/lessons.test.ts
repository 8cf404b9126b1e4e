import { existsSync, readdirSync } from "node:fs";
import path from "node:path";
import { PNG } from "pngjs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ATTACHMENT_BYTES_MAX, emptyLessonInput, type Lesson, type LessonInput } from "@shared/schemas/lessons";
import { db } from "../../server/db/client";
import { diceSet, lesson, lessonAttachment, user } from "../../server/db/schema/index";
import { env } from "../../server/env";
import { demoPassword, demoRunLesson, demoTeachers } from "../../seed/demo-scenario";
import { HttpAgent, startTestApp, uniqueEmail, type TestApp } from "../helpers/test-app";

let app: TestApp;
const headAccount = demoTeachers.find((t) => t.role === "head")!;
const [ownerAccount, colleagueAccount] = demoTeachers.filter((t) => t.role === "teacher");

type Agents = { owner: HttpAgent; colleague: HttpAgent; head: HttpAgent; outsider: HttpAgent; signedOut: HttpAgent };
let agents: Agents;
let ids: { owner: string; colleague: string; outsider: string; department: string; outsiderDepartment: string };
let sets: { ownPrivate: string; colleagueShared: string; colleaguePrivate: string; outsiderShared: string };

const uploadsDir = () => path.join(env.DATA_DIR, "uploads");
const storedFiles = () => (existsSync(uploadsDir()) ? readdirSync(uploadsDir()) : []);

/** A valid input with the fields a test cares about. */
function lessonInput(overrides: Partial<LessonInput> = {}): LessonInput {
  return { ...emptyLessonInput(), title: "Cycles with the test trio", classGroup: "8K", status: "draft", ...overrides };
}

async function insertSet(ownerId: string, departmentId: string, name: string, visibility: "private" | "department") {
  // Faces of our own; this file checks access, not the maths.
  const [row] = await db
    .insert(diceSet)
    .values({
      ownerId,
      departmentId,
      name,
      visibility,
      dice: [
        { name: "Skua", faces: [1, 5, 5, 5, 5, 6], colour: "teal", pattern: "dots" },
        { name: "Fulmar", faces: [3, 3, 3, 4, 4, 8], colour: "amber", pattern: "stripes" },
        { name: "Gannet", faces: [2, 2, 2, 7, 7, 9], colour: "plum", pattern: "checks" },
      ],
    })
    .returning({ id: diceSet.id });
  return row.id;
}

async function createLessonAs(agent: HttpAgent, overrides: Partial<LessonInput> = {}): Promise<Lesson> {
  const response = await agent.post("/api/lessons", lessonInput(overrides));
  expect(response.status, response.text).toBe(201);
  return response.body.lesson;
}

function pngBytes(): Buffer {
  const image = new PNG({ width: 4, height: 3 });
  image.data.fill(200);
  return PNG.sync.write(image);
}
// The smallest well-formed PDF header and trailer; file-type detects PDF from the "%PDF-" signature (ISO 32000-1, 7.5.2).
const pdfBytes = () => Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n", "latin1");
// JPEG starts with SOI FF D8 and an APP0 "JFIF" segment (ITU-T T.81 / JFIF 1.02).
const jpegBytes = () =>
  Buffer.concat([
    Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00]),
    Buffer.alloc(64),
    Buffer.from([0xff, 0xd9]),
  ]);

function form(bytes: Buffer, fileName: string, claimedType: string) {
  const data = new FormData();
  data.append("file", new Blob([new Uint8Array(bytes)], { type: claimedType }), fileName);
  return data;
}

beforeAll(async () => {
  app = await startTestApp({ signInLimitPerMinute: 1000 });
  const signedIn = async (email: string) => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.signIn(email, demoPassword);
    return agent;
  };
  const outsider = new HttpAgent(app.baseUrl);
  const outsiderEmail = uniqueEmail("other-department");
  expect(
    (await outsider.post("/api/auth/sign-up/email", { name: "Morwenna Pike", email: outsiderEmail, password: "a-long-password" })).status,
  ).toBe(200);
  const outsiderDepartment = await outsider.post("/api/departments", { name: "Maths, Saltmarsh School" });
  expect(outsiderDepartment.status).toBe(201);
  agents = {
    owner: await signedIn(ownerAccount.email),
    colleague: await signedIn(colleagueAccount.email),
    head: await signedIn(headAccount.email),
    outsider,
    signedOut: new HttpAgent(app.baseUrl),
  };
  const me = async (agent: HttpAgent) => (await agent.get("/api/me")).body;
  const [ownerMe, colleagueMe, outsiderMe] = [await me(agents.owner), await me(agents.colleague), await me(outsider)];
  ids = {
    owner: ownerMe.user.id,
    colleague: colleagueMe.user.id,
    outsider: outsiderMe.user.id,
    department: ownerMe.department.id,
    outsiderDepartment: outsiderMe.department.id,
  };
  sets = {
    ownPrivate: await insertSet(ids.owner, ids.department, "Test terns (own)", "private"),
    colleagueShared: await insertSet(ids.colleague, ids.department, "Test terns (shared)", "department"),
    colleaguePrivate: await insertSet(ids.colleague, ids.department, "Test terns (colleague's private)", "private"),
    outsiderShared: await insertSet(ids.outsider, ids.outsiderDepartment, "Test terns (elsewhere)", "department"),
  };
});
afterAll(() => app.close());

describe("lesson routes: the role matrix", () => {
  it("answers 401 on every lesson and upload route when signed out", async () => {
    const someId = crypto.randomUUID();
    const routes: [string, string, unknown?][] = [
      ["GET", "/api/lessons"],
      ["POST", "/api/lessons", lessonInput()],
      ["GET", `/api/lessons/${someId}`],
      ["PUT", `/api/lessons/${someId}`, { ...lessonInput(), version: 1 }],
      ["POST", `/api/lessons/${someId}/duplicate`, {}],
      ["POST", `/api/lessons/${someId}/archive`, { archived: true }],
      ["DELETE", `/api/lessons/${someId}`],
      ["GET", `/api/lessons/${someId}/attachments`],
      ["POST", `/api/lessons/${someId}/attachments`, form(pngBytes(), "grid.png", "image/png")],
      ["GET", `/api/lessons/${someId}/attachments/${someId}`],
      ["DELETE", `/api/lessons/${someId}/attachments/${someId}`],
    ];
    for (const [method, route, body] of routes) {
      const response = await agents.signedOut.request(method, route, body);
      expect(response.status, `${method} ${route}`).toBe(401);
      expect(response.body).toEqual({ error: { code: "unauthenticated", message: "Sign in to continue." } });
    }
  });

  it("answers 403 to a signed-in teacher with no department", async () => {
    const loner = new HttpAgent(app.baseUrl);
    await loner.post("/api/auth/sign-up/email", { name: "Lone Teacher", email: uniqueEmail("no-department"), password: "a-long-password" });
    const response = await loner.get("/api/lessons");
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("forbidden");
  });

  it("lets only the owner change a lesson; the head reads it; other teachers are told it does not exist", async () => {
    const created = await createLessonAs(agents.owner, { title: "Role matrix lesson", diceSetId: sets.ownPrivate });
    const url = `/api/lessons/${created.id}`;
    const update = { ...lessonInput({ title: "Role matrix lesson, edited" }), version: created.version };

    const expected: Record<keyof Omit<Agents, "signedOut">, { read: number; write: number }> = {
      owner: { read: 200, write: 200 },
      head: { read: 200, write: 403 },
      colleague: { read: 404, write: 404 },
      outsider: { read: 404, write: 404 },
    };
    for (const [who, codes] of Object.entries(expected) as [keyof typeof expected, { read: number; write: number }][]) {
      const agent = agents[who];
      expect((await agent.get(url)).status, `${who} reads`).toBe(codes.read);
      expect((await agent.get(`${url}/attachments`)).status, `${who} lists attachments`).toBe(codes.read);
      if (who === "owner") continue;
      // Every write route answers the same refusal for a non-owner, and nothing changes.
      expect((await agent.put(url, update)).status, `${who} updates`).toBe(codes.write);
      expect((await agent.post(`${url}/duplicate`, {})).status, `${who} duplicates`).toBe(codes.write);
      expect((await agent.post(`${url}/archive`, { archived: true })).status, `${who} archives`).toBe(codes.write);
      expect((await agent.delete(url)).status, `${who} deletes`).toBe(codes.write);
      expect((await agent.postForm(`${url}/attachments`, form(pngBytes(), "grid.png", "image/png"))).status, `${who} uploads`).toBe(
        codes.write,
      );
    }
    const stored = await agents.owner.get(url);
    expect(stored.body.lesson).toMatchObject({ title: "Role matrix lesson", version: 1, archivedAt: null, isOwner: true });
    expect(stored.body.attachments).toEqual([]);
    const asHead = await agents.head.get(url);
    expect(asHead.body.lesson.isOwner).toBe(false);
    expect(asHead.body.diceSet.name).toBe("Test terns (own)");
    expect((await agents.owner.put(url, update)).status).toBe(200);
  });

  it("lists only the teacher's own lessons", async () => {
    const mine = await createLessonAs(agents.owner, { title: "Only mine" });
    for (const [who, agent] of Object.entries({ head: agents.head, colleague: agents.colleague, outsider: agents.outsider })) {
      const list = await agent.get("/api/lessons");
      expect(list.status).toBe(200);
      expect(
        list.body.lessons.map((entry: { id: string }) => entry.id),
        who,
      ).not.toContain(mine.id);
    }
    const own = await agents.owner.get("/api/lessons");
    expect(own.body.lessons.map((entry: { id: string }) => entry.id)).toContain(mine.id);
  });

  it("answers a malformed lesson id with 400 before any lookup", async () => {
    const response = await agents.owner.get("/api/lessons/not-a-uuid");
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
  });
});

describe("creating and editing lessons", () => {
  it("refuses a bad plan with per-field messages and stores nothing", async () => {
    const before = await db.select({ id: lesson.id }).from(lesson).where(eq(lesson.ownerId, ids.owner));
    const bad = { ...lessonInput({ title: "" }), groups: 0, mode: { dicePerPlayer: 3, players: 2 }, phases: lessonInput().phases.slice(1) };
    const response = await agents.owner.post("/api/lessons", bad);
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields)).toEqual(expect.arrayContaining(["title", "groups", "mode.dicePerPlayer", "phases"]));
    const after = await db.select({ id: lesson.id }).from(lesson).where(eq(lesson.ownerId, ids.owner));
    expect(after.length).toBe(before.length);
  });

  it("accepts the teacher's own set and a set shared with the department, and refuses others' private or other departments' sets", async () => {
    expect((await agents.owner.post("/api/lessons", lessonInput({ diceSetId: sets.ownPrivate }))).status).toBe(201);
    const shared = await agents.owner.post("/api/lessons", lessonInput({ diceSetId: sets.colleagueShared }));
    expect(shared.status).toBe(201);
    expect(shared.body.lesson.diceSetName).toBe("Test terns (shared)");
    for (const refused of [sets.colleaguePrivate, sets.outsiderShared, crypto.randomUUID()]) {
      const response = await agents.owner.post("/api/lessons", lessonInput({ diceSetId: refused }));
      expect(response.status).toBe(400);
      expect(response.body.error.fields.diceSetId).toEqual(["That dice set is not one you can use."]);
    }
  });

  it("refuses a stale update with 409 stale_version and keeps the first save", async () => {
    const created = await createLessonAs(agents.owner, { title: "Two tabs" });
    const url = `/api/lessons/${created.id}`;
    const first = await agents.owner.put(url, { ...lessonInput({ title: "Two tabs, first save", rollsPerGroup: 40 }), version: 1 });
    expect(first.status).toBe(200);
    expect(first.body.lesson).toMatchObject({ version: 2, rollsPerGroup: 40 });
    const second = await agents.owner.put(url, { ...lessonInput({ title: "Two tabs, second save" }), version: 1 });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("stale_version");
    const stored = await agents.owner.get(url);
    expect(stored.body.lesson).toMatchObject({ title: "Two tabs, first save", version: 2, rollsPerGroup: 40 });
  });

  it("stores every part of the plan and reads it back unchanged", async () => {
    const input = lessonInput({
      title: "Full plan",
      classGroup: "9M",
      durationMinutes: 75,
      objectives: [{ text: "Estimate from relative frequency", curriculumCode: "7.SP.C.6" }, { text: "Build a tree diagram" }],
      mode: { dicePerPlayer: 2, players: 3 },
      tieRule: "ties-score-half",
      groups: 6,
      pupilsPerGroup: 4,
      rollsPerGroup: 25,
      matchupChoice: "group-choice",
      discussionPrompts: ["Which die would you pick first?", "Why did the pooled result settle?"],
      exitTicket: "Which die beats the Gannet?",
      differentiation: { support: "Pre-filled tree", stretch: "Three players" },
      status: "ready",
      diceSetId: sets.ownPrivate,
    });
    input.phases[4] = { phase: "Twist", included: false, minutes: 0, notes: "" };
    const created = await createLessonAs(agents.owner, input);
    const { lesson: stored } = (await agents.owner.get(`/api/lessons/${created.id}`)).body;
    for (const [key, value] of Object.entries(input)) expect(stored[key], key).toEqual(value);
  });

  it("refuses an unknown curriculum code", async () => {
    const response = await agents.owner.post(
      "/api/lessons",
      lessonInput({ objectives: [{ text: "x", curriculumCode: "7.SP.Z.9" as "7.SP.C.5" }] }),
    );
    expect(response.status).toBe(400);
    expect(response.body.error.fields["objectives.0.curriculumCode"]).toBeDefined();
  });
});

describe("the Lessons list, duplicate, archive and delete", () => {
  it("filters by search text, set, class and status, and hides archived lessons unless asked", async () => {
    const tag = crypto.randomUUID().slice(0, 6);
    const a = await createLessonAs(agents.owner, {
      title: `Filter ${tag} alpha`,
      classGroup: "8K",
      status: "draft",
      diceSetId: sets.ownPrivate,
    });
    const b = await createLessonAs(agents.owner, { title: `Filter ${tag} beta`, classGroup: "9M", status: "taught" });
    const c = await createLessonAs(agents.owner, { title: `Filter ${tag} gamma_%`, classGroup: "9M", status: "taught" });
    expect((await agents.owner.post(`/api/lessons/${c.id}/archive`, { archived: true })).status).toBe(200);
    const idsOf = async (query: string) => {
      const response = await agents.owner.get(`/api/lessons?search=${encodeURIComponent(`Filter ${tag}`)}${query}`);
      expect(response.status, response.text).toBe(200);
      return response.body.lessons.map((entry: { id: string }) => entry.id).sort();
    };
    expect(await idsOf("")).toEqual([a.id, b.id].sort());
    expect(await idsOf("&includeArchived=true")).toEqual([a.id, b.id, c.id].sort());
    expect(await idsOf("&classGroup=9m")).toEqual([b.id]);
    expect(await idsOf("&status=draft")).toEqual([a.id]);
    expect(await idsOf(`&diceSetId=${sets.ownPrivate}`)).toEqual([a.id]);
    // A LIKE wildcard in the search text matches only itself.
    const literal = await agents.owner.get(`/api/lessons?includeArchived=true&search=${encodeURIComponent(`${tag} gamma_%`)}`);
    expect(literal.body.lessons.map((entry: { id: string }) => entry.id)).toEqual([c.id]);
    const wildcard = await agents.owner.get(`/api/lessons?search=${encodeURIComponent(`${tag}%beta`)}`);
    expect(wildcard.body.lessons).toEqual([]);
    expect((await agents.owner.get("/api/lessons?status=finished")).status).toBe(400);
  });

  it("duplicates a lesson as a new draft titled as a copy", async () => {
    const source = await createLessonAs(agents.owner, {
      title: "Original plan",
      status: "taught",
      rollsPerGroup: 44,
      diceSetId: sets.ownPrivate,
    });
    const response = await agents.owner.post(`/api/lessons/${source.id}/duplicate`, {});
    expect(response.status).toBe(201);
    expect(response.body.lesson).toMatchObject({
      title: "Original plan (copy)",
      status: "draft",
      rollsPerGroup: 44,
      diceSetId: sets.ownPrivate,
      version: 1,
    });
    expect(response.body.lesson.id).not.toBe(source.id);
  });

  it("archives and unarchives without changing the plan's version", async () => {
    const created = await createLessonAs(agents.owner, { title: "To archive" });
    const archived = await agents.owner.post(`/api/lessons/${created.id}/archive`, { archived: true });
    expect(archived.body.lesson.archivedAt).not.toBeNull();
    expect(archived.body.lesson.version).toBe(1);
    const back = await agents.owner.post(`/api/lessons/${created.id}/archive`, { archived: false });
    expect(back.body.lesson.archivedAt).toBeNull();
    expect((await agents.owner.post(`/api/lessons/${created.id}/archive`, { archived: "yes" })).status).toBe(400);
  });

  it("deletes a lesson with its attachments' rows and files", async () => {
    const created = await createLessonAs(agents.owner, { title: "To delete" });
    const upload = await agents.owner.postForm(`/api/lessons/${created.id}/attachments`, form(pngBytes(), "grid.png", "image/png"));
    expect(upload.status, upload.text).toBe(201);
    const [row] = await db.select().from(lessonAttachment).where(eq(lessonAttachment.id, upload.body.attachment.id));
    expect(existsSync(path.join(uploadsDir(), row.storageKey))).toBe(true);

    expect((await agents.owner.delete(`/api/lessons/${created.id}`)).status).toBe(204);
    expect((await agents.owner.get(`/api/lessons/${created.id}`)).status).toBe(404);
    expect(await db.select().from(lessonAttachment).where(eq(lessonAttachment.lessonId, created.id))).toEqual([]);
    expect(existsSync(path.join(uploadsDir(), row.storageKey))).toBe(false);
    expect((await agents.owner.delete(`/api/lessons/${created.id}`)).status).toBe(404);
  });
});

describe("attachments", () => {
  let lessonId: string;
  beforeAll(async () => {
    lessonId = (await createLessonAs(agents.owner, { title: "With worksheets" })).id;
  });

  const attachmentRows = () => db.select().from(lessonAttachment).where(eq(lessonAttachment.lessonId, lessonId));

  it("refuses a text file named .pdf and claimed as a PDF, and stores nothing", async () => {
    const filesBefore = storedFiles();
    const response = await agents.owner.postForm(
      `/api/lessons/${lessonId}/attachments`,
      form(Buffer.from("Not a PDF at all, just words.\n"), "worksheet.pdf", "application/pdf"),
    );
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("unsupported_file_type");
    expect(response.body.error.message).toMatch(/Only PDF, PNG and JPEG/);
    expect(await attachmentRows()).toEqual([]);
    expect(storedFiles()).toEqual(filesBefore);
  });

  it("refuses a GIF renamed .png, naming what its content really is", async () => {
    // GIF89a signature and a 1×1 logical screen (GIF89a specification, section 17).
    const gif = Buffer.concat([Buffer.from("GIF89a", "latin1"), Buffer.from([1, 0, 1, 0, 0, 0, 0]), Buffer.from([0x3b])]);
    const response = await agents.owner.postForm(`/api/lessons/${lessonId}/attachments`, form(gif, "picture.png", "image/png"));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toContain("GIF");
    expect(await attachmentRows()).toEqual([]);
  });

  it("refuses a file over 10 MB with 413 and stores nothing", async () => {
    const filesBefore = storedFiles();
    const big = Buffer.concat([pngBytes(), Buffer.alloc(ATTACHMENT_BYTES_MAX)]);
    const response = await agents.owner.postForm(`/api/lessons/${lessonId}/attachments`, form(big, "huge.png", "image/png"));
    expect(response.status).toBe(413);
    expect(response.body.error).toEqual({ code: "too_large", message: "That file is larger than 10 MB; attach a smaller one." });
    expect(await attachmentRows()).toEqual([]);
    expect(storedFiles()).toEqual(filesBefore);
  });

  it("refuses a request with no file", async () => {
    const response = await agents.owner.postForm(`/api/lessons/${lessonId}/attachments`, new FormData());
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("no_file");
  });

  it("stores a PDF, a PNG and a JPEG by their content type, whatever the browser claimed", async () => {
    const cases = [
      { bytes: pdfBytes(), name: "worksheet.pdf", claimed: "application/octet-stream", type: "application/pdf" },
      { bytes: pngBytes(), name: "grid", claimed: "text/plain", type: "image/png" },
      { bytes: jpegBytes(), name: "photo.jpeg", claimed: "image/png", type: "image/jpeg" },
    ];
    for (const entry of cases) {
      const response = await agents.owner.postForm(`/api/lessons/${lessonId}/attachments`, form(entry.bytes, entry.name, entry.claimed));
      expect(response.status, response.text).toBe(201);
      expect(response.body.attachment).toMatchObject({
        fileName: entry.name,
        mimeType: entry.type,
        sizeBytes: entry.bytes.length,
        uploadedByName: ownerAccount.name,
      });
    }
    const rows = await attachmentRows();
    expect(rows.map((row) => row.mimeType).sort()).toEqual(["application/pdf", "image/jpeg", "image/png"]);
    for (const row of rows) expect(existsSync(path.join(uploadsDir(), row.storageKey))).toBe(true);
    const listed = await agents.owner.get(`/api/lessons/${lessonId}/attachments`);
    expect(listed.body.attachments).toHaveLength(3);
  });

  it("serves an attachment's bytes to members of the lesson's department only, with safe headers", async () => {
    const upload = await agents.owner.postForm(
      `/api/lessons/${lessonId}/attachments`,
      form(pngBytes(), "Tide table ‘8K’.png", "image/png"),
    );
    const url = `/api/lessons/${lessonId}/attachments/${upload.body.attachment.id}`;
    for (const member of [agents.owner, agents.colleague, agents.head]) {
      const response = await member.get(url);
      expect(response.status).toBe(200);
      expect(response.headers.get("content-type")).toBe("image/png");
      expect(response.headers.get("x-content-type-options")).toBe("nosniff");
      expect(response.headers.get("content-disposition")).toBe(
        `inline; filename="Tide table _8K_.png"; filename*=UTF-8''${encodeURIComponent("Tide table ‘8K’.png")}`,
      );
      expect(response.bytes.equals(pngBytes())).toBe(true);
    }
    expect((await agents.owner.get(`${url}?download=1`)).headers.get("content-disposition")).toMatch(/^attachment;/);
    expect((await agents.outsider.get(url)).status).toBe(404);
    expect((await agents.signedOut.get(url)).status).toBe(401);
    expect((await agents.owner.get(`/api/lessons/${lessonId}/attachments/${crypto.randomUUID()}`)).status).toBe(404);
  });

  it("lets only the owner delete an attachment, removing its row and file", async () => {
    const upload = await agents.owner.postForm(
      `/api/lessons/${lessonId}/attachments`,
      form(pdfBytes(), "to-remove.pdf", "application/pdf"),
    );
    const url = `/api/lessons/${lessonId}/attachments/${upload.body.attachment.id}`;
    const [row] = await db.select().from(lessonAttachment).where(eq(lessonAttachment.id, upload.body.attachment.id));
    expect((await agents.head.delete(url)).status).toBe(403);
    expect((await agents.colleague.delete(url)).status).toBe(404);
    expect((await agents.outsider.delete(url)).status).toBe(404);
    expect(existsSync(path.join(uploadsDir(), row.storageKey))).toBe(true);
    expect((await agents.owner.delete(url)).status).toBe(204);
    expect(existsSync(path.join(uploadsDir(), row.storageKey))).toBe(false);
    expect((await agents.owner.get(url)).status).toBe(404);
  });
});

describe("demo lessons", () => {
  it("give each demo teacher lessons in every status for classes 8K and 9M, and the run lesson exactly as the scenario names it", async () => {
    for (const account of demoTeachers) {
      const [owner] = await db.select({ id: user.id }).from(user).where(eq(user.email, account.email));
      const rows = await db.select().from(lesson).where(eq(lesson.ownerId, owner.id));
      const seeded = rows.filter((row) => row.classGroup === "8K" || row.classGroup === "9M");
      expect(new Set(seeded.map((row) => row.status)), account.email).toEqual(new Set(["draft", "ready", "taught"]));
      expect(new Set(seeded.map((row) => row.classGroup)), account.email).toEqual(new Set(["8K", "9M"]));
    }
    const [tomasz] = await db.select({ id: user.id }).from(user).where(eq(user.email, demoRunLesson.ownerEmail));
    const runLessons = await db.select().from(lesson).where(eq(lesson.title, demoRunLesson.title));
    expect(runLessons).toHaveLength(1);
    expect(runLessons[0]).toMatchObject({ ownerId: tomasz.id, classGroup: demoRunLesson.classGroup, status: "taught" });
  });
});
