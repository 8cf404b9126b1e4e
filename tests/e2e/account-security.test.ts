import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((t) => t.role === "teacher")!;

describe("account safety in chromium", () => {
  for (const [size, viewport] of [
    ["phone", viewports.phone],
    ["laptop", viewports.laptop],
  ] as const) {
    describe(`at ${size} size`, () => {
      let browser: Awaited<ReturnType<typeof openBrowser>>;
      beforeAll(async () => {
        browser = await openBrowser(viewport);
      });
      afterAll(() => browser.close());

      it("explains on the sign-up form why a common password is refused and stays on the form", async () => {
        const page = await browser.context.newPage();
        await page.goto(`${appUrl}/sign-up`);
        await page.getByLabel("Your name").fill("Morwenna Pike");
        await page.getByLabel("School e-mail").fill(`weak-${size}-${Date.now()}@outroll-tests.test`);
        await page.getByLabel("Password").fill("password12");
        await page.getByLabel("Your department").fill("Maths, Gullrock School");
        await page.getByRole("button", { name: "Create account" }).click();
        await expect(page.getByRole("alert").textContent()).resolves.toMatch(/too easy to guess/);
        expect(page.url()).toBe(`${appUrl}/sign-up`);
        await screenshot(page, `sign-up-weak-password-${size}`);
        await page.close();
      });

      it("answers a sign-up with an address that has an account by pointing to sign-in, without saying whether it exists", async () => {
        const page = await browser.context.newPage();
        await page.goto(`${appUrl}/sign-up`);
        await page.getByLabel("Your name").fill("Someone Else");
        await page.getByLabel("School e-mail").fill(teacher.email);
        await page.getByLabel("Password").fill("tidal-pool-lantern-42");
        await page.getByLabel("Your department").fill("Maths, Gullrock School");
        await page.getByRole("button", { name: "Create account" }).click();
        await expect(page.getByRole("alert").textContent()).resolves.toMatch(/may already have one/);
        await screenshot(page, `sign-up-existing-address-${size}`);
        await page.close();
      });
    });
  }
});
