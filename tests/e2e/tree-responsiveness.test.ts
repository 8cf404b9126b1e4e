import { appendFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { mulberry32, randomBelow } from "@shared/probability/seeded-random";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { HttpAgent } from "../helpers/test-app";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((each) => each.email === "ada.okafor@harbourside.test")!;

/** A 60-faced die of our own with spread values (seeded), so two dice each give well over a thousand distinct sums. */
function spreadDie(seed: number): number[] {
  const random = mulberry32(seed);
  return Array.from({ length: 60 }, () => 1 + randomBelow(random, 999));
}

/** Chooses an option of a labelled select as a teacher would. */
async function chooseOption(page: Page, label: string, option: string) {
  await page.getByLabel(label, { exact: true }).selectOption({ label: option });
}

describe("a large tree diagram in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;
  let set: DiceSet;

  beforeAll(async () => {
    const agent = new HttpAgent(appUrl);
    await agent.signIn(teacher.email, demoPassword);
    const created = await agent.post("/api/dice-sets", {
      name: `Wide petrels ${Date.now().toString(36)}`,
      description: "",
      visibility: "private",
      dice: [
        { name: "Storm petrel", faces: spreadDie(7), colour: "ocean", pattern: "rings" },
        { name: "Fork petrel", faces: spreadDie(8), colour: "sand", pattern: "zigzags" },
      ],
    });
    expect(created.status).toBe(201);
    set = created.body as DiceSet;
    browser = await openBrowser(viewports.laptop);
    page = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
  });
  afterAll(() => browser.close());

  it("draws two 60-faced dice at two dice each grouped, with exact totals, and the page answers typing meanwhile", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByRole("tab", { name: "Tree diagram" }).click();
    await page.getByTestId("grouped-tree-diagram").waitFor();
    await page.evaluate(() => {
      const record = window as unknown as { inputDelays: number[]; longTasks: number[] };
      record.inputDelays = [];
      record.longTasks = [];
      // The delay before the page handles a key press: from the event's time stamp to its handler.
      document.addEventListener("keydown", (event) => record.inputDelays.push(performance.now() - event.timeStamp), { capture: true });
      new PerformanceObserver((list) => list.getEntries().forEach((entry) => record.longTasks.push(entry.duration))).observe({
        type: "longtask",
      });
    });

    await chooseOption(page, "Mode", "two dice each");
    const name = page.getByLabel("Set name", { exact: true });
    await name.focus();
    await page.keyboard.press("End");
    await page.keyboard.type(" x");
    await page.getByTestId("grouped-tree-diagram").waitFor();
    await expect(page.getByTestId("grouped-tree-diagram").getByText("P(paths)").count()).resolves.toBe(1);
    await expect(name.inputValue()).resolves.toMatch(/ x$/);

    // Grouped: at most 12 bands × 3 outcomes drawn, not one element per path.
    const drawnPaths = await page.getByTestId("grouped-tree-diagram").locator("[data-outcome]").count();
    expect(drawnPaths).toBeGreaterThan(0);
    expect(drawnPaths).toBeLessThanOrEqual(36);
    const caption = await page.locator("figcaption").filter({ hasText: "paths, so they are drawn grouped" }).textContent();
    const paths = Number(caption!.match(/The full tree has ([\d,]+) paths/)![1].replace(/,/g, ""));
    expect(paths).toBeGreaterThan(1_000_000);
    const totals = await page.getByTestId("tree-totals").textContent();
    // The totals are the engine's exact chances, out of 60⁴ equally likely pairs of pairs.
    expect(totals).toMatch(/P\(Storm petrel wins\) = \d+\/\d+/);
    await expect(page.getByText("too many to read here; the totals below are exact").count()).resolves.toBe(1);
    await page.getByTestId("two-way-totals").waitFor();
    await screenshot(page, "tree-grouped-by-total-laptop");

    await page
      .locator("label")
      .filter({ has: page.getByRole("radio", { name: "outcome", exact: true }) })
      .click();
    await page.locator("figcaption").filter({ hasText: "drawn grouped: by outcome" }).waitFor();
    await screenshot(page, "tree-grouped-by-outcome-laptop");

    const measured = await page.evaluate(() => {
      const record = window as unknown as { inputDelays: number[]; longTasks: number[] };
      return { inputDelays: [...record.inputDelays], longTasks: [...record.longTasks] };
    });
    const report = `Tree diagram, two 60-faced dice at two dice each (${paths.toLocaleString("en-GB")} paths): time to the next key press ${Math.max(...measured.inputDelays).toFixed(0)} ms, longest task ${Math.max(0, ...measured.longTasks).toFixed(0)} ms\n`;
    if (process.env.BENCH_TREE_REPORT) appendFileSync(process.env.BENCH_TREE_REPORT, report);
    else console.info(report);

    await page.setViewportSize(viewports.phone);
    await screenshot(page, "tree-grouped-by-outcome-phone");
  });
});
