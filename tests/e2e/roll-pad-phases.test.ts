import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot } from "../helpers/browser";
import { openPadTestRun } from "../helpers/pad-run-fixtures";

const appUrl = inject("appUrl");

describe("the Roll pad follows the class run's phases (phone-sized chromium)", () => {
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    phone = await openBrowser({ width: 360, height: 740 });
  });
  afterAll(async () => {
    await phone.close();
  });

  it("keeps focus on the voted die, records in Roll, and in Pool shows what the class is doing with no record controls", async () => {
    const run = await openPadTestRun(appUrl);
    const page = await phone.context.newPage();
    await page.goto(`${appUrl}/pad/${run.joinCode}`);
    await page.getByLabel("Group nickname", { exact: true }).fill("Quayside Puffins");
    await page.getByRole("button", { name: "Join with this nickname" }).click();
    await page.getByRole("heading", { name: "Which die is best?" }).waitFor();

    await page.getByRole("button", { name: /Guillemot/ }).click();
    await page.getByText("✓ Our vote").waitFor();
    // After Vote, keyboard focus is still on the die voted for, not on the page body.
    await expect(page.evaluate(() => document.activeElement?.textContent ?? "")).resolves.toContain("Guillemot");

    await run.phase("Roll");
    await page.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    await page.getByRole("button", { name: "Auk shows 5", exact: true }).click();
    await page.getByRole("button", { name: "Razorbill shows 3", exact: true }).click();
    await page.getByRole("button", { name: "Record 5 v 3" }).click();
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();

    await run.phase("Pool");
    await page.getByTestId("look-at-board").waitFor();
    await expect(page.getByTestId("look-at-board").textContent()).resolves.toContain("Look at the board");
    expect(await page.getByRole("button", { name: "Auk shows 5", exact: true }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Undo last roll" }).count()).toBe(0);
    await screenshot(page, "roll-pad-pool-360");

    await run.phase("Prove");
    await page.getByText("Look at the board: we are proving it.").first().waitFor();
    await run.teacher.dispose();
  });
});
