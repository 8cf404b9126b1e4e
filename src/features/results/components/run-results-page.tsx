import { useState, type ReactNode } from "react";
import { Link } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { useRunResults } from "../api/get-run-results";
import { ConvergenceChart } from "./convergence-chart";
import { DeleteRunButton } from "./delete-run-button";
import { ExportDownloads } from "./export-downloads";
import { dayText, plural, runModeText, tallyHeading, tieRulePhrase, tieRuleText } from "./figures";
import { GroupTable } from "./group-table";
import { GuessVotes } from "./guess-votes";
import { PooledTable } from "./pooled-table";
import { PupilDataNote } from "./pupil-data-note";
import { formatNumber } from "@/lib/format";

function Section({ title, children, id }: { title: string; children: ReactNode; id?: string }) {
  return (
    <section className="mb-8" aria-labelledby={id}>
      <h2 id={id} className="mb-3 text-2xl">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Figure({ label, value }: { label: string; value: ReactNode }) {
  return (
    <div className="rounded-2xl border-2 border-line bg-shell p-3">
      <dt className="text-sm text-ink-soft">{label}</dt>
      <dd className="text-2xl font-bold tabular-nums">{value}</dd>
    </div>
  );
}

/** A run's results page: the pooled figures, the convergence chart, each group's results, the Guess votes and the exports. */
export function RunResultsPage({ runId }: { runId: string }) {
  const [includeSimulated, setIncludeSimulated] = useState(true);
  const results = useRunResults(runId, includeSimulated);
  const [chosenKey, setChosenKey] = useState<string | null>(null);

  if (results.isPending) return <p role="status">Pooling the run&rsquo;s rolls…</p>;
  if (results.isError) {
    return (
      <Alert tone="error" title="This run's results could not be loaded">
        {results.error.message}{" "}
        <Link to="/app/results" className="font-bold underline">
          Back to Results
        </Link>
      </Alert>
    );
  }
  const { run, pooled, tallies, groups, guessVotes, findings, mainMatchupKey } = results.data;
  const chartKey = chosenKey && pooled.matchups.some((entry) => entry.key === chosenKey) ? chosenKey : mainMatchupKey;
  const chartMatchup = pooled.matchups.find((entry) => entry.key === chartKey) ?? null;
  const simulated = pooled.totals.bySource.simulated;

  return (
    <>
      <p className="no-print mb-2">
        <Link to="/app/results" className="font-bold text-tide-dark underline underline-offset-2">
          ← Results
        </Link>
      </p>
      <PageHeader
        title={run.title}
        lead={
          <>
            {run.diceSetName} · {run.classGroup ? `class ${run.classGroup}` : "no class"} · taught {dayText(run.taughtAt)} ·{" "}
            {runModeText(run)} · {tieRuleText(run.tieRule).toLowerCase()}
            {!run.isOwner && <> · run by {run.ownerName}</>}
          </>
        }
        actions={
          <>
            <LinkButton to={`/app/results/${run.id}/report${includeSimulated ? "" : "?includeSimulated=false"}`} variant="primary">
              Class report
            </LinkButton>
            <LinkButton
              to={`/app/results/pooled?setKey=${run.setKey}&dicePerPlayer=${run.dicePerPlayer}${run.isOwner ? "" : "&scope=department"}`}
              variant="secondary"
            >
              Pool with other runs
            </LinkButton>
            {run.isOwner && (
              <>
                <LinkButton to={`/app/results/${run.id}/tally-grid`} variant="secondary">
                  Tally grid
                </LinkButton>
                <LinkButton to={`/app/results/${run.id}/paper-import`} variant="secondary">
                  Paper import
                </LinkButton>
              </>
            )}
          </>
        }
      />
      {run.status !== "closed" && (
        <div className="mb-4">
          <Alert tone="caution" title="This run is still going">
            The figures include every roll recorded so far.
          </Alert>
        </div>
      )}

      <label className="mb-4 flex min-h-11 items-center gap-2 font-bold">
        <input
          type="checkbox"
          className="h-5 w-5 accent-tide"
          checked={includeSimulated}
          onChange={(event) => setIncludeSimulated(event.target.checked)}
        />
        Include simulated rolls (the virtual class) in the figures and downloads
      </label>

      <dl className="mb-6 grid grid-cols-2 gap-3 sm:grid-cols-4">
        <Figure label="Rolls" value={formatNumber(pooled.totals.rolls)} />
        <Figure label="Groups with rolls" value={pooled.totals.groups} />
        <Figure label="Matchups" value={pooled.totals.matchups} />
        <Figure label="Simulated rolls" value={formatNumber(simulated)} />
      </dl>

      <Section title="What the class found" id="findings">
        <ul className="flex max-w-3xl list-disc flex-col gap-2 pl-6 text-lg">
          {findings.map((finding) => (
            <li key={finding}>{finding}</li>
          ))}
        </ul>
      </Section>

      <Section title="Pooled results beside the exact values" id="pooled">
        {pooled.matchups.length === 0 ? (
          <p className="text-ink-soft">No rolls that count are stored for this run yet.</p>
        ) : (
          <div className="flex flex-col gap-6">
            {tallies
              .filter((entry) => entry.tally.tally === 1 || entry.pooled.matchups.length > 0)
              .map((entry) => (
                <div key={entry.tally.tally} data-testid={`results-tally-${entry.tally.tally}`}>
                  {tallies.length > 1 && <h3 className="mb-2 text-xl">{tallyHeading(entry.tally)}</h3>}
                  {entry.pooled.matchups.length === 0 ? (
                    <p className="text-ink-soft">No rolls that count in this tally.</p>
                  ) : (
                    <PooledTable
                      matchups={entry.pooled.matchups}
                      dice={run.dice}
                      caption={`Each class estimate is the relative frequency of the first die of its matchup winning, ${tieRulePhrase(run.tieRule)}; the exact value beside it is the probability of the same, under the tie rule. Undone rolls are never counted.`}
                    />
                  )}
                </div>
              ))}
          </div>
        )}
      </Section>

      {chartMatchup && (
        <Section title="Convergence" id="convergence">
          {pooled.matchups.length > 1 && (
            <SelectField
              label="Matchup"
              className="mb-3 max-w-sm"
              value={chartMatchup.key}
              onChange={(event) => setChosenKey(event.target.value)}
              options={pooled.matchups.map((entry) => ({ value: entry.key, label: `${entry.label} (${plural(entry.rolls, "roll")})` }))}
            />
          )}
          <div className="rounded-2xl border-2 border-line bg-shell p-3">
            <ConvergenceChart matchup={chartMatchup} tieRule={run.tieRule} />
          </div>
        </Section>
      )}

      <Section title="Each group" id="groups">
        <GroupTable groups={pooled.groups} dice={run.dice} />
        {groups.some((group) => group.rolls === 0) && (
          <p className="mt-2 text-sm text-ink-soft">
            Groups without rolls that count:{" "}
            {groups
              .filter((group) => group.rolls === 0)
              .map((group) => group.nickname)
              .join(", ")}
            .
          </p>
        )}
      </Section>

      <Section title="Guess votes" id="votes">
        <GuessVotes votes={guessVotes} dice={run.dice} />
      </Section>

      <Section title="Downloads" id="downloads">
        <ExportDownloads runId={run.id} includeSimulated={includeSimulated} />
      </Section>

      <div className="mb-8 grid max-w-3xl gap-4">
        <PupilDataNote />
        {run.isOwner && run.status === "closed" && (
          <div>
            <DeleteRunButton runId={run.id} title={run.title} rolls={run.rollCount} groups={run.groupCount} />
          </div>
        )}
      </div>
    </>
  );
}
