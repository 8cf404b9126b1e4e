import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DiceSet, DiceSetInput } from "@shared/schemas/dice-sets";
import { db } from "../../server/db/client";
import { diceSet, lesson, organization } from "../../server/db/schema/index";
import { demoDepartment, demoDiceSetNames, demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { seedDiceSets } from "../../seed/seed-dice-sets";
import { createDepartment, type DepartmentFixture, signUpAgent, userIdFor } from "../helpers/department-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let department: DepartmentFixture;
let owner: HttpAgent;
let colleague: HttpAgent;
let outsider: HttpAgent;

const sample = (name: string, visibility: "private" | "department" = "private"): DiceSetInput => ({
  name,
  description: "Three dice for a Year 8 starter.",
  visibility,
  dice: [
    { name: "Fulmar", faces: [2, 2, 6, 6, 7, 7], colour: "teal", pattern: "dots" },
    { name: "Gannet", faces: [1, 5, 5, 5, 5, 9], colour: "amber", pattern: "stripes" },
    { name: "Skua", faces: [3, 3, 3, 4, 8, 8], colour: "plum", pattern: "checks" },
  ],
});

async function create(agent: HttpAgent, input: DiceSetInput): Promise<DiceSet> {
  const response = await agent.post("/api/dice-sets", input);
  expect(response.status, response.text).toBe(201);
  return response.body;
}

beforeAll(async () => {
  app = await startTestApp();
  department = await createDepartment(app.baseUrl, "dice-sets", 1);
  owner = department.head;
  colleague = department.teachers[0].agent;
  // A teacher of another department: signed up afresh, with a department of their own.
  const other = await signUpAgent(app.baseUrl, "dice-sets-outsider", "Morgan Elsewhere");
  outsider = other.agent;
  const created = await outsider.post("/api/departments", { name: "Maths, Elsewhere High" });
  expect(created.status).toBe(201);
});
afterAll(() => app.close());

describe("dice sets API", () => {
  it("answers 401 without a session", async () => {
    const anonymous = new HttpAgent(app.baseUrl);
    expect((await anonymous.get("/api/dice-sets")).status).toBe(401);
    expect((await anonymous.post("/api/dice-sets", sample("Nobody's set"))).status).toBe(401);
  });

  it("creates a set owned by the caller and reads it back", async () => {
    const set = await create(owner, sample("Fulmar three"));
    expect(set).toMatchObject({ name: "Fulmar three", visibility: "private", version: 1, isOwner: true, ownerName: "Rowan Head" });
    expect(set.dice.map((die) => die.faces)).toEqual(sample("x").dice.map((die) => die.faces));
    const read = await owner.get(`/api/dice-sets/${set.id}`);
    expect(read.status).toBe(200);
    expect(read.body).toEqual(set);
    const list = await owner.get("/api/dice-sets");
    expect(list.body.sets.map((s: DiceSet) => s.id)).toContain(set.id);
  });

  it("lets a department colleague read and duplicate a shared set but not edit or delete it", async () => {
    const shared = await create(owner, sample("Shared with colleagues", "department"));
    const hidden = await create(owner, sample("Kept private"));
    const list = (await colleague.get("/api/dice-sets")).body.sets as DiceSet[];
    expect(list.map((s) => s.id)).toContain(shared.id);
    expect(list.map((s) => s.id)).not.toContain(hidden.id);
    expect(list.find((s) => s.id === shared.id)!.isOwner).toBe(false);
    expect((await colleague.get(`/api/dice-sets/${hidden.id}`)).status).toBe(404);

    const read = await colleague.get(`/api/dice-sets/${shared.id}`);
    expect(read.status).toBe(200);
    expect(read.body.isOwner).toBe(false);

    const edit = await colleague.put(`/api/dice-sets/${shared.id}`, { ...sample("Taken over", "department"), version: shared.version });
    expect(edit.status).toBe(403);
    expect(edit.body.error.code).toBe("not_owner");
    const remove = await colleague.delete(`/api/dice-sets/${shared.id}`);
    expect(remove.status).toBe(403);

    const copy = await colleague.post(`/api/dice-sets/${shared.id}/duplicate`);
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({ name: "Shared with colleagues (copy)", visibility: "private", isOwner: true, version: 1 });
    expect(copy.body.dice).toEqual(shared.dice);
    expect(copy.body.ownerId).not.toBe(shared.ownerId);
    expect((await owner.get(`/api/dice-sets/${copy.body.id}`)).status).toBe(404);
    expect((await owner.get(`/api/dice-sets/${shared.id}`)).body.version).toBe(1);
  });

  it("hides a department's shared sets from a teacher of another department", async () => {
    const shared = await create(owner, sample("Only for Rowan's department", "department"));
    const list = (await outsider.get("/api/dice-sets")).body.sets as DiceSet[];
    expect(list.map((s) => s.id)).not.toContain(shared.id);
    expect((await outsider.get(`/api/dice-sets/${shared.id}`)).status).toBe(404);
    expect((await outsider.post(`/api/dice-sets/${shared.id}/duplicate`)).status).toBe(404);
    expect((await outsider.get(`/api/dice-sets/${shared.id}/file`)).status).toBe(404);
    expect((await outsider.delete(`/api/dice-sets/${shared.id}`)).status).toBe(404);
  });

  it("saves an update at the current version and refuses a stale one without changing anything", async () => {
    const set = await create(owner, sample("Edited twice"));
    const first = await owner.put(`/api/dice-sets/${set.id}`, { ...sample("Edited once"), version: 1 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ name: "Edited once", version: 2 });

    const stale = await owner.put(`/api/dice-sets/${set.id}`, { ...sample("Stale edit"), description: "from an old tab", version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect(stale.body.error.message).toMatch(/Someone saved this dice set after you opened it/);
    expect(stale.body.error.message).toContain("version 2");

    const after = await owner.get(`/api/dice-sets/${set.id}`);
    expect(after.body).toMatchObject({ name: "Edited once", version: 2, description: sample("x").description });
  });

  it("refuses bad input with a message for each field and stores nothing", async () => {
    const before = (await owner.get("/api/dice-sets")).body.sets.length;
    const badFace = sample("Bad faces");
    badFace.dice[1].faces = [1, 5, 5, 5, 1000, 9];
    const response = await owner.post("/api/dice-sets", badFace);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(response.body.error.fields["dice.1.faces.4"]).toEqual(["Face values must be at most 999."]);

    const tooMany = sample("Eleven dice");
    tooMany.dice = Array.from({ length: 11 }, (_, index) => ({
      name: `Tern ${index + 1}`,
      faces: [index, index + 1],
      colour: "slate",
      pattern: "waves",
    }));
    const many = await owner.post("/api/dice-sets", tooMany);
    expect(many.status).toBe(400);
    expect(many.body.error.fields.dice).toEqual(["A dice set can have at most 10 dice."]);

    const badColour = await owner.post("/api/dice-sets", {
      ...sample("Odd colour"),
      dice: [{ ...sample("x").dice[0], colour: "magenta" }, sample("x").dice[1]],
    });
    expect(badColour.status).toBe(400);
    expect(badColour.body.error.fields["dice.0.colour"][0]).toMatch(/Choose a colour from the palette/);

    const noName = await owner.post("/api/dice-sets", { ...sample(""), name: "  " });
    expect(noName.body.error.fields.name).toEqual(["Name the dice set."]);

    expect((await owner.get("/api/dice-sets")).body.sets.length).toBe(before);
  });

  it("answers 400 for a malformed id and 404 for an unknown one", async () => {
    const malformed = await owner.get("/api/dice-sets/not-a-uuid");
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe("invalid_input");
    expect((await owner.get(`/api/dice-sets/${crypto.randomUUID()}`)).status).toBe(404);
  });

  it("refuses department sharing for a teacher without a department", async () => {
    const lone = await signUpAgent(app.baseUrl, "dice-sets-lone", "Lone Teacher");
    const response = await lone.agent.post("/api/dice-sets", sample("Shared by nobody", "department"));
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("no_department");
    expect(response.body.error.fields.visibility).toHaveLength(1);
    expect((await lone.agent.post("/api/dice-sets", sample("Private is fine"))).status).toBe(201);
  });

  it("deletes the owner's set and unlinks lessons that used it", async () => {
    const set = await create(owner, sample("To be deleted"));
    const [planned] = await db
      .insert(lesson)
      .values({ ownerId: set.ownerId, title: "Lesson using a deleted set", diceSetId: set.id, plan: {} })
      .returning({ id: lesson.id });
    const response = await owner.delete(`/api/dice-sets/${set.id}`);
    expect(response.status).toBe(204);
    expect((await owner.get(`/api/dice-sets/${set.id}`)).status).toBe(404);
    const [kept] = await db.select({ diceSetId: lesson.diceSetId }).from(lesson).where(eq(lesson.id, planned.id));
    expect(kept.diceSetId).toBeNull();
    await db.delete(lesson).where(eq(lesson.id, planned.id));
  });
});

describe("dice set files", () => {
  it("exports a set as an attachment and imports it back unchanged", async () => {
    const set = await create(owner, sample("Round trip: sea birds"));
    const exported = await owner.get(`/api/dice-sets/${set.id}/file`);
    expect(exported.status).toBe(200);
    expect(exported.headers.get("content-disposition")).toMatch(/^attachment; filename="?round-trip-sea-birds\.outroll-dice\.json"?$/);
    expect(exported.body).toMatchObject({
      format: "outroll-dice-set",
      version: 1,
      name: set.name,
      description: set.description,
      dice: set.dice,
    });

    const imported = await colleague.post("/api/dice-sets/import", exported.body);
    expect(imported.status).toBe(201);
    expect(imported.body).toMatchObject({
      name: set.name,
      description: set.description,
      dice: set.dice,
      visibility: "private",
      isOwner: true,
      version: 1,
    });

    const asText = await colleague.request("POST", "/api/dice-sets/import", exported.text, { "content-type": "text/plain" });
    expect(asText.status).toBe(201);
    expect(asText.body.dice).toEqual(set.dice);
  });

  it("refuses a malformed file with a list of what is wrong and stores nothing", async () => {
    const before = (await owner.get("/api/dice-sets")).body.sets.length;
    const file = {
      format: "outroll-dice-set",
      version: 1,
      name: "Broken file",
      dice: [
        { name: "Puffin", faces: [1, 2, 3], colour: "teal", pattern: "dots" },
        { name: "Tern", faces: [4, 5, "six", 7, 1000], colour: "teal", pattern: "spots" },
      ],
    };
    const response = await owner.post("/api/dice-sets/import", file);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_file");
    expect(response.body.error.issues).toEqual([
      "dice[1].faces[2]: Each face value must be a number.",
      "dice[1].faces[4]: Face values must be at most 999.",
      "dice[1].pattern: Choose a pattern from the palette: dots, stripes, checks, waves, triangles, crosses, rings, zigzags, diamonds, squares, hexagons, bricks, dashes, grid, chevrons, hearts, bars, hatching.",
    ]);
    expect(response.body.error.fields["dice[1].faces[4]"]).toEqual(["Face values must be at most 999."]);

    const wrongFormat = await owner.post("/api/dice-sets/import", { ...file, format: "some-other-format", version: 3 });
    expect(wrongFormat.body.error.issues).toEqual([
      'format: This is not an Outroll dice set file: "format" must be "outroll-dice-set".',
      'version: This file\'s version is not one Outroll reads: "version" must be 1.',
      "dice[1].faces[2]: Each face value must be a number.",
      "dice[1].faces[4]: Face values must be at most 999.",
      "dice[1].pattern: Choose a pattern from the palette: dots, stripes, checks, waves, triangles, crosses, rings, zigzags, diamonds, squares, hexagons, bricks, dashes, grid, chevrons, hearts, bars, hatching.",
    ]);

    const notJson = await owner.request("POST", "/api/dice-sets/import", "{ this is not json", { "content-type": "text/plain" });
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.code).toBe("invalid_file");
    expect(notJson.body.error.issues[0]).toMatch(/^The file is not valid JSON/);

    const empty = await owner.request("POST", "/api/dice-sets/import", "", { "content-type": "text/plain" });
    expect(empty.status).toBe(400);
    expect(empty.body.error.code).toBe("invalid_file");

    const array = await owner.post("/api/dice-sets/import", [1, 2, 3]);
    expect(array.body.error.issues).toEqual(["The file must hold one JSON object with format, version, name and dice."]);

    expect((await owner.get("/api/dice-sets")).body.sets.length).toBe(before);
  });
});

describe("demo dice sets", () => {
  it("are seeded for the demo department: shared sets for everyone there, Tomasz's draft for him alone", async () => {
    const ada = new HttpAgent(app.baseUrl);
    await ada.signIn("ada.okafor@harbourside.test", demoPassword);
    const adaSees = ((await ada.get("/api/dice-sets")).body.sets as DiceSet[]).map((set) => `${set.name} / ${set.ownerName}`);
    expect(adaSees).toEqual(
      expect.arrayContaining([
        `${demoDiceSetNames.threeDice} / Tomasz Reid`,
        `${demoDiceSetNames.reversing} / Tomasz Reid`,
        `${demoDiceSetNames.fiveDice} / Ada Okafor`,
      ]),
    );
    expect(adaSees).not.toContain("Gull starter (four faces) / Tomasz Reid");
    const tomasz = new HttpAgent(app.baseUrl);
    await tomasz.signIn("tomasz.reid@harbourside.test", demoPassword);
    const own = ((await tomasz.get("/api/dice-sets")).body.sets as DiceSet[])
      .filter((set) => set.isOwner)
      .map((set) => `${set.name} (${set.visibility})`);
    expect(own).toEqual(
      expect.arrayContaining([
        `${demoDiceSetNames.threeDice} (department)`,
        `${demoDiceSetNames.reversing} (department)`,
        "Gull starter (four faces) (private)",
      ]),
    );
  });

  it("seeds nothing twice", async () => {
    const department = await db.query.organization.findFirst({ where: eq(organization.slug, demoDepartment.slug) });
    const teacherIds = new Map<string, string>();
    for (const teacher of demoTeachers) teacherIds.set(teacher.email, await userIdFor(teacher.email));
    const [before] = await db.select({ rows: count() }).from(diceSet);
    const again = await seedDiceSets(db, { departmentId: department!.id, teacherIds });
    const [after] = await db.select({ rows: count() }).from(diceSet);
    expect(after.rows).toBe(before.rows);
    expect(again.diceSetIds).toHaveLength(4);
  });
});
