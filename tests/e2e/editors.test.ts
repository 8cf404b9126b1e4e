import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";
import { HttpAgent } from "../helpers/test-app";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((each) => each.email === "ada.okafor@harbourside.test")!;
const tag = Date.now().toString(36);

/** Our own three dice (a cycle with one die each, checked with the engine in tests/e2e/dice-bench.test.ts). */
const trio = [
  { name: "Guillemot", faces: [1, 3, 3, 4, 4, 9], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [1, 1, 5, 5, 5, 6], colour: "amber", pattern: "stripes" },
  { name: "Fulmar", faces: [2, 2, 3, 3, 7, 8], colour: "plum", pattern: "checks" },
];

function navLink(page: Page, name: string) {
  return page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name, exact: true });
}

describe("nothing lost in the editors, in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;
  let set: DiceSet;
  let lessonId = "";

  beforeAll(async () => {
    const agent = new HttpAgent(appUrl);
    await agent.signIn(teacher.email, demoPassword);
    const created = await agent.post("/api/dice-sets", { name: `Auk ledge ${tag}`, description: "", visibility: "private", dice: trio });
    expect(created.status).toBe(201);
    set = created.body as DiceSet;
    const lesson = await agent.post("/api/lessons", { ...emptyLessonInput(), title: `Auk lesson ${tag}`, diceSetId: set.id });
    expect(lesson.status).toBe(201);
    lessonId = (lesson.body as { lesson: { id: string } }).lesson.id;
    // Two sets that would read alike in the lesson's list (same name, same number of dice).
    for (let copy = 0; copy < 2; copy += 1) {
      const twin = await agent.post("/api/dice-sets", { name: `Skerry pair ${tag}`, description: "", visibility: "private", dice: trio });
      expect(twin.status).toBe(201);
    }
    browser = await openBrowser(viewports.laptop);
    page = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
  });
  afterAll(() => browser.close());

  it("asks before leaving an edited set, stays on request with the edit kept, and leaves when told to", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Die 1 name", { exact: true }).fill("Guillemot II");
    await navLink(page, "Lessons").click();
    const dialog = page.getByRole("dialog", { name: "Leave without saving?" });
    await dialog.waitFor();
    await screenshot(page, "editors-leave-set-laptop");
    await dialog.getByRole("button", { name: "Stay and keep editing" }).click();
    await expect(dialog.count()).resolves.toBe(0);
    expect(new URL(page.url()).pathname).toBe(`/app/bench/${set.id}`);
    await expect(page.getByLabel("Die 1 name", { exact: true }).inputValue()).resolves.toBe("Guillemot II");

    await navLink(page, "Lessons").click();
    await page.getByRole("dialog", { name: "Leave without saving?" }).getByRole("button", { name: "Leave and lose the changes" }).click();
    await page.waitForURL(`${appUrl}/app/lessons`);
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await expect(page.getByLabel("Die 1 name", { exact: true }).inputValue()).resolves.toBe("Guillemot");
    // Leaving on purpose drops the browser draft as well, so nothing is offered.
    await expect(page.getByTestId("draft-offer").count()).resolves.toBe(0);
  });

  it("confirms a save where the teacher is looking, then leaves without asking", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Die 3 name", { exact: true }).fill("Fulmar II");
    // The save button at the foot of the form: the confirmation must not be only at the top of the page.
    await page.getByRole("button", { name: "Save changes" }).last().click();
    const toast = page.getByTestId("saved-toast");
    await toast.waitFor();
    await expect(toast.textContent()).resolves.toMatch(/^✓ Saved at \d\d:\d\d\.$/);
    await expect(toast.isVisible()).resolves.toBe(true);
    await screenshot(page, "editors-saved-set-laptop");
    await navLink(page, "Lessons").click();
    await page.waitForURL(`${appUrl}/app/lessons`);
  });

  it("says beside Save why a set with a bad face was not saved", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Faces of die 2", { exact: true }).fill("1, 1, five, 5, 5, 6");
    await page.getByRole("button", { name: "Save changes" }).last().click();
    const problems = page.getByTestId("save-problems").last();
    await problems.waitFor();
    await expect(problems.textContent()).resolves.toMatch(/Die 2, face 3: /);
    await screenshot(page, "editors-bad-face-laptop");
    await page.getByLabel("Faces of die 2", { exact: true }).fill("1, 1, 5, 5, 5, 6");
  });

  it("keeps an unsaved set in the browser when the tab closes and offers it back", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Set name", { exact: true }).fill(`Auk ledge ${tag} (draft)`);
    await page.waitForFunction(() => Object.keys(localStorage).some((key) => key.startsWith("outroll:draft:dice-set:")));
    await page.close({ runBeforeUnload: false });

    page = await browser.context.newPage();
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    const offer = page.getByTestId("draft-offer");
    await offer.waitFor();
    await expect(page.getByLabel("Set name", { exact: true }).inputValue()).resolves.toBe(`Auk ledge ${tag}`);
    await screenshot(page, "editors-draft-offer-laptop");
    await offer.getByRole("button", { name: "Restore my edits" }).click();
    await expect(page.getByLabel("Set name", { exact: true }).inputValue()).resolves.toBe(`Auk ledge ${tag} (draft)`);
    await expect(page.getByText("unsaved changes").count()).resolves.toBeGreaterThan(0);
    await page.getByRole("button", { name: "Save changes" }).first().click();
    await page.getByTestId("saved-toast").waitFor();
    await page.reload();
    await page.getByLabel("Set name", { exact: true }).waitFor();
    await expect(page.getByTestId("draft-offer").count()).resolves.toBe(0);
  });

  it("suggests the colour a die's name asks for, and duplicates the set from its page", async () => {
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Die 1 name", { exact: true }).fill("Red");
    const suggestion = page.getByTestId("colour-suggestion-0");
    await suggestion.waitFor();
    await screenshot(page, "editors-colour-suggestion-laptop");
    await suggestion.getByRole("button", { name: "Use red for die 1" }).click();
    await page.getByText("Colour and pattern of die 1: red, diamonds").waitFor();
    await expect(suggestion.count()).resolves.toBe(0);

    await page.getByRole("button", { name: "Duplicate", exact: true }).click();
    await page.waitForURL(`${appUrl}/app/bench/new`);
    // The new page may take a moment to replace the old one after the address changes.
    await expect.poll(() => page.getByLabel("Set name", { exact: true }).inputValue()).toBe(`Auk ledge ${tag} (draft) (copy)`);
    await expect(page.getByLabel("Die 1 name", { exact: true }).inputValue()).resolves.toBe("Red");
  });

  it("asks before leaving an edited lesson and confirms its save", async () => {
    await page.goto(`${appUrl}/app/lessons/${lessonId}`);
    const setList = page.getByLabel("Dice set", { exact: true });
    await expect.poll(() => setList.locator("option").count()).toBeGreaterThan(3);
    const labels = await setList.locator("option").allTextContents();
    expect(new Set(labels).size).toBe(labels.length);
    expect(labels.filter((label) => label.startsWith(`Skerry pair ${tag}`))).toHaveLength(2);
    await page.getByLabel("Title", { exact: true }).fill(`Auk lesson ${tag}, edited`);
    await navLink(page, "Dice bench").click();
    const dialog = page.getByRole("dialog", { name: "Leave without saving?" });
    await dialog.waitFor();
    await dialog.getByRole("button", { name: "Stay and keep editing" }).click();
    await page.getByRole("button", { name: "Save lesson" }).last().click();
    const toast = page.getByTestId("saved-toast");
    await toast.waitFor();
    await expect(toast.textContent()).resolves.toMatch(/^✓ Saved at \d\d:\d\d \(version 2\)\.$/);
    await screenshot(page, "editors-saved-lesson-laptop");
    await navLink(page, "Dice bench").click();
    await page.waitForURL(`${appUrl}/app/bench`);
  });

  it("fits the dialog, the draft offer and the palette on a phone", async () => {
    await page.setViewportSize(viewports.phone);
    await page.goto(`${appUrl}/app/bench/${set.id}`);
    await page.getByLabel("Die 2 name", { exact: true }).fill("Blue");
    await page.getByTestId("colour-suggestion-1").waitFor();
    await screenshot(page, "editors-colour-suggestion-phone");
    await navLink(page, "Lessons").click();
    await page.getByRole("dialog", { name: "Leave without saving?" }).waitFor();
    await screenshot(page, "editors-leave-set-phone");
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(viewports.phone.width);
  });
});
