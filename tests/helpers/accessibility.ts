// Accessibility checks for browser tests: axe-core (through @axe-core/playwright) run on the page as it is now.
import { AxeBuilder } from "@axe-core/playwright";
import type { Page } from "playwright-core";

const failingImpacts = new Set(["serious", "critical"]);

/**
 * Runs every axe-core rule on the page and fails, naming the screen, with one line per serious or critical violation:
 * the rule id, its impact, axe's help text and the selectors of the elements it found (with axe's own summary, which
 * for colour contrast gives the measured ratio). Minor and moderate findings are not failures.
 */
export async function expectNoSeriousViolations(page: Page, name: string) {
  const results = await new AxeBuilder({ page }).analyze();
  const found = results.violations
    .filter((violation) => failingImpacts.has(violation.impact ?? ""))
    .flatMap((violation) =>
      violation.nodes.map((node) => {
        const summary = (node.failureSummary ?? "").split("\n").slice(1, 2).join("").trim();
        return `${violation.id} (${violation.impact}): ${violation.help} at ${node.target.join(" ")}${summary ? ` (${summary})` : ""}`;
      }),
    );
  if (found.length > 0) {
    throw new Error(
      `${found.length} serious or critical accessibility violations on ${name}:\n${found.map((line) => `- ${line}`).join("\n")}`,
    );
  }
}
