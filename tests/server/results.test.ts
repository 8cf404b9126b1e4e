import ExcelJS from "exceljs";
import Papa from "papaparse";
import { and, count, eq, isNull, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { lessonPlanFromInput, emptyLessonInput } from "@shared/schemas/lessons";
import { paperImportColumns } from "@shared/schemas/paper-import";
import { rollsExportColumns, summaryExportColumns } from "@shared/results/export-columns";
import { db } from "../../server/db/client";
import { classRun, diceSet, guessVote, lesson, paperImport, roll, runGroup } from "../../server/db/schema/index";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { HttpAgent, startTestApp, uniqueEmail, type TestApp } from "../helpers/test-app";
import { insertFixtureRun, testDice, userIdByEmail } from "../helpers/results-fixtures";

let app: TestApp;
const head = demoTeachers.find((t) => t.role === "head")!;
const [tomasz, ada] = demoTeachers.filter((t) => t.role === "teacher");
const agents: Record<"tomasz" | "ada" | "head" | "outsider" | "signedOut", HttpAgent> = {} as never;
// A unique marker keeps these runs apart from any other file's runs in the shared test database.
const marker = `R${crypto.randomUUID().slice(0, 6)}`;
let mainRun: string;
let secondRun: string;
let adaRun: string;
let openRun: string;

/** Rolls that count in a run, straight from the database. */
async function liveRolls(runId: string, includeSimulated = true) {
  const rows = await db
    .select({ n: count() })
    .from(roll)
    .where(and(eq(roll.runId, runId), isNull(roll.undoneAt), includeSimulated ? undefined : sql`${roll.source} <> 'simulated'`));
  return rows[0].n;
}

function csvRows(text: string) {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed;
}

function csvForm(csv: string, options: { createGroups?: boolean; name?: string } = {}) {
  const form = new FormData();
  form.set("createGroups", options.createGroups ? "true" : "false");
  form.set("file", new Blob([csv], { type: "text/csv" }), options.name ?? "sheets.csv");
  return form;
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
  agents.outsider = new HttpAgent(app.baseUrl);
  await agents.outsider.post("/api/auth/sign-up/email", {
    name: "Wren Calder",
    email: uniqueEmail("results-outsider"),
    password: "a-long-password",
  });
  expect((await agents.outsider.post("/api/departments", { name: "Maths, Saltmarsh School" })).status).toBe(201);
  agents.signedOut = new HttpAgent(app.baseUrl);

  mainRun = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `${marker} No best die, Skerry trio`,
      classGroup: "8K",
      createdAt: new Date("2026-03-12T09:00:00Z"),
      groups: [
        { nickname: "Puffins", matchup: [0, 1], rolls: 40, undone: 3 },
        { nickname: 'Gulls, "the loud ones"', matchup: [1, 2], rolls: 35 },
        { nickname: "=Crabs", matchup: [2, 0], rolls: 30, undone: 1 },
        { nickname: "Virtual class", matchup: [0, 1], rolls: 25, source: "simulated" },
      ],
      votes: [0, 0, 2],
      seed: 11,
    })
  ).runId;
  // Same dice listed in another order under other names: still "the same set" for pooling.
  secondRun = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `${marker} No best die again`,
      classGroup: "9M",
      createdAt: new Date("2026-03-19T09:00:00Z"),
      dice: [
        { ...testDice[2], name: "Northern gannet" },
        { ...testDice[0], name: "Great skua" },
        { ...testDice[1], name: "Arctic tern" },
      ],
      groups: [
        { nickname: "Seals", matchup: [1, 2], rolls: 4500 },
        { nickname: "Otters", matchup: [0, 1], rolls: 20 },
      ],
      seed: 12,
    })
  ).runId;
  adaRun = (
    await insertFixtureRun(db, {
      ownerEmail: ada.email,
      title: `${marker} Ada's trio lesson`,
      classGroup: "9M",
      createdAt: new Date("2026-03-20T09:00:00Z"),
      groups: [{ nickname: "Limpets", matchup: [0, 1], rolls: 30 }],
      seed: 13,
    })
  ).runId;
  openRun = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `${marker} Still running`,
      classGroup: "8K",
      status: "open",
      groups: [{ nickname: "Whelks", matchup: [0, 1], rolls: 5 }],
    })
  ).runId;
}, 120_000);
afterAll(() => app.close());

describe("Results archive", () => {
  it("lists the teacher's closed runs with roll and group counts equal to the database's, leaving out open runs and undone rolls", async () => {
    const response = await agents.tomasz.get(`/api/results/runs?lesson=${marker}`);
    expect(response.status).toBe(200);
    const ids = response.body.runs.map((run: { id: string }) => run.id);
    expect(ids).toContain(mainRun);
    expect(ids).toContain(secondRun);
    expect(ids).not.toContain(openRun);
    expect(ids).not.toContain(adaRun);
    const main = response.body.runs.find((run: { id: string }) => run.id === mainRun);
    expect(main.rollCount).toBe(await liveRolls(mainRun));
    expect(main.rollCount).toBe(40 - 3 + 35 + 30 - 1 + 25);
    expect(main.simulatedRollCount).toBe(25);
    expect(main.groupCount).toBe(4);
    expect(main).toMatchObject({
      classGroup: "8K",
      diceSetName: "Skerry trio",
      dieNames: ["Skua", "Tern", "Gannet"],
      isOwner: true,
      recordedOn: "phones",
    });
  });

  it("filters by class, set and dates, and sorts by rolls either way", async () => {
    const byClass = await agents.tomasz.get(`/api/results/runs?lesson=${marker}&classGroup=9m`);
    expect(byClass.body.runs.map((run: { id: string }) => run.id)).toEqual([secondRun]);
    const byDate = await agents.tomasz.get(`/api/results/runs?lesson=${marker}&from=2026-03-12&to=2026-03-12`);
    expect(byDate.body.runs.map((run: { id: string }) => run.id)).toEqual([mainRun]);
    const bySet = await agents.tomasz.get(`/api/results/runs?lesson=${marker}&set=no-such-set`);
    expect(bySet.body.runs).toEqual([]);
    const ascending = await agents.tomasz.get(`/api/results/runs?lesson=${marker}&sort=rolls&order=asc`);
    expect(ascending.body.runs.map((run: { id: string }) => run.id)).toEqual([mainRun, secondRun]);
    const descending = await agents.tomasz.get(`/api/results/runs?lesson=${marker}&sort=rolls&order=desc`);
    expect(descending.body.runs.map((run: { id: string }) => run.id)).toEqual([secondRun, mainRun]);
  });

  it("refuses a bad filter with 400 and field messages", async () => {
    const response = await agents.tomasz.get("/api/results/runs?from=12/03/2026&sort=colour");
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(["from", "sort"]);
  });

  it("gives the head of department every teacher's runs with scope=department, and refuses that scope to a teacher", async () => {
    const headView = await agents.head.get(`/api/results/runs?scope=department&lesson=${marker}`);
    expect(headView.status).toBe(200);
    const ids = headView.body.runs.map((run: { id: string }) => run.id).sort();
    expect(ids).toEqual([mainRun, secondRun, adaRun].sort());
    expect(headView.body.runs.every((run: { isOwner: boolean }) => !run.isOwner)).toBe(true);
    expect((await agents.head.get(`/api/results/runs?lesson=${marker}`)).body.runs).toEqual([]);
    const teacherView = await agents.tomasz.get("/api/results/runs?scope=department");
    expect(teacherView.status).toBe(403);
    expect(teacherView.body.error.code).toBe("forbidden");
    const outsiderView = await agents.outsider.get(`/api/results/runs?scope=department&lesson=${marker}`);
    expect(outsiderView.status).toBe(200);
    expect(outsiderView.body.runs).toEqual([]);
  });
});

describe("a run's results page", () => {
  it("pools the stored rolls on the server: counts per matchup equal the database's, with exact values and Guess votes", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}`);
    expect(response.status).toBe(200);
    const { pooled, guessVotes, groups, findings, mainMatchupKey } = response.body;
    expect(pooled.totals.rolls).toBe(await liveRolls(mainRun));
    const stored = await db
      .select({ matchup: roll.matchup, winnerSeat: roll.winnerSeat })
      .from(roll)
      .where(and(eq(roll.runId, mainRun), isNull(roll.undoneAt)));
    const skuaTern = pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    const skuaTernRows = stored.filter((row) => row.matchup.join() === "0,1");
    expect(skuaTern.rolls).toBe(skuaTernRows.length);
    expect(skuaTern.seats[0].wins).toBe(skuaTernRows.filter((row) => row.winnerSeat === 0).length);
    // Direct enumeration of the 36 equally likely face pairs of Skua and Tern.
    const skuaWins = testDice[0].faces.flatMap((a) => testDice[1].faces.filter((b) => a > b)).length;
    expect(skuaTern.exact.underTieRule.fraction).toBe(`${skuaWins / 4}/9`);
    expect(skuaWins).toBe(20);
    // Gannet v Skua was recorded with Gannet in the first seat; pooling puts the lower die index first.
    const skuaGannet = pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-2");
    expect(skuaGannet.rolls).toBe(29);
    expect(skuaGannet.exact.underTieRule.fraction).toBe("5/12");
    expect(guessVotes).toEqual([
      { dieIndex: 0, dieName: "Skua", votes: 2 },
      { dieIndex: 1, dieName: "Tern", votes: 0 },
      { dieIndex: 2, dieName: "Gannet", votes: 1 },
    ]);
    expect(groups.find((group: { nickname: string }) => group.nickname === "Puffins").rolls).toBe(37);
    expect(mainMatchupKey).toBe("1:0-1");
    expect(findings).toHaveLength(2);
    expect(findings[0]).toContain(`After ${skuaTern.rolls} rolls of Skua v Tern`);
    expect(findings[0]).toContain("the exact 5/9 (0.556)");
  });

  it("leaves simulated rolls out when asked", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}?includeSimulated=false`);
    expect(response.body.pooled.totals.rolls).toBe(await liveRolls(mainRun, false));
    expect(response.body.pooled.totals.bySource.simulated).toBe(0);
  });

  it("answers 400 for a malformed id and 404 for a run that does not exist", async () => {
    expect((await agents.tomasz.get("/api/results/runs/not-a-uuid")).status).toBe(400);
    expect((await agents.tomasz.get(`/api/results/runs/${crypto.randomUUID()}`)).status).toBe(404);
  });
});

describe("exports", () => {
  it("exports one CSV row per roll that counts, parsed back with papaparse and compared with the database", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}/rolls.csv`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toContain(
      `filename="${marker.toLowerCase()}-no-best-die-skerry-trio_8k_2026-03-12_rolls.csv"`,
    );
    const parsed = csvRows(response.text);
    expect(parsed.meta.fields).toEqual([...rollsExportColumns]);
    expect(parsed.data).toHaveLength(await liveRolls(mainRun));
    const stored = await db
      .select({ id: roll.id, faces: roll.faces, winnerSeat: roll.winnerSeat, source: roll.source })
      .from(roll)
      .where(and(eq(roll.runId, mainRun), isNull(roll.undoneAt)));
    const byId = new Map(stored.map((row) => [row.id, row]));
    for (const row of parsed.data) {
      const original = byId.get(row.roll_id)!;
      expect(row.faces_1).toBe(String(original.faces[0][0]));
      expect(row.faces_2).toBe(String(original.faces[1][0]));
      expect(row.simulated).toBe(original.source === "simulated" ? "yes" : "no");
      expect(row.outcome === "tie").toBe(original.winnerSeat === null);
    }
    const nicknames = new Set(parsed.data.map((row) => row.group));
    // RFC 4180 quoting survives the round trip; a formula-like nickname is defused with an apostrophe.
    expect(nicknames).toEqual(new Set(["Puffins", 'Gulls, "the loud ones"', "'=Crabs", "Virtual class"]));
    expect(response.text).toContain('"Gulls, ""the loud ones"""');
  });

  it("leaves simulated rolls out of the CSV with includeSimulated=false", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}/rolls.csv?includeSimulated=false`);
    const parsed = csvRows(response.text);
    expect(parsed.data).toHaveLength(await liveRolls(mainRun, false));
    expect(parsed.data.every((row) => row.simulated === "no")).toBe(true);
  });

  it("streams a run larger than one cursor batch without losing or repeating a roll", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${secondRun}/rolls.csv`);
    const parsed = csvRows(response.text);
    expect(parsed.data).toHaveLength(await liveRolls(secondRun));
    expect(new Set(parsed.data.map((row) => row.roll_id)).size).toBe(4520);
  });

  it("exports a summary whose counts per matchup and per group add up to the database's", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}/summary.csv`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toContain("_8k_2026-03-12_summary.csv");
    const parsed = csvRows(response.text);
    expect(parsed.meta.fields).toEqual([...summaryExportColumns]);
    const matchups = parsed.data.filter((row) => row.section === "matchup");
    const groups = parsed.data.filter((row) => row.section === "group");
    expect(matchups.reduce((sum, row) => sum + Number(row.rolls), 0)).toBe(await liveRolls(mainRun));
    expect(groups.reduce((sum, row) => sum + Number(row.rolls), 0)).toBe(await liveRolls(mainRun));
    const skuaTern = matchups.find((row) => row.matchup === "Skua v Tern")!;
    expect(skuaTern).toMatchObject({ exact_fraction: "5/9", exact_decimal: "0.556", tie_rule: "re-roll-ties", first_die: "Skua" });
    const lower = Number(skuaTern.wilson_95_lower);
    const upper = Number(skuaTern.wilson_95_upper);
    expect(lower).toBeLessThan(Number(skuaTern.relative_frequency));
    expect(upper).toBeGreaterThan(Number(skuaTern.relative_frequency));
    expect(Number(skuaTern.relative_frequency)).toBeCloseTo(Number(skuaTern.first_die_wins) / Number(skuaTern.decided_rolls), 3);
    const puffins = groups.find((row) => row.group === "Puffins")!;
    expect(Number(puffins.rolls)).toBe(37);
    expect(Number(puffins.binomial_p_value)).toBeGreaterThan(0);
  });

  it("exports a workbook with a Rolls sheet and a Summary sheet, read back with exceljs", async () => {
    const response = await agents.tomasz.get(`/api/results/runs/${mainRun}/results.xlsx?includeSimulated=false`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toContain("_8k_2026-03-12_results.xlsx");
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(response.bytes as unknown as ArrayBuffer);
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual(["Rolls", "Summary"]);
    const rolls = workbook.getWorksheet("Rolls")!;
    const header = (rolls.getRow(1).values as unknown[]).slice(1);
    expect(header).toEqual([...rollsExportColumns]);
    expect(rolls.actualRowCount - 1).toBe(await liveRolls(mainRun, false));
    const summary = workbook.getWorksheet("Summary")!;
    const summaryHeader = (summary.getRow(1).values as unknown[]).slice(1) as string[];
    expect(summaryHeader).toEqual([...summaryExportColumns]);
    const rollsColumn = summaryHeader.indexOf("rolls") + 1;
    const sectionColumn = summaryHeader.indexOf("section") + 1;
    let matchupRolls = 0;
    summary.eachRow((row, number) => {
      if (number > 1 && row.getCell(sectionColumn).value === "matchup") matchupRolls += Number(row.getCell(rollsColumn).value);
    });
    expect(matchupRolls).toBe(await liveRolls(mainRun, false));
  });
});

/** The recording-sheet CSV for rows of [group, roll, die 1, faces 1, die 2, faces 2]. */
function sheet(rows: string[][]) {
  return [paperImportColumns.join(","), ...rows.map((row) => [...row, "", ""].join(","))].join("\r\n");
}

describe("Paper import", () => {
  const goodRows = [
    ["Puffins", "1", "Skua", "10", "Tern", "9"],
    ["Puffins", "2", "Skua", "1", "Tern", "18"],
    ['Gulls, "the loud ones"', "1", "Tern", "11", "Gannet", "14"],
    ["puffins", "3", "Tern", "4", "Skua", "12"],
  ].map((row) => row.map((cell) => (cell.includes(",") ? `"${cell.replace(/"/g, '""')}"` : cell)));

  it("previews good rows without storing anything, then imports them all in one go", async () => {
    const before = await liveRolls(mainRun);
    const preview = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, csvForm(sheet(goodRows)));
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ errors: [], newRows: 4, duplicateRows: 0, newGroups: [], imported: false });
    expect(preview.body.rows.map((row: { row: number }) => row.row)).toEqual([2, 3, 4, 5]);
    expect(preview.body.rows[0]).toMatchObject({
      group: "Puffins",
      dieNames: ["Skua", "Tern"],
      faces: [[10], [9]],
      winner: "Skua",
      status: "new",
    });
    expect(preview.body.rows[3].group).toBe("Puffins");
    expect(await liveRolls(mainRun)).toBe(before);

    const commit = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import`, csvForm(sheet(goodRows)));
    expect(commit.status).toBe(201);
    expect(commit.body).toMatchObject({ imported: true, newRows: 4, duplicateRows: 0 });
    expect(await liveRolls(mainRun)).toBe(before + 4);
    const paperRows = await db
      .select({ n: count() })
      .from(roll)
      .where(and(eq(roll.runId, mainRun), eq(roll.source, "paper")));
    expect(paperRows[0].n).toBe(4);

    const again = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import`, csvForm(sheet(goodRows)));
    expect(again.status).toBe(200);
    expect(again.body.imported).toBe(false);
    expect(again.body.alreadyImportedAt).not.toBeNull();
    expect(await liveRolls(mainRun)).toBe(before + 4);

    // An edited file: one row changed, one added. Only the added row is new; the stored roll is kept as it was.
    const edited = [...goodRows.slice(0, 3), ["puffins", "3", "Tern", "7", "Skua", "12"], ["Puffins", "4", "Skua", "13", "Tern", "8"]];
    const editedPreview = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, csvForm(sheet(edited)));
    expect(editedPreview.body).toMatchObject({ newRows: 1, duplicateRows: 4, alreadyImportedAt: null });
    expect(editedPreview.body.rows[3].status).toBe("present-but-different");
    const editedCommit = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import`, csvForm(sheet(edited)));
    expect(editedCommit.status).toBe(201);
    expect(editedCommit.body).toMatchObject({ newRows: 1, duplicateRows: 4 });
    expect(await liveRolls(mainRun)).toBe(before + 5);
    const imports = await db.select({ n: count() }).from(paperImport).where(eq(paperImport.runId, mainRun));
    expect(imports[0].n).toBe(2);
  });

  it("reports every bad row with its row number and stores nothing", async () => {
    const before = await liveRolls(mainRun);
    const importsBefore = (await db.select({ n: count() }).from(paperImport).where(eq(paperImport.runId, mainRun)))[0].n;
    const rows = [
      ["Puffins", "20", "Skua", "10", "Tern", "9"],
      ["Puffins", "21", "Skua", "10", "Kestrel", "9"],
      ["Puffins", "22", "Skua", "7", "Tern", "9"],
      ["Puffins", "23", "Skua", "10+12", "Tern", "9"],
      ["Herons", "1", "Skua", "10", "Tern", "9"],
      ["Puffins", "20", "Skua", "12", "Tern", "9"],
      ["Puffins", "x", "Skua", "12", "Tern", "9"],
      ["Puffins", "24", "Skua", "12", "Skua", "10"],
    ];
    const csv = `${sheet(rows.slice(0, 4))}\r\n\r\n${sheet(rows.slice(4)).split("\r\n").slice(1).join("\r\n")}`;
    const preview = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, csvForm(csv));
    expect(preview.status).toBe(200);
    const errors = preview.body.errors as { row: number; messages: string[] }[];
    // Row 1 is the header; the blank line is row 6 and is skipped.
    expect(errors.map((entry) => entry.row)).toEqual([3, 4, 5, 7, 8, 9, 10]);
    const at = (row: number) => errors.find((entry) => entry.row === row)!.messages.join(" ");
    expect(at(3)).toContain('"Kestrel" is not a die of this run\'s set');
    expect(at(4)).toContain("Skua has no face 7");
    expect(at(5)).toContain("write 1 face; found 2");
    expect(at(7)).toContain('This run has no group "Herons"');
    expect(at(8)).toContain("roll 20 twice in this file (rows 2 and 8)");
    expect(at(9)).toContain("Roll must be a number");
    expect(at(10)).toContain("a matchup needs different dice");
    expect(preview.body.rows.map((row: { row: number }) => row.row)).toEqual([2]);

    const commit = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import`, csvForm(csv));
    expect(commit.status).toBe(422);
    expect(commit.body.error.code).toBe("paper_import_invalid");
    expect(Object.keys(commit.body.error.fields)).toEqual(["row 3", "row 4", "row 5", "row 7", "row 8", "row 9", "row 10"]);
    expect(await liveRolls(mainRun)).toBe(before);
    expect((await db.select({ n: count() }).from(paperImport).where(eq(paperImport.runId, mainRun)))[0].n).toBe(importsBefore);
  });

  it("creates groups that are new only when the teacher ticks the box", async () => {
    const rows = [
      ["Herons", "1", "Skua", "10", "Tern", "9"],
      ["Herons", "2", "Gannet", "17", "Skua", "15"],
    ];
    const refused = await agents.tomasz.postForm(`/api/results/runs/${secondRun}/paper-import/preview`, csvForm(sheet(rows)));
    expect(refused.body.errors).toHaveLength(2);
    const preview = await agents.tomasz.postForm(
      `/api/results/runs/${secondRun}/paper-import/preview`,
      csvForm(sheet(rows), { createGroups: true }),
    );
    // The second run names its dice differently; these names are the first run's, so they are refused there.
    expect(preview.body.errors.map((entry: { row: number }) => entry.row)).toEqual([2, 3]);
    const named = [
      ["Herons", "1", "Great skua", "10", "Arctic tern", "9"],
      ["Herons", "2", "Northern gannet", "17", "great skua", "15"],
    ];
    const commit = await agents.tomasz.postForm(
      `/api/results/runs/${secondRun}/paper-import`,
      csvForm(sheet(named), { createGroups: true }),
    );
    expect(commit.status).toBe(201);
    expect(commit.body).toMatchObject({ newRows: 2, newGroups: ["Herons"] });
    const [group] = await db
      .select()
      .from(runGroup)
      .where(and(eq(runGroup.runId, secondRun), eq(runGroup.nickname, "Herons")));
    expect(group.source).toBe("paper");
  });

  it("imports into the tally the teacher names, checked against that tally's mode", async () => {
    const twisted = (
      await insertFixtureRun(db, {
        ownerEmail: tomasz.email,
        title: `${marker} Twisted run`,
        classGroup: "8K",
        groups: [{ nickname: "Crabs", matchup: [0, 1], rolls: 4 }],
      })
    ).runId;
    await db
      .update(classRun)
      .set({
        currentTally: 2,
        dicePerPlayer: 2,
        tallies: [
          { tally: 1, dicePerPlayer: 1, players: 2, startedAt: new Date().toISOString() },
          { tally: 2, dicePerPlayer: 2, players: 2, startedAt: new Date().toISOString() },
        ],
      })
      .where(eq(classRun.id, twisted));
    const oneDie = sheet([["Crabs", "1", "Skua", "10", "Tern", "9"]]);
    const twoDice = sheet([["Crabs", "1", "Skua", "10+15", "Tern", "9+4"]]);
    const form = (csv: string, tally: string) => {
      const body = csvForm(csv);
      body.set("tally", tally);
      return body;
    };
    const wrongMode = await agents.tomasz.postForm(`/api/results/runs/${twisted}/paper-import/preview`, form(twoDice, "1"));
    expect(wrongMode.body.errors[0].messages.join(" ")).toContain("write 1 face; found 2");
    expect((await agents.tomasz.postForm(`/api/results/runs/${twisted}/paper-import`, form(oneDie, "1"))).status).toBe(201);
    expect((await agents.tomasz.postForm(`/api/results/runs/${twisted}/paper-import`, form(twoDice, "2"))).status).toBe(201);
    const paper = await db
      .select({ tally: roll.tally, dicePerPlayer: roll.dicePerPlayer, faces: roll.faces })
      .from(roll)
      .where(and(eq(roll.runId, twisted), eq(roll.source, "paper")))
      .orderBy(roll.tally);
    expect(paper).toEqual([
      { tally: 1, dicePerPlayer: 1, faces: [[10], [9]] },
      {
        tally: 2,
        dicePerPlayer: 2,
        faces: [
          [10, 15],
          [9, 4],
        ],
      },
    ]);
    const noSuchTally = await agents.tomasz.postForm(`/api/results/runs/${twisted}/paper-import/preview`, form(oneDie, "3"));
    expect(noSuchTally.status).toBe(422);
    expect(noSuchTally.body.error.message).toContain("This run has no tally 3");
  });

  it("refuses a workbook, a file without the header row, and a file over the size limit, each with a clear message", async () => {
    const workbook = new ExcelJS.Workbook();
    workbook.addWorksheet("Rolls").addRow([...paperImportColumns]);
    const bytes = Buffer.from(await workbook.xlsx.writeBuffer());
    const form = new FormData();
    form.set("file", new Blob([bytes]), "sheets.csv");
    const xlsx = await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, form);
    expect(xlsx.status).toBe(415);
    expect(xlsx.body.error.message).toContain("not CSV");

    const headerless = await agents.tomasz.postForm(
      `/api/results/runs/${mainRun}/paper-import/preview`,
      csvForm("Puffins,1,Skua,10,Tern,9\r\n"),
    );
    expect(headerless.status).toBe(422);
    expect(headerless.body.error.message).toContain("not part of the Paper import format");

    const huge = await agents.tomasz.postForm(
      `/api/results/runs/${mainRun}/paper-import/preview`,
      csvForm(sheet([]) + "\r\n" + "x".repeat(600 * 1024)),
    );
    expect(huge.status).toBe(413);

    const missing = new FormData();
    missing.set("createGroups", "false");
    expect((await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, missing)).body.error.code).toBe("no_file");
    expect(
      (await agents.tomasz.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, csvForm(sheet(goodRows), { name: "sheets.pdf" })))
        .status,
    ).toBe(415);
  });

  it("makes a closed paper run from one of the teacher's lessons and imports into it", async () => {
    const owner = await userIdByEmail(db, tomasz.email);
    const [set] = await db
      .insert(diceSet)
      .values({ ownerId: owner.id, departmentId: owner.departmentId, name: `${marker} Skerry trio`, dice: testDice })
      .returning({ id: diceSet.id });
    const input = {
      ...emptyLessonInput(),
      title: `${marker} Paper lesson`,
      classGroup: "8K",
      diceSetId: set.id,
      mode: { dicePerPlayer: 1 as const, players: 2 as const },
    };
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

    const lessons = await agents.tomasz.get("/api/results/paper-runs/lessons");
    expect(lessons.body.lessons.find((entry: { id: string }) => entry.id === created.id)).toMatchObject({
      ready: true,
      diceSetName: `${marker} Skerry trio`,
    });
    expect((await agents.ada.post("/api/results/paper-runs", { lessonId: created.id })).status).toBe(404);
    expect((await agents.tomasz.post("/api/results/paper-runs", { lessonId: "nope" })).status).toBe(400);

    const made = await agents.tomasz.post("/api/results/paper-runs", { lessonId: created.id, taughtOn: "2026-02-02" });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({
      title: `${marker} Paper lesson`,
      classGroup: "8K",
      rollCount: 0,
      groupCount: 0,
      recordedOn: "no rolls yet",
    });
    const [stored] = await db.select().from(classRun).where(eq(classRun.id, made.body.id));
    expect(stored.status).toBe("closed");
    expect(stored.dice).toEqual(testDice);

    const rows = [
      ["Limpets", "1", "Skua", "10", "Tern", "9"],
      ["Limpets", "2", "Tern", "18", "Gannet", "2"],
    ];
    const commit = await agents.tomasz.postForm(
      `/api/results/runs/${made.body.id}/paper-import`,
      csvForm(sheet(rows), { createGroups: true }),
    );
    expect(commit.status).toBe(201);
    const listed = await agents.tomasz.get(`/api/results/runs?lesson=${encodeURIComponent(`${marker} Paper`)}`);
    expect(listed.body.runs[0]).toMatchObject({
      rollCount: 2,
      paperRollCount: 2,
      recordedOn: "paper",
      taughtAt: "2026-02-02T12:00:00.000Z",
    });
  });
});

describe("pooling across runs", () => {
  it("pools runs of the same set (the same faces, whatever the names and order) into counts equal to the sum of the single runs", async () => {
    const pooled = await agents.tomasz.get(`/api/results/pooled?runIds=${mainRun},${secondRun}&dicePerPlayer=1`);
    expect(pooled.status).toBe(200);
    expect(pooled.body.dice.map((die: { name: string }) => die.name)).toEqual(["Skua", "Tern", "Gannet"]);
    const single = await Promise.all([mainRun, secondRun].map((id) => agents.tomasz.get(`/api/results/runs/${id}`)));
    expect(pooled.body.pooled.totals.rolls).toBe(single[0].body.pooled.totals.rolls + single[1].body.pooled.totals.rolls);
    // The second run's "Great skua v Arctic tern" (its dice 1 and 2) is the first run's Skua v Tern (dice 0 and 1).
    const skuaTern = pooled.body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    const firstOwn = single[0].body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:0-1");
    const secondOwn = single[1].body.pooled.matchups.find((entry: { key: string }) => entry.key === "1:1-2");
    expect(skuaTern.rolls).toBe(firstOwn.rolls + secondOwn.rolls);
    expect(skuaTern.seats[0].wins).toBe(firstOwn.seats[0].wins + secondOwn.seats[0].wins);
    for (const entry of pooled.body.pooled.matchups) {
      const shares = pooled.body.contributions.map((share: { matchups: { key: string; rolls: number; firstSeatWins: number }[] }) =>
        share.matchups.find((own) => own.key === entry.key),
      );
      expect(shares.reduce((sum: number, share: { rolls: number } | undefined) => sum + (share?.rolls ?? 0), 0)).toBe(entry.rolls);
      expect(shares.reduce((sum: number, share: { firstSeatWins: number } | undefined) => sum + (share?.firstSeatWins ?? 0), 0)).toBe(
        entry.seats[0].wins,
      );
    }
    expect(pooled.body.contributions.map((share: { run: { classGroup: string } }) => share.run.classGroup)).toEqual(["8K", "9M"]);
    expect(pooled.body.candidates.map((run: { id: string }) => run.id)).toEqual(expect.arrayContaining([mainRun, secondRun]));
    expect(pooled.body.candidates.map((run: { id: string }) => run.id)).not.toContain(adaRun);
  });

  it("pools by set key alone, and lets the head pool runs of several teachers", async () => {
    const list = await agents.tomasz.get(`/api/results/runs?lesson=${marker}`);
    const setKey = list.body.runs.find((run: { id: string }) => run.id === mainRun).setKey;
    expect(list.body.runs.find((run: { id: string }) => run.id === secondRun).setKey).toBe(setKey);
    const bySet = await agents.tomasz.get(`/api/results/pooled?setKey=${setKey}`);
    expect(bySet.status).toBe(200);
    expect(bySet.body.contributions.map((share: { run: { id: string } }) => share.run.id)).toEqual(
      expect.arrayContaining([mainRun, secondRun]),
    );

    const headPool = await agents.head.get(`/api/results/pooled?scope=department&runIds=${mainRun},${adaRun}`);
    expect(headPool.status).toBe(200);
    const both = await Promise.all([agents.head.get(`/api/results/runs/${mainRun}`), agents.head.get(`/api/results/runs/${adaRun}`)]);
    expect(headPool.body.pooled.totals.rolls).toBe(both[0].body.pooled.totals.rolls + both[1].body.pooled.totals.rolls);
  });

  it("refuses a teacher another teacher's run, a set that differs, and a missing choice", async () => {
    const other = await agents.tomasz.get(`/api/results/pooled?runIds=${mainRun},${adaRun}`);
    expect(other.status).toBe(404);
    const differentDice = (
      await insertFixtureRun(db, {
        ownerEmail: tomasz.email,
        title: `${marker} Other dice`,
        classGroup: "8K",
        dice: [testDice[0], testDice[1], { ...testDice[2], faces: [2, 3, 6, 14, 16, 19] }],
        groups: [{ nickname: "Crabs", matchup: [0, 1], rolls: 3 }],
      })
    ).runId;
    const mixed = await agents.tomasz.get(`/api/results/pooled?runIds=${mainRun},${differentDice}`);
    expect(mixed.status).toBe(400);
    expect(mixed.body.error.code).toBe("not_same_set");
    expect((await agents.tomasz.get("/api/results/pooled")).status).toBe(400);
    expect((await agents.tomasz.get("/api/results/pooled?runIds=x")).status).toBe(400);
    expect((await agents.tomasz.get(`/api/results/pooled?scope=department&runIds=${mainRun}`)).status).toBe(403);
  });
});

describe("role checks on every results route", () => {
  const routes = (runId: string) =>
    [
      ["GET", "/api/results/runs"],
      ["GET", `/api/results/runs/${runId}`],
      ["GET", `/api/results/runs/${runId}/rolls.csv`],
      ["GET", `/api/results/runs/${runId}/summary.csv`],
      ["GET", `/api/results/runs/${runId}/results.xlsx`],
      ["POST", `/api/results/runs/${runId}/paper-import/preview`],
      ["POST", `/api/results/runs/${runId}/paper-import`],
      ["DELETE", `/api/results/runs/${runId}`],
      ["GET", `/api/results/pooled?runIds=${runId}`],
      ["GET", "/api/results/paper-runs/lessons"],
      ["POST", "/api/results/paper-runs"],
    ] as const;

  it("answers 401 without a session", async () => {
    for (const [method, path] of routes(mainRun)) {
      const response = await agents.signedOut.request(method, path, method === "POST" ? {} : undefined);
      expect(response.status, `${method} ${path}`).toBe(401);
      expect(response.body.error.code).toBe("unauthenticated");
    }
  });

  it("hides a run from another teacher of the department and from another department (404)", async () => {
    for (const agent of [agents.ada, agents.outsider]) {
      for (const [method, path] of routes(mainRun).slice(1, 9)) {
        const body = method === "POST" ? csvForm(sheet([["Puffins", "1", "Skua", "10", "Tern", "9"]])) : undefined;
        const response = await agent.request(method, path, body);
        expect(response.status, `${method} ${path}`).toBe(404);
        expect(response.body.error.code).toBe("not_found");
      }
    }
  });

  it("lets the head of department read and export a teacher's run but not import into it or delete it (403)", async () => {
    for (const [method, path] of routes(mainRun).slice(1, 5)) {
      expect((await agents.head.request(method, path)).status, `${method} ${path}`).toBe(200);
    }
    const form = () => csvForm(sheet([["Puffins", "1", "Skua", "10", "Tern", "9"]]));
    expect((await agents.head.postForm(`/api/results/runs/${mainRun}/paper-import/preview`, form())).status).toBe(403);
    expect((await agents.head.postForm(`/api/results/runs/${mainRun}/paper-import`, form())).status).toBe(403);
    const deletion = await agents.head.delete(`/api/results/runs/${mainRun}`);
    expect(deletion.status).toBe(403);
    expect(deletion.body.error.message).toContain("Only the teacher who ran this class");
  });

  it("lets the owner do all of it", async () => {
    for (const [method, path] of routes(mainRun).slice(0, 5)) {
      expect((await agents.tomasz.request(method, path)).status, `${method} ${path}`).toBe(200);
    }
    expect((await agents.tomasz.get(`/api/results/pooled?runIds=${mainRun}`)).status).toBe(200);
    expect((await agents.tomasz.get("/api/results/paper-runs/lessons")).status).toBe(200);
  });
});

describe("retention: deleting a run", () => {
  it("refuses a run that is still open", async () => {
    const response = await agents.tomasz.delete(`/api/results/runs/${openRun}`);
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("run_not_closed");
  });

  it("deletes the run with its rolls, groups, votes and Paper imports in one go", async () => {
    const rollsBefore = (await db.select({ n: count() }).from(roll).where(eq(roll.runId, mainRun)))[0].n;
    const response = await agents.tomasz.delete(`/api/results/runs/${mainRun}`);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ id: mainRun, rolls: rollsBefore, groups: 4, votes: 3, imports: 2 });
    for (const table of [roll, runGroup, guessVote, paperImport]) {
      expect((await db.select({ n: count() }).from(table).where(eq(table.runId, mainRun)))[0].n).toBe(0);
    }
    expect((await db.select({ n: count() }).from(classRun).where(eq(classRun.id, mainRun)))[0].n).toBe(0);
    expect((await agents.tomasz.get(`/api/results/runs/${mainRun}`)).status).toBe(404);
    expect((await agents.tomasz.delete(`/api/results/runs/${mainRun}`)).status).toBe(404);
  });
});
