import type { PooledMatchup, PooledResults } from "@shared/class-results/pooled-results";
import { matchupFromSeat, padDieOrder, seatShares, shareSentence } from "@shared/class-results/seat-shares";
import { tieRuleLabels } from "@shared/schemas/lessons";
import type { TieRule } from "@shared/probability/index";
import { ConvergenceChart } from "./convergence-chart";

export const decimal = (value: number | null | undefined, places = 3) =>
  value === null || value === undefined ? "–" : value.toFixed(places);

function modeText(entry: Pick<PooledMatchup, "dicePerPlayer" | "players">) {
  return `${entry.dicePerPlayer === 2 ? "two dice each" : "one die each"}, ${entry.players === 3 ? "three players" : "two players"}`;
}

/** The column words for a share and its exact value: "under the tie rule" wherever the rule changes the figure. */
function shareHeadings(tieRule: TieRule) {
  if (tieRule === "ties-score-nothing") return { share: "Share of rolls", exact: "Exact share" };
  return { share: `Share under the tie rule`, exact: "Exact under the tie rule" };
}

/**
 * One matchup's pooled counts, dice in the order the pads play it: each die's share under the tie rule beside its one
 * exact value, the first die's share in words with its interval, then the convergence chart.
 */
function MatchupCard({ entry, tieRule, dieOrder }: { entry: PooledMatchup; tieRule: TieRule; dieOrder: number[] }) {
  const shares = seatShares(entry, tieRule, dieOrder);
  const [lead] = shares;
  const headings = shareHeadings(tieRule);
  const label = shares.map((share) => share.dieName).join(" v ");
  return (
    <article className="min-w-0 rounded-2xl border-2 border-line bg-shell p-4" aria-labelledby={`matchup-${entry.key}`}>
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`matchup-${entry.key}`} className="text-xl">
          {label}
        </h3>
        <p className="text-sm text-ink-soft">
          {modeText(entry)} · {entry.rolls} rolls
        </p>
      </header>
      <div className="overflow-x-auto">
        <table className="w-full min-w-[22rem] text-left text-base" data-testid={`pooled-${entry.key}`}>
          <caption className="sr-only">
            Pooled counts for {label}, {tieRuleLabels[tieRule].toLowerCase()}
          </caption>
          <thead>
            <tr className="border-b-2 border-line">
              <th scope="col" className="py-1 pr-3">
                Die
              </th>
              <th scope="col" className="py-1 pr-3 text-right">
                Wins
              </th>
              <th scope="col" className="py-1 pr-3 text-right">
                Ties
              </th>
              <th scope="col" className="py-1 pr-3 text-right">
                Losses
              </th>
              <th scope="col" className="py-1 pr-3 text-right">
                {headings.share}
              </th>
              <th scope="col" className="py-1 text-right">
                {headings.exact}
              </th>
            </tr>
          </thead>
          <tbody>
            {shares.map((share) => (
              <tr key={share.seat} className="border-b border-line/60">
                <th scope="row" className="py-1 pr-3 font-bold">
                  {share.dieName}
                </th>
                <td className="py-1 pr-3 text-right tabular-nums">{share.wins}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{share.ties}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{share.losses}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{decimal(share.share)}</td>
                <td className="py-1 text-right tabular-nums">
                  {share.exact ? (
                    <>
                      {share.exact.fraction} <span className="text-ink-soft">≈ {share.exact.decimal}</span>
                    </>
                  ) : (
                    "every roll ties"
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-3 text-sm text-ink-soft">{tieRuleLabels[tieRule]}</p>
      <p className="text-2xl font-bold tabular-nums" data-testid={`frequency-${entry.key}`}>
        {shareSentence(lead.dieName, lead.share, tieRule)}
      </p>
      <p className="text-base tabular-nums text-ink-soft" data-testid={`exact-${entry.key}`}>
        {lead.interval ? `95% interval ${decimal(lead.interval.lower)} to ${decimal(lead.interval.upper)}` : "No interval yet"} ·{" "}
        {tieRule === "ties-score-nothing" ? "exact" : "exact under the tie rule"}{" "}
        {lead.exact ? `${lead.exact.fraction} ≈ ${lead.exact.decimal}` : "none: every roll ties"}
      </p>
      <div className="mt-3">
        <ConvergenceChart entry={matchupFromSeat(entry, tieRule, lead.seat)} tieRule={tieRule} />
      </div>
    </article>
  );
}

/** The class's pooled results: one card per matchup (dice in the pads' order), or a note while no rolls have come in. */
export function PooledMatchups({
  pooled,
  playedMatchups,
  diceCount,
}: {
  pooled: PooledResults;
  playedMatchups: (number[] | null)[];
  diceCount: number;
}) {
  if (pooled.matchups.length === 0) {
    return (
      <p className="rounded-2xl border-2 border-dashed border-line p-6 text-ink-soft">
        No rolls yet. They appear here as the groups record them.
      </p>
    );
  }
  return (
    <div className="grid gap-4 2xl:grid-cols-2">
      {pooled.matchups.map((entry) => (
        <MatchupCard
          key={entry.key}
          entry={entry}
          tieRule={pooled.tieRule}
          dieOrder={padDieOrder(entry.matchup, playedMatchups, diceCount)}
        />
      ))}
    </div>
  );
}
