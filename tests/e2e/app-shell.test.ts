import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((t) => t.role === "teacher")!;

describe("the app shell in chromium", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(viewports.laptop);
  });
  afterAll(() => browser.close());

  it("shows the landing page and the sign-in page to a visitor", async () => {
    const page = await browser.context.newPage();
    await page.goto(appUrl);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toMatch(/beat each other/);
    await screenshot(page, "landing-laptop");
    await page.getByRole("link", { name: "I have an account" }).click();
    await page.waitForURL(`${appUrl}/sign-in`);
    await screenshot(page, "sign-in-laptop");
    await page.close();
  });

  it("explains a wrong password without leaving the form", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${appUrl}/sign-in`);
    await page.getByLabel("E-mail").fill(teacher.email);
    await page.getByLabel("Password").fill("not-the-right-one");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("alert").textContent()).resolves.toMatch(/invalid email or password/i);
    expect(page.url()).toBe(`${appUrl}/sign-in`);
    await page.close();
  });

  it("signs a demo teacher in through the form and shows the shell with every product area", async () => {
    const page = await signInThroughUi(browser.context, appUrl, teacher.email, demoPassword);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(`Welcome, ${teacher.name.split(" ")[0]}`);
    const nav = page.getByRole("navigation", { name: "Product areas" });
    const labels = await nav.getByRole("link").allTextContents();
    expect(labels).toEqual(["Dice bench", "Set finder", "Lessons", "Department shelf", "Class runs", "Results", "Department"]);
    await page.getByText("Teacher · Maths, Harbourside Academy").waitFor();
    await screenshot(page, "app-home-laptop");

    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${appUrl}/`);
    await page.goto(`${appUrl}/app`);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.close();
  });

  it("creates an account through the sign-up form and makes the new teacher head of their department", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${appUrl}/sign-up`);
    await page.getByRole("button", { name: "Create account" }).click();
    await page.getByText("Enter your name as colleagues know it.").waitFor();
    await page.getByLabel("Your name").fill("Morwenna Pike");
    await page.getByLabel("School e-mail").fill(`morwenna-${Date.now()}@outroll-tests.test`);
    await page.getByLabel("Password").fill("a-long-password");
    await page.getByLabel("Your department").fill("Maths, Gullrock School");
    await screenshot(page, "sign-up-laptop");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL(`${appUrl}/app`);
    await page.getByText("Head of department · Maths, Gullrock School").waitFor();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${appUrl}/`);
    await page.close();
  });

  it("fits a 390 px phone: the shell, the sign-in page and the not-found page", async () => {
    const phone = await openBrowser(viewports.phone);
    try {
      const signIn = await phone.context.newPage();
      await signIn.goto(`${appUrl}/sign-in`);
      await screenshot(signIn, "sign-in-phone");
      const page = await signInThroughUi(phone.context, appUrl, teacher.email, demoPassword);
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(width).toBeLessThanOrEqual(viewports.phone.width);
      await screenshot(page, "app-home-phone");
      await page.goto(`${appUrl}/no-such-page`);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("This page is not here");
      await screenshot(page, "not-found-phone");
    } finally {
      await phone.close();
    }
  });
});
