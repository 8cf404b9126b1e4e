import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { rollsExportColumns, summaryExportColumns } from "@shared/results/export-columns";
import type { SetDie } from "@shared/schemas/dice-sets";
import { db } from "../../server/db/client";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";
import { insertFixtureRun, testDice } from "../helpers/results-fixtures";

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): a cell starting with one of these characters
// is read by spreadsheet programs as a formula, unless a leading apostrophe makes it text.
const FORMULA_START = /^[=+\-@\t\r]/;

// Die names and nicknames a colleague's shared set, an imported set file or a pupil could bring in.
const hostileDice: SetDie[] = [
  { ...testDice[0], name: '=HYPERLINK("http://evil.test","x")', faces: [-1, 5, 10, 12, 13, 15] },
  { ...testDice[1], name: "+Tern" },
  { ...testDice[2], name: "@Gannet" },
];
const hostileNicknames = ["-1+1", "-2+3*7", "\tTabs", "\rReturns", "=Crabs", "@Gulls"];

const rollsTextColumns = [
  "roll_time",
  "group",
  "matchup",
  "die_1",
  "faces_1",
  "die_2",
  "faces_2",
  "die_3",
  "faces_3",
  "outcome",
  "winning_die",
  "source",
  "simulated",
  "roll_id",
];
const rollsNumberColumns = ["tally", "dice_per_player", "total_1", "total_2", "total_3"];
const summaryTextColumns = ["section", "group", "matchup", "first_die", "tie_rule", "exact_fraction", "exact_decimal", "implausible"];
const summaryNumberColumns = [
  "dice_per_player",
  "players",
  "rolls",
  "decided_rolls",
  "first_die_wins",
  "first_die_ties",
  "first_die_losses",
  "relative_frequency",
  "wilson_95_lower",
  "wilson_95_upper",
  "binomial_p_value",
];

let app: TestApp;
let agent: HttpAgent;
let runId: string;
const tomasz = demoTeachers.find((t) => t.role === "teacher")!;

/**
 * A strict CSV read (RFC 4180): the text must end in one line break and hold no empty line anywhere, and papaparse
 * must read it without errors while keeping empty lines as rows.
 */
function strictCsv(text: string): Record<string, string>[] {
  const body = text.replace(/^\ufeff/, "");
  expect(body.endsWith("\r\n")).toBe(true);
  const parsed = Papa.parse<Record<string, string>>(body.slice(0, -2), { header: true, skipEmptyLines: false });
  expect(parsed.errors).toEqual([]);
  for (const row of parsed.data) expect(Object.values(row).some((cell) => cell !== "")).toBe(true);
  return parsed.data;
}

/** Every text cell that would start a formula carries the apostrophe; every number column holds plain numbers. */
function expectSpreadsheetSafe(rows: Record<string, string>[], textColumns: string[], numberColumns: string[]) {
  for (const row of rows) {
    for (const column of textColumns) expect(FORMULA_START.test(row[column]), `${column}: ${JSON.stringify(row[column])}`).toBe(false);
    for (const column of numberColumns) {
      if (row[column] !== "") expect(row[column], column).toMatch(/^-?\d+(\.\d+)?$/);
    }
  }
}

beforeAll(async () => {
  app = await startTestApp();
  agent = new HttpAgent(app.baseUrl);
  await agent.signIn(tomasz.email, demoPassword);
  runId = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `C${crypto.randomUUID().slice(0, 6)} Hostile names`,
      classGroup: "9M",
      dice: hostileDice,
      dicePerPlayer: 2,
      groups: hostileNicknames.map((nickname, index) => ({ nickname, matchup: [index % 3, (index + 1) % 3], rolls: 12 })),
      seed: 5,
    })
  ).runId;
});
afterAll(() => app.close());

describe("CSV downloads against spreadsheet formula injection", () => {
  it("escapes every text cell of rolls.csv that starts like a formula and keeps the number columns numeric", async () => {
    const response = await agent.get(`/api/results/runs/${runId}/rolls.csv`);
    expect(response.status).toBe(200);
    const rows = strictCsv(response.text);
    expect(Object.keys(rows[0])).toEqual([...rollsExportColumns]);
    expect(rows).toHaveLength(hostileNicknames.length * 12);
    expectSpreadsheetSafe(rows, rollsTextColumns, rollsNumberColumns);
    // The apostrophe is the whole change: take it off and the original name is back.
    expect(new Set(rows.map((row) => row.group))).toEqual(new Set(hostileNicknames.map((nickname) => `'${nickname}`)));
    expect(new Set(rows.map((row) => row.die_1))).toEqual(new Set(hostileDice.map((die) => `'${die.name}`)));
    expect(rows.some((row) => row.faces_1.startsWith("'-1+"))).toBe(true);
    expect(rows.every((row) => row.outcome === "tie" || row.outcome.startsWith("'"))).toBe(true);
    expect(rows.every((row) => row.winning_die === "" || row.winning_die.startsWith("'"))).toBe(true);
  });

  it("escapes every text cell of summary.csv and writes its number columns as numbers", async () => {
    const response = await agent.get(`/api/results/runs/${runId}/summary.csv`);
    expect(response.status).toBe(200);
    const rows = strictCsv(response.text);
    expect(Object.keys(rows[0])).toEqual([...summaryExportColumns]);
    expectSpreadsheetSafe(rows, summaryTextColumns, summaryNumberColumns);
    const groupRows = rows.filter((row) => row.section === "group");
    expect(new Set(groupRows.map((row) => row.group))).toEqual(new Set(hostileNicknames.map((nickname) => `'${nickname}`)));
    expect(rows.every((row) => row.matchup.startsWith("'") && row.first_die.startsWith("'"))).toBe(true);
  });
});

describe("export correctness", () => {
  it("writes rolls.csv with no empty line after the header, even for a run without rolls", async () => {
    const empty = await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `E${crypto.randomUUID().slice(0, 6)} No rolls yet`,
      classGroup: "8K",
      groups: [],
    });
    const response = await agent.get(`/api/results/runs/${empty.runId}/rolls.csv`);
    expect(response.text.replace(/^\ufeff/, "")).toBe(`${rollsExportColumns.join(",")}\r\n`);
    const withRolls = await agent.get(`/api/results/runs/${runId}/rolls.csv`);
    const lines = withRolls.text.replace(/^\ufeff/, "").split("\r\n");
    expect(lines[1]).not.toBe("");
    expect(lines.slice(0, -1).every((line) => line !== "")).toBe(true);
  });

  it("writes Wilson bounds and relative frequencies with four decimals and p-values with six, in every row", async () => {
    const rows = strictCsv((await agent.get(`/api/results/runs/${runId}/summary.csv`)).text);
    for (const row of rows) {
      expect(row.wilson_95_lower).toMatch(/^\d\.\d{4}$/);
      expect(row.wilson_95_upper).toMatch(/^\d\.\d{4}$/);
      expect(row.relative_frequency).toMatch(/^\d\.\d{4}$/);
      if (row.section === "group") expect(row.binomial_p_value).toMatch(/^\d\.\d{6}$/);
    }
  });
});
