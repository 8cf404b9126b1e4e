import pg from "pg";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot } from "../helpers/browser";
import { openPadTestRun, padTestDice } from "../helpers/pad-run-fixtures";

const appUrl = inject("appUrl");
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 1 });

/** Taps a face for each die of the matchup and records the roll. */
async function recordRoll(page: Page, faces: [number, number]) {
  await page.getByRole("button", { name: `Auk shows ${faces[0]}`, exact: true }).click();
  await page.getByRole("button", { name: `Razorbill shows ${faces[1]}`, exact: true }).click();
  await page.getByRole("button", { name: `Record ${faces[0]} v ${faces[1]}` }).click();
}

/** The ids of the rolls this phone logged, read from its storage. */
async function loggedRollIds(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const session = JSON.parse(localStorage.getItem("outroll.pad.session") ?? "null") as { groupId: string } | null;
    const log = JSON.parse(localStorage.getItem(`outroll.pad.log.${session?.groupId}`) ?? "[]") as { id: string }[];
    return log.map((entry) => entry.id);
  });
}

describe("the Roll pad with a lost connection (phone-sized chromium)", () => {
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    phone = await openBrowser({ width: 360, height: 740 });
  });
  afterAll(async () => {
    await phone.close();
    await pool.end();
  });

  it("joins, goes offline, reloads to the pad with its waiting rolls, and stores every roll once when back online", async () => {
    expect(padTestDice.map((die) => die.name)).toContain("Auk");
    const run = await openPadTestRun(appUrl);
    await run.phase("Roll");
    const page = await phone.context.newPage();

    // The landing page's way in for pupils.
    await page.goto(appUrl);
    await screenshot(page, "landing-join-a-class-360");
    await page.getByRole("link", { name: "Join a class" }).click();
    await page.getByLabel("Join code", { exact: true }).fill(run.joinCode.toLowerCase());
    await page.getByRole("button", { name: "Find the class run" }).click();
    await page.waitForURL(`${appUrl}/pad/${run.joinCode}`);
    await page.getByLabel("Group nickname", { exact: true }).fill("Harbour Otters");
    await screenshot(page, "roll-pad-join-360");
    await page.getByRole("button", { name: "Join with this nickname" }).click();
    await page.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();

    // The pad's service worker has taken the page over and cached its shell.
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 30_000 });
    // Chromium finds nothing stopping a pupil from adding the pad to the home screen (manifest, icons, worker).
    const cdp = await phone.context.newCDPSession(page);
    await expect(cdp.send("Page.getInstallabilityErrors").then((answer) => answer.installabilityErrors)).resolves.toEqual([]);

    await recordRoll(page, [5, 3]);
    // After Record, keyboard focus stays on the pad's next useful control: the first face of the next roll.
    await expect(page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).resolves.toBe("Auk shows 1");
    await recordRoll(page, [1, 7]);
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();

    await phone.context.setOffline(true);
    await recordRoll(page, [6, 2]);
    await recordRoll(page, [5, 4]);
    // Screen readers hear the count: the status is a polite live region.
    await page.getByRole("status").filter({ hasText: "2 waiting" }).waitFor();
    await expect(page.getByTestId("delivery-status").getAttribute("aria-live")).resolves.toBe("polite");

    const reload = await page.reload();
    expect(reload?.fromServiceWorker()).toBe(true);
    await page.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    await page.getByTestId("delivery-status").filter({ hasText: "2 waiting · offline" }).waitFor();
    await recordRoll(page, [6, 7]);
    await page.getByTestId("delivery-status").filter({ hasText: "3 waiting · offline" }).waitFor();
    await screenshot(page, "roll-pad-offline-360");

    await phone.context.setOffline(false);
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor({ timeout: 30_000 });
    await expect(page.getByTestId("running-score").textContent()).resolves.toBe("Auk 3 · Razorbill 2 · ties 0");

    // The worker serves the pad only: a teacher's page in the same browser is not under its control.
    const teacherPage = await phone.context.newPage();
    await teacherPage.goto(`${appUrl}/sign-in`);
    await teacherPage.getByLabel("E-mail").waitFor();
    await expect(teacherPage.evaluate(() => navigator.serviceWorker.controller)).resolves.toBeNull();
    await teacherPage.close();

    const ids = await loggedRollIds(page);
    expect(ids).toHaveLength(5);
    const stored = await pool.query<{ id: string }>("select id from roll where run_id = $1 and undone_at is null", [run.id]);
    expect(stored.rows.map((row) => row.id).sort()).toEqual([...ids].sort());
    await run.teacher.dispose();
  });

  it("fits a 360 px phone at 200% zoom, reflowing without sideways scrolling", async () => {
    const page = await phone.context.newPage();
    // 200% zoom on a 360 × 740 screen lays the page out in 180 × 370 CSS pixels, each drawn twice as large.
    await page.setViewportSize({ width: 180, height: 370 });
    await page.goto(`${appUrl}/pad`);
    await page.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "roll-pad-record-360-zoom-200");
  });
});
