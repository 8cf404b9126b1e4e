import { readFile } from "node:fs/promises";
import { and, count, eq, isNull } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import ExcelJS from "exceljs";
import Papa from "papaparse";
import pg from "pg";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { paperImportColumns } from "@shared/schemas/paper-import";
import { rollsExportColumns } from "@shared/results/export-columns";
import * as schema from "../../server/db/schema/index";
import { classRun, roll, runGroup } from "../../server/db/schema/index";
import { demoPassword, demoRunLesson, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { findSeededDemoRun, insertFixtureRun } from "../helpers/results-fixtures";

const appUrl = inject("appUrl");
const tomasz = demoTeachers.find((t) => t.email === demoRunLesson.ownerEmail)!;
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 2 });
const db = drizzle(pool, { schema, casing: "snake_case" });

let runId: string;
let dice: { name: string; faces: number[] }[];
let knownGroup: string;
let matchup: number[];

async function liveRolls() {
  const [row] = await db
    .select({ n: count() })
    .from(roll)
    .where(and(eq(roll.runId, runId), isNull(roll.undoneAt)));
  return row.n;
}

/** The Paper import CSV for rows of [group, roll, die 1, faces 1, die 2, faces 2]. */
function sheet(rows: (string | number)[][]) {
  return [paperImportColumns.join(","), ...rows.map((row) => [...row, "", ""].join(","))].join("\r\n") + "\r\n";
}

async function both(page: Page, name: string) {
  await page.setViewportSize(viewports.laptop);
  await screenshot(page, `${name}-laptop`);
  await page.setViewportSize(viewports.phone);
  await screenshot(page, `${name}-phone`);
  await page.setViewportSize(viewports.laptop);
}

describe("Results in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    // The class-runs seed makes the finished demo run once the demo dice sets exist; without it, a closed run of the
    // demo lesson's title is written here so the walk-through still has a finished run to open.
    const demo = await findSeededDemoRun(db, demoRunLesson);
    if (demo) runId = demo;
    else {
      console.log("Results e2e: no seeded demo run found, so the test writes its own closed run of the demo lesson.");
      runId = (
        await insertFixtureRun(db, {
          ownerEmail: tomasz.email,
          title: demoRunLesson.title,
          classGroup: demoRunLesson.classGroup,
          createdAt: new Date("2026-03-10T09:05:00Z"),
          groups: [
            { nickname: "Rockpool Rangers", matchup: [0, 1], rolls: 60 },
            { nickname: "Gull Patrol", matchup: [1, 2], rolls: 55 },
            { nickname: "Kelp Crew", matchup: [2, 0], rolls: 50, undone: 2 },
            { nickname: "Harbour Seals", matchup: [0, 1], rolls: 60 },
            { nickname: "Tide Turners", matchup: [1, 2], rolls: 45 },
          ],
          votes: [0, 0, 1, 2, 0],
          seed: 310,
        })
      ).runId;
    }
    const [run] = await db.select().from(classRun).where(eq(classRun.id, runId));
    dice = run.dice;
    const [group] = await db
      .select({ id: runGroup.id, nickname: runGroup.nickname, matchup: runGroup.matchup })
      .from(runGroup)
      .where(eq(runGroup.runId, runId))
      .limit(1);
    knownGroup = group.nickname;
    matchup = group.matchup ?? [0, 1];
    browser = await openBrowser(viewports.laptop);
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await pool.end();
  });

  it("opens a finished demo run, downloads both exports, imports a corrected Paper import file and opens the class report", async () => {
    const page = await signInThroughUi(browser.context, appUrl, tomasz.email, demoPassword);
    await page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: "Results" }).click();
    await page.waitForURL(`${appUrl}/app/results`);
    const runLink = page.getByRole("link", { name: demoRunLesson.title }).first();
    await runLink.waitFor();
    await both(page, "results-archive");

    await runLink.click();
    await page.waitForURL(`${appUrl}/app/results/${runId}`);
    await page.getByRole("heading", { name: "What the class found" }).waitFor();
    await page.getByRole("heading", { name: "Convergence" }).waitFor();
    await page.locator(".recharts-line").first().waitFor();
    await both(page, "results-run");

    const before = await liveRolls();
    const [csvDownload] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "⤓ Rolls (CSV)" }).click()]);
    expect(csvDownload.suggestedFilename()).toMatch(
      new RegExp(`_${demoRunLesson.classGroup.toLowerCase()}_\\d{4}-\\d{2}-\\d{2}_rolls\\.csv$`),
    );
    const csv = Papa.parse<Record<string, string>>(await readFile((await csvDownload.path())!, "utf8"), {
      header: true,
      skipEmptyLines: true,
    });
    expect(csv.meta.fields).toEqual([...rollsExportColumns]);
    expect(csv.data).toHaveLength(before);

    const [xlsxDownload] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: /XLSX workbook/ }).click()]);
    expect(xlsxDownload.suggestedFilename()).toMatch(/_results\.xlsx$/);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await readFile((await xlsxDownload.path())!)) as unknown as ArrayBuffer);
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual(["Rolls", "Summary"]);
    expect(workbook.getWorksheet("Rolls")!.actualRowCount - 1).toBe(before);

    await page.getByRole("link", { name: "Paper import", exact: true }).click();
    await page.waitForURL(`${appUrl}/app/results/${runId}/paper-import`);
    await page.getByRole("heading", { name: "Paper import", level: 1 }).waitFor();
    const [first, second] = matchup.map((index) => dice[index]);
    const face = (die: { faces: number[] }, index: number) => die.faces[index % die.faces.length];
    const bad = sheet([
      [knownGroup, 901, first.name, face(first, 0), second.name, face(second, 1)],
      [knownGroup, 902, first.name, face(first, 2), "Kestrel", face(second, 3)],
      [knownGroup, 903, first.name, face(first, 4), second.name, face(second, 5)],
    ]);
    await page
      .getByLabel("CSV file typed up from the recording sheets")
      .setInputFiles({ name: "sheets-8k.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Check the file" }).click();
    const problems = page.getByRole("list", { name: "Problems by row" });
    await problems.waitFor();
    await expect(problems.textContent()).resolves.toContain(`Row 3: die_2: "Kestrel" is not a die of this run's set`);
    expect(await page.getByRole("button", { name: /^Import/ }).count()).toBe(0);
    await both(page, "results-paper-import-error");
    expect(await liveRolls()).toBe(before);

    const fixed = bad.replace("Kestrel", second.name);
    await page
      .getByLabel("CSV file typed up from the recording sheets")
      .setInputFiles({ name: "sheets-8k.csv", mimeType: "text/csv", buffer: Buffer.from(fixed) });
    await page.getByRole("button", { name: "Check the file" }).click();
    await page.getByText("All 3 rows are fine").waitFor();
    await page.getByRole("button", { name: "Import 3 rolls" }).click();
    await page.getByText("3 new rolls stored").waitFor();
    await both(page, "results-paper-import-done");
    expect(await liveRolls()).toBe(before + 3);

    await page.getByRole("link", { name: "See the results" }).click();
    await page.waitForURL(`${appUrl}/app/results/${runId}`);
    await page.getByRole("link", { name: "Class report" }).click();
    await page.waitForURL(`${appUrl}/app/results/${runId}/report`);
    await page.getByText("Class report", { exact: true }).waitFor();
    await page.getByRole("img", { name: /^Tree diagram of/ }).waitFor();
    await page.getByRole("heading", { name: /^Pooled results beside the exact values/ }).waitFor();
    const findings = await page.getByRole("heading", { name: "What the class found" }).locator("xpath=following-sibling::ol").textContent();
    expect(findings).toMatch(/After \d+ rolls of .+ the class estimate of .+ is \d\.\d{3}/);
    await both(page, "results-class-report");
    // An A4 page is about 794 px wide at 96 dpi: the print layout as the browser's print (and "Save as PDF") lays it out.
    await page.setViewportSize({ width: 794, height: 1123 });
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "results-class-report-print");
    const pdf = await page.pdf({ format: "A4", printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(pdf.length).toBeGreaterThan(20_000);
    await page.emulateMedia({ media: "screen" });
    await page.close();
  });

  it("pools runs of one set, offers a paper run for a lesson, and deletes a run after a confirmation", async () => {
    const extra = await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: "Second go: the same trio with 9M",
      classGroup: "9M",
      diceSetName: "Kittiwake trio",
      dice: dice.map((die, index) => ({
        ...die,
        colour: ["teal", "amber", "plum", "slate"][index % 4],
        pattern: ["dots", "stripes", "checks", "waves"][index % 4],
      })),
      createdAt: new Date("2026-03-17T10:00:00Z"),
      groups: [
        { nickname: "Sandpipers", matchup: [0, 1], rolls: 40 },
        { nickname: "Limpets", matchup: [1, 2], rolls: 40 },
      ],
      seed: 917,
    });
    const page = await signInThroughUi(browser.context, appUrl, tomasz.email, demoPassword);
    await page.goto(`${appUrl}/app/results/${runId}`);
    await page.getByRole("link", { name: "Pool with other runs" }).click();
    await page.waitForURL(/\/app\/results\/pooled\?/);
    await page.getByRole("heading", { name: "Each class’s contribution" }).waitFor();
    const contribution = page.getByRole("table").filter({ hasText: "Share of the pool" });
    await expect(contribution.getByRole("rowheader").allTextContents()).resolves.toEqual([
      expect.stringContaining("8K"),
      expect.stringContaining("9M"),
      "Pooled",
    ]);
    await both(page, "results-pooled");

    await page.goto(`${appUrl}/app/results/paper-runs/new`);
    await page.getByRole("heading", { name: "Paper import for a lesson" }).waitFor();
    await page.getByLabel("Lesson", { exact: true }).selectOption({ label: `${demoRunLesson.title} (${demoRunLesson.classGroup})` });
    await page.getByLabel("Day the lesson was taught").fill("2026-03-24");
    await both(page, "results-paper-run-new");
    await page.getByRole("button", { name: "Make the run and go to Paper import" }).click();
    await page.waitForURL(/\/app\/results\/[0-9a-f-]{36}\/paper-import$/);
    await page.getByRole("heading", { name: "Paper import", level: 1 }).waitFor();
    await page.getByText("(8K, 24 Mar 2026)", { exact: false }).waitFor();

    await page.goto(`${appUrl}/app/results/${extra.runId}`);
    await page.getByRole("button", { name: "Delete run" }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this class run?" });
    await dialog.getByText("80 rolls").waitFor();
    await screenshot(page, "results-delete-confirm-laptop");
    await dialog.getByRole("button", { name: "Delete run and its rolls" }).click();
    await page.waitForURL(`${appUrl}/app/results`);
    await page.getByText("Deleted “Second go: the same trio with 9M”: 80 rolls and 2 groups.").waitFor();
    const [left] = await db.select({ n: count() }).from(roll).where(eq(roll.runId, extra.runId));
    expect(left.n).toBe(0);
    await page.close();
  });
});
