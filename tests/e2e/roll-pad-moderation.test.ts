import pg from "pg";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot } from "../helpers/browser";
import { openPadTestRun } from "../helpers/pad-run-fixtures";

const appUrl = inject("appUrl");
const pool = new pg.Pool({ connectionString: inject("e2eDatabaseUrl"), max: 1 });

async function recordRoll(page: Page, faces: [number, number]) {
  await page.getByRole("button", { name: `Auk shows ${faces[0]}`, exact: true }).click();
  await page.getByRole("button", { name: `Razorbill shows ${faces[1]}`, exact: true }).click();
  await page.getByRole("button", { name: `Record ${faces[0]} v ${faces[1]}` }).click();
}

async function storedRolls(runId: string): Promise<number> {
  const result = await pool.query<{ count: string }>("select count(*) from roll where run_id = $1 and undone_at is null", [runId]);
  return Number(result.rows[0].count);
}

describe("the Roll pad when the teacher moves on, renames, removes and locks (phone-sized chromium)", () => {
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    phone = await openBrowser({ width: 360, height: 740 });
  });
  afterAll(async () => {
    await phone.close();
    await pool.end();
  });

  it("keeps rolls refused for the phase quietly, follows a rename, forgets a removed group and says joining is locked", async () => {
    const run = await openPadTestRun(appUrl);
    await run.phase("Roll");
    const page = await phone.context.newPage();
    await page.goto(`${appUrl}/pad/${run.joinCode}`);
    await page.getByLabel("Group nickname", { exact: true }).fill("Harbour Otters");
    await page.getByRole("button", { name: "Join with this nickname" }).click();
    await page.getByRole("heading", { name: "Auk v Razorbill" }).waitFor();
    const groupId = await page.evaluate(() => (JSON.parse(localStorage.getItem("outroll.pad.session")!) as { groupId: string }).groupId);

    // The teacher renames the group: the pad shows the new nickname, and keeps it through a reload.
    const renamed = await run.teacher.patch(`/api/class-runs/${run.id}/groups/${groupId}`, { data: { nickname: "Harbour Seals" } });
    expect(renamed.ok(), await renamed.text()).toBe(true);
    await page.getByTestId("group-nickname").filter({ hasText: "Harbour Seals" }).waitFor();
    await page.reload();
    await page.getByTestId("group-nickname").filter({ hasText: "Harbour Seals" }).waitFor();

    // Two rolls made on a phone that has not heard the class move on to Pool: refused with not_roll_phase, kept quietly.
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();
    await phone.context.setOffline(true);
    await page.getByTestId("delivery-status").filter({ hasText: "offline" }).waitFor({ timeout: 30_000 });
    await recordRoll(page, [5, 3]);
    await recordRoll(page, [6, 7]);
    await run.phase("Pool");
    await phone.context.setOffline(false);
    await page.getByTestId("look-at-board").filter({ hasText: "2 rolls are kept on this phone" }).waitFor({ timeout: 30_000 });
    await page.getByTestId("delivery-status").filter({ hasText: "2 waiting" }).waitFor();
    expect(await page.getByRole("alert").count()).toBe(0);
    expect(await storedRolls(run.id)).toBe(0);
    await screenshot(page, "roll-pad-pool-waiting-360");

    // Back in Roll, the kept rolls go by themselves, once each.
    await run.phase("Roll");
    await page.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor({ timeout: 30_000 });
    expect(await storedRolls(run.id)).toBe(2);

    // The teacher removes the group: the pad says so plainly and forgets the group's token.
    const removed = await run.teacher.delete(`/api/class-runs/${run.id}/groups/${groupId}`);
    expect(removed.ok(), await removed.text()).toBe(true);
    await page.getByText("Your teacher removed this group").waitFor();
    await expect(page.evaluate(() => localStorage.getItem("outroll.pad.session"))).resolves.toBeNull();
    await screenshot(page, "roll-pad-removed-360");

    // Joining again while the teacher has locked joining: a plain refusal, and nothing joined.
    const locked = await run.teacher.put(`/api/class-runs/${run.id}/joining`, { data: { locked: true } });
    expect(locked.ok(), await locked.text()).toBe(true);
    await page.getByRole("button", { name: "Join the class again" }).click();
    await page.getByLabel("Join code", { exact: true }).fill(run.joinCode);
    await page.getByRole("button", { name: "Find the class run" }).click();
    await page.getByLabel("Group nickname", { exact: true }).fill("Harbour Otters");
    await page.getByRole("button", { name: "Join with this nickname" }).click();
    await page.getByRole("alert").filter({ hasText: "Your teacher has closed joining" }).waitFor();
    await screenshot(page, "roll-pad-joining-locked-360");
    await run.teacher.dispose();
  });
});
