import type { ResultsDie } from "@shared/schemas/results";
import { DieSwatch } from "@/components/dice/die-swatch";

/** A matchup's dice by name, each with its colour-and-pattern swatch, joined by "v". */
export function MatchupLabel({ matchup, dice }: { matchup: number[]; dice: ResultsDie[] }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-x-1 gap-y-0.5">
      {matchup.map((dieIndex, position) => (
        <span key={`${dieIndex}-${position}`} className="inline-flex items-center gap-1">
          {position > 0 && <span className="px-0.5 text-ink-soft">v</span>}
          <DieSwatch colour={dice[dieIndex]?.colour ?? "slate"} pattern={dice[dieIndex]?.pattern ?? "waves"} className="h-4 w-4" />
          <span className="font-bold">{dice[dieIndex]?.name ?? `Die ${dieIndex + 1}`}</span>
        </span>
      ))}
    </span>
  );
}
