import pg from "pg";
import { PNG } from "pngjs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const databaseUrl = inject("e2eDatabaseUrl");
const teacher = demoTeachers.find((t) => t.role === "teacher")!;
const tag = Date.now().toString(36);
const setName = `Tern trio ${tag}`;
const lessonTitle = `Tern cycle ${tag}`;

/** Our own trio, checked with the engine: Tern beats Auk 25/36, Auk beats Eider 5/9, Eider beats Tern 7/12 (no ties). */
const trio = [
  { name: "Tern", faces: [1, 5, 5, 5, 5, 6], colour: "teal", pattern: "dots" },
  { name: "Auk", faces: [3, 3, 3, 4, 4, 8], colour: "amber", pattern: "stripes" },
  { name: "Eider", faces: [2, 2, 2, 7, 7, 9], colour: "plum", pattern: "checks" },
];

async function fill(page: Page, label: string, value: string) {
  const field = page.getByLabel(label, { exact: true });
  await field.fill(value);
  await field.blur();
}

describe("Lessons in chromium", () => {
  let lessonId: string;
  beforeAll(async () => {
    // The test's own dice set goes straight into the e2e database, so this file does not depend on other areas' seeds.
    const client = new pg.Client({ connectionString: databaseUrl });
    await client.connect();
    const owner = await client.query<{ id: string; organization_id: string }>(
      `select u.id, m.organization_id from "user" u join member m on m.user_id = u.id where u.email = $1`,
      [teacher.email],
    );
    await client.query(`insert into dice_set (owner_id, department_id, name, visibility, dice) values ($1, $2, $3, 'private', $4)`, [
      owner.rows[0].id,
      owner.rows[0].organization_id,
      setName,
      JSON.stringify(trio),
    ]);
    await client.end();
  });

  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(viewports.laptop);
  });
  afterAll(() => browser.close());

  it("lists, filters and opens a lesson, and the materials list and verdict follow the groups and rolls", async () => {
    const page = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
    const sets = await (await page.request.get(`${appUrl}/api/dice-sets`)).json();
    const setId = sets.sets.find((set: { name: string }) => set.name === setName).id;
    const created = await page.request.post(`${appUrl}/api/lessons`, {
      data: {
        ...emptyLessonInput(),
        title: lessonTitle,
        classGroup: "9M",
        status: "ready",
        diceSetId: setId,
        groups: 6,
        rollsPerGroup: 30,
        phases: emptyLessonInput().phases.map((entry) => ({ ...entry, included: entry.phase !== "Twist" })),
      },
    });
    expect(created.status()).toBe(201);
    lessonId = (await created.json()).lesson.id;

    await page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: "Lessons" }).click();
    await page.waitForURL(`${appUrl}/app/lessons`);
    const table = page.getByRole("table");
    await table.getByRole("link", { name: lessonTitle }).waitFor();
    // The demo lessons are there too, until the filters narrow the list.
    expect(await table.getByRole("row").count()).toBeGreaterThan(2);
    await screenshot(page, "lessons-list-laptop");

    await page.getByLabel("Status").selectOption("ready");
    await page.getByLabel("Class").selectOption("9M");
    await page.getByRole("searchbox", { name: "Search" }).fill(tag);
    await expect.poll(() => table.getByRole("row").count()).toBe(2);
    await expect(table.getByRole("row").nth(1).textContent()).resolves.toContain(setName);
    await page.getByRole("searchbox", { name: "Search" }).fill("no lesson is called this");
    await page.getByText("No lesson matches the search and filters.").waitFor();
    await page.getByRole("searchbox", { name: "Search" }).fill(tag);
    await screenshot(page, "lessons-list-filtered-laptop");

    await table.getByRole("link", { name: lessonTitle }).click();
    await page.waitForURL(`${appUrl}/app/lessons/${lessonId}`);
    const verdict = page.getByTestId("verdict-message");
    const totalDice = page.getByTestId("total-dice");
    const pace = page.getByTestId("roll-pace");
    const sheets = page.getByTestId("recording-sheets");
    // A 10-minute Roll phase at 3 rolls a minute (our common-practice pace) gives 30 rolls a group. 6 groups × 30 rolls
    // over the 3 matchups round the cycle: 60 each, short of the 139 that 7/12 needs and the 312 that 5/9 needs; even 20
    // groups make only 7 × 30 = 210 rolls of Auk v Eider, so the verdict says it is too close and proposes Tern over Auk.
    await expect.poll(() => pace.textContent()).toContain("a 10-minute Roll phase at about 3 rolls a minute");
    await expect.poll(() => verdict.textContent()).toMatch(/^Not enough yet: 2 of 3 main matchups fall short\. Try 15 groups\./);
    await expect(verdict.textContent()).resolves.toContain("Auk over Eider is too close to show in one lesson");
    await expect(verdict.textContent()).resolves.toContain("The set's strongest matchup, Tern over Auk (wins 25/36), needs about 26 rolls");
    // 6 groups, 2 per matchup: each die sits in 4 groups' games; 2 spares each.
    await expect.poll(() => totalDice.textContent()).toBe("18");

    await fill(page, "Groups", "9");
    await expect.poll(() => totalDice.textContent()).toBe("27");
    // More rolls than fit in the Roll phase are never promised: the sheets keep 30 rows and the plan is offered 30.
    await fill(page, "Rolls per group", "110");
    await expect.poll(() => verdict.textContent()).toContain("110 rolls per group do not fit in the 10-minute Roll phase");
    await expect.poll(() => sheets.textContent()).toContain("room for 30 rolls each");
    await page.getByRole("button", { name: "Use 30 rolls per group" }).click();
    await expect.poll(() => page.getByLabel("Rolls per group", { exact: true }).inputValue()).toBe("30");
    await screenshot(page, "lesson-editor-too-close-laptop");

    // A 40-minute Roll phase holds 120 rolls a group: 9 groups × 110 rolls are enough.
    await fill(page, "Roll minutes", "40");
    await fill(page, "Rolls per group", "110");
    await expect.poll(() => verdict.textContent()).toMatch(/^Enough: 990 pooled rolls/);
    await screenshot(page, "lesson-editor-enough-laptop");

    // The impossible plan: 312 rolls a group. The verdict counts the 120 that fit and suggests more groups instead.
    await fill(page, "Groups", "3");
    await fill(page, "Rolls per group", "312");
    await expect
      .poll(() => verdict.textContent())
      .toMatch(/312 rolls per group do not fit in the 40-minute Roll phase.*Try 8 groups and 104 rolls per group\./);
    await expect.poll(() => sheets.textContent()).toContain("room for 120 rolls each");
    await expect(page.getByRole("button", { name: "Use 312 rolls per group" }).count()).resolves.toBe(0);
    await page.getByRole("button", { name: "Use 104 rolls per group" }).click();
    await expect.poll(() => page.getByLabel("Rolls per group", { exact: true }).inputValue()).toBe("104");
    await expect.poll(() => sheets.textContent()).toContain("room for 104 rolls each");

    await page.getByRole("button", { name: "Save lesson" }).first().click();
    await page
      .getByText(/Saved at \d\d:\d\d \(version 2\)\./)
      .first()
      .waitFor();

    const image = new PNG({ width: 8, height: 8 });
    image.data.fill(180);
    await page.getByLabel("Attach a file").setInputFiles({ name: "tally-grid.png", mimeType: "image/png", buffer: PNG.sync.write(image) });
    await page.getByText("Attached “tally-grid.png”.").waitFor();
    await page.getByRole("list", { name: "Attached files" }).getByRole("link", { name: "tally-grid.png", exact: true }).waitFor();
    const wrong = { name: "notes.pdf", mimeType: "application/pdf", buffer: Buffer.from("just words, not a PDF") };
    await page.getByLabel("Attach a file").setInputFiles(wrong);
    await page.getByText("That file was not attached").waitFor();
    await screenshot(page, "lesson-editor-laptop");

    await page.getByRole("link", { name: "Print view" }).click();
    await page.waitForURL(`${appUrl}/app/lessons/${lessonId}/print`);
    await page.getByRole("heading", { name: lessonTitle }).waitFor();
    await page.getByText("Tern beats Auk (25/36), Auk beats Eider (5/9) and Eider beats Tern (7/12).").waitFor();
    await page.getByText("Whichever die you pick, another die beats it: there is no best die.").waitFor();
    await expect(page.getByTestId("total-dice").textContent()).resolves.toBe("9");
    await screenshot(page, "lesson-print-laptop");

    await page.goto(`${appUrl}/app/lessons`);
    await page.getByRole("button", { name: `Duplicate ${lessonTitle}` }).click();
    await page.getByText(`Duplicated as “${lessonTitle} (copy)”.`).waitFor();
    await page.getByRole("link", { name: "Back to lessons" }).click();
    await page.getByRole("button", { name: `Delete ${lessonTitle} (copy)` }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this lesson?" });
    await dialog.waitFor();
    await screenshot(page, "lesson-delete-confirm-laptop");
    await dialog.getByRole("button", { name: "Delete lesson" }).click();
    await dialog.waitFor({ state: "detached" });
    await page
      .getByRole("table")
      .getByRole("link", { name: `${lessonTitle} (copy)` })
      .waitFor({ state: "detached" });
    await page.getByRole("table").getByRole("link", { name: lessonTitle, exact: true }).waitFor();
    await page.close();
  });

  it("fits the list, the editor and the print view on a phone", async () => {
    const phone = await openBrowser(viewports.phone);
    try {
      const page = await signInThroughUi(phone.context, appUrl, teacher.email, demoPassword);
      await page.goto(`${appUrl}/app/lessons`);
      await page.getByRole("table").getByRole("link", { name: lessonTitle }).waitFor();
      await screenshot(page, "lessons-list-phone");
      await page.goto(`${appUrl}/app/lessons/${lessonId}`);
      await page.getByTestId("materials-list").waitFor();
      await screenshot(page, "lesson-editor-phone");
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, "the editor scrolls sideways on a phone").toBeLessThanOrEqual(0);
      await page.goto(`${appUrl}/app/lessons/${lessonId}/print`);
      await page.getByRole("heading", { name: lessonTitle }).waitFor();
      await screenshot(page, "lesson-print-phone");
      await page.close();
    } finally {
      await phone.close();
    }
  });
});
