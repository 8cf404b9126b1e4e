import { and, count, countDistinct, eq, isNull } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import jsQR from "jsqr";
import pg from "pg";
import { PNG } from "pngjs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import * as schema from "../../server/db/schema/index";
import { roll } from "../../server/db/schema/index";
import { demoPassword, demoRunLesson, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { findSeededDemoRun } from "../helpers/results-fixtures";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((t) => t.email === demoRunLesson.ownerEmail)!;
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 1 });
const db = drizzle(pool, { schema, casing: "snake_case" });

/** The seeded closed demo run (the oldest closed run of the demo lesson) with its live rolls and recording groups, read
 * straight from PostgreSQL. Other browser tests may add rolls to it (the Results walk-through imports three) or make
 * newer runs of the same lesson, so the board is checked against the database. */
async function seededDemoRun() {
  const id = await findSeededDemoRun(db, demoRunLesson);
  if (!id) throw new Error("the seed's closed demo run is missing");
  const [totals] = await db
    .select({ rolls: count(), groups: countDistinct(roll.groupId) })
    .from(roll)
    .where(and(eq(roll.runId, id), isNull(roll.undoneAt)));
  return { id, ...totals };
}

// Invented dice for the browser test.
const dice = [
  { name: "Auk", faces: [1, 1, 5, 5, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [2, 3, 3, 4, 7, 7], colour: "amber", pattern: "stripes" },
  { name: "Guillemot", faces: [0, 4, 4, 4, 4, 8], colour: "plum", pattern: "checks" },
];

/** Reads a QR code from a screenshot of one element (pngjs decodes the PNG, jsqr reads the code). */
async function decodeQr(page: Page, testId: string): Promise<string> {
  const png = PNG.sync.read(await page.getByTestId(testId).screenshot());
  const code = jsQR(new Uint8ClampedArray(png.data), png.width, png.height);
  if (!code) throw new Error("no QR code found in the screenshot");
  return code.data;
}

/** Taps one face on the Roll pad for a die (and, with two dice each, one of its dice). */
async function tapFace(page: Page, dieName: string, face: number) {
  await page.getByRole("button", { name: `${dieName} shows ${face}`, exact: true }).click();
}

describe("a class run in two chromium contexts: the teacher's board and a pupil's phone", () => {
  let teacherBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let pupilBrowser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    teacherBrowser = await openBrowser(viewports.laptop);
    pupilBrowser = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    await teacherBrowser.close();
    await pupilBrowser.close();
    await pool.end();
  });

  it("opens a run, joins it by the QR code's address, votes, records rolls through a reload, and pools them on the board", async () => {
    const board = await signInThroughUi(teacherBrowser.context, appUrl, teacher.email, demoPassword);
    const headers = { origin: appUrl };
    const set = await board.request.post(`${appUrl}/api/dice-sets`, {
      headers,
      data: { name: "Cliff-top three", description: "", visibility: "private", dice },
    });
    expect(set.status()).toBe(201);
    const title = `Cliff-top run ${Date.now().toString(36)}`;
    const lesson = await board.request.post(`${appUrl}/api/lessons`, {
      headers,
      data: { ...emptyLessonInput(), title, classGroup: "8K", status: "ready", diceSetId: (await set.json()).id },
    });
    expect(lesson.status(), await lesson.text()).toBe(201);

    await board.goto(`${appUrl}/app/runs`);
    await board.getByRole("heading", { name: "Your class runs" }).waitFor();
    // The seeded closed run of the demo lesson: a full Run board for a new user.
    const demo = await seededDemoRun();
    expect(demo.rolls).toBeGreaterThanOrEqual(300);
    await board
      .getByRole("link", { name: demoRunLesson.title })
      .and(board.locator(`[href$="/app/runs/${demo.id}"]`))
      .click();
    await board.waitForURL(`${appUrl}/app/runs/${demo.id}`);
    await board
      .getByTestId("pooled-total")
      .filter({ hasText: `${demo.rolls} rolls from ${demo.groups} groups` })
      .waitFor();
    await screenshot(board, "class-run-demo-board-laptop");
    await board.goto(`${appUrl}/app/runs`);
    const card = board.getByRole("listitem").filter({ hasText: title });
    await card.getByRole("button", { name: "Open a class run" }).waitFor();
    await board.getByRole("table").waitFor();
    await screenshot(board, "class-runs-list-laptop");
    await card.getByRole("button", { name: "Open a class run" }).click();
    await board.waitForURL(/\/app\/runs\/[0-9a-f-]{36}$/);
    await board.getByTestId("live-state").filter({ hasText: "Live" }).waitFor();
    const runId = board.url().split("/").pop()!;

    const wall = await teacherBrowser.context.newPage();
    await wall.setViewportSize(viewports.projector);
    await wall.goto(`${appUrl}/app/runs/${runId}/wall`);
    await wall.getByTestId("join-qr").waitFor();
    const joinUrl = await decodeQr(wall, "join-qr");
    const code = (await wall.getByTestId("join-code").textContent())!.replace(/\s/g, "");
    expect(joinUrl).toBe(`${appUrl}/pad/${code}`);
    await screenshot(wall, "class-run-wall-guess-projector");

    const phone = await pupilBrowser.context.newPage();
    await phone.goto(`${appUrl}/pad`);
    await phone.getByLabel("Join code", { exact: true }).waitFor();
    await screenshot(phone, "roll-pad-code-phone");
    await phone.goto(joinUrl);
    await phone.getByLabel("Group nickname", { exact: true }).fill("Rockpool Rangers");
    await screenshot(phone, "roll-pad-join-phone");
    await phone.getByRole("button", { name: "Join with this nickname" }).click();
    await phone.getByRole("heading", { name: "Which die is best?" }).waitFor();
    await phone.getByRole("button", { name: /Guillemot/ }).click();
    await phone.getByText("✓ Our vote").waitFor();
    await screenshot(phone, "roll-pad-vote-phone");
    await board.getByText("1 group has voted.").waitFor();

    await board.getByRole("button", { name: "Move on to Roll" }).click();
    await phone.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    const rolls: [number, number][] = [
      [5, 3],
      [1, 7],
      [6, 4],
      [6, 7],
      [5, 2],
    ];
    for (const [auk, razorbill] of rolls.slice(0, 3)) {
      await tapFace(phone, "Auk", auk);
      await tapFace(phone, "Razorbill", razorbill);
      await phone.getByRole("button", { name: `Record ${auk} v ${razorbill}` }).click();
    }
    await phone.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();
    await expect(phone.getByTestId("running-score").textContent()).resolves.toBe("Auk 2 · Razorbill 1 · ties 0");

    // A reload mid-way: the phone rejoins the same group from its storage and goes on recording.
    await phone.reload();
    await phone.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    await phone.getByText("Rockpool Rangers", { exact: true }).waitFor();
    for (const [auk, razorbill] of rolls.slice(3)) {
      await tapFace(phone, "Auk", auk);
      await tapFace(phone, "Razorbill", razorbill);
      await phone.getByRole("button", { name: `Record ${auk} v ${razorbill}` }).click();
    }
    await phone.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();
    await expect(phone.getByTestId("running-score").textContent()).resolves.toBe("Auk 3 · Razorbill 2 · ties 0");
    await screenshot(phone, "roll-pad-record-phone");
    await phone.setViewportSize({ width: 360, height: 740 });
    await screenshot(phone, "roll-pad-record-360");
    await phone.setViewportSize(viewports.phone);

    // The board's pooled figures follow: 5 rolls, Auk won 3 (5>3, 6>4, 5>2), Razorbill 2.
    await board.getByTestId("pooled-total").filter({ hasText: "5 rolls from 1 group" }).waitFor({ timeout: 10_000 });
    const table = board.getByTestId("pooled-1:0-1");
    await expect(table.getByRole("row", { name: /Auk/ }).textContent()).resolves.toMatch(/^Auk302/);
    await expect(board.getByTestId("frequency-1:0-1").textContent()).resolves.toBe("Auk wins 0.600 of the rolls that were not ties");
    // Auk [1,1,5,5,6,6] beats Razorbill [2,3,3,4,7,7] in 16 of the 36 face pairs and never ties (counted by hand): 4/9.
    await expect(board.getByTestId("exact-1:0-1").textContent()).resolves.toMatch(/· exact under the tie rule 4\/9 ≈ 0\.444$/);
    await board
      .getByTestId("group-table")
      .getByRole("rowheader", { name: /Rockpool Rangers/ })
      .waitFor();
    await screenshot(board, "class-run-board-laptop");

    await board.getByRole("button", { name: "Move on to Pool" }).click();
    await wall.getByRole("heading", { name: "Pool", exact: true }).waitFor();
    await screenshot(wall, "class-run-wall-pool-projector");
    await board.getByRole("button", { name: "Move on to Prove" }).click();
    await wall.getByTestId("tree-totals").waitFor();
    await screenshot(wall, "class-run-wall-prove-projector");
    await board.getByRole("button", { name: "Move on to Twist" }).click();
    await phone.getByText("Two dice each, faces added.", { exact: false }).waitFor();
    await screenshot(phone, "roll-pad-twist-phone");
    await screenshot(wall, "class-run-wall-twist-projector");
  });
});
