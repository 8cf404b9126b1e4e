import type { GuessVoteCount, ResultsDie } from "@shared/schemas/results";
import { DieSwatch } from "@/components/dice/die-swatch";
import { plural } from "./figures";

/** The Guess phase: how many groups picked each die as the best, as labelled bars with their counts. */
export function GuessVotes({ votes, dice }: { votes: GuessVoteCount[]; dice: ResultsDie[] }) {
  const total = votes.reduce((sum, vote) => sum + vote.votes, 0);
  if (total === 0) return <p className="text-ink-soft">No Guess votes were recorded in this run.</p>;
  const most = Math.max(...votes.map((vote) => vote.votes));
  return (
    <div>
      <ul className="flex flex-col gap-2" aria-label="Guess votes per die">
        {votes.map((vote) => (
          <li key={vote.dieIndex} className="grid grid-cols-[minmax(6rem,10rem)_1fr_auto] items-center gap-2">
            <span className="inline-flex items-center gap-1 font-bold">
              <DieSwatch
                colour={dice[vote.dieIndex]?.colour ?? "slate"}
                pattern={dice[vote.dieIndex]?.pattern ?? "waves"}
                className="h-4 w-4"
              />
              {vote.dieName}
            </span>
            <span className="h-4 rounded bg-sand" aria-hidden="true">
              <span className="block h-4 rounded bg-tide" style={{ width: `${(vote.votes / most) * 100}%` }} />
            </span>
            <span className="tabular-nums">{plural(vote.votes, "vote")}</span>
          </li>
        ))}
      </ul>
      <p className="mt-2 text-sm text-ink-soft">
        {plural(total, "group")} voted for the die they thought best. In a set that goes round in a circle, every die has another that beats
        it.
      </p>
    </div>
  );
}
