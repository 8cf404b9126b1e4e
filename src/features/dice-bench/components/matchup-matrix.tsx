import type { SetLevelAnalysis } from "@shared/probability/index";
import { DieSwatch } from "@/components/dice/die-swatch";
import { modeLabel, probabilityText } from "@/lib/probability-text";
import type { BenchDie } from "../hooks/use-set-analysis";
import { RelationIcon, relationWords } from "./relation-icon";

const cellTone = {
  beats: "bg-tide-light text-ink",
  loses: "bg-beacon-light text-ink",
  even: "bg-white text-ink",
} as const;

/** The matchup matrix as a table: each cell says in words and with a shape how the row die fares, with exact fractions. */
export function MatchupMatrix({ level, dice }: { level: SetLevelAnalysis; dice: BenchDie[] }) {
  const mode = modeLabel(level.dicePerPlayer);
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <p className="text-ink-soft" aria-hidden="true">
        Matchup matrix, <strong className="text-ink">{mode}</strong>: how the die in the row does against the die in the column in one roll.
        ▲ beats, ▽ loses to, = even.
      </p>
      <div
        className="relative max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell"
        tabIndex={0}
        role="region"
        aria-label={`Matchup matrix, ${mode}`}
      >
        <table className="w-full border-collapse text-sm" data-testid={`matchup-matrix-${level.dicePerPlayer}`}>
          <caption className="sr-only">
            Matchup matrix, {mode}: how the die in the row does against the die in the column in one roll.
          </caption>
          <thead>
            <tr>
              <td className="border-b-2 border-line p-2" />
              {dice.map((die) => (
                <th key={die.name} scope="col" className="border-b-2 border-line p-2 text-left align-bottom">
                  <span className="block text-xs font-normal text-ink-soft">against</span>
                  <span className="flex items-center gap-1.5">
                    <DieSwatch colour={die.colour} pattern={die.pattern} className="h-5 w-5" />
                    <span className="break-words">{die.name}</span>
                  </span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {dice.map((rowDie, row) => (
              <tr key={rowDie.name}>
                <th scope="row" className="border-r-2 border-line p-1.5 text-left align-top sm:p-2">
                  <span className="flex items-center gap-1.5">
                    <DieSwatch colour={rowDie.colour} pattern={rowDie.pattern} className="h-5 w-5" />
                    {rowDie.name}
                  </span>
                </th>
                {dice.map((columnDie, column) => {
                  const entry = level.matrix[row][column];
                  if (entry === null) {
                    return (
                      <td key={columnDie.name} className="border border-line/60 bg-sand/60 p-2 text-center text-ink-soft">
                        <span aria-hidden="true">—</span>
                        <span className="sr-only">same die</span>
                      </td>
                    );
                  }
                  return (
                    <td
                      key={columnDie.name}
                      className={`min-w-[5.5rem] border border-line/60 p-1.5 align-top sm:p-2 ${cellTone[entry.relation]}`}
                      data-testid={`cell-${level.dicePerPlayer}-${row}-${column}`}
                    >
                      <span className="flex items-center gap-1 font-bold">
                        <RelationIcon relation={entry.relation} />
                        {relationWords[entry.relation]}
                      </span>
                      <span className="block">wins {probabilityText(entry.win)}</span>
                      {!entry.tie.equals(0) && <span className="block text-ink-soft">ties {probabilityText(entry.tie)}</span>}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
