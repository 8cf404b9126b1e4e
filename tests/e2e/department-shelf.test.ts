import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import type { ReceivedMail } from "@shared/schemas/dev-mail";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { demoTemplates } from "../../seed/seed-shelf";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const head = demoTeachers.find((t) => t.role === "head")!;

/** The newest e-mail for `email` whose subject matches, as the server's local fake mail server received it (read over its dev API). */
async function mailFor(email: string, subject: RegExp): Promise<ReceivedMail> {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const response = await fetch(`${appUrl}/api/dev/mail`);
    expect(response.status).toBe(200);
    const { messages } = (await response.json()) as { messages: ReceivedMail[] };
    const found = messages.find((message) => message.to.includes(email) && subject.test(message.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no e-mail matching ${subject} for ${email}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

async function noSideways(page: Page, width: number) {
  const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(scrollWidth).toBeLessThanOrEqual(width);
}

describe("Department shelf in chromium: invitation by e-mail, joining, copying a template and editing the copy", () => {
  let laptop: Awaited<ReturnType<typeof openBrowser>>;
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  const email = `new-colleague-${crypto.randomUUID().slice(0, 8)}@harbourside.test`;
  let joinLink = "";

  beforeAll(async () => {
    laptop = await openBrowser(viewports.laptop);
    phone = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    await laptop.close();
    await phone.close();
  });

  it("lets the head of department invite a colleague, and the invitation e-mail reaches the fake mail server", async () => {
    const page = await signInThroughUi(laptop.context, appUrl, head.email, demoPassword);
    await page.getByRole("navigation", { name: "Product areas" }).getByRole("link", { name: "Department", exact: true }).click();
    await page.waitForURL(`${appUrl}/app/department`);
    await page.getByRole("heading", { name: "Maths, Harbourside Academy" }).waitFor();

    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Enter an e-mail address such as name@school.test.").waitFor();

    await page.getByLabel("Colleague's school e-mail").fill(email);
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Invitation sent").waitFor();
    const waiting = page.getByRole("list", { name: "Invitations waiting" });
    await waiting.getByText(email).waitFor();
    await waiting.getByText(/Expires in 6 days|Expires in 7 days/).waitFor();
    await screenshot(page, "shelf-colleagues-head-laptop");

    const message = await mailFor(email, /invites you to join/);
    expect(message.subject).toBe("Priya Castellanos invites you to join Maths, Harbourside Academy on Outroll");
    joinLink = message.links.find((link) => new URL(link).pathname === "/join")!;
    expect(joinLink.startsWith(`${appUrl}/join?invitation=`)).toBe(true);

    await page.goto(`${appUrl}/dev/mail`);
    await page.getByRole("heading", { name: message.subject }).waitFor();
    await page.getByRole("link", { name: joinLink }).waitFor();
    await page.getByText("Show the HTML version").click();
    await page.frameLocator("iframe").getByText("Join the department").waitFor();
    await screenshot(page, "dev-mail-laptop");
    await page.close();
  });

  it("lets the invited teacher follow the e-mail link on a phone, sign up and join the department", async () => {
    const page = await phone.context.newPage();
    await page.goto(joinLink);
    await page.getByText("Priya Castellanos", { exact: true }).waitFor();
    await page.getByText("Maths, Harbourside Academy", { exact: true }).waitFor();
    await expect(page.getByLabel("E-mail").inputValue()).resolves.toBe(email);
    await noSideways(page, viewports.phone.width);
    await screenshot(page, "join-phone");

    await page.getByLabel("Your name").fill("Morgan Tideswell");
    await page.getByLabel("Choose a password").fill("a-long-password-2026");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(`${appUrl}/app/shelf`);
    await page.getByText("Teacher · Maths, Harbourside Academy").waitFor();
    await page.getByRole("list", { name: "Templates" }).waitFor();
    for (const demo of demoTemplates) {
      await page.getByRole("link", { name: demo.lessonTitle }).waitFor();
    }
    await noSideways(page, viewports.phone.width);
    await screenshot(page, "shelf-teacher-phone");

    // The same link a second time: the invitation works once.
    await page.goto(joinLink);
    await page.getByText("This invitation has already been used").waitFor();
    await page.close();
  });

  it("lets the new teacher copy a template, edit the copy and see the materials list change", async () => {
    const page = await phone.context.newPage();
    await page.goto(`${appUrl}/app/shelf`);
    const title = demoTemplates[0].lessonTitle;
    await page.getByRole("link", { name: title }).click();
    await page.getByRole("heading", { name: "Versions" }).waitFor();
    await page.getByText(demoTemplates[0].earlier[0].changeNote).first().waitFor();
    await noSideways(page, viewports.phone.width);
    await screenshot(page, "shelf-template-phone");

    await page.getByRole("button", { name: "Copy version 2 into my lessons" }).click();
    await page.getByText("Copied into your lessons").waitFor();
    await page.getByRole("link", { name: "Open your copy" }).click();
    await page.waitForURL(/\/app\/lessons\/[0-9a-f-]{36}$/);
    await page.getByText("Copied from a Department shelf template (version 2).").waitFor();

    const sheets = page.getByTestId("recording-sheets");
    await sheets.waitFor();
    const before = await sheets.textContent();
    const totalBefore = (await page.getByTestId("total-dice").count()) ? await page.getByTestId("total-dice").textContent() : null;
    const groups = page.getByLabel("Groups", { exact: true });
    const planned = Number(await groups.inputValue());
    await groups.fill(String(planned - 4));
    await page.waitForFunction((text) => document.querySelector('[data-testid="recording-sheets"]')?.textContent !== text, before);
    const after = await sheets.textContent();
    expect(after).not.toBe(before);
    expect(Number(after!.match(/^(\d+) recording sheets/)![1])).toBeLessThan(Number(before!.match(/^(\d+) recording sheets/)![1]));
    if (totalBefore !== null) {
      expect(Number(await page.getByTestId("total-dice").textContent())).toBeLessThan(Number(totalBefore));
    }
    await screenshot(page, "shelf-copy-edited-phone");

    await page.getByRole("button", { name: "Save lesson" }).first().click();
    await page.getByRole("status").filter({ hasText: /saved/i }).waitFor();

    // The copy is the teacher's own: propose it back for the shelf.
    await page.goto(`${appUrl}/app/shelf/proposals`);
    const picker = page.getByLabel("Lesson to propose");
    const copyValue = await picker.locator("option", { hasText: title }).first().getAttribute("value");
    await picker.selectOption(copyValue!);
    await page.getByLabel("Note for your head of department").fill("Four fewer groups suits a small set.");
    await page.getByRole("button", { name: "Propose for the shelf" }).click();
    await page.getByRole("heading", { name: "Your proposals waiting (1)" }).waitFor();
    await noSideways(page, viewports.phone.width);
    await screenshot(page, "shelf-proposals-teacher-phone");
    await page.close();
  });

  it("shows the head of department the shelf, the template with its versions and the proposal queue at laptop size", async () => {
    const page = await laptop.context.newPage();
    await page.goto(`${appUrl}/app/shelf`);
    await page.getByRole("list", { name: "Templates" }).waitFor();
    await page.getByRole("button", { name: "Publish a lesson" }).click();
    await page.getByLabel("Lesson to publish").waitFor();
    await screenshot(page, "shelf-head-laptop");

    await page.getByRole("link", { name: demoTemplates[0].lessonTitle }).click();
    await page.getByRole("heading", { name: "Versions" }).waitFor();
    await page.getByRole("link", { name: "View version 1" }).click();
    await page.getByText("An older version; the current one is version 2", { exact: false }).waitFor();
    await screenshot(page, "shelf-template-version1-laptop");

    await page.goto(`${appUrl}/app/shelf/proposals`);
    await page.getByRole("heading", { name: "Waiting for your decision (1)" }).waitFor();
    await page.getByText("Four fewer groups suits a small set.").waitFor();
    await page.getByText("Read the lesson as it stands").click();
    // Nothing is decided beforehand: no choice is ticked and neither form is shown until the head picks one.
    const decision = page.getByRole("group", { name: "Your decision" });
    expect(await decision.getByRole("radio", { checked: true }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Approve and publish" }).count()).toBe(0);
    await screenshot(page, "shelf-proposals-head-laptop");

    await decision.getByText("Approve").click();
    expect(await page.getByRole("group", { name: "Publish it as" }).getByRole("radio", { checked: true }).count()).toBe(0);
    await page.getByRole("button", { name: "Approve and publish" }).click();
    await page.getByText("Choose whether it becomes a new template or the next version of one.").waitFor();
    await page.getByText("The next version of a template").click();
    await page.getByRole("button", { name: "Approve and publish" }).click();
    await page.getByText("Write a change note of a few words", { exact: false }).waitFor();
    await page.getByLabel("Change note").fill("Smaller classes: four fewer groups, from Morgan's copy");
    await page.getByLabel("Template it updates").selectOption({ label: `${demoTemplates[0].lessonTitle} (now version 2)` });
    await page.getByRole("button", { name: "Approve and publish" }).click();
    await page.getByRole("heading", { name: "Waiting for your decision (0)" }).waitFor();
    await page.getByRole("heading", { name: "Decided" }).waitFor();

    await page.goto(`${appUrl}/app/shelf`);
    const card = page.getByRole("listitem").filter({ hasText: demoTemplates[0].lessonTitle });
    await card.getByText("Version 3").waitFor();
    await card.getByText("Smaller classes: four fewer groups", { exact: false }).waitFor();
    // The new version credits the teacher whose proposal it was, beside the head who published it.
    await card.getByText(/Proposed by Morgan Tideswell, published by Priya Castellanos/).waitFor();
    await screenshot(page, "shelf-after-approval-laptop");
    await page.close();
  });

  it("lets the new teacher reset a forgotten password through the e-mailed link", async () => {
    const fresh = await openBrowser(viewports.phone);
    try {
      const page = await fresh.context.newPage();
      await page.goto(`${appUrl}/sign-in`);
      await page.getByRole("link", { name: "Forgot your password?" }).click();
      await page.waitForURL(`${appUrl}/forgot-password`);
      await page.getByLabel("E-mail").fill(email);
      await page.getByRole("button", { name: "Send the link" }).click();
      await page.getByText("Check your e-mail").waitFor();
      await screenshot(page, "forgot-password-phone");

      const message = await mailFor(email, /new Outroll password/);
      const link = message.links.find((entry) => new URL(entry).pathname === "/reset-password")!;
      await page.goto(link);
      await page.getByLabel("New password", { exact: true }).fill("a-fresh-tide-password");
      await page.getByLabel("New password again").fill("a-different-password");
      await page.getByRole("button", { name: "Set the new password" }).click();
      await page.getByText("The two passwords are not the same.").waitFor();
      await page.getByLabel("New password again").fill("a-fresh-tide-password");
      await page.getByRole("button", { name: "Set the new password" }).click();
      await page.getByText("Password changed").waitFor();
      await noSideways(page, viewports.phone.width);
      await screenshot(page, "reset-password-phone");
      await page.close();

      const signedIn = await signInThroughUi(fresh.context, appUrl, email, "a-fresh-tide-password");
      await signedIn.getByText("Teacher · Maths, Harbourside Academy").waitFor();

      // The link works once.
      await signedIn.goto(link);
      await signedIn.getByLabel("New password", { exact: true }).fill("yet-another-password");
      await signedIn.getByLabel("New password again").fill("yet-another-password");
      await signedIn.getByRole("button", { name: "Set the new password" }).click();
      await signedIn.getByText("This link has expired or was already used.").waitFor();
    } finally {
      await fresh.close();
    }
  });
});
