import { Link } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { DieSwatch } from "@/components/dice/die-swatch";
import { useRunResults } from "../api/get-run-results";
import { ConvergenceChart } from "./convergence-chart";
import { dayText, plural, runModeText, tallyHeading, tieRulePhrase, tieRuleText } from "./figures";
import { PooledTable } from "./pooled-table";
import { MatchupTree } from "@/components/tree-diagram";

/** The printable class report: lesson, set, tree diagram of the main matchup, pooled results beside exact values, convergence, findings. */
export function ClassReportPage({ runId, includeSimulated = true }: { runId: string; includeSimulated?: boolean }) {
  const results = useRunResults(runId, includeSimulated);
  if (results.isPending) return <p role="status">Preparing the class report…</p>;
  if (results.isError) {
    return (
      <Alert tone="error" title="The class report could not be prepared">
        {results.error.message}{" "}
        <Link to="/app/results" className="font-bold underline">
          Back to Results
        </Link>
      </Alert>
    );
  }
  const { run, pooled, tallies, findings, mainMatchupKey } = results.data;
  const main = tallies[0]?.pooled.matchups.find((entry) => entry.key === mainMatchupKey) ?? null;
  const [firstIndex, secondIndex] = main?.matchup ?? [];
  const tree = main !== null && main.players === 2;

  return (
    <article className="mx-auto max-w-[52rem] bg-white p-4 text-ink sm:p-8 print:max-w-none print:p-0">
      <style>{"@page { size: A4; margin: 14mm; } @media print { main { padding: 0 !important; max-width: none !important; } }"}</style>
      <div className="no-print mb-6 flex flex-wrap items-center justify-between gap-3">
        <Link to={`/app/results/${run.id}`} className="font-bold text-tide-dark underline underline-offset-2">
          ← Back to the results
        </Link>
        <Button onClick={() => window.print()}>Print or save as PDF</Button>
      </div>

      <header className="mb-6 border-b-2 border-ink pb-4">
        <p className="text-sm font-bold uppercase tracking-wide text-ink-soft">Class report</p>
        <h1 className="text-3xl">{run.title}</h1>
        <p className="mt-1 text-lg">
          {run.classGroup ? `Class ${run.classGroup}` : "No class"} · taught {dayText(run.taughtAt)} · {run.ownerName}
        </p>
        <p className="text-ink-soft">
          {run.diceSetName}: {runModeText(run)}, {tieRuleText(run.tieRule).toLowerCase()} · {plural(pooled.totals.rolls, "roll")} from{" "}
          {plural(pooled.totals.groups, "group")}
          {pooled.totals.bySource.simulated > 0 && ` (${pooled.totals.bySource.simulated} simulated)`}
        </p>
      </header>

      <section className="mb-6 break-inside-avoid" aria-labelledby="report-findings">
        <h2 id="report-findings" className="mb-2 text-xl">
          What the class found
        </h2>
        <ol className="flex list-decimal flex-col gap-1 pl-6 text-lg">
          {findings.map((finding) => (
            <li key={finding}>{finding}</li>
          ))}
        </ol>
      </section>

      <section className="mb-6 break-inside-avoid" aria-labelledby="report-set">
        <h2 id="report-set" className="mb-2 text-xl">
          The set
        </h2>
        <ul className="grid gap-2 sm:grid-cols-2">
          {run.dice.map((die) => (
            <li key={die.name} className="flex items-center gap-2">
              <DieSwatch colour={die.colour} pattern={die.pattern} className="h-6 w-6" />
              <span className="font-bold">{die.name}</span>
              <span className="tabular-nums text-ink-soft">{die.faces.join(" · ")}</span>
            </li>
          ))}
        </ul>
      </section>

      {main && tree && (
        <section className="mb-6 break-inside-avoid" aria-labelledby="report-tree">
          <h2 id="report-tree" className="mb-2 text-xl">
            Prove it: the tree diagram of {main.label}
          </h2>
          <MatchupTree first={run.dice[firstIndex]} second={run.dice[secondIndex]} dicePerPlayer={main.dicePerPlayer} look="print" />
        </section>
      )}

      <section className="mb-6 break-inside-avoid" aria-labelledby="report-pooled">
        <h2 id="report-pooled" className="mb-2 text-xl">
          Pooled results beside the exact values
        </h2>
        {pooled.matchups.length > 0 ? (
          <div className="flex flex-col gap-4">
            {tallies
              .filter((entry) => entry.pooled.matchups.length > 0)
              .map((entry) => (
                <div key={entry.tally.tally} className="break-inside-avoid">
                  {tallies.length > 1 && <h3 className="mb-1 text-lg">{tallyHeading(entry.tally)}</h3>}
                  <PooledTable
                    matchups={entry.pooled.matchups}
                    dice={run.dice}
                    caption={`Each class estimate is the relative frequency of the first die of its matchup winning, ${tieRulePhrase(run.tieRule)}, beside the exact probability under the same tie rule.`}
                  />
                </div>
              ))}
          </div>
        ) : (
          <p>No rolls that count are stored for this run.</p>
        )}
      </section>

      {main && (
        <section className="mb-6 break-inside-avoid" aria-labelledby="report-convergence">
          <h2 id="report-convergence" className="mb-2 text-xl">
            How the estimate settled: {main.label}
          </h2>
          <div className="overflow-x-auto">
            <ConvergenceChart matchup={main} tieRule={run.tieRule} size={{ width: 660, height: 260 }} />
          </div>
        </section>
      )}

      <footer className="mt-8 border-t border-line pt-2 text-sm text-ink-soft">
        Made with Outroll. Outroll stores only group nicknames and rolls for this run, until the teacher deletes it.
      </footer>
    </article>
  );
}
