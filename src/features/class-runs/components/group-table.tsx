import { cycleMatchups } from "@shared/class-results/assigned-matchups";
import { IMPLAUSIBLE_P_VALUE, type PooledResults } from "@shared/class-results/pooled-results";
import type { BoardSnapshot } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { useAssignGroupMatchup } from "../api/assign-group-matchup";
import { GroupActions, GroupStateMarks } from "./group-moderation";
import { decimal } from "./pooled-matchups";

const sourceLabels = { phone: "Phone", simulated: "Simulated", paper: "Paper" } as const;

function pValueText(value: number) {
  return value < 0.001 ? "< 0.001" : value.toFixed(3);
}

/**
 * Every group with its matchup, rolls and vote, and per matchup in the shown tally an exact binomial test of its
 * results against the exact chance: groups with p < 0.01 are flagged so the teacher can check their dice or recording.
 */
export function GroupTable({ snapshot, pooled, canManage }: { snapshot: BoardSnapshot; pooled: PooledResults; canManage: boolean }) {
  const { run } = snapshot;
  const assign = useAssignGroupMatchup(run.id);
  const options = run.players <= run.dice.length ? cycleMatchups(run.dice.length, run.players) : [];
  const label = (matchup: number[] | null) =>
    matchup ? matchup.map((index) => run.dice[index]?.name ?? "?").join(" v ") : "Not chosen yet";
  if (snapshot.groups.length === 0) {
    return (
      <p className="rounded-2xl border-2 border-dashed border-line p-6 text-ink-soft">
        No groups yet. Groups appear here as they join with the code.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      {assign.error && <Alert tone="error">{assign.error.message}</Alert>}
      <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
        <table className="w-full min-w-[46rem] lg:min-w-[60rem] text-left text-base" data-testid="group-table">
          <caption className="sr-only">Groups in this class run</caption>
          <thead>
            <tr className="border-b-2 border-line">
              <th scope="col" className="px-3 py-2">
                Group
              </th>
              <th scope="col" className="px-3 py-2">
                Matchup
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Rolls
              </th>
              <th scope="col" className="px-3 py-2">
                Vote
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Share (die)
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                p-value
              </th>
              <th scope="col" className="px-3 py-2">
                Check
              </th>
              {canManage && (
                <th scope="col" className="px-3 py-2">
                  Moderate
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {snapshot.groups.map((group) => {
              const tests = pooled.groups.filter((entry) => entry.groupId === group.id);
              const flagged = tests.some((entry) => entry.test.implausible);
              return (
                <tr
                  key={group.id}
                  data-testid="group-row"
                  className={`border-b border-line/60 align-top ${flagged ? "bg-alarm-light" : ""} ${group.leftOut ? "text-ink-soft" : ""}`}
                >
                  <th scope="row" className="px-3 py-2">
                    <span className="block font-bold">{group.nickname}</span>
                    <span className="text-sm text-ink-soft">{sourceLabels[group.source]}</span>
                    <GroupStateMarks group={group} />
                  </th>
                  <td className="px-3 py-2">
                    {canManage && options.length > 0 && run.status !== "closed" ? (
                      <label className="flex flex-col text-sm">
                        <span className="sr-only">Matchup of {group.nickname}</span>
                        <select
                          className="min-h-11 rounded-lg border-2 border-line bg-white px-2 text-base"
                          value={group.matchup?.join("-") ?? ""}
                          disabled={assign.isPending}
                          onChange={(event) =>
                            assign.mutate({ runId: run.id, groupId: group.id, matchup: event.target.value.split("-").map(Number) })
                          }
                        >
                          {!group.matchup && <option value="">Not chosen yet</option>}
                          {group.matchup && !options.some((option) => option.join("-") === group.matchup!.join("-")) && (
                            <option value={group.matchup.join("-")}>{label(group.matchup)}</option>
                          )}
                          {options.map((option) => (
                            <option key={option.join("-")} value={option.join("-")}>
                              {label(option)}
                            </option>
                          ))}
                        </select>
                      </label>
                    ) : (
                      label(group.matchup)
                    )}
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">{group.rolls}</td>
                  <td className="px-3 py-2">{group.vote === null ? "–" : run.dice[group.vote]?.name}</td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {tests.length === 0
                      ? "–"
                      : tests.map((entry) => (
                          <span key={entry.matchupKey} className="block">
                            {decimal(entry.frequencyUnderTieRule)} <span className="text-sm text-ink-soft">{entry.seats[0].dieName}</span>
                          </span>
                        ))}
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {tests.length === 0
                      ? "–"
                      : tests.map((entry) => (
                          <span key={entry.matchupKey} className="block">
                            {pValueText(entry.test.pValue)}
                          </span>
                        ))}
                  </td>
                  <td className="px-3 py-2">
                    {tests.map((entry) =>
                      entry.test.implausible ? (
                        <span key={entry.matchupKey} className="block font-bold text-alarm">
                          <span aria-hidden="true">⚠ </span>Unlikely: check the dice or the recording ({entry.label})
                        </span>
                      ) : (
                        <span key={entry.matchupKey} className="block text-ink-soft">
                          <span aria-hidden="true">✓ </span>Plausible
                        </span>
                      ),
                    )}
                  </td>
                  {canManage && (
                    <td className="px-3 py-2">
                      <GroupActions run={run} group={group} />
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-soft">
        Plausibility: an exact two-sided binomial test of each group’s wins for the first die of its matchup against the exact chance; a
        group is flagged when p &lt; {IMPLAUSIBLE_P_VALUE}. About one honest group in a hundred is flagged by chance.
      </p>
    </div>
  );
}
