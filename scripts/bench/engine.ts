// Benchmark of the exact probability engine against a naive enumeration of every joint outcome: npx tsx scripts/bench/engine.ts
import { analyzeSet, beatAllProbability, compareDice } from "../../shared/probability/index";
import { naiveBeatAll, naiveEnumeration, naiveSetAnalysis } from "./naive";

const NAIVE_BUDGET_MILLISECONDS = 10_000;

/** Median wall time in milliseconds of `repetitions` runs after `warmUps` untimed runs. */
function medianMilliseconds(task: () => unknown, repetitions: number, warmUps: number): number {
  for (let run = 0; run < warmUps; run += 1) task();
  const times: number[] = [];
  for (let run = 0; run < repetitions; run += 1) {
    const start = performance.now();
    task();
    times.push(performance.now() - start);
  }
  times.sort((x, y) => x - y);
  return times[Math.floor(times.length / 2)];
}

const format = (milliseconds: number): string => (milliseconds < 10 ? milliseconds.toFixed(3) : milliseconds.toFixed(1));

// Invented dice for the benchmark only.
const fiveDieSet = [
  { name: "Petrel", faces: [2, 2, 6, 6, 7, 7] },
  { name: "Gannet", faces: [1, 5, 5, 5, 9, 9] },
  { name: "Shag", faces: [3, 3, 4, 4, 8, 8] },
  { name: "Puffin", faces: [0, 4, 6, 6, 6, 10] },
  { name: "Tern", faces: [1, 2, 7, 7, 7, 8] },
];
const twentyA = [1, 2, 2, 4, 5, 7, 7, 8, 10, 11, 11, 13, 14, 14, 16, 17, 18, 18, 19, 20];
const twentyB = [3, 3, 3, 4, 6, 6, 8, 9, 9, 9, 12, 12, 12, 15, 15, 15, 16, 17, 19, 19];
const pick = [2, 2, 6, 6, 7, 7];
const opponents = [
  [1, 5, 5, 5, 9, 9],
  [3, 3, 4, 4, 8, 8],
];

const rows: string[][] = [];

// (a) A 5-die, 6-face set analysed for 1, 2 and 3 dice each, with every three-player pick.
{
  const ours = medianMilliseconds(() => analyzeSet(fiveDieSet), 21, 5);
  const naive = medianMilliseconds(() => naiveSetAnalysis(fiveDieSet.map((die) => die.faces)), 3, 1);
  const exact = analyzeSet(fiveDieSet);
  const brute = naiveSetAnalysis(fiveDieSet.map((die) => die.faces));
  const agree = exact.levels.every((level, index) =>
    level.matrix.every((row, i) => row.every((cell, j) => cell === null || cell.win.equals(brute.matrices[index][i][j]))),
  );
  rows.push([
    "(a) 5-die set, k = 1, 2, 3, all three-player picks",
    format(ours),
    format(naive),
    `${(naive / ours).toFixed(0)}×`,
    agree ? "yes" : "NO",
  ]);
}

// (b) Two d20 dice, 6 each: 20^12 joint outcomes, so the naive run gets a time budget.
{
  const ours = medianMilliseconds(() => compareDice(twentyA, twentyB, { dicePerPlayer: 6 }), 21, 5);
  const start = performance.now();
  const partial = naiveEnumeration([twentyA, twentyB], 6, NAIVE_BUDGET_MILLISECONDS);
  const spent = performance.now() - start;
  const share = partial.outcomesDone / partial.outcomesTotal;
  const extrapolated = spent / share;
  rows.push([
    "(b) two d20 dice, 6 each",
    format(ours),
    `did not finish in ${NAIVE_BUDGET_MILLISECONDS / 1000} s (${partial.outcomesDone.toExponential(2)} of ${partial.outcomesTotal.toExponential(2)} outcomes; extrapolated ${(extrapolated / 3_600_000).toFixed(1)} h)`,
    `> ${(spent / ours).toFixed(0)}× (extrapolated ${(extrapolated / ours).toExponential(1)}×)`,
    "n/a",
  ]);
}

// (c) Beat-all for one pick against two opponents, 3 dice each: 6^9 joint outcomes.
{
  const ours = medianMilliseconds(() => beatAllProbability(pick, opponents, { dicePerPlayer: 3 }), 21, 5);
  const naive = medianMilliseconds(() => naiveBeatAll(pick, opponents, 3), 3, 1);
  const agree = beatAllProbability(pick, opponents, { dicePerPlayer: 3 }).equals(naiveBeatAll(pick, opponents, 3));
  rows.push([
    "(c) beat-all, 1 pick vs 2 opponents, 3 dice each",
    format(ours),
    format(naive),
    `${(naive / ours).toFixed(0)}×`,
    agree ? "yes" : "NO",
  ]);
}

const header = ["case", "engine median (ms)", "naive median (ms)", "speed-up", "same answer"];
console.log(`| ${header.join(" | ")} |`);
console.log(`| ${header.map(() => "---").join(" | ")} |`);
for (const row of rows) console.log(`| ${row.join(" | ")} |`);
console.log("\nTargets: (a) < 20 ms, (b) < 5 ms, at least 100× faster than naive where naive finishes. Medians after warm-up.");
