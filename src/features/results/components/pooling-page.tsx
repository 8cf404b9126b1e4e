import { useMemo, useState } from "react";
import { Link, useSearchParams } from "react-router-dom";
import type { ResultsRunSummary, ResultsScope } from "@shared/schemas/results";
import { Alert } from "@/components/ui/alert";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { modeLabel } from "@/lib/probability-text";
import { usePooledResults } from "../api/get-pooled-results";
import { useResultsRuns } from "../api/list-results-runs";
import { ConvergenceChart } from "./convergence-chart";
import { dayText, playersText, plural, runModeText, three, tieRuleText } from "./figures";
import { PooledTable } from "./pooled-table";

type SetChoice = { setKey: string; label: string; runs: ResultsRunSummary[] };

/** Pooling across classes: several closed runs of one set and mode in one convergence chart and table, each class's share shown. */
export function PoolingPage({ canSeeDepartment }: { canSeeDepartment: boolean }) {
  const [params, setParams] = useSearchParams();
  const scope: ResultsScope = canSeeDepartment && params.get("scope") === "department" ? "department" : "mine";
  const [includeSimulated, setIncludeSimulated] = useState(true);
  const [chosenKey, setChosenKey] = useState<string | null>(null);
  const runs = useResultsRuns(scope);

  const sets = useMemo<SetChoice[]>(() => {
    const bySet = new Map<string, SetChoice>();
    for (const run of runs.data?.runs ?? []) {
      const entry = bySet.get(run.setKey) ?? { setKey: run.setKey, label: `${run.diceSetName} (${run.dieNames.join(", ")})`, runs: [] };
      entry.runs.push(run);
      bySet.set(run.setKey, entry);
    }
    return [...bySet.values()].sort((a, b) => b.runs.length - a.runs.length || a.label.localeCompare(b.label));
  }, [runs.data]);
  const setKey = sets.some((entry) => entry.setKey === params.get("setKey")) ? params.get("setKey")! : sets[0]?.setKey;
  const ofSet = sets.find((entry) => entry.setKey === setKey)?.runs ?? [];
  const requested = params.get("runIds")?.split(",").filter(Boolean);
  const selected = requested ? ofSet.filter((run) => requested.includes(run.id)).map((run) => run.id) : ofSet.map((run) => run.id);
  // Runs are listed by their main mode, so the default pools what the lessons were about; the Twist is the other choice.
  const mainDice = ofSet[0]?.dicePerPlayer === 2 ? 2 : 1;
  const dicePerPlayer = Number(params.get("dicePerPlayer") ?? mainDice) === 2 ? 2 : 1;
  const modeNote = (dice: number) =>
    dice === mainDice ? " (the main mode)" : ofSet.some((run) => run.twist?.dicePerPlayer === dice) ? " (the Twist)" : "";
  const pooled = usePooledResults({ scope, dicePerPlayer, runIds: selected, includeSimulated }, selected.length > 0);

  const update = (next: Record<string, string | null>) => {
    const merged = new URLSearchParams(params);
    for (const [key, value] of Object.entries(next)) {
      if (value === null) merged.delete(key);
      else merged.set(key, value);
    }
    setParams(merged, { replace: true });
  };
  const toggleRun = (runId: string, on: boolean) => {
    const next = on ? [...selected, runId] : selected.filter((id) => id !== runId);
    update({ runIds: next.join(",") || "none" });
  };

  const data = pooled.data;
  const matchups = data?.pooled.matchups ?? [];
  const chartKey =
    chosenKey && matchups.some((entry) => entry.key === chosenKey)
      ? chosenKey
      : matchups.reduce<string | null>(
          (best, entry) => (best === null || entry.rolls > (matchups.find((m) => m.key === best)?.rolls ?? 0) ? entry.key : best),
          null,
        );
  const chartMatchup = matchups.find((entry) => entry.key === chartKey) ?? null;

  return (
    <>
      <p className="mb-2">
        <Link to="/app/results" className="font-bold text-tide-dark underline underline-offset-2">
          ← Results
        </Link>
      </p>
      <PageHeader
        title="Pool several runs"
        lead="Put the rolls of several classes together: runs of the same set (the same dice faces, whatever the dice are called) and the same mode, in one convergence chart and one table, with each class's share."
      />
      <section aria-label="Runs to pool" className="mb-6 grid gap-4 rounded-2xl border-2 border-line bg-shell p-4 lg:grid-cols-2">
        {canSeeDepartment && (
          <ChoiceGroup<ResultsScope>
            legend="Whose runs"
            value={scope}
            onChange={(value) => update({ scope: value, runIds: null, setKey: null })}
            options={[
              { value: "mine", label: "My runs" },
              { value: "department", label: "Whole department" },
            ]}
            className="lg:col-span-2"
          />
        )}
        <SelectField
          label="Dice set"
          value={setKey ?? ""}
          onChange={(event) => update({ setKey: event.target.value, runIds: null })}
          options={
            sets.length > 0
              ? sets.map((entry) => ({ value: entry.setKey, label: `${entry.label}: ${plural(entry.runs.length, "run")}` }))
              : [{ value: "", label: "No closed runs yet" }]
          }
        />
        <ChoiceGroup<"1" | "2">
          legend="Mode"
          value={String(dicePerPlayer) as "1" | "2"}
          onChange={(value) => update({ dicePerPlayer: value })}
          options={[
            { value: "1", label: `One die each${modeNote(1)}` },
            { value: "2", label: `Two dice each${modeNote(2)}` },
          ]}
        />
        {ofSet.length > 0 && (
          <fieldset className="lg:col-span-2">
            <legend className="mb-1 font-bold">Runs</legend>
            <ul className="grid gap-1 sm:grid-cols-2">
              {ofSet.map((run) => (
                <li key={run.id}>
                  <label className="flex min-h-11 items-start gap-2">
                    <input
                      type="checkbox"
                      className="mt-1 h-5 w-5 accent-tide"
                      checked={selected.includes(run.id)}
                      onChange={(event) => toggleRun(run.id, event.target.checked)}
                    />
                    <span>
                      <span className="font-bold">{run.classGroup || "No class"}</span> · {run.title}
                      <span className="block text-sm text-ink-soft">
                        {dayText(run.taughtAt)} · {plural(run.rollCount, "roll")} · {runModeText(run)},{" "}
                        {tieRuleText(run.tieRule).toLowerCase()}
                        {scope === "department" && ` · ${run.ownerName}`}
                      </span>
                    </span>
                  </label>
                </li>
              ))}
            </ul>
          </fieldset>
        )}
        <label className="flex min-h-11 items-center gap-2 font-bold lg:col-span-2">
          <input
            type="checkbox"
            className="h-5 w-5 accent-tide"
            checked={includeSimulated}
            onChange={(event) => setIncludeSimulated(event.target.checked)}
          />
          Include simulated rolls
        </label>
      </section>

      {runs.isPending && <p role="status">Loading the closed runs…</p>}
      {runs.isError && (
        <Alert tone="error" title="The closed runs could not be loaded">
          {runs.error.message}
        </Alert>
      )}
      {selected.length === 0 && ofSet.length > 0 && <Alert tone="info">Tick at least one run to pool.</Alert>}
      {pooled.isError && (
        <Alert tone="error" title="These runs cannot be pooled">
          {pooled.error.message}
        </Alert>
      )}
      {data && selected.length > 0 && (
        <>
          <p className="mb-4 text-lg" role="status" aria-live="polite">
            {plural(data.pooled.totals.rolls, "roll")} from {plural(data.contributions.length, "run")}: {modeLabel(data.dicePerPlayer)},{" "}
            {playersText(data.players)}, {tieRuleText(data.tieRule).toLowerCase()}.
          </p>
          <section className="mb-8" aria-labelledby="pooled-table">
            <h2 id="pooled-table" className="mb-3 text-2xl">
              Pooled results beside the exact values
            </h2>
            {matchups.length > 0 ? (
              <PooledTable
                matchups={matchups}
                dice={data.dice}
                caption="Dice are named as in the earliest run; runs that named them differently are matched by their faces."
              />
            ) : (
              <p className="text-ink-soft">These runs have no rolls {modeLabel(data.dicePerPlayer)}.</p>
            )}
          </section>
          {chartMatchup && (
            <section className="mb-8" aria-labelledby="pooled-convergence">
              <h2 id="pooled-convergence" className="mb-3 text-2xl">
                Convergence of the pooled rolls
              </h2>
              {matchups.length > 1 && (
                <SelectField
                  label="Matchup"
                  className="mb-3 max-w-sm"
                  value={chartMatchup.key}
                  onChange={(event) => setChosenKey(event.target.value)}
                  options={matchups.map((entry) => ({ value: entry.key, label: `${entry.label} (${plural(entry.rolls, "roll")})` }))}
                />
              )}
              <div className="rounded-2xl border-2 border-line bg-shell p-3">
                <ConvergenceChart matchup={chartMatchup} tieRule={data.tieRule} />
              </div>
            </section>
          )}
          <section className="mb-8" aria-labelledby="pooled-contributions">
            <h2 id="pooled-contributions" className="mb-3 text-2xl">
              Each class&rsquo;s contribution
            </h2>
            <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
              <table className="w-full border-collapse text-left">
                <caption className="px-3 pt-3 text-left text-sm text-ink-soft">
                  Rolls and class estimate of each run, per matchup; the last row is the pool.
                </caption>
                <thead>
                  <tr className="border-b-2 border-line text-sm">
                    <th scope="col" className="px-3 py-2">
                      Run
                    </th>
                    {matchups.map((entry) => (
                      <th key={entry.key} scope="col" className="px-3 py-2 text-right">
                        {entry.label}
                      </th>
                    ))}
                    <th scope="col" className="px-3 py-2 text-right">
                      Share of the pool
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {data.contributions.map((share) => {
                    const rolls = share.matchups.reduce((sum, entry) => sum + entry.rolls, 0);
                    const percent = data.pooled.totals.rolls === 0 ? 0 : (rolls / data.pooled.totals.rolls) * 100;
                    return (
                      <tr key={share.run.id} className="border-b border-line even:bg-sand/40">
                        <th scope="row" className="px-3 py-2 text-left">
                          {share.run.classGroup || "No class"}
                          <span className="block text-sm font-normal text-ink-soft">
                            {dayText(share.run.taughtAt)} · {share.run.ownerName}
                          </span>
                        </th>
                        {matchups.map((entry) => {
                          const own = share.matchups.find((item) => item.key === entry.key);
                          return (
                            <td key={entry.key} className="px-3 py-2 text-right tabular-nums">
                              {own ? (
                                <>
                                  {own.rolls} <span className="text-ink-soft">rolls</span>
                                  <span className="block">{three(own.frequencyUnderTieRule)}</span>
                                </>
                              ) : (
                                "—"
                              )}
                            </td>
                          );
                        })}
                        <td className="px-3 py-2 text-right tabular-nums">
                          {percent.toFixed(0)}%
                          <span className="mt-1 block h-2 rounded bg-sand" aria-hidden="true">
                            <span className="block h-2 rounded bg-tide" style={{ width: `${percent}%` }} />
                          </span>
                        </td>
                      </tr>
                    );
                  })}
                  <tr className="border-t-2 border-ink font-bold">
                    <th scope="row" className="px-3 py-2 text-left">
                      Pooled
                    </th>
                    {matchups.map((entry) => (
                      <td key={entry.key} className="px-3 py-2 text-right tabular-nums">
                        {entry.rolls} <span className="font-normal text-ink-soft">rolls</span>
                        <span className="block">{three(entry.frequencyUnderTieRule)}</span>
                      </td>
                    ))}
                    <td className="px-3 py-2 text-right">100%</td>
                  </tr>
                </tbody>
              </table>
            </div>
          </section>
        </>
      )}
    </>
  );
}
