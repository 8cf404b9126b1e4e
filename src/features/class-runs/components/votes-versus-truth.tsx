import { guessTruth } from "@shared/class-results/guess-truth";
import type { BoardSnapshot } from "@shared/schemas/class-runs";
import { DieSwatch } from "@/components/dice/die-swatch";

/** The groups' Guess votes per die, beside the exact truth: which die beats each one. */
export function VotesVersusTruth({
  snapshot,
  large = false,
  showTruth = true,
}: {
  snapshot: BoardSnapshot;
  large?: boolean;
  showTruth?: boolean;
}) {
  const { run, votes } = snapshot;
  const truth = guessTruth(run.dice, run.tieRule, run.tallies[0]?.dicePerPlayer ?? 1);
  const total = votes.reduce((sum, count) => sum + count, 0);
  const most = Math.max(1, ...votes);
  return (
    <div className={`flex flex-col gap-3 ${large ? "text-3xl" : ""}`}>
      <p className={large ? "" : "text-ink-soft"}>
        {total} {total === 1 ? "group has" : "groups have"} voted.
        {showTruth && " "}
        {showTruth &&
          (truth.bestDieIndex === null
            ? "The truth: no die is best — every die is beaten by another."
            : `The truth: ${run.dice[truth.bestDieIndex].name} beats every other die.`)}
      </p>
      <ul className="flex flex-col gap-2">
        {run.dice.map((die, index) => {
          const verdict = truth.verdicts[index];
          return (
            <li key={die.name} className="grid grid-cols-[auto_1fr] items-center gap-x-3 gap-y-1">
              <DieSwatch colour={die.colour} pattern={die.pattern} className={large ? "h-14 w-14" : "h-8 w-8"} />
              <div className="flex items-center gap-3">
                <span className={`font-bold ${large ? "w-72" : "w-32"}`}>{die.name}</span>
                <span className="h-6 flex-1 rounded bg-line/40" aria-hidden="true">
                  <span
                    className={`block h-full rounded ${large ? "bg-white" : "bg-ink"}`}
                    style={{ width: `${(votes[index] / most) * 100}%` }}
                  />
                </span>
                <span className={`text-right tabular-nums font-bold whitespace-nowrap ${large ? "w-48" : "w-20"}`}>
                  {votes[index]} {votes[index] === 1 ? "vote" : "votes"}
                </span>
              </div>
              {showTruth && (
                <>
                  <span />
                  <span className={large ? "text-2xl" : "text-sm text-ink-soft"}>
                    {verdict.beatenBy
                      ? `Beaten by ${verdict.beatenBy.name}: ${verdict.beatenBy.fraction} ≈ ${verdict.beatenBy.decimal}`
                      : "No die beats it."}
                  </span>
                </>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
