import ExcelJS from "exceljs";
import jStat from "jstat";
import Papa from "papaparse";
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyLessonInput, lessonPlanFromInput } from "@shared/schemas/lessons";
import { db } from "../../server/db/client";
import { diceSet, lesson, paperCount, roll, runGroup } from "../../server/db/schema/index";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";
import { insertFixtureRun, testDice, userIdByEmail } from "../helpers/results-fixtures";

let app: TestApp;
const head = demoTeachers.find((t) => t.role === "head")!;
const [tomasz, ada] = demoTeachers.filter((t) => t.role === "teacher");
const agents: Record<"tomasz" | "ada" | "head" | "signedOut", HttpAgent> = {} as never;
const marker = `T${crypto.randomUUID().slice(0, 6)}`;
let lessonId: string;
let paperRun: string;
let phoneRun: string;

const z95 = jStat.normal.inv(0.975, 0, 1);
/** Wilson (1927) score interval, written out here as an outside check of the server's figures. */
function wilson(successes: number, trials: number) {
  const p = successes / trials;
  const centre = (p + (z95 * z95) / (2 * trials)) / (1 + (z95 * z95) / trials);
  const half = (z95 / (1 + (z95 * z95) / trials)) * Math.sqrt((p * (1 - p)) / trials + (z95 * z95) / (4 * trials * trials));
  return { lower: centre - half, upper: centre + half };
}

const rollRow = (group: string, rollNumber: number, first: [string, number], second: [string, number]) => ({
  group,
  roll: String(rollNumber),
  die_1: first[0],
  faces_1: String(first[1]),
  die_2: second[0],
  faces_2: String(second[1]),
});

// Limpets typed roll by roll: Skua v Tern, Skua wins rolls 1 and 3 (10 > 9, 12 > 11), Tern wins roll 2 (18 > 1).
const limpetRolls = [
  rollRow("Limpets", 1, ["Skua", 10], ["Tern", 9]),
  rollRow("Limpets", 2, ["Skua", 1], ["Tern", 18]),
  rollRow("Limpets", 3, ["Skua", 12], ["Tern", 11]),
];

async function rollRowsOf(runId: string) {
  return (await db.select({ n: count() }).from(roll).where(eq(roll.runId, runId)))[0].n;
}

beforeAll(async () => {
  app = await startTestApp();
  for (const [key, email] of [
    ["tomasz", tomasz.email],
    ["ada", ada.email],
    ["head", head.email],
  ] as const) {
    agents[key] = new HttpAgent(app.baseUrl);
    await agents[key].signIn(email, demoPassword);
  }
  agents.signedOut = new HttpAgent(app.baseUrl);
  const owner = await userIdByEmail(db, tomasz.email);
  const [set] = await db
    .insert(diceSet)
    .values({ ownerId: owner.id, departmentId: owner.departmentId, name: `${marker} Skerry trio`, dice: testDice })
    .returning({ id: diceSet.id });
  const input = { ...emptyLessonInput(), title: `${marker} Paper lesson`, classGroup: "8K", diceSetId: set.id, rollsPerGroup: 20 };
  const [created] = await db
    .insert(lesson)
    .values({
      ownerId: owner.id,
      departmentId: owner.departmentId,
      title: input.title,
      classGroup: "8K",
      diceSetId: set.id,
      plan: lessonPlanFromInput(input),
    })
    .returning({ id: lesson.id });
  lessonId = created.id;
  phoneRun = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `${marker} Phone lesson`,
      classGroup: "8K",
      createdAt: new Date("2026-03-12T09:00:00Z"),
      groups: [{ nickname: "Puffins", matchup: [0, 1], rolls: 40 }],
      seed: 21,
    })
  ).runId;
}, 120_000);
afterAll(() => app.close());

describe("paper runs: the class field", () => {
  it("gives a paper run the class typed for it, so a second class shows under its own name, and the lesson's class otherwise", async () => {
    const second = await agents.tomasz.post("/api/results/paper-runs", { lessonId, taughtOn: "2026-03-13", classGroup: "9M" });
    expect(second.status).toBe(201);
    expect(second.body.classGroup).toBe("9M");
    paperRun = second.body.id;
    const plain = await agents.tomasz.post("/api/results/paper-runs", { lessonId, taughtOn: "2026-03-14" });
    expect(plain.body.classGroup).toBe("8K");
    const listed = await agents.tomasz.get(`/api/results/runs?lesson=${encodeURIComponent(`${marker} Paper`)}&classGroup=9M`);
    expect(listed.body.runs.map((run: { id: string }) => run.id)).toEqual([paperRun]);
    expect((await agents.tomasz.post("/api/results/paper-runs", { lessonId, classGroup: "x".repeat(41) })).status).toBe(400);
  });
});

describe("the tally grid: rolls", () => {
  it("answers the grid's dice, tallies, groups and the sheet's planned rows (the lesson's rolls per group)", async () => {
    const grid = await agents.tomasz.get(`/api/results/runs/${paperRun}/tally-grid`);
    expect(grid.status).toBe(200);
    expect(grid.body.run).toMatchObject({
      dieNames: ["Skua", "Tern", "Gannet"],
      tallies: [{ tally: 1, dicePerPlayer: 1, players: 2 }],
      isOwner: true,
      classGroup: "9M",
    });
    expect(grid.body.plannedRolls).toBe(20);
    expect(grid.body.counts).toEqual([]);
  });

  it("refuses a bad row with its row number and stores nothing, then stores the rolls in one go", async () => {
    const bad = await agents.tomasz.post(`/api/results/runs/${paperRun}/tally-grid/rolls`, {
      createGroups: true,
      rows: [limpetRolls[0], rollRow("Limpets", 2, ["Skua", 2], ["Tern", 18])],
    });
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe("paper_import_invalid");
    expect(bad.body.error.fields["row 2"].join(" ")).toContain("Skua has no face 2");
    expect(await rollRowsOf(paperRun)).toBe(0);

    const saved = await agents.tomasz.post(`/api/results/runs/${paperRun}/tally-grid/rolls`, { createGroups: true, rows: limpetRolls });
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({ imported: true, newRows: 3, newGroups: ["Limpets"] });
    const stored = await db.select().from(roll).where(eq(roll.runId, paperRun));
    expect(stored.map((entry) => entry.source)).toEqual(["paper", "paper", "paper"]);
    expect(stored.map((entry) => entry.winnerSeat).sort()).toEqual([0, 0, 1]);
  });

  it("stores a roll once whether it is typed again or uploaded as CSV (the same ids)", async () => {
    const again = await agents.tomasz.post(`/api/results/runs/${paperRun}/tally-grid/rolls`, {
      rows: [...limpetRolls, rollRow("Limpets", 4, ["Skua", 5], ["Tern", 4])],
    });
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ newRows: 1, duplicateRows: 3 });
    const form = new FormData();
    form.set(
      "file",
      new Blob(["group,roll,die_1,faces_1,die_2,faces_2\r\nLimpets,4,Skua,5,Tern,4\r\n"], { type: "text/csv" }),
      "sheet.csv",
    );
    const upload = await agents.tomasz.postForm(`/api/results/runs/${paperRun}/paper-import`, form);
    expect(upload.body).toMatchObject({ newRows: 0, duplicateRows: 1 });
    expect(await rollRowsOf(paperRun)).toBe(4);
  });
});

describe("the tally grid: counts", () => {
  it("refuses bad counts whole, each row with its problem, and stores nothing", async () => {
    const path = `/api/results/runs/${paperRun}/tally-grid/counts`;
    const refused = await agents.tomasz.put(path, {
      counts: [
        { group: "Whelks", dice: ["Tern", "Gannet"], firstWins: 5, ties: 0, secondWins: 4 },
        { group: "Limpets", dice: ["Skua", "Skua"], firstWins: 1, ties: 0, secondWins: 1 },
        { group: "Limpets", dice: ["Skua", "Tern"], firstWins: 1, ties: 2, secondWins: 1 },
        { group: "Limpets", dice: ["Gannet", "Puffin"], firstWins: 1, ties: 0, secondWins: 1 },
      ],
    });
    expect(refused.status).toBe(422);
    expect(Object.keys(refused.body.error.fields)).toEqual(["row 1", "row 2", "row 3", "row 4"]);
    expect(refused.body.error.fields["row 1"][0]).toContain('no group "Whelks"');
    expect(refused.body.error.fields["row 3"][0]).toContain("cannot tie");
    expect(refused.body.error.fields["row 4"][0]).toContain('"Puffin" is not a die');
    const negative = await agents.tomasz.put(path, {
      counts: [{ group: "Limpets", dice: ["Skua", "Tern"], firstWins: -1, ties: 0, secondWins: 1 }],
    });
    expect(negative.status).toBe(400);
    expect(negative.body.error.code).toBe("invalid_input");
    const twice = await agents.tomasz.put(path, {
      counts: [
        { group: "Limpets", dice: ["Skua", "Tern"], firstWins: 1, ties: 0, secondWins: 1 },
        { group: "limpets", dice: ["Tern", "Skua"], firstWins: 1, ties: 0, secondWins: 1 },
      ],
    });
    expect(twice.body.error.fields["row 2"][0]).toContain("has this matchup twice");
    expect((await db.select({ n: count() }).from(paperCount).where(eq(paperCount.runId, paperRun)))[0].n).toBe(0);
  });

  it("stores each group's win/tie/loss counts per matchup as counts, writing no roll", async () => {
    const saved = await agents.tomasz.put(`/api/results/runs/${paperRun}/tally-grid/counts`, {
      createGroups: true,
      counts: [
        // Typed from Tern's side: stored from Skua's (the lower die) with the wins swapped.
        { group: "Razorbills", dice: ["Tern", "Skua"], firstWins: 8, ties: 0, secondWins: 12 },
        { group: "Razorbills", dice: ["Tern", "Gannet"], firstWins: 0, ties: 0, secondWins: 0 },
        { group: "Limpets", dice: ["Gannet", "Skua"], firstWins: 9, ties: 0, secondWins: 6 },
      ],
    });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ saved: 2, removed: 0, newGroups: ["Razorbills"] });
    const stored = await db.select().from(paperCount).where(eq(paperCount.runId, paperRun));
    expect(stored.map((row) => [row.matchupKey, row.firstWins, row.ties, row.secondWins]).sort()).toEqual([
      ["0-1", 12, 0, 8],
      ["0-2", 6, 0, 9],
    ]);
    const [razorbills] = await db
      .select()
      .from(runGroup)
      .where(and(eq(runGroup.runId, paperRun), eq(runGroup.nickname, "Razorbills")));
    expect(razorbills.source).toBe("paper");
    expect((await db.select({ n: count() }).from(roll).where(eq(roll.groupId, razorbills.id)))[0].n).toBe(0);
    expect(await rollRowsOf(paperRun)).toBe(4);
  });

  it("pools counts into the counts, frequencies and Wilson intervals, never into the convergence series", async () => {
    const results = await agents.tomasz.get(`/api/results/runs/${paperRun}`);
    expect(results.status).toBe(200);
    const skuaTern = results.body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    // 4 rolls typed one by one (Skua 3 wins, Tern 1) and Razorbills' 20 counted (Skua 12, Tern 8).
    expect(skuaTern).toMatchObject({ rolls: 24, countedRolls: 20, decidedRolls: 24 });
    expect(skuaTern.seats.map((seat: { wins: number; losses: number }) => [seat.wins, seat.losses])).toEqual([
      [15, 9],
      [9, 15],
    ]);
    expect(skuaTern.frequencyUnderTieRule).toBeCloseTo(15 / 24, 12);
    const outside = wilson(15, 24);
    expect(skuaTern.interval.lower).toBeCloseTo(outside.lower, 9);
    expect(skuaTern.interval.upper).toBeCloseTo(outside.upper, 9);
    // The series has a point per roll typed one by one and none for the counts.
    expect(skuaTern.convergence.map((point: { rolls: number }) => point.rolls)).toEqual([1, 2, 3, 4]);
    const skuaGannet = results.body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-2");
    expect(skuaGannet).toMatchObject({ rolls: 15, countedRolls: 15, convergence: [] });
    expect(results.body.pooled.totals).toMatchObject({ rolls: 39, countedRolls: 35 });
    const razorbills = results.body.pooled.groups.find((group: { groupNickname: string }) => group.groupNickname === "Razorbills");
    expect(razorbills).toMatchObject({ rolls: 20, countedRolls: 20, sources: ["paper"] });
    expect(razorbills.test.trials).toBe(20);
    expect(results.body.groups.find((group: { nickname: string }) => group.nickname === "Limpets").rolls).toBe(4 + 15);
    const listed = await agents.tomasz.get(`/api/results/runs?lesson=${encodeURIComponent(`${marker} Paper`)}&classGroup=9M`);
    expect(listed.body.runs[0]).toMatchObject({ rollCount: 39, paperRollCount: 39, countedRollCount: 35, recordedOn: "paper" });
  });

  it("exports no roll row for counts, and the summary says which rows are counts", async () => {
    const rolls = await agents.tomasz.get(`/api/results/runs/${paperRun}/rolls.csv`);
    const rollRows = Papa.parse<Record<string, string>>(rolls.text.replace(/^\ufeff/, ""), { header: true, skipEmptyLines: true }).data;
    expect(rollRows).toHaveLength(4);
    expect(new Set(rollRows.map((row) => row.group))).toEqual(new Set(["Limpets"]));

    const summary = await agents.tomasz.get(`/api/results/runs/${paperRun}/summary.csv`);
    const rows = Papa.parse<Record<string, string>>(summary.text.replace(/^\ufeff/, ""), { header: true, skipEmptyLines: true }).data;
    const row = (section: string, group: string, matchup: string) =>
      rows.find((entry) => entry.section === section && entry.group === group && entry.matchup === matchup)!;
    expect(row("matchup", "", "Skua v Tern")).toMatchObject({ rolls: "24", entered_as: "rolls and counts", rolls_from_counts: "20" });
    expect(row("matchup", "", "Skua v Gannet")).toMatchObject({ rolls: "15", entered_as: "counts", rolls_from_counts: "15" });
    expect(row("group", "Razorbills", "Skua v Tern")).toMatchObject({
      rolls: "20",
      first_die_wins: "12",
      entered_as: "counts",
      rolls_from_counts: "20",
    });
    expect(row("group", "Limpets", "Skua v Tern")).toMatchObject({ rolls: "4", entered_as: "rolls", rolls_from_counts: "0" });

    const workbookResponse = await agents.tomasz.get(`/api/results/runs/${paperRun}/results.xlsx`);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(workbookResponse.bytes as never);
    expect(workbook.getWorksheet("Rolls")!.rowCount).toBe(1 + 4);
    const sheet = workbook.getWorksheet("Summary")!;
    const header = (sheet.getRow(1).values as unknown[]).slice(1);
    const enteredAs = header.indexOf("entered_as") + 1;
    const values: string[] = [];
    sheet.eachRow((line, number) => {
      if (number > 1) values.push(String(line.getCell(enteredAs).value));
    });
    expect(values).toContain("counts");
    expect(values).toContain("rolls and counts");
  });

  it("pools a counted paper run with a phone class, the counts adding to the phone class's rolls", async () => {
    const pooled = await agents.tomasz.get(`/api/results/pooled?runIds=${phoneRun},${paperRun}&dicePerPlayer=1`);
    expect(pooled.status).toBe(200);
    const phone = await agents.tomasz.get(`/api/results/runs/${phoneRun}`);
    const phoneSkuaTern = phone.body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    const both = pooled.body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    expect(both.rolls).toBe(phoneSkuaTern.rolls + 24);
    expect(both.countedRolls).toBe(20);
    expect(both.seats[0].wins).toBe(phoneSkuaTern.seats[0].wins + 15);
    // The series holds the phone class's rolls and the 4 typed one by one, not the 20 counted.
    expect(both.convergence.at(-1).rolls).toBe(phoneSkuaTern.rolls + 4);
    expect(pooled.body.contributions.map((share: { run: { classGroup: string } }) => share.run.classGroup)).toEqual(["8K", "9M"]);
  });

  it("replaces a tally's counts on the next save, removing rows left out", async () => {
    const saved = await agents.tomasz.put(`/api/results/runs/${paperRun}/tally-grid/counts`, {
      counts: [{ group: "Razorbills", dice: ["Skua", "Tern"], firstWins: 11, ties: 0, secondWins: 9 }],
    });
    expect(saved.body).toMatchObject({ saved: 1, removed: 2 });
    expect(saved.body.counts).toEqual([
      expect.objectContaining({ group: "Razorbills", dice: ["Skua", "Tern"], firstWins: 11, ties: 0, secondWins: 9, tally: 1 }),
    ]);
    const results = await agents.tomasz.get(`/api/results/runs/${paperRun}`);
    expect(results.body.pooled.totals).toMatchObject({ rolls: 24, countedRolls: 20 });
  });
});

describe("the tally grid: who may use it", () => {
  it("answers 401 signed out, 404 to another teacher, 403 to the head who may only read, and lets the head read the grid", async () => {
    const body = { counts: [] };
    expect((await agents.signedOut.get(`/api/results/runs/${paperRun}/tally-grid`)).status).toBe(401);
    expect((await agents.ada.get(`/api/results/runs/${paperRun}/tally-grid`)).status).toBe(404);
    expect((await agents.ada.put(`/api/results/runs/${paperRun}/tally-grid/counts`, body)).status).toBe(404);
    const headGrid = await agents.head.get(`/api/results/runs/${paperRun}/tally-grid`);
    expect(headGrid.status).toBe(200);
    expect(headGrid.body.run.isOwner).toBe(false);
    expect((await agents.head.put(`/api/results/runs/${paperRun}/tally-grid/counts`, body)).status).toBe(403);
    expect((await agents.head.post(`/api/results/runs/${paperRun}/tally-grid/rolls`, { rows: limpetRolls })).status).toBe(403);
    expect((await agents.tomasz.get(`/api/results/runs/not-a-run/tally-grid`)).status).toBe(400);
  });

  it("refuses counts for a three-player tally: counts cannot say which seats tied", async () => {
    const trio = (
      await insertFixtureRun(db, {
        ownerEmail: tomasz.email,
        title: `${marker} Trio`,
        classGroup: "8K",
        players: 3,
        groups: [{ nickname: "Crabs", matchup: [0, 1, 2], rolls: 3 }],
      })
    ).runId;
    const refused = await agents.tomasz.put(`/api/results/runs/${trio}/tally-grid/counts`, {
      counts: [{ group: "Crabs", dice: ["Skua", "Tern"], firstWins: 1, ties: 0, secondWins: 0 }],
    });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe("counts_need_two_players");
  });
});
