// Benchmark of the Set finder's exhaustive search: npx tsx scripts/bench/set-finder.ts
import { compareDice, mulberry32, randomBelow } from "../../shared/probability/index";
import type { SetFinderRequestInput } from "../../shared/schemas/set-finder";
import { buildDicePool, poolDieFaces } from "../../shared/set-finder/candidate-dice";
import { searchDiceSets } from "../../shared/set-finder/search-dice-sets";

const TARGET_SECONDS = 30;
const SAMPLED_CYCLES = 20_000;

const cases: { label: string; request: SetFinderRequestInput }[] = [
  {
    label: "3 dice × 6 faces, values 1–9, one cycle, ties allowed",
    request: {
      diceCount: 3,
      facesPerDie: 6,
      faceValues: { kind: "range", min: 1, max: 9 },
      property: "one-cycle",
      allowTies: true,
      objective: "strongest-cycle",
      timeBudgetSeconds: 120,
    },
  },
  {
    label: "3 dice × 6 faces, values 1–9, one cycle, no ties",
    request: {
      diceCount: 3,
      facesPerDie: 6,
      faceValues: { kind: "range", min: 1, max: 9 },
      property: "one-cycle",
      allowTies: false,
      objective: "strongest-cycle",
      timeBudgetSeconds: 120,
    },
  },
  {
    label: "3 dice × 6 faces, values 1–9, reversing cycle, no ties",
    request: {
      diceCount: 3,
      facesPerDie: 6,
      faceValues: { kind: "range", min: 1, max: 9 },
      property: "reversing-cycle",
      allowTies: false,
      objective: "strongest-cycle",
      timeBudgetSeconds: 120,
    },
  },
];

const perSecond = (count: number, seconds: number) => (count / seconds).toExponential(2);

/** Seconds the plain way would take: every candidate cycle checked with three exact engine comparisons, timed on a random sample. */
function naiveEstimateSeconds(total: number): number {
  const pool = buildDicePool([1, 2, 3, 4, 5, 6, 7, 8, 9], 6);
  const random = mulberry32(2024);
  const start = performance.now();
  for (let sample = 0; sample < SAMPLED_CYCLES; sample += 1) {
    const [a, b, c] = [0, 1, 2].map(() => poolDieFaces(pool, randomBelow(random, pool.size)));
    const steps = [compareDice(a, b), compareDice(b, c), compareDice(c, a)];
    steps.every((step) => step.win.gt(step.loss));
  }
  return ((performance.now() - start) / 1000 / SAMPLED_CYCLES) * total;
}

const rows: string[][] = [];
let firstTotal = 0;
for (const { label, request } of cases) {
  const started = performance.now();
  const outcome = searchDiceSets(request);
  const seconds = (performance.now() - started) / 1000;
  if (firstTotal === 0) firstTotal = outcome.progress.total;
  const best = outcome.results[0];
  rows.push([
    label,
    `< ${TARGET_SECONDS} s`,
    `${seconds.toFixed(1)} s${outcome.complete ? "" : " (not complete)"}`,
    perSecond(outcome.progress.examined, seconds),
    perSecond(outcome.checked, seconds),
    best ? `${best.figures.weakestCycleWin} ${JSON.stringify(best.dice.map((die) => die.faces))}` : "none",
  ]);
}
const naive = naiveEstimateSeconds(firstTotal);

const header = ["case", "target", "time", "candidate cycles settled per s", "cycles checked one by one per s", "best weakest win"];
const widths = header.map((title, column) => Math.max(title.length, ...rows.map((row) => row[column].length)));
const line = (cells: string[]) => cells.map((cell, column) => cell.padEnd(widths[column])).join("  ");
console.log("Set finder, exhaustive search (figures from this machine; nothing asserted):");
console.log(line(header));
for (const row of rows) console.log(line(row));
console.log(
  `Naive baseline (every one of the ${firstTotal.toLocaleString("en-GB")} candidate cycles checked with the exact engine, timed on ${SAMPLED_CYCLES.toLocaleString("en-GB")} random ones): about ${Math.round(naive).toLocaleString("en-GB")} s.`,
);
console.log("Settled counts include cycles ruled out together by the bound (a failed step or a step too weak to enter the results).");
