import { count, eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import * as schema from "../../server/db/schema/index";
import { paperCount, roll } from "../../server/db/schema/index";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { insertFixtureRun, testDice } from "../helpers/results-fixtures";

const appUrl = inject("appUrl");
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 2 });
const db = drizzle(pool, { schema, casing: "snake_case" });
const ada = demoTeachers.find((t) => t.email.startsWith("ada."))!;
const tag = Date.now().toString(36);
// Our own Skerry trio with every face raised by 20: the same chances, but a set key no other test's runs share.
const dice = testDice.map((die) => ({ ...die, faces: die.faces.map((face) => face + 20) }));
const lessonTitle = `Skerry paper lesson ${tag}`;

async function both(page: Page, name: string) {
  await page.setViewportSize(viewports.laptop);
  await screenshot(page, `${name}-laptop`);
  await page.setViewportSize(viewports.phone);
  await screenshot(page, `${name}-phone`);
  await page.setViewportSize(viewports.laptop);
}

describe("the tally grid in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;
  let setId: string;
  let lessonId: string;
  let phoneRunId: string;
  let paperRunId: string;

  beforeAll(async () => {
    browser = await openBrowser(viewports.laptop);
    page = await signInThroughUi(browser.context, appUrl, ada.email, demoPassword);
    const set = await page.request.post(`${appUrl}/api/dice-sets`, {
      data: { name: `Skerry high trio ${tag}`, visibility: "private", dice },
    });
    expect(set.status()).toBe(201);
    setId = (await set.json()).id;
    const phases = emptyLessonInput().phases.map((entry) => ({ ...entry, included: entry.phase !== "Twist" }));
    const lesson = await page.request.post(`${appUrl}/api/lessons`, {
      data: {
        ...emptyLessonInput(),
        title: lessonTitle,
        classGroup: "8K",
        status: "ready",
        diceSetId: setId,
        groups: 4,
        rollsPerGroup: 6,
        phases,
      },
    });
    expect(lesson.status()).toBe(201);
    lessonId = (await lesson.json()).lesson.id;
    // The phone class: a closed run of the same lesson and set whose rolls came from pupils' phones.
    phoneRunId = (
      await insertFixtureRun(db, {
        ownerEmail: ada.email,
        title: lessonTitle,
        classGroup: "8K",
        dice,
        diceSetName: `Skerry high trio ${tag}`,
        createdAt: new Date("2026-03-09T09:00:00Z"),
        groups: [
          { nickname: "Sandpipers", matchup: [0, 1], rolls: 30 },
          { nickname: "Oystercatchers", matchup: [1, 2], rolls: 30 },
        ],
        seed: 1601,
      })
    ).runId;
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await pool.end();
  });

  it("a paper lesson entered through the tally grid and pooled with a phone class", async () => {
    await page.goto(`${appUrl}/app/results/paper-runs/new`);
    await page.getByLabel("Lesson", { exact: true }).selectOption({ label: `${lessonTitle} (8K)` });
    // A second class of the same lesson, under its own name.
    await page.getByLabel("Class", { exact: true }).fill("8L");
    await page.getByLabel("Day the lesson was taught").fill("2026-03-11");
    await page.getByRole("button", { name: "Make the run and open the tally grid" }).click();
    await page.waitForURL(/\/app\/results\/[0-9a-f-]{36}\/tally-grid$/);
    paperRunId = page.url().split("/").at(-2)!;
    await page.getByRole("heading", { name: "Tally grid", level: 1 }).waitFor();
    await page.getByText("(8L)", { exact: false }).first().waitFor();

    // Roll by roll: the grid has the lesson's 6 lines, and shows each roll's winner as it is typed.
    const rollsGrid = page.getByTestId("tally-rolls");
    await expect(rollsGrid.locator("tbody tr").count()).resolves.toBe(6);
    await page.getByLabel("Group nickname").fill("Razorbills");
    const typed: [number, number][] = [
      [30, 29], // Skua 30 beats Tern 29
      [21, 38], // Tern wins
      [32, 31], // Skua wins
    ];
    for (const [index, [skua, tern]] of typed.entries()) {
      await page.getByLabel(`Roll ${index + 1}: Skua rolled`).fill(String(skua));
      await page.getByLabel(`Roll ${index + 1}: Tern rolled`).fill(String(tern));
    }
    await expect(rollsGrid.locator("tbody tr").nth(1).locator("td").last().textContent()).resolves.toBe("Tern");
    // A face the die does not have is refused by the server, row by row, and nothing is stored.
    await page.getByLabel("Roll 4: Skua rolled").fill("2");
    await page.getByLabel("Roll 4: Tern rolled").fill("27");
    await page.getByText("“Razorbills” is a new group in this run: create it").click();
    await page.getByRole("button", { name: "Save 4 rolls" }).click();
    await page.getByTestId("tally-problems").getByText("Skua has no face 2").waitFor();
    const stored = async () => (await db.select({ n: count() }).from(roll).where(eq(roll.runId, paperRunId)))[0].n;
    expect(await stored()).toBe(0);
    await page.getByLabel("Roll 4: Skua rolled").fill("");
    await page.getByLabel("Roll 4: Tern rolled").fill("");
    await page.getByRole("button", { name: "Save 3 rolls" }).click();
    await page.getByTestId("tally-rolls-saved").getByText("3 new rolls stored").waitFor();
    expect(await stored()).toBe(3);
    await both(page, "tally-grid-rolls");

    // Counts only, for the groups that just kept a tally: stored as counts, with no roll written.
    await page.getByRole("tab", { name: "Counts only (quick lesson)" }).click();
    const countsGrid = page.getByTestId("tally-counts");
    await page.getByLabel("Line 1: group").fill("Limpets");
    await page.getByLabel("Line 1: die").selectOption("Skua");
    await page.getByLabel("Line 1: against").selectOption("Tern");
    await page.getByLabel("Line 1: Skua won").fill("7");
    await page.getByLabel("Line 1: ties").fill("0");
    await page.getByLabel("Line 1: Tern won").fill("5");
    await page.getByRole("button", { name: "Add a line" }).click();
    await page.getByLabel("Line 2: group").fill("Limpets");
    await page.getByLabel("Line 2: die").selectOption("Tern");
    await page.getByLabel("Line 2: against").selectOption("Gannet");
    await page.getByLabel("Line 2: Tern won").fill("4");
    await page.getByLabel("Line 2: Gannet won").fill("2");
    await page.getByText("Create the new group “Limpets”").click();
    await page.getByRole("button", { name: "Save counts" }).click();
    await page.getByTestId("tally-counts-saved").getByText("2 lines of counts stored").waitFor();
    await expect.poll(() => countsGrid.locator("li").count()).toBe(2);
    const counts = await db.select().from(paperCount).where(eq(paperCount.runId, paperRunId));
    expect(counts.map((row) => [row.matchupKey, row.firstWins, row.ties, row.secondWins]).sort()).toEqual([
      ["0-1", 7, 0, 5],
      ["1-2", 4, 0, 2],
    ]);
    expect(await stored()).toBe(3);
    await both(page, "tally-grid-counts");

    // The run's results: 3 rolls and 18 counted, the counts marked.
    const archive = await page.request.get(`${appUrl}/api/results/runs?lesson=${encodeURIComponent(tag)}`);
    const paperSummary = (await archive.json()).runs.find((run: { id: string }) => run.id === paperRunId);
    expect(paperSummary).toMatchObject({ classGroup: "8L", rollCount: 21, countedRollCount: 18, recordedOn: "paper" });

    // Pooled with the phone class: each class under its own name, the counts added to the phone rolls.
    await page.goto(`${appUrl}/app/results/pooled?runIds=${phoneRunId},${paperRunId}&dicePerPlayer=1`);
    await page.getByRole("heading", { name: "Each class’s contribution" }).waitFor();
    const contribution = page.getByRole("table").filter({ hasText: "Share of the pool" });
    await expect(contribution.getByRole("rowheader").allTextContents()).resolves.toEqual([
      expect.stringContaining("8K"),
      expect.stringContaining("8L"),
      "Pooled",
    ]);
    const pooled = await (await page.request.get(`${appUrl}/api/results/pooled?runIds=${phoneRunId},${paperRunId}&dicePerPlayer=1`)).json();
    const phone = await (await page.request.get(`${appUrl}/api/results/runs/${phoneRunId}`)).json();
    const skuaTern = pooled.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    const phoneSkuaTern = phone.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    // Razorbills typed 3 rolls (Skua 2 wins), Limpets counted 12 (Skua 7 wins).
    expect(skuaTern.rolls).toBe(phoneSkuaTern.rolls + 3 + 12);
    expect(skuaTern.seats[0].wins).toBe(phoneSkuaTern.seats[0].wins + 2 + 7);
    expect(skuaTern.countedRolls).toBe(12);
    // The convergence series has no point for the counted rolls.
    expect(skuaTern.convergence.at(-1).rolls).toBe(phoneSkuaTern.rolls + 3);
    await both(page, "tally-grid-pooled");
  });

  it("prints the group recording sheet the lesson asks for, from the lesson editor", async () => {
    await page.goto(`${appUrl}/app/lessons/${lessonId}`);
    await page.getByRole("link", { name: "Print the recording sheet" }).click();
    await page.waitForURL(/\/print\?kind=sheet&paper=a4&rolls=6&players=2&dice=1$/);
    const sheet = page.getByTestId("recording-sheet");
    await expect.poll(() => sheet.locator("tbody tr").count()).toBe(6);
    const headings = await sheet.locator("thead th").evaluateAll((cells) => cells.map((cell) => cell.firstChild?.textContent ?? ""));
    expect(headings).toEqual(["Roll", "Player 1 rolled", "Player 2 rolled", "Who won?"]);
    // A longer lesson with two dice each continues over a second page.
    await page.goto(`${appUrl}/app/bench/${setId}/print?kind=sheet&paper=a4&rolls=30&players=2&dice=2`);
    await expect.poll(() => page.getByTestId("recording-sheet").count()).toBe(2);
    await page.getByText("both numbers, like 3 + 5").first().waitFor();
    await both(page, "recording-sheet");
    await page.setViewportSize({ width: 794, height: 1123 });
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "recording-sheet-print");
    const pdf = await page.pdf({ preferCSSPageSize: true });
    expect(pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g)?.length).toBe(2);
    await page.emulateMedia({ media: "screen" });
  });
});
