import type { APIRequestContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const [teacher] = demoTeachers.filter((entry) => entry.role === "teacher");
const headers = { origin: appUrl };
const laptop = { width: 1280, height: 800 };

// Invented dice for the browser test.
const dice = [
  { name: "Auk", faces: [1, 1, 5, 5, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [2, 3, 3, 4, 7, 7], colour: "amber", pattern: "stripes" },
  { name: "Guillemot", faces: [0, 4, 4, 4, 4, 8], colour: "plum", pattern: "checks" },
];
// Counted by hand over the 36 equally likely face pairs, ties re-rolled: Auk beats Razorbill in 16 (no ties) = 4/9;
// Razorbill beats Guillemot in 14 with 4 ties = 14/32 = 7/16; Guillemot beats Auk in 14 (no ties) = 7/18.
// The assignment cycle hands out Auk v Razorbill, Razorbill v Guillemot and Guillemot v Auk, so each first die is named here.
const exactForFirstDie: Record<string, string> = { Auk: "4/9 ≈ 0.444", Razorbill: "7/16 ≈ 0.438", Guillemot: "7/18 ≈ 0.389" };
const prompts = ["Which die would you choose if you went second?", "Why can every die be beaten?"];
const exitTicket = "Write one sentence: why is there no best die in this set?";

async function openRunOf(request: APIRequestContext, fields: Record<string, unknown>) {
  const set = await request.post(`${appUrl}/api/dice-sets`, {
    headers,
    data: { name: "Cliff-top three", description: "", visibility: "private", dice },
  });
  expect(set.status()).toBe(201);
  const title = `Wall lesson ${Date.now().toString(36)}`;
  const lesson = await request.post(`${appUrl}/api/lessons`, {
    headers,
    data: { ...emptyLessonInput(), title, classGroup: "9S", status: "ready", diceSetId: (await set.json()).id, ...fields },
  });
  expect(lesson.status(), await lesson.text()).toBe(201);
  const run = await request.post(`${appUrl}/api/class-runs`, { headers, data: { lessonId: (await lesson.json()).lesson.id } });
  expect(run.status(), await run.text()).toBe(201);
  return (await run.json()).id as string;
}

async function moveTo(request: APIRequestContext, runId: string, phase: string, twist?: string) {
  const moved = await request.post(`${appUrl}/api/class-runs/${runId}/phase`, { headers, data: twist ? { phase, twist } : { phase } });
  expect(moved.status(), await moved.text()).toBe(200);
}

async function simulate(request: APIRequestContext, runId: string, seed: number) {
  const added = await request.post(`${appUrl}/api/class-runs/${runId}/simulated-groups`, {
    headers,
    data: { groups: 3, rollsPerGroup: 40, seed },
  });
  expect(added.status(), await added.text()).toBe(201);
}

/** Screenshots of the Wall at the projector's size and a laptop's. */
async function wallShots(wall: Page, name: string) {
  await wall.setViewportSize(viewports.projector);
  await screenshot(wall, `wall-${name}-projector`);
  await wall.setViewportSize(laptop);
  await screenshot(wall, `wall-${name}-laptop`);
  await wall.setViewportSize(viewports.projector);
}

describe("the Wall view tells the lesson's story in order", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(viewports.projector);
  });
  afterAll(async () => {
    await browser.close();
  });

  it("hides exact values during Roll and shows them in Prove; Reflect sets the main tally beside the Twist with the prompts and exit ticket", async () => {
    const board = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
    const runId = await openRunOf(board.request, { discussionPrompts: prompts, exitTicket });
    await moveTo(board.request, runId, "Roll");
    await simulate(board.request, runId, 5);

    const wall = await browser.context.newPage();
    await wall.goto(`${appUrl}/app/runs/${runId}/wall`);
    await wall.getByTestId("wall-roll-count").filter({ hasText: "120 rolls from 3 groups" }).waitFor();
    await expect(wall.getByTestId("wall-exact").allTextContents()).resolves.toEqual(
      Array(3).fill(expect.stringContaining("Shown in Prove")),
    );
    // No exact fraction anywhere on the Wall before Prove, though the class's figures are there.
    await expect(wall.locator("body").innerText()).resolves.not.toMatch(/\d+\/\d+/);
    const shares = await wall.getByTestId("wall-share").allTextContents();
    expect(shares.map((text) => text.split(" ")[0]).sort()).toEqual(["Auk", "Guillemot", "Razorbill"]);
    expect(shares.every((text) => /^\w+ wins 0\.\d{3} of the rolls that were not ties$/.test(text))).toBe(true);
    await wallShots(wall, "roll");

    await moveTo(board.request, runId, "Pool");
    await wall.getByRole("heading", { name: "Pool", exact: true }).waitFor();
    await wall.getByRole("img", { name: /^Convergence chart/ }).waitFor();
    await expect(wall.locator("body").innerText()).resolves.not.toMatch(/\d+\/\d+/);
    await wallShots(wall, "pool");

    await moveTo(board.request, runId, "Prove");
    await wall.getByTestId("tree-totals").waitFor();
    const share = (await wall.getByTestId("wall-share").textContent())!;
    const firstDie = share.split(" ")[0];
    await expect(wall.getByTestId("wall-exact").textContent()).resolves.toContain(exactForFirstDie[firstDie]);
    await expect(wall.getByTestId("wall-exact").textContent()).resolves.toContain("Exact under the tie rule (re-roll ties)");
    await wallShots(wall, "prove");

    await moveTo(board.request, runId, "Twist", "two-dice-each");
    await wall.getByText("Twist: two dice each, two players. A fresh tally starts at zero.").waitFor();
    await simulate(board.request, runId, 6);
    await moveTo(board.request, runId, "Reflect");
    const main = wall.getByTestId("wall-main-tally");
    await main.getByRole("heading", { name: /^Main tally: one die each, two players/ }).waitFor();
    await expect(main.getByRole("heading").first().textContent()).resolves.toContain("120 rolls from 3 groups");
    const twist = wall.getByTestId("wall-twist-tally");
    await expect(twist.getByRole("heading").first().textContent()).resolves.toMatch(
      /^Twist: two dice each, two players\d+ rolls from \d+ groups$/,
    );
    await expect(twist.getByTestId("wall-matchup").count()).resolves.toBeGreaterThan(0);
    await expect(main.getByTestId("wall-exact").allTextContents()).resolves.toEqual(
      expect.arrayContaining([expect.stringContaining("4/9 ≈ 0.444")]),
    );
    for (const prompt of prompts) await wall.getByRole("listitem").filter({ hasText: prompt }).waitFor();
    await wall.getByRole("heading", { name: "Exit ticket" }).waitFor();
    await wall.getByText(exitTicket).waitFor();
    await wallShots(wall, "reflect");

    const closed = await board.request.post(`${appUrl}/api/class-runs/${runId}/status`, { headers, data: { status: "closed" } });
    expect(closed.status()).toBe(200);
    await board.setViewportSize(laptop);
    await board.goto(`${appUrl}/app/runs/${runId}`);
    await board.getByText("This run is closed", { exact: true }).waitFor();
    await expect(board.getByTestId("live-state").count()).resolves.toBe(0);
    await expect(board.getByText("Live", { exact: true }).count()).resolves.toBe(0);
    await board.getByText(/^■?\s*Closed$/).waitFor();
    await expect(board.getByRole("link", { name: "See the results" }).getAttribute("href")).resolves.toBe(`/app/results/${runId}`);
    await expect(board.getByRole("tab").allTextContents()).resolves.toEqual([
      "Main tally: one die each, two players",
      "Twist: two dice each, two players",
    ]);
    await screenshot(board, "run-board-closed-laptop");
    await board.setViewportSize(viewports.phone);
    await screenshot(board, "run-board-closed-phone");
    await board.getByRole("link", { name: "See the results" }).click();
    await board.waitForURL(`${appUrl}/app/results/${runId}`);
    await board.getByTestId("results-tally-2").getByRole("heading", { name: "Twist: two dice each, two players" }).waitFor();
    await board.close();
  });

  it("shows exact values from Roll on when the lesson lets it", async () => {
    const board = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
    const runId = await openRunOf(board.request, { hideExactUntilProve: false });
    await moveTo(board.request, runId, "Roll");
    await simulate(board.request, runId, 7);
    const wall = await browser.context.newPage();
    await wall.goto(`${appUrl}/app/runs/${runId}/wall`);
    await wall.getByTestId("wall-roll-count").filter({ hasText: "120 rolls from 3 groups" }).waitFor();
    const lines = await wall.getByTestId("wall-matchup").all();
    expect(lines).toHaveLength(3);
    for (const line of lines) {
      const firstDie = (await line.getByTestId("wall-share").textContent())!.split(" ")[0];
      await expect(line.getByTestId("wall-exact").textContent()).resolves.toContain(exactForFirstDie[firstDie]);
    }
    await board.close();
    await wall.close();
  });
});
