import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const head = demoTeachers.find((t) => t.role === "head")!;
const teacher = demoTeachers.find((t) => t.role === "teacher")!;

async function noSideways(page: Page, width: number) {
  const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(scrollWidth).toBeLessThanOrEqual(width);
}

/** A JSON request from inside the signed-in page, as the client itself would make it. */
async function apiFrom(page: Page, method: string, path: string, body?: unknown) {
  return page.evaluate(
    async ({ method, path, body }) => {
      const response = await fetch(path, {
        method,
        headers: body === undefined ? {} : { "content-type": "application/json" },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: response.status, body: await response.json().catch(() => null) };
    },
    { method, path, body },
  );
}

/** The number on the Department shelf's navigation link, or 0 when it shows none. */
async function navCount(page: Page) {
  const link = page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: /^Department shelf/ });
  const text = (await link.textContent()) ?? "";
  const match = text.match(/(\d+)/);
  return match ? Number(match[1]) : 0;
}

describe("the privacy notice in chromium", () => {
  let laptop: Awaited<ReturnType<typeof openBrowser>>;
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    laptop = await openBrowser(viewports.laptop);
    phone = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    await laptop.close();
    await phone.close();
  });

  it("is reached from the landing page without signing in and names the controller the operator set", async () => {
    const page = await laptop.context.newPage();
    await page.goto(appUrl);
    await page.getByRole("link", { name: "Privacy notice" }).click();
    await page.waitForURL(`${appUrl}/privacy`);
    await page.getByRole("heading", { name: "Privacy notice", level: 1 }).waitFor();
    for (const heading of ["Who is responsible", "Pupils", "Teachers and heads of department", "What Outroll does not do"]) {
      await page.getByRole("heading", { name: heading, level: 2 }).waitFor();
    }
    await page.getByText("Harbourside Academy", { exact: true }).waitFor();
    expect(await page.getByRole("link", { name: "privacy@harbourside.test" }).getAttribute("href")).toBe("mailto:privacy@harbourside.test");
    await page.getByRole("table", { name: "What Outroll keeps about pupils" }).getByText("Group nickname").waitFor();
    await screenshot(page, "privacy-laptop");
    await page.close();
  });

  it("reads on a phone without sideways scrolling", async () => {
    const page = await phone.context.newPage();
    await page.goto(`${appUrl}/privacy`);
    await page.getByText("Harbourside Academy", { exact: true }).waitFor();
    await noSideways(page, viewports.phone.width);
    await screenshot(page, "privacy-phone");
    await page.close();
  });
});

describe("the head of department's queue and Department page in chromium", () => {
  let headBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let teacherBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let headPhone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    headBrowser = await openBrowser(viewports.laptop);
    teacherBrowser = await openBrowser(viewports.laptop);
    headPhone = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    await headBrowser.close();
    await teacherBrowser.close();
    await headPhone.close();
  });

  it("counts a new proposal on the navigation and the home page, and counts it off once declined", async () => {
    const priya = await signInThroughUi(headBrowser.context, appUrl, head.email, demoPassword);
    const before = (await apiFrom(priya, "GET", "/api/shelf/proposals/waiting")).body.waiting as number;
    await expect.poll(() => navCount(priya)).toBe(before);

    const tomasz = await signInThroughUi(teacherBrowser.context, appUrl, teacher.email, demoPassword);
    const title = `Queue check ${crypto.randomUUID().slice(0, 6)}`;
    const created = await apiFrom(tomasz, "POST", "/api/lessons", { ...emptyLessonInput(), title, classGroup: "9M", status: "ready" });
    expect(created.status).toBe(201);
    const proposed = await apiFrom(tomasz, "POST", "/api/shelf/proposals", {
      lessonId: created.body.lesson.id,
      note: "For the spring term",
    });
    expect(proposed.status).toBe(201);

    await priya.goto(`${appUrl}/app`);
    await priya
      .getByRole("heading", {
        name: before + 1 === 1 ? "1 proposal waits for your decision" : `${before + 1} proposals wait for your decision`,
      })
      .waitFor();
    await expect.poll(() => navCount(priya)).toBe(before + 1);
    await screenshot(priya, "home-head-waiting-laptop");

    const onPhone = await signInThroughUi(headPhone.context, appUrl, head.email, demoPassword);
    await onPhone.getByRole("link", { name: "Decide on the proposals" }).waitFor();
    await screenshot(onPhone, "home-head-waiting-phone");
    await noSideways(onPhone, viewports.phone.width);
    await onPhone.close();

    await priya.getByRole("link", { name: "Decide on the proposals" }).click();
    await priya.waitForURL(`${appUrl}/app/shelf/proposals`);
    const proposalsTab = priya.getByRole("navigation", { name: "Department shelf" }).getByRole("link", { name: /^Proposals/ });
    const tabCount = async () => Number((await proposalsTab.textContent())?.match(/\d+/)?.[0] ?? 0);
    await expect.poll(tabCount).toBe(before + 1);
    const card = priya.getByRole("listitem").filter({ has: priya.getByRole("heading", { name: title }) });
    const decision = card.getByRole("group", { name: "Your decision" });
    await decision.waitFor();
    expect(await decision.getByRole("radio").count()).toBe(2);
    expect(await decision.getByRole("radio", { checked: true }).count()).toBe(0);
    await decision.getByText("Decline").click();
    await card.getByLabel("Why, for the teacher").fill("Add a Prove phase first");
    await card.getByRole("button", { name: "Decline" }).click();
    await priya.getByRole("heading", { name: `Waiting for your decision (${before})` }).waitFor();
    await expect.poll(() => navCount(priya)).toBe(before);
    await expect.poll(tabCount).toBe(before);
    await priya.close();
    await tomasz.close();
  });

  it("gives the department its own page with colleagues and invitations, and the old Colleagues address leads there", async () => {
    const page = await headBrowser.context.newPage();
    await page.goto(`${appUrl}/app/shelf/colleagues`);
    await page.waitForURL(`${appUrl}/app/department`);
    await page.getByRole("heading", { name: "Invite a colleague" }).waitFor();
    await page.getByRole("heading", { name: "Colleagues in the department" }).waitFor();
    await page.getByText(teacher.name).first().waitFor();
    expect(await page.getByRole("navigation", { name: "Department shelf" }).getByRole("link", { name: "Colleagues" }).count()).toBe(0);
    await screenshot(page, "department-head-laptop");
    await page.getByRole("contentinfo").getByRole("link", { name: "Privacy notice" }).click();
    await page.waitForURL(`${appUrl}/privacy`);
    await page.close();

    const phonePage = await headPhone.context.newPage();
    await phonePage.goto(`${appUrl}/app/department`);
    await phonePage.getByRole("heading", { name: "Invite a colleague" }).waitFor();
    await noSideways(phonePage, viewports.phone.width);
    await screenshot(phonePage, "department-head-phone");
    await phonePage.close();
  });
});
