import { useId } from "react";
import type { PooledMatchup } from "@shared/class-results/pooled-results";
import type { ResultsDie } from "@shared/schemas/results";
import { modeLabel } from "@/lib/probability-text";
import { three } from "./figures";
import { MatchupLabel } from "./matchup-label";

/** Counts a phone leaves out (the exports and the wider screen show them). */
const countColumn = "hidden sm:table-cell";

/** Whether the exact value lies inside the interval, in words and a mark (never by colour alone). */
function Agreement({ matchup }: { matchup: PooledMatchup }) {
  const exact = matchup.exact.underTieRule;
  if (!exact || !matchup.interval) return <span className="text-ink-soft">—</span>;
  const inside = matchup.interval.lower <= exact.value && exact.value <= matchup.interval.upper;
  return inside ? <span>✓ inside</span> : <span className="font-bold text-alarm">✗ outside</span>;
}

/** The pooled results per matchup beside the exact values: counts, relative frequency, exact fraction, Wilson 95% interval. */
export function PooledTable({ matchups, dice, caption }: { matchups: PooledMatchup[]; dice: ResultsDie[]; caption: string }) {
  const mixedModes = new Set(matchups.map((entry) => entry.dicePerPlayer)).size > 1;
  const captionId = useId();
  return (
    <div>
      <p id={captionId} className="mb-2 text-sm text-ink-soft">
        {caption}
      </p>
      <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell print:rounded-none print:border">
        <table className="w-full border-collapse text-left" aria-describedby={captionId}>
          <caption className="sr-only">Pooled results per matchup</caption>
          <thead>
            <tr className="border-b-2 border-line text-sm">
              <th scope="col" className="px-3 py-2">
                Matchup
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Rolls
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Class estimate
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Exact
              </th>
              <th scope="col" className="px-3 py-2">
                Wilson 95% interval
              </th>
              <th scope="col" className="px-3 py-2">
                Exact in interval
              </th>
              <th scope="col" className={`px-3 py-2 text-right ${countColumn}`}>
                First die won
              </th>
              <th scope="col" className={`px-3 py-2 text-right ${countColumn}`}>
                Ties
              </th>
            </tr>
          </thead>
          <tbody>
            {matchups.map((entry) => (
              <tr key={entry.key} className="border-b border-line last:border-b-0 even:bg-sand/40">
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  <MatchupLabel matchup={entry.matchup} dice={dice} />
                  {mixedModes && <span className="block text-sm text-ink-soft">{modeLabel(entry.dicePerPlayer)}</span>}
                </th>
                <td className="px-3 py-2 text-right tabular-nums">{entry.rolls}</td>
                <td className="px-3 py-2 text-right tabular-nums font-bold">{three(entry.frequencyUnderTieRule)}</td>
                <td className="px-3 py-2 text-right tabular-nums whitespace-nowrap">
                  {entry.exact.underTieRule ? (
                    <>
                      <span className="font-bold">{entry.exact.underTieRule.fraction}</span>{" "}
                      <span className="text-ink-soft">({entry.exact.underTieRule.decimal})</span>
                    </>
                  ) : (
                    "—"
                  )}
                </td>
                <td className="px-3 py-2 tabular-nums whitespace-nowrap">
                  {entry.interval ? `${three(entry.interval.lower)} to ${three(entry.interval.upper)}` : "—"}
                </td>
                <td className="px-3 py-2 whitespace-nowrap">
                  <Agreement matchup={entry} />
                </td>
                <td className={`px-3 py-2 text-right tabular-nums ${countColumn}`}>{entry.seats[0].wins}</td>
                <td className={`px-3 py-2 text-right tabular-nums ${countColumn}`}>{entry.seats[0].ties}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
