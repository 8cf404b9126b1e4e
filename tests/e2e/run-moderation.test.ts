import { io as connect, type Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { EVENTS, type GroupJoinAck, type GroupRemovedBroadcast, type RollRecordAck } from "@shared/events";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { openBrowser, screenshot, signInThroughUi, viewports } from "../helpers/browser";

const appUrl = inject("appUrl");
const teacher = demoTeachers.find((each) => each.email === "tomasz.reid@harbourside.test")!;
const head = demoTeachers.find((each) => each.role === "head")!;

// Invented dice for the browser test.
const dice = [
  { name: "Puffin", faces: [2, 2, 2, 6, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Gannet", faces: [1, 5, 5, 5, 5, 5], colour: "amber", pattern: "stripes" },
  { name: "Fulmar", faces: [3, 3, 3, 4, 4, 4], colour: "plum", pattern: "checks" },
];

async function tapFace(page: Page, dieName: string, face: number) {
  await page.getByRole("button", { name: `${dieName} shows ${face}`, exact: true }).click();
}

/** A phone from Node that keeps recording rolls of its matchup until it is told to stop, counting what happens. */
function recordingPhone(socket: Socket, token: string, state: Extract<GroupJoinAck, { ok: true }>["state"]) {
  const answers: RollRecordAck[] = [];
  let running = true;
  const done = (async () => {
    while (running) {
      const faces = state.group.matchup!.map((index) => [state.run.dice[index].faces[Math.floor(Math.random() * 6)]]);
      const roll = { id: uuidv4(), tally: state.run.tally, matchup: state.group.matchup!, faces, recordedAt: new Date().toISOString() };
      answers.push(await socket.emitWithAck(EVENTS.rollRecord, { token, roll }));
      await new Promise((resolve) => setTimeout(resolve, 300));
    }
  })();
  return {
    answers,
    stop: async () => {
      running = false;
      await done;
    },
  };
}

describe("the teacher moderates groups on the Run board while phones are recording", () => {
  let teacherBrowser: Awaited<ReturnType<typeof openBrowser>>;
  let pupilBrowser: Awaited<ReturnType<typeof openBrowser>>;
  const sockets: Socket[] = [];
  beforeAll(async () => {
    teacherBrowser = await openBrowser(viewports.laptop);
    pupilBrowser = await openBrowser(viewports.phone);
  });
  afterAll(async () => {
    for (const socket of sockets) socket.disconnect();
    await teacherBrowser.close();
    await pupilBrowser.close();
  });

  it("removes a group and renames another: the removed phone is told and refused, the renamed phone shows its new nickname and goes on recording", async () => {
    const board = await signInThroughUi(teacherBrowser.context, appUrl, teacher.email, demoPassword);
    const headers = { origin: appUrl };
    const set = await board.request.post(`${appUrl}/api/dice-sets`, {
      headers,
      data: { name: "Sea-stack three", description: "", visibility: "private", dice },
    });
    expect(set.status()).toBe(201);
    const title = `Sea-stack run ${Date.now().toString(36)}`;
    const lesson = await board.request.post(`${appUrl}/api/lessons`, {
      headers,
      data: { ...emptyLessonInput(), title, classGroup: "9M", status: "ready", diceSetId: (await set.json()).id },
    });
    expect(lesson.status(), await lesson.text()).toBe(201);

    // The teacher opens the run with a cap of 20 groups.
    await board.goto(`${appUrl}/app/runs`);
    await board.getByLabel("Most groups that may join").fill("20");
    await board.getByRole("listitem").filter({ hasText: title }).getByRole("button", { name: "Open a class run" }).click();
    await board.waitForURL(/\/app\/runs\/[0-9a-f-]{36}$/);
    await board.getByTestId("live-state").filter({ hasText: "Live" }).waitFor();
    await board.getByTestId("joining-controls").filter({ hasText: "0 of 20 groups" }).waitFor();
    const runId = board.url().split("/").pop()!;
    const code = (await (await board.request.get(`${appUrl}/api/class-runs/${runId}`)).json()).joinCode as string;
    await board.getByRole("button", { name: "Move on to Roll" }).click();

    // A pupil's phone in chromium joins and records.
    const phone = await pupilBrowser.context.newPage();
    await phone.goto(`${appUrl}/pad/${code}`);
    await phone.getByLabel("Group nickname", { exact: true }).fill("Tide Pool");
    await phone.getByRole("button", { name: "Join with this nickname" }).click();
    await phone.getByRole("heading", { name: "Puffin v Gannet" }).waitFor();
    await tapFace(phone, "Puffin", 6);
    await tapFace(phone, "Gannet", 5);
    await phone.getByRole("button", { name: "Record 6 v 5" }).click();
    await phone.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();

    // A second phone (socket.io from Node) joins and keeps recording every 300 ms.
    const spammer = connect(appUrl, { path: "/socket.io", transports: ["websocket"], forceNew: true });
    sockets.push(spammer);
    await new Promise<void>((resolve) => spammer.once("connect", () => resolve()));
    const joined: GroupJoinAck = await spammer.emitWithAck(EVENTS.groupJoin, { code, nickname: "Noisy Neighbours", attemptId: uuidv4() });
    if (!joined.ok) throw new Error(joined.error.message);
    const told = new Promise<GroupRemovedBroadcast>((resolve) => spammer.once(EVENTS.groupRemoved, resolve));
    const recorder = recordingPhone(spammer, joined.token, joined.state);

    const groups = board.getByTestId("group-table");
    await groups.getByRole("rowheader", { name: /Noisy Neighbours/ }).waitFor();
    await board.getByTestId("joining-controls").filter({ hasText: "2 of 20 groups" }).waitFor();
    await expect.poll(() => recorder.answers.filter((answer) => answer.ok).length, { timeout: 10_000 }).toBeGreaterThan(2);
    await screenshot(board, "run-board-moderation-laptop");

    // Remove the recording group.
    await board.getByRole("button", { name: "Remove Noisy Neighbours" }).click();
    await board.getByRole("dialog").getByRole("button", { name: "Remove the group" }).click();
    await groups.getByRole("rowheader", { name: /Noisy Neighbours/ }).waitFor({ state: "detached" });
    expect(await told).toEqual({ runId, groupId: joined.state.group.id });
    await expect.poll(() => recorder.answers.at(-1), { timeout: 5_000 }).toMatchObject({ ok: false, error: { code: "group_removed" } });
    await recorder.stop();
    // Only the chromium phone's roll is left in the figures.
    await board
      .getByTestId("pooled-total")
      .filter({ hasText: "1 rolls from 1 group" })
      .or(board.getByTestId("pooled-total").filter({ hasText: "1 roll from 1 group" }))
      .waitFor();

    // Rename the chromium phone's group; the phone shows the new nickname and goes on recording.
    await board.getByRole("button", { name: "Rename Tide Pool" }).click();
    await board.getByLabel("New nickname for Tide Pool").fill("Lighthouse Lot");
    await board.getByRole("button", { name: "Save" }).click();
    await groups.getByRole("rowheader", { name: /Lighthouse Lot/ }).waitFor();
    await phone.getByText("Lighthouse Lot", { exact: true }).waitFor();
    await tapFace(phone, "Puffin", 2);
    await tapFace(phone, "Gannet", 5);
    await phone.getByRole("button", { name: "Record 2 v 5" }).click();
    await phone.getByTestId("delivery-status").filter({ hasText: "Saved" }).waitFor();
    await board.getByTestId("pooled-total").filter({ hasText: "2 rolls from 1 group" }).waitFor({ timeout: 10_000 });
    await screenshot(phone, "roll-pad-renamed-phone");

    // Lock joining: a new phone is refused.
    await board.getByRole("button", { name: "Lock joining" }).click();
    await board.getByTestId("joining-controls").filter({ hasText: "Joining is locked" }).waitFor();
    const late: GroupJoinAck = await spammer.emitWithAck(EVENTS.groupJoin, { code, nickname: "Late Lot" });
    expect(late).toMatchObject({ ok: false, error: { code: "joining_locked" } });

    // Leave the renamed group out: it stays on the board, marked, and out of the figures.
    await board.getByRole("button", { name: "Leave out Lighthouse Lot" }).click();
    await board.getByTestId("left-out-mark").waitFor();
    await board.getByTestId("pooled-total").filter({ hasText: "0 rolls" }).waitFor({ timeout: 10_000 });
    await screenshot(board, "run-board-moderated-laptop");
    await board.setViewportSize({ width: 390, height: 844 });
    await screenshot(board, "run-board-moderated-phone");

    // The head of department watching sees each group's state but no moderation controls.
    const headBrowser = await openBrowser(viewports.laptop);
    try {
      const watching = await signInThroughUi(headBrowser.context, appUrl, head.email, demoPassword);
      await watching.goto(`${appUrl}/app/runs/${runId}`);
      await watching
        .getByTestId("group-table")
        .getByRole("rowheader", { name: /Lighthouse Lot/ })
        .waitFor();
      await watching.getByTestId("left-out-mark").waitFor();
      await watching.getByText("Joining is locked", { exact: false }).waitFor();
      for (const name of ["Rename Lighthouse Lot", "Remove Lighthouse Lot", "Count again Lighthouse Lot", "Unlock joining"]) {
        expect(await watching.getByRole("button", { name }).count()).toBe(0);
      }
      await screenshot(watching, "run-board-head-watching-laptop");
    } finally {
      await headBrowser.close();
    }
  });
});
