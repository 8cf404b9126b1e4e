import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const [tomasz, ada] = demoTeachers.filter((t) => t.role === "teacher");

describe("a shared dice set a colleague's lesson uses, in chromium", () => {
  let owner: Awaited<ReturnType<typeof openBrowser>>;
  let ownerPhone: Awaited<ReturnType<typeof openBrowser>>;
  let colleague: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    owner = await openBrowser(viewports.laptop);
    ownerPhone = await openBrowser(viewports.phone);
    colleague = await openBrowser(viewports.laptop);
  });
  afterAll(async () => {
    await owner.close();
    await ownerPhone.close();
    await colleague.close();
  });

  it("refuses the owner's delete on the Dice bench and names the colleague's lesson", async () => {
    const setName = `Breakwater trio ${crypto.randomUUID().slice(0, 4)}`;
    const ownerPage = await signInThroughUi(owner.context, appUrl, tomasz.email, demoPassword);
    const created = await ownerPage.request.post(`${appUrl}/api/dice-sets`, {
      data: {
        name: setName,
        description: "Shared with the department.",
        visibility: "department",
        dice: [
          { name: "Fulmar", faces: [2, 2, 6, 6, 7, 7], colour: "teal", pattern: "dots" },
          { name: "Gannet", faces: [1, 5, 5, 5, 5, 9], colour: "amber", pattern: "stripes" },
          { name: "Skua", faces: [3, 3, 3, 4, 8, 8], colour: "plum", pattern: "checks" },
        ],
      },
    });
    expect(created.status()).toBe(201);
    const set = (await created.json()) as { id: string };
    const colleaguePage = await signInThroughUi(colleague.context, appUrl, ada.email, demoPassword);
    const lesson = await colleaguePage.request.post(`${appUrl}/api/lessons`, {
      data: { ...emptyLessonInput(), title: "Breakwater starter", classGroup: "9M", diceSetId: set.id },
    });
    expect(lesson.status()).toBe(201);

    const ownerPhonePage = await signInThroughUi(ownerPhone.context, appUrl, tomasz.email, demoPassword);
    for (const [page, size] of [
      [ownerPage, "laptop"],
      [ownerPhonePage, "phone"],
    ] as const) {
      await page.goto(`${appUrl}/app/bench`);
      await page.getByRole("button", { name: `Delete ${setName}` }).click();
      await page.getByRole("button", { name: "Yes, delete it" }).click();
      const refusal = page.getByRole("alert").filter({ hasText: "That did not work" });
      await expect(refusal.textContent()).resolves.toContain("Ada Okafor’s “Breakwater starter”");
      await refusal.scrollIntoViewIfNeeded();
      await screenshot(page, `dice-bench-set-in-use-${size}`);
      await page.reload();
      await page.getByRole("heading", { name: setName }).waitFor();
    }
  });
});
