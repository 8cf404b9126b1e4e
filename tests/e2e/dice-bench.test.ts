import { readFileSync, writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { HttpAgent } from "../helpers/test-app";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((each) => each.email === "ada.okafor@harbourside.test")!;
const colleague = demoTeachers.find((each) => each.email === "tomasz.reid@harbourside.test")!;

/** Our own three dice (found with a seeded random search over faces 1 to 9): a cycle with one die each that reverses with two dice each. */
const trio = [
  { name: "Guillemot", faces: [1, 3, 3, 4, 4, 9] },
  { name: "Razorbill", faces: [1, 1, 5, 5, 5, 6] },
  { name: "Fulmar", faces: [2, 2, 3, 3, 7, 8] },
];
/** Three more dice of our own, to make a six-die set for the re-render measurement. */
const extraDice = [
  { name: "Shag", faces: [2, 2, 2, 6, 6, 6] },
  { name: "Skua", faces: [1, 4, 4, 5, 8, 8] },
  { name: "Tern", faces: [3, 3, 4, 5, 6, 7] },
];

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Brute force, independent of the engine: count every equally likely pair of faces (k = 1) or of sums of two rolls each (k = 2). */
function bruteForceWin(a: number[], b: number[], dicePerPlayer = 1): string {
  const rolls = (faces: number[]) => (dicePerPlayer === 1 ? faces : faces.flatMap((x) => faces.map((y) => x + y)));
  const first = rolls(a);
  const second = rolls(b);
  let wins = 0;
  for (const x of first) for (const y of second) if (x > y) wins += 1;
  const total = first.length * second.length;
  const divisor = gcd(wins, total);
  return wins === 0 ? "0" : wins === total ? "1" : `${wins / divisor}/${total / divisor}`;
}

async function noSideways(page: Page) {
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(width).toBeLessThanOrEqual(viewports.phone.width);
}

/** Clicks the visible pill of a radio option, as a teacher would (the radio itself is visually hidden). */
async function choose(page: Page, name: string) {
  await page
    .locator("label")
    .filter({ has: page.getByRole("radio", { name, exact: true }) })
    .click();
  await expect(page.getByRole("radio", { name, exact: true }).isChecked()).resolves.toBe(true);
}

async function typeDie(page: Page, index: number, die: { name: string; faces: number[] }) {
  await page.getByLabel(`Die ${index + 1} name`, { exact: true }).fill(die.name);
  await page.getByLabel(`Faces of die ${index + 1}`, { exact: true }).fill(die.faces.join(", "));
}

describe("the Dice bench and the Set finder in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;
  let savedSetId = "";
  let foundSetId = "";
  let sharedSetId = "";
  let downloadedFile = "";
  const workDir = mkdtempSync(path.join(tmpdir(), "outroll-dice-bench-"));

  beforeAll(async () => {
    // A colleague shares a set with the department through the real API, so the teacher has something to read only.
    const agent = new HttpAgent(appUrl);
    await agent.signIn(colleague.email, demoPassword);
    const shared = await agent.post("/api/dice-sets", {
      name: "Cormorant corner",
      description: "Shared by Tomasz for Year 8.",
      visibility: "department",
      dice: trio.map((die, index) => ({
        ...die,
        name: `${die.name} C`,
        colour: ["ocean", "moss", "coral"][index],
        pattern: ["rings", "crosses", "triangles"][index],
      })),
    });
    expect(shared.status).toBe(201);
    sharedSetId = shared.body.id;

    browser = await openBrowser(viewports.laptop);
    page = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
  });
  afterAll(() => browser.close());

  it("builds a set from scratch and shows every view for one, two and three dice each", async () => {
    await page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: "Dice bench" }).click();
    await page.waitForURL(`${appUrl}/app/bench`);
    // The page's code loads after the address changes: wait for its heading rather than reading the old one.
    await page.getByRole("heading", { level: 1, name: "Dice bench", exact: true }).waitFor();
    await page.getByRole("heading", { name: "Shared by colleagues" }).waitFor();
    await screenshot(page, "dice-bench-list-laptop");

    await page.getByRole("link", { name: "+ New dice set" }).click();
    await page.waitForURL(`${appUrl}/app/bench/new`);
    await page.getByLabel("Set name").fill("Puffin practice");
    for (const [index, die] of trio.entries()) await typeDie(page, index, die);

    // Every figure in the matrix is checked against brute-force enumeration of the 36 face pairs.
    for (let row = 0; row < 3; row += 1) {
      for (let column = 0; column < 3; column += 1) {
        if (row === column) continue;
        const cell = page.getByTestId(`cell-1-${row}-${column}`);
        await expect.poll(() => cell.textContent()).toContain(`wins ${bruteForceWin(trio[row].faces, trio[column].faces)} (`);
      }
    }
    const summary = page.getByTestId("set-summary");
    await expect.poll(() => summary.textContent()).toContain("One die each: every die is beaten by another.");
    await expect(summary.textContent()).resolves.toMatch(/These three matchups reverse with two dice each: /);
    await expect(page.getByTestId("beats-graph-1").locator("[data-cycle-edge]").count()).resolves.toBe(3);
    await screenshot(page, "dice-bench-editor-laptop");

    // A bad face gets an inline error naming the face, and the analysis keeps the other dice.
    const facesOfThird = page.getByLabel("Faces of die 3", { exact: true });
    await facesOfThird.fill("2, 2, x, 3, 7, 8");
    await expect(page.getByTestId("face-errors").textContent()).resolves.toContain("Face 3 (“x”): Each face value must be a number.");
    await page.getByText("One die is left out").waitFor();
    await facesOfThird.fill("2, 2, 3.5, 3, 7, 8");
    await expect(page.getByTestId("face-errors").textContent()).resolves.toContain("Face 3 (“3.5”): Face values must be whole numbers");
    await screenshot(page, "dice-bench-face-error-laptop");
    await facesOfThird.fill(trio[2].faces.join(" "));
    await expect(page.getByTestId("face-errors").count()).resolves.toBe(0);

    await choose(page, "two dice each");
    const twoDiceCell = page.getByTestId("cell-2-0-1");
    await expect.poll(() => twoDiceCell.textContent()).toContain(`wins ${bruteForceWin(trio[0].faces, trio[1].faces, 2)} (`);
    await page.getByTestId("beats-graph-2").waitFor();
    await screenshot(page, "dice-bench-two-dice-laptop");
    await choose(page, "three dice each");
    await page.getByTestId("matchup-matrix-3").waitFor();

    await page.getByRole("tab", { name: "Tree diagram" }).click();
    const tree = page.getByTestId("tree-diagram");
    await tree.waitFor();
    // Distinct faces: Guillemot has 1, 3, 4, 9 and Razorbill 1, 5, 6, so 4 × 3 leaves.
    await expect(tree.locator("[data-outcome]").count()).resolves.toBe(12);
    await expect(tree.locator('[data-outcome="win"]').count()).resolves.toBeGreaterThan(0);
    await expect(page.getByTestId("tree-totals").textContent()).resolves.toContain(
      `P(Guillemot wins) = ${bruteForceWin(trio[0].faces, trio[1].faces)} (`,
    );
    await page.getByTestId("two-way-table").waitFor();
    await screenshot(page, "dice-bench-tree-laptop");
    await page.getByLabel("Mode", { exact: true }).selectOption("2");
    await expect(page.getByTestId("two-way-totals").textContent()).resolves.toContain(
      `Guillemot wins ${bruteForceWin(trio[0].faces, trio[1].faces, 2)} (`,
    );
    await screenshot(page, "dice-bench-two-way-sums-laptop");

    await page.getByRole("tab", { name: "Pick advisor" }).click();
    await page.getByRole("heading", { name: "Three players: your two opponents have chosen" }).waitFor();
    await expect(page.getByRole("region", { name: "Pick advisor, three players" }).locator("tbody tr").count()).resolves.toBe(3);
    await screenshot(page, "dice-bench-pick-advisor-laptop");

    await page.getByRole("tab", { name: "Series planner" }).click();
    await expect(page.getByTestId("series-outcome").textContent()).resolves.toMatch(
      /In a best-of-5 series \(re-roll ties\), Guillemot wins the series with probability/,
    );
    await choose(page, "ties score half");
    await expect(page.getByTestId("series-outcome").textContent()).resolves.toMatch(/ends level with/);
    await expect(page.getByTestId("pooled-rolls").textContent()).resolves.toMatch(/Pool about \d+ rolls/);
    // The default 15-minute Roll phase: 45 rolls a group at 3 a minute (one die each), 30 at 2 a minute (two dice each).
    await expect(page.getByTestId("pooled-rolls-in-time").textContent()).resolves.toMatch(
      /about (3 rolls a minute .* about 45|2 rolls a minute .* about 30) rolls in 15 minutes/,
    );
    await screenshot(page, "dice-bench-series-laptop");

    // One box per face: add a face, then remove it again.
    await choose(page, "one box per face");
    await page.getByRole("button", { name: "+ Add a face to die 1" }).click();
    await expect(page.getByTestId("die-card-0").getByLabel("Face 7", { exact: true }).inputValue()).resolves.toBe("9");
    await screenshot(page, "dice-bench-face-boxes-laptop");
    await page.getByRole("button", { name: "Remove face 7 of die 1" }).click();
    await expect(page.getByTestId("die-card-0").getByLabel("Face 7", { exact: true }).count()).resolves.toBe(0);
    await choose(page, "a list");

    await page.getByRole("button", { name: "Save dice set" }).first().click();
    await page.waitForURL(/\/app\/bench\/[0-9a-f-]{36}$/);
    savedSetId = page.url().split("/").pop()!;
    await page
      .getByRole("status")
      .filter({ hasText: /Saved at \d\d:\d\d\./ })
      .waitFor();
    const stored = (await (await page.request.get(`${appUrl}/api/dice-sets/${savedSetId}`)).json()) as DiceSet;
    expect(stored.dice.map((die) => ({ name: die.name, faces: die.faces }))).toEqual(trio);
  });

  it("refuses a stale save with the server's message and reloads the saved set on request", async () => {
    const stored = (await (await page.request.get(`${appUrl}/api/dice-sets/${savedSetId}`)).json()) as DiceSet;
    // The same teacher saves from another tab meanwhile, so this page's version is now stale.
    const other = await page.request.put(`${appUrl}/api/dice-sets/${savedSetId}`, {
      data: {
        name: "Puffin practice (other tab)",
        description: stored.description,
        visibility: stored.visibility,
        dice: stored.dice,
        version: stored.version,
      },
    });
    expect(other.status()).toBe(200);

    await page.getByLabel("Set name").fill("Puffin practice, edited here");
    await page.getByRole("button", { name: "Save changes" }).first().click();
    const alert = page.getByRole("alert").filter({ hasText: "Not saved: this set changed since you opened it" });
    await alert.waitFor();
    await screenshot(page, "dice-bench-stale-laptop");
    const afterRefusal = (await (await page.request.get(`${appUrl}/api/dice-sets/${savedSetId}`)).json()) as DiceSet;
    expect(afterRefusal.name).toBe("Puffin practice (other tab)");

    await alert.getByRole("button", { name: "Reload the saved set" }).click();
    await page.getByRole("status").filter({ hasText: "Reloaded the saved set" }).waitFor();
    await expect(page.getByLabel("Set name").inputValue()).resolves.toBe("Puffin practice (other tab)");
  });

  it("measures how long a six-die analysis takes to re-render after a face edit", async () => {
    await page.goto(`${appUrl}/app/bench/new`);
    await page.getByLabel("Set name").fill("Six sea birds");
    for (let added = 0; added < 3; added += 1) await page.getByRole("button", { name: "+ Add a die" }).click();
    for (const [index, die] of [...trio, ...extraDice].entries()) await typeDie(page, index, die);
    await page.getByTestId("cell-1-5-0").waitFor();

    const variants = ["2, 3, 4, 5, 6, 7", "3, 4, 5, 6, 7, 8"];
    const timings: number[] = [];
    for (let round = 0; round < 8; round += 1) {
      const faces = variants[round % 2];
      const elapsed = await page.getByLabel("Faces of die 6", { exact: true }).evaluate(async (input: HTMLInputElement, value: string) => {
        const cell = document.querySelector('[data-testid="cell-1-5-0"]')!;
        const before = cell.textContent;
        const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, "value")!.set!;
        const start = performance.now();
        const changed = new Promise<void>((resolve) => {
          const observer = new MutationObserver(() => {
            if (document.querySelector('[data-testid="cell-1-5-0"]')?.textContent !== before) {
              observer.disconnect();
              resolve();
            }
          });
          observer.observe(document.body, { subtree: true, childList: true, characterData: true });
        });
        setValue.call(input, value);
        input.dispatchEvent(new Event("input", { bubbles: true }));
        await changed;
        return performance.now() - start;
      }, faces);
      timings.push(elapsed);
      const expected = bruteForceWin(faces.split(", ").map(Number), trio[0].faces);
      await expect(page.getByTestId("cell-1-5-0").textContent()).resolves.toContain(`wins ${expected} (`);
    }
    const sorted = [...timings].sort((a, b) => a - b);
    console.log(
      `Dice bench re-render, six dice, face edit until the new figure is in the DOM: median ${sorted[Math.floor(sorted.length / 2)].toFixed(1)} ms, ` +
        `min ${sorted[0].toFixed(1)} ms, max ${sorted[sorted.length - 1].toFixed(1)} ms over ${timings.length} edits (first edit included)`,
    );
    await screenshot(page, "dice-bench-six-dice-laptop");
  });

  it("shows a colleague's shared set read only and duplicates it to edit, then deletes the copy after confirmation", async () => {
    await page.goto(`${appUrl}/app/bench/${sharedSetId}`);
    await page.getByText("shared by Tomasz Reid (read only)").waitFor();
    await expect(page.getByLabel("Set name").count()).resolves.toBe(0);
    await screenshot(page, "dice-bench-shared-laptop");
    await page.getByRole("button", { name: "Duplicate to edit" }).click();
    await page.waitForURL((url) => /\/app\/bench\/[0-9a-f-]{36}$/.test(url.pathname) && !url.pathname.endsWith(sharedSetId));
    await page.getByLabel("Set name").waitFor();
    const copyId = page.url().split("/").pop()!;
    const copyName = await page.getByLabel("Set name").inputValue();

    await page.goto(`${appUrl}/app/bench`);
    await page
      .getByRole("button", { name: `Delete ${copyName}` })
      .first()
      .click();
    const confirm = page.getByRole("alertdialog");
    await confirm.waitFor();
    await screenshot(page, "dice-bench-delete-confirm-laptop");
    await confirm.getByRole("button", { name: "Yes, delete it" }).click();
    await expect.poll(async () => (await page.request.get(`${appUrl}/api/dice-sets/${copyId}`)).status()).toBe(404);
  });

  it("runs the Set finder with progress, cancels one search, lets a small one finish and saves a found set", async () => {
    await page.goto(`${appUrl}/app/finder`);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Set finder");
    await screenshot(page, "set-finder-form-laptop");

    // A large search, cancelled while it runs.
    await page.getByLabel("Number of dice").selectOption("4");
    await page.getByLabel("Faces on each die").selectOption("8");
    await page.getByLabel("Largest value").fill("20");
    await page.getByLabel("Stop after (seconds)").fill("300");
    await page.getByRole("button", { name: "Find dice sets" }).click();
    const progress = page.getByRole("progressbar");
    await progress.waitFor();
    await expect(progress.getAttribute("aria-valuenow")).resolves.toMatch(/^\d+$/);
    await page
      .getByText(/s left|min left|estimating time left/)
      .first()
      .waitFor();
    await screenshot(page, "set-finder-running-laptop");
    await page.getByRole("button", { name: "Cancel the search" }).click();
    await page.getByRole("status").filter({ hasText: "Search cancelled after examining" }).waitFor({ timeout: 15_000 });
    // A cancelled search says how much it examined, never "100% · N of N".
    await expect(page.getByText(/^Cancelled: [\d,]+ of [\d,]+ candidate sets examined \(\d+%\)/).count()).resolves.toBe(1);
    await expect(progress.getAttribute("aria-valuenow")).resolves.not.toBe("100");
    await screenshot(page, "set-finder-cancelled-laptop");

    // A small search, left to finish.
    await page.getByLabel("Number of dice").selectOption("3");
    await page.getByLabel("Faces on each die").selectOption("6");
    await page.getByLabel("Largest value").fill("6");
    await page.getByLabel("Allow ties").check();
    await page.getByLabel("Sets to list").fill("5");
    await page.getByLabel("Stop after (seconds)").fill("30");
    await page.getByRole("button", { name: "Find dice sets" }).click();
    await page.getByRole("status").filter({ hasText: "Finished:" }).waitFor({ timeout: 60_000 });
    const results = page.getByTestId("found-set");
    expect(await results.count()).toBeGreaterThan(0);
    await screenshot(page, "set-finder-results-laptop");

    // The first result's weakest win, re-checked here by brute force over its faces.
    const job = await page.request.get(`${appUrl}/api/set-finder/searches/${new URL(page.url()).searchParams.get("search")}`);
    const best = (await job.json()).results[0] as {
      dice: { name: string; faces: number[] }[];
      figures: { cycleOrder: number[]; weakestCycleWin: string };
    };
    const cycleWins = best.figures.cycleOrder.map((from, position) => {
      const to = best.figures.cycleOrder[(position + 1) % best.figures.cycleOrder.length];
      return bruteForceWin(best.dice[from].faces, best.dice[to].faces);
    });
    const weakest = cycleWins.reduce((least, each) => (fractionValue(each) < fractionValue(least) ? each : least));
    expect(best.figures.weakestCycleWin).toBe(weakest);
    await expect(results.first().textContent()).resolves.toContain(`Weakest win ${weakest}`);

    // Both searches are kept on the server: after leaving the page and coming back, the recent list shows them.
    await page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: "Dice bench" }).click();
    await page.waitForURL(`${appUrl}/app/bench`);
    await page.goto(`${appUrl}/app/finder`);
    const recent = page.getByRole("region", { name: "Your recent searches" }).getByRole("listitem");
    await recent.first().waitFor();
    await expect(recent.nth(0).textContent()).resolves.toMatch(/3 dice × 6 faces.*Finished · \d+ sets? found/);
    await expect(recent.nth(1).textContent()).resolves.toMatch(/4 dice × 8 faces.*Cancelled at \d+% examined/);
    await screenshot(page, "set-finder-recent-laptop");
    await page.setViewportSize(viewports.phone);
    await screenshot(page, "set-finder-recent-phone");
    await page.setViewportSize(viewports.laptop);
    await recent.nth(0).getByRole("link").click();
    await page.getByRole("status").filter({ hasText: "Finished:" }).waitFor();

    await results
      .first()
      .getByRole("button", { name: /Open in the Dice bench/ })
      .click();
    await page.waitForURL(`${appUrl}/app/bench/new`);
    for (const [index, die] of best.dice.entries()) {
      await expect(page.getByLabel(`Faces of die ${index + 1}`, { exact: true }).inputValue()).resolves.toBe(die.faces.join(", "));
    }
    await screenshot(page, "dice-bench-found-draft-laptop");
    await page.getByLabel("Set name").fill("Storm petrel (found)");
    await page.getByRole("button", { name: "Save dice set" }).first().click();
    await page.waitForURL(/\/app\/bench\/[0-9a-f-]{36}$/);
    foundSetId = page.url().split("/").pop()!;
  });

  it("prints the found set's nets and recording sheet for A4 and US Letter", async () => {
    await page.getByRole("link", { name: "Print dice" }).click();
    await page.waitForURL(`${appUrl}/app/bench/${foundSetId}/print?kind=nets&paper=a4`);
    await page.getByTestId("printables").waitFor();
    await expect(page.getByTestId("cube-net").count()).resolves.toBe(3);
    await screenshot(page, "print-nets-a4-laptop");
    const a4 = await page.pdf({ preferCSSPageSize: true });
    // A4 is 210 × 297 mm = 595.28 × 841.89 pt (ISO 216); Chromium rounds through CSS pixels, so allow 2 pt.
    expectPageSize(a4, [595.28, 841.89]);
    // Three nets fit one page (four to a page), so nothing is cut across a page break.
    expect(pdfPageCount(a4)).toBe(1);

    await choose(page, "US Letter");
    await page.waitForURL(/paper=letter/);
    const letter = await page.pdf({ preferCSSPageSize: true });
    // US Letter is 8.5 × 11 in = 612 × 792 pt (ANSI/ASME Y14.1).
    expectPageSize(letter, [612, 792]);
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "print-nets-letter-print-media-laptop");
    await expect(page.getByRole("navigation", { name: "Product areas" }).isVisible()).resolves.toBe(false);
    await page.emulateMedia({ media: null });

    await choose(page, "Recording sheet");
    await page.waitForURL(/kind=sheet/);
    // Plain headings, a column per player; without a lesson the sheet has 20 lines for two players, one die each.
    const headings = () =>
      page
        .getByTestId("recording-sheet")
        .first()
        .locator("thead th")
        .evaluateAll((cells) => cells.map((cell) => cell.firstChild?.textContent ?? ""));
    await expect(headings()).resolves.toEqual(["Roll", "Player 1 rolled", "Player 2 rolled", "Who won?"]);
    await expect(page.getByTestId("recording-sheet").locator("tbody tr").count()).resolves.toBe(20);
    await screenshot(page, "print-sheet-letter-laptop");
    // The recording sheet prints portrait, 612 × 792 pt, on one page.
    const sheet = await page.pdf({ preferCSSPageSize: true });
    expectPageSize(sheet, [612, 792]);
    expect(pdfPageCount(sheet)).toBe(1);
    await choose(page, "A4");
    await page.waitForURL(/kind=sheet&paper=a4/);
    await choose(page, "Three players");
    await page.waitForURL(/players=3/);
    await expect(headings()).resolves.toEqual(["Roll", "Player 1 rolled", "Player 2 rolled", "Player 3 rolled", "Who won?"]);
    const a4Sheet = await page.pdf({ preferCSSPageSize: true });
    expectPageSize(a4Sheet, [595.28, 841.89]);
    expect(pdfPageCount(a4Sheet)).toBe(1);
  });

  it("exports the set file and imports it back; a malformed file lists its problems and changes nothing", async () => {
    await page.goto(`${appUrl}/app/bench/${foundSetId}`);
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download set file" }).click()]);
    downloadedFile = path.join(workDir, download.suggestedFilename());
    await download.saveAs(downloadedFile);
    const file = JSON.parse(readFileSync(downloadedFile, "utf8"));
    expect(file.format).toBe("outroll-dice-set");
    expect(file.name).toBe("Storm petrel (found)");

    const before = ((await (await page.request.get(`${appUrl}/api/dice-sets`)).json()) as { sets: DiceSet[] }).sets.length;
    const broken = path.join(workDir, "broken.outroll-dice.json");
    writeFileSync(broken, JSON.stringify({ ...file, dice: [{ ...file.dice[0], faces: [1, "x"] }, file.dice[1]] }));
    await page.goto(`${appUrl}/app/bench`);
    await page.getByLabel("Set file to import").setInputFiles(broken);
    const issues = page.getByTestId("import-issues");
    await issues.waitFor();
    expect(await issues.locator("li").count()).toBeGreaterThan(0);
    await screenshot(page, "dice-bench-import-issues-laptop");
    const afterBroken = ((await (await page.request.get(`${appUrl}/api/dice-sets`)).json()) as { sets: DiceSet[] }).sets.length;
    expect(afterBroken).toBe(before);

    await page.getByLabel("Set file to import").setInputFiles(downloadedFile);
    await page.waitForURL((url) => /\/app\/bench\/[0-9a-f-]{36}$/.test(url.pathname) && !url.pathname.endsWith(foundSetId));
    await page.getByRole("status").filter({ hasText: "Imported from" }).waitFor();
    const importedId = page.url().split("/").pop()!;
    const imported = (await (await page.request.get(`${appUrl}/api/dice-sets/${importedId}`)).json()) as DiceSet;
    expect(imported.dice).toEqual(file.dice);
  });

  it("fits a 390 px phone on every screen", async () => {
    const phone = await openBrowser(viewports.phone);
    try {
      const small = await signInThroughUi(phone.context, appUrl, teacher.email, demoPassword);
      await small.goto(`${appUrl}/app/bench`);
      await small.getByRole("heading", { name: "Your dice sets" }).waitFor();
      await noSideways(small);
      await screenshot(small, "dice-bench-list-phone");

      await small.goto(`${appUrl}/app/bench/${savedSetId}`);
      await small.getByTestId("matchup-matrix-1").waitFor();
      await noSideways(small);
      await screenshot(small, "dice-bench-editor-phone");
      for (const [tab, name] of [
        ["Tree diagram", "tree"],
        ["Pick advisor", "pick-advisor"],
        ["Series planner", "series"],
      ] as const) {
        await small.getByRole("tab", { name: tab }).click();
        await small.getByRole("tabpanel").waitFor();
        await noSideways(small);
        await screenshot(small, `dice-bench-${name}-phone`);
      }
      await choose(small, "one box per face");
      await noSideways(small);
      await screenshot(small, "dice-bench-face-boxes-phone");

      // Six dice, two of them not six-faced: the widest matrix and tables, and nets beside face cards.
      const mixed = await small.request.post(`${appUrl}/api/dice-sets`, {
        data: {
          name: "Mixed flock",
          description: "",
          visibility: "private",
          dice: [
            ...[...trio, { name: "Shag", faces: [0, 3, 3, 9, 9, 12] }].map((die, index) => ({
              ...die,
              colour: ["teal", "amber", "plum", "slate"][index],
              pattern: ["dots", "stripes", "checks", "waves"][index],
            })),
            { name: "Skua spinner", faces: [1, 5, 5, 6], colour: "coral", pattern: "triangles" },
            { name: "Tern octagon", faces: [2, 3, 4, 5, 6, 7, 8, 100], colour: "moss", pattern: "crosses" },
          ],
        },
      });
      expect(mixed.status()).toBe(201);
      const mixedId = ((await mixed.json()) as DiceSet).id;
      await small.goto(`${appUrl}/app/bench/${mixedId}`);
      await small.getByTestId("cell-1-5-4").waitFor();
      await noSideways(small);
      await screenshot(small, "dice-bench-six-mixed-phone");
      for (const tab of ["Tree diagram", "Pick advisor", "Series planner"]) {
        await small.getByRole("tab", { name: tab }).click();
        await noSideways(small);
      }
      await small.goto(`${appUrl}/app/bench/${mixedId}/print?kind=nets&paper=letter`);
      await small.getByTestId("printables").waitFor();
      await expect(small.getByTestId("cube-net").count()).resolves.toBe(4);
      await expect(small.getByTestId("face-cards").count()).resolves.toBe(2);
      await noSideways(small);
      await screenshot(small, "print-nets-and-cards-phone");

      await small.goto(`${appUrl}/app/bench/${sharedSetId}`);
      await small.getByRole("button", { name: "Duplicate to edit" }).waitFor();
      await noSideways(small);
      await screenshot(small, "dice-bench-shared-phone");

      await small.goto(`${appUrl}/app/finder`);
      await small.getByRole("button", { name: "Find dice sets" }).waitFor();
      await noSideways(small);
      await screenshot(small, "set-finder-form-phone");
      await small.getByLabel("Largest value").fill("6");
      await small.getByLabel("Allow ties").check();
      await small.getByLabel("Stop after (seconds)").fill("30");
      await small.getByRole("button", { name: "Find dice sets" }).click();
      await small.getByRole("status").filter({ hasText: "Finished:" }).waitFor({ timeout: 60_000 });
      await noSideways(small);
      await screenshot(small, "set-finder-results-phone");

      for (const kind of ["nets", "sheet"]) {
        await small.goto(`${appUrl}/app/bench/${foundSetId}/print?kind=${kind}&paper=a4`);
        await small.getByTestId("printables").waitFor();
        await noSideways(small);
        await screenshot(small, `print-${kind}-phone`);
      }
    } finally {
      await phone.close();
    }
  });
});

function fractionValue(text: string): number {
  const [numerator, denominator = "1"] = text.split("/");
  return Number(numerator) / Number(denominator);
}

/** Pages in a PDF: its page objects ("/Type /Page", not "/Pages"). */
function pdfPageCount(pdf: Buffer): number {
  return pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g)?.length ?? 0;
}

/** Checks the first page's MediaBox of a PDF against a paper size in points, within 2 pt. */
function expectPageSize(pdf: Buffer, [width, height]: [number, number]) {
  const match = /\/MediaBox\s*\[\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s*\]/.exec(pdf.toString("latin1"));
  if (!match) throw new Error("no MediaBox in the PDF");
  expect(Math.abs(Number(match[3]) - Number(match[1]) - width)).toBeLessThan(2);
  expect(Math.abs(Number(match[4]) - Number(match[2]) - height)).toBeLessThan(2);
}
