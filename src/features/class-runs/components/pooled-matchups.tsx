import type { PooledMatchup, PooledResults } from "@shared/class-results/pooled-results";
import { tieRuleLabels } from "@shared/schemas/lessons";
import { ConvergenceChart, frequencyMeaning } from "./convergence-chart";

export const decimal = (value: number | null | undefined, places = 3) => (value === null || value === undefined ? "–" : value.toFixed(places));

function modeText(entry: Pick<PooledMatchup, "dicePerPlayer" | "players">) {
  return `${entry.dicePerPlayer === 2 ? "two dice each" : "one die each"}, ${entry.players === 3 ? "three players" : "two players"}`;
}

/** One matchup's pooled counts beside the exact probabilities, then its convergence chart. */
function MatchupCard({ entry, tieRule }: { entry: PooledMatchup; tieRule: string }) {
  const first = entry.seats[0];
  return (
    <article className="rounded-2xl border-2 border-line bg-shell p-4" aria-labelledby={`matchup-${entry.key}`}>
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`matchup-${entry.key}`} className="text-xl">
          {entry.label}
        </h3>
        <p className="text-sm text-ink-soft">
          {modeText(entry)} · {entry.rolls} rolls
        </p>
      </header>
      <div className="overflow-x-auto">
        <table className="w-full min-w-[22rem] text-left text-base" data-testid={`pooled-${entry.key}`}>
          <caption className="sr-only">Pooled counts for {entry.label}</caption>
          <thead>
            <tr className="border-b-2 border-line">
              <th scope="col" className="py-1 pr-3">Die</th>
              <th scope="col" className="py-1 pr-3 text-right">Wins</th>
              <th scope="col" className="py-1 pr-3 text-right">Ties</th>
              <th scope="col" className="py-1 pr-3 text-right">Losses</th>
              <th scope="col" className="py-1 pr-3 text-right">Win share</th>
              <th scope="col" className="py-1 text-right">Exact</th>
            </tr>
          </thead>
          <tbody>
            {entry.seats.map((seat) => (
              <tr key={seat.seat} className="border-b border-line/60">
                <th scope="row" className="py-1 pr-3 font-bold">{seat.dieName}</th>
                <td className="py-1 pr-3 text-right tabular-nums">{seat.wins}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{seat.ties}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{seat.losses}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{decimal(entry.rolls ? seat.wins / entry.rolls : null)}</td>
                <td className="py-1 text-right tabular-nums">
                  {entry.exact.seatWins[seat.seat].fraction} <span className="text-ink-soft">≈ {entry.exact.seatWins[seat.seat].decimal}</span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-base sm:grid-cols-2">
        <div>
          <dt className="text-sm text-ink-soft">{tieRuleLabels[tieRule as keyof typeof tieRuleLabels]}: {frequencyMeaning(entry, tieRule)}</dt>
          <dd className="text-2xl font-bold tabular-nums" data-testid={`frequency-${entry.key}`}>
            {decimal(entry.frequencyUnderTieRule)}
            <span className="ml-2 text-base font-normal text-ink-soft">
              95% interval {entry.interval ? `${decimal(entry.interval.lower)} to ${decimal(entry.interval.upper)}` : "–"}
            </span>
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-soft">Exact chance for {first.dieName} under the tie rule</dt>
          <dd className="text-2xl font-bold tabular-nums" data-testid={`exact-${entry.key}`}>
            {entry.exact.underTieRule ? (
              <>
                {entry.exact.underTieRule.fraction} <span className="text-base font-normal text-ink-soft">≈ {entry.exact.underTieRule.decimal}</span>
              </>
            ) : (
              "every roll ties"
            )}
          </dd>
        </div>
      </dl>
      <div className="mt-3">
        <ConvergenceChart entry={entry} tieRule={tieRule} />
      </div>
    </article>
  );
}

/** The class's pooled results: one card per matchup, or a note while no rolls have come in. */
export function PooledMatchups({ pooled }: { pooled: PooledResults }) {
  if (pooled.matchups.length === 0) {
    return <p className="rounded-2xl border-2 border-dashed border-line p-6 text-ink-soft">No rolls yet. They appear here as the groups record them.</p>;
  }
  return (
    <div className="grid gap-4 2xl:grid-cols-2">
      {pooled.matchups.map((entry) => (
        <MatchupCard key={entry.key} entry={entry} tieRule={pooled.tieRule} />
      ))}
    </div>
  );
}
