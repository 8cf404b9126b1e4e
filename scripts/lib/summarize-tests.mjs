// Prints the closing "N passed, N failed" line over every step of npm test and exits non-zero on any failure.
import { existsSync, readFileSync } from "node:fs";

const [stepsFile, vitestFile] = process.argv.slice(2);
let passed = 0;
let failed = 0;
for (const line of readFileSync(stepsFile, "utf8").split("\n").filter(Boolean)) {
  const [outcome, ...name] = line.split(" ");
  if (name.join(" ") === "vitest") continue;
  if (outcome === "passed") passed += 1;
  else {
    failed += 1;
    console.log(`step failed: ${name.join(" ")}`);
  }
}
const vitestFailed = readFileSync(stepsFile, "utf8").includes("failed vitest");
if (existsSync(vitestFile)) {
  const report = JSON.parse(readFileSync(vitestFile, "utf8"));
  passed += report.numPassedTests;
  failed += report.numFailedTests;
  const brokenFiles = report.testResults.filter((file) => file.status === "failed" && file.assertionResults.length === 0);
  for (const file of brokenFiles) console.log(`test file could not run: ${file.name}\n${file.message ?? ""}`);
  failed += brokenFiles.length;
  if (vitestFailed && report.numFailedTests === 0 && brokenFiles.length === 0) failed += 1;
} else if (vitestFailed) {
  failed += 1;
  console.log("vitest did not produce a report");
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
