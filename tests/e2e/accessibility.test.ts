import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "../../server/db/schema/index";
import { demoDiceSetNames, demoPassword, demoRunLesson, demoTeachers } from "../../seed/demo-scenario";
import { demoTemplates } from "../../seed/seed-shelf";
import { expectNoSeriousViolations } from "../helpers/accessibility";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { findSeededDemoRun } from "../helpers/results-fixtures";

const appUrl = inject("appUrl");
const headers = { origin: appUrl };
const tomasz = demoTeachers.find((t) => t.email === demoRunLesson.ownerEmail)!;
const priya = demoTeachers.find((t) => t.role === "head")!;
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 1 });
const db = drizzle(pool, { schema, casing: "snake_case" });

/** Opens a screen, waits for what shows it is drawn, and checks it with axe. */
async function check(page: Page, name: string, ready: () => Promise<unknown>) {
  await ready();
  await expectNoSeriousViolations(page, name);
}

describe("every main screen has no serious or critical accessibility violations (axe-core)", () => {
  let teacherBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let headBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let pupilBrowser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    teacherBrowser = await openBrowser(viewports.laptop);
    headBrowser = await openBrowser(viewports.laptop);
    pupilBrowser = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    await teacherBrowser?.close();
    await headBrowser?.close();
    await pupilBrowser?.close();
    await pool.end();
  });

  it("the check itself fails on a page with an unnamed button and an unlabelled field, naming each", async () => {
    const page = await teacherBrowser.context.newPage();
    await page.setContent(`<!doctype html><html lang="en"><head><title>Broken</title></head><body><main><h1>Broken</h1>
      <button id="unnamed"></button><input id="unlabelled" type="text"></main></body></html>`);
    const failure = await expectNoSeriousViolations(page, "a broken page").then(
      () => null,
      (error: Error) => error.message,
    );
    expect(failure).toContain("2 serious or critical accessibility violations on a broken page");
    expect(failure).toMatch(/button-name \(critical\): Buttons must have discernible text at #unnamed/);
    expect(failure).toMatch(/label \(critical\): Form elements must have labels at #unlabelled/);
    await page.close();
  });

  it("public pages: landing, sign-in and the privacy notice", async () => {
    const page = await teacherBrowser.context.newPage();
    await page.goto(`${appUrl}/`);
    await check(page, "the landing page", () => page.getByRole("heading", { level: 1 }).waitFor());
    await page.goto(`${appUrl}/sign-in`);
    await check(page, "the sign-in page", () => page.getByLabel("E-mail").waitFor());
    await page.getByRole("button", { name: "Sign in" }).click();
    await check(page, "the sign-in page with its field errors", () =>
      page.getByLabel("E-mail").and(page.locator("[aria-invalid=true]")).waitFor(),
    );
    await screenshot(page, "accessibility-sign-in-laptop");
    await page.setViewportSize(viewports.phone);
    await screenshot(page, "accessibility-sign-in-phone");
    await page.setViewportSize(viewports.laptop);
    await page.goto(`${appUrl}/sign-up`);
    await check(page, "the sign-up page", () => page.getByRole("heading", { name: "Create your account", level: 1 }).waitFor());
    await page.goto(`${appUrl}/privacy`);
    await check(page, "the privacy notice", () => page.getByRole("heading", { name: "Privacy notice", level: 1 }).waitFor());
    await page.close();
  });

  it("a teacher's screens: home, Dice bench, Set finder, lessons, class runs, results and the class report", async () => {
    const page = await signInThroughUi(teacherBrowser.context, appUrl, tomasz.email, demoPassword);
    await check(page, "home", () => page.getByRole("heading", { level: 1 }).waitFor());

    await page.goto(`${appUrl}/app/bench`);
    const setLink = page.getByRole("link", { name: demoDiceSetNames.threeDice }).first();
    await check(page, "the Dice bench list", () => setLink.waitFor());
    // Deleting asks first, inline, with the focus on the safe answer.
    await page.getByRole("button", { name: `Delete ${demoDiceSetNames.threeDice}` }).click();
    const keepIt = page.getByRole("alertdialog").getByRole("button", { name: "Keep it" });
    await check(page, "the Dice bench asking before it deletes a set", () => keepIt.waitFor());
    await expect.poll(() => keepIt.evaluate((button) => button === document.activeElement)).toBe(true);
    await keepIt.click();
    await setLink.click();
    await page.waitForURL(/\/app\/bench\/[0-9a-f-]{36}$/);
    await check(page, "a dice set on the Dice bench", () =>
      page
        .getByTestId(/^matchup-matrix-/)
        .first()
        .waitFor(),
    );
    // Each view of the exact analysis is drawn only while its tab is chosen, so each is checked on its own.
    const views = page.getByRole("tablist", { name: "Views of the analysis" }).getByRole("tab");
    const viewNames = await views.allTextContents();
    expect(viewNames.length).toBeGreaterThan(1);
    for (const [index, viewName] of viewNames.entries()) {
      await views.nth(index).click();
      await check(page, `the Dice bench's ${viewName} view`, () => page.getByRole("tabpanel").waitFor());
    }

    await page.goto(`${appUrl}/app/bench/new`);
    await check(page, "a new dice set on the Dice bench", () => page.getByLabel("Set name").waitFor());

    await page.goto(`${appUrl}/app/finder`);
    await check(page, "the Set finder", () => page.getByRole("heading", { name: "Set finder", level: 1 }).waitFor());

    await page.goto(`${appUrl}/app/lessons`);
    const lessonLink = page.getByRole("table").getByRole("link", { name: demoRunLesson.title });
    await check(page, "the lessons list", () => lessonLink.waitFor());
    await lessonLink.click();
    await page.waitForURL(/\/app\/lessons\/[0-9a-f-]{36}$/);
    await check(page, "the lesson editor", () => page.getByLabel("Title", { exact: true }).waitFor());

    await page.goto(`${appUrl}/app/runs`);
    await check(page, "the class runs list", () => page.getByRole("link", { name: demoRunLesson.title }).first().waitFor());
    await page.goto(`${appUrl}/app/results`);
    await check(page, "the results archive", () => page.getByRole("link", { name: demoRunLesson.title }).first().waitFor());

    const runId = await findSeededDemoRun(db, demoRunLesson);
    expect(runId, "the seed's closed demo run").toBeTruthy();
    await page.goto(`${appUrl}/app/runs/${runId}`);
    await check(page, "the Run board of the closed demo run", () => page.getByTestId("pooled-total").waitFor());
    await page.goto(`${appUrl}/app/results/${runId}`);
    await check(page, "a run's results", async () => {
      await page.getByRole("heading", { name: "Convergence" }).waitFor();
      await page.locator(".recharts-line").first().waitFor();
    });
    await page.goto(`${appUrl}/app/results/${runId}/report`);
    await check(page, "the class report", () => page.getByRole("heading", { name: demoRunLesson.title, level: 1 }).waitFor());
  });

  it("the head's Department shelf, a template and the Department page", async () => {
    const page = await signInThroughUi(headBrowser.context, appUrl, priya.email, demoPassword);
    await page.goto(`${appUrl}/app/shelf`);
    const template = page.getByRole("link", { name: demoTemplates[0].lessonTitle }).first();
    await check(page, "the Department shelf", () => template.waitFor());
    await template.click();
    await page.waitForURL(/\/app\/shelf\/templates\//);
    await check(page, "a shelf template", () => page.getByText(demoTemplates[0].changeNote).first().waitFor());
    await page.goto(`${appUrl}/app/department`);
    await check(page, "the Department page of the head", () =>
      page.getByRole("heading", { name: "Maths, Harbourside Academy", level: 1 }).waitFor(),
    );
  });

  it("a live run: the Run board and the Wall view at laptop size, the Roll pad at phone size", async () => {
    const board = await signInThroughUi(teacherBrowser.context, appUrl, tomasz.email, demoPassword);
    const sets = (await (await board.request.get(`${appUrl}/api/dice-sets`)).json()).sets as { id: string; name: string }[];
    const set = sets.find((entry) => entry.name === demoDiceSetNames.threeDice)!;
    const lesson = await board.request.post(`${appUrl}/api/lessons`, {
      headers,
      data: {
        ...emptyLessonInput(),
        title: `Harbour checks ${Date.now().toString(36)}`,
        classGroup: "9M",
        status: "ready",
        diceSetId: set.id,
      },
    });
    expect(lesson.status(), await lesson.text()).toBe(201);
    const run = await board.request.post(`${appUrl}/api/class-runs`, { headers, data: { lessonId: (await lesson.json()).lesson.id } });
    expect(run.status(), await run.text()).toBe(201);
    const { id: runId, joinCode } = (await run.json()) as { id: string; joinCode: string };

    const phone = await pupilBrowser.context.newPage();
    await phone.goto(`${appUrl}/pad`);
    await check(phone, "the Roll pad's code box", () => phone.getByLabel("Join code", { exact: true }).waitFor());
    await phone.goto(`${appUrl}/pad/${joinCode}`);
    await check(phone, "the Roll pad's nickname form", () => phone.getByLabel("Group nickname", { exact: true }).waitFor());
    await phone.getByLabel("Group nickname", { exact: true }).fill("Lighthouse Crew");
    await phone.getByRole("button", { name: "Join with this nickname" }).click();
    await check(phone, "the Roll pad's vote", () => phone.getByRole("heading", { name: "Which die is best?" }).waitFor());

    const moved = await board.request.post(`${appUrl}/api/class-runs/${runId}/phase`, { headers, data: { phase: "Roll" } });
    expect(moved.status(), await moved.text()).toBe(200);
    const face = phone.getByRole("button", { name: / shows / }).first();
    await face.waitFor();
    await face.click();
    await check(phone, "the Roll pad recording a roll", () =>
      phone
        .getByRole("button", { name: / shows / })
        .first()
        .waitFor(),
    );
    await screenshot(phone, "accessibility-roll-pad-phone");

    await board.goto(`${appUrl}/app/runs/${runId}`);
    await check(board, "the Run board of a live run", () => board.getByText("Lighthouse Crew").first().waitFor());
    await screenshot(board, "accessibility-run-board-laptop");
    // Removing a group asks in a modal dialog whose focus starts on Cancel; renaming puts the focus in the new name's field.
    await board.getByRole("button", { name: "Remove Lighthouse Crew" }).click();
    const dialog = board.getByRole("dialog", { name: /^Remove .Lighthouse Crew. from the run\?$/ });
    await check(board, "the Run board asking before it removes a group", () => dialog.waitFor());
    const cancel = dialog.getByRole("button", { name: "Cancel" });
    await expect.poll(() => cancel.evaluate((button) => button === document.activeElement)).toBe(true);
    await cancel.click();
    await board.getByRole("button", { name: "Rename Lighthouse Crew" }).click();
    const newName = board.getByLabel("New nickname for Lighthouse Crew");
    await check(board, "the Run board renaming a group", () => newName.waitFor());
    await expect.poll(() => newName.evaluate((field) => field === document.activeElement)).toBe(true);
    await board.getByRole("button", { name: "Cancel" }).click();
    const wall = await teacherBrowser.context.newPage();
    await wall.goto(`${appUrl}/app/runs/${runId}/wall`);
    await check(wall, "the Wall view", () => wall.getByTestId("join-code").waitFor());
    await expect(wall.getByTestId("join-code").textContent()).resolves.toBe(`${joinCode.slice(0, 3)} ${joinCode.slice(3)}`);
    await screenshot(wall, "accessibility-wall-laptop");
  });
});
