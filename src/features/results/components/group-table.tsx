import type { PooledGroup } from "@shared/class-results/pooled-results";
import type { ResultsDie } from "@shared/schemas/results";
import { three } from "./figures";
import { MatchupLabel } from "./matchup-label";

const sourceWords: Record<string, string> = { phone: "phone", simulated: "simulated", paper: "paper" };

/** Each group's results per matchup, with the binomial check that flags a recording worth a second look. */
export function GroupTable({ groups, dice }: { groups: PooledGroup[]; dice: ResultsDie[] }) {
  if (groups.length === 0) return <p className="text-ink-soft">No group has recorded a roll yet.</p>;
  return (
    <div>
      <p className="mb-2 text-sm text-ink-soft">
        &ldquo;Check&rdquo; marks a group result the exact binomial test finds unlikely for fair dice (p below 0.01): worth asking the group
        how it recorded.
      </p>
      <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Each group&rsquo;s rolls per matchup</caption>
          <thead>
            <tr className="border-b-2 border-line text-sm">
              <th scope="col" className="px-3 py-2">
                Group
              </th>
              <th scope="col" className="px-3 py-2">
                Matchup
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Rolls
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                First die won
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Group estimate
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                p-value
              </th>
              <th scope="col" className="px-3 py-2">
                Recording
              </th>
            </tr>
          </thead>
          <tbody>
            {groups.map((group) => (
              <tr key={`${group.groupId}-${group.matchupKey}`} className="border-b border-line last:border-b-0 even:bg-sand/40">
                <th scope="row" className="px-3 py-2 text-left">
                  {group.groupNickname ?? "Unnamed group"}
                  <span className="block text-sm font-normal text-ink-soft">
                    {group.sources.map((source) => sourceWords[source] ?? source).join(", ")}
                  </span>
                </th>
                <td className="px-3 py-2">
                  <MatchupLabel matchup={group.matchup} dice={dice} />
                </td>
                <td className="px-3 py-2 text-right tabular-nums">{group.rolls}</td>
                <td className="px-3 py-2 text-right tabular-nums">{group.seats[0].wins}</td>
                <td className="px-3 py-2 text-right tabular-nums">{three(group.frequencyUnderTieRule)}</td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {group.test.pValue < 0.001 ? "< 0.001" : group.test.pValue.toFixed(3)}
                </td>
                <td className="px-3 py-2">
                  {group.test.implausible ? <span className="font-bold text-alarm">⚠ Check</span> : <span>✓ Plausible</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
