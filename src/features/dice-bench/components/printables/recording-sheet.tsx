import type { DiceSet } from "@shared/schemas/dice-sets";
import { recordingSheetColumns, recordingSheetPages, type RecordingSheetPlan } from "@shared/results/recording-sheet-layout";
import { DieSwatch } from "@/components/dice/die-swatch";

/**
 * A group recording sheet for a paper lesson, following the lesson: one numbered line per planned roll (continued over
 * pages), a column for what each player rolled (both dice with two dice each), and who won, in words pupils use.
 * The teacher types it into the tally grid, or up as a Paper import CSV.
 */
export function RecordingSheet({ set, plan }: { set: DiceSet; plan: RecordingSheetPlan }) {
  const columns = recordingSheetColumns(plan);
  const pages = recordingSheetPages(plan.rolls);
  return (
    <>
      {pages.map((rolls, pageIndex) => (
        <article
          key={pageIndex}
          className="print-page recording-sheet flex flex-col gap-2 bg-white p-4 text-ink print:p-0"
          data-testid="recording-sheet"
          aria-label={`Recording sheet, page ${pageIndex + 1} of ${pages.length}`}
        >
          <header className="flex flex-wrap items-end justify-between gap-3">
            <div>
              <h2 className="text-2xl">
                Our dice results · {set.name}
                {pages.length > 1 && (
                  <span className="text-base font-normal">
                    {" "}
                    · page {pageIndex + 1} of {pages.length}
                  </span>
                )}
              </h2>
              <p className="text-sm">
                {plan.players === 3 ? "Three" : "Two"} players,{" "}
                {plan.dicePerPlayer === 1 ? "one die each" : "two dice each: add your two numbers"}. Write one line for every roll.
              </p>
            </div>
            <p className="text-lg">
              Group nickname: <span className="inline-block w-48 border-b-2 border-ink align-bottom">&nbsp;</span>
            </p>
          </header>
          <p className="text-sm font-bold">Nicknames only: do not write anyone&rsquo;s real name on this sheet.</p>
          {pageIndex === 0 && (
            <>
              <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Dice in this set">
                {set.dice.map((die) => (
                  <li key={die.name} className="flex items-center gap-1.5">
                    <DieSwatch colour={die.colour} pattern={die.pattern} className="h-4 w-4" />
                    <strong>{die.name}</strong> ({die.faces.join(", ")})
                  </li>
                ))}
              </ul>
              <p className="flex flex-wrap gap-x-6 gap-y-2 text-base" data-testid="recording-sheet-dice">
                {Array.from({ length: plan.players }, (_, index) => (
                  <span key={index}>
                    Player {index + 1}&rsquo;s die: <span className="inline-block w-32 border-b-2 border-ink align-bottom">&nbsp;</span>
                  </span>
                ))}
              </p>
            </>
          )}
          <table className="w-full table-fixed border-collapse text-sm">
            <colgroup>
              {columns.map((column) => (
                <col key={column.heading} style={{ width: column.csvColumn === "roll" ? "12%" : undefined }} />
              ))}
            </colgroup>
            <thead>
              <tr>
                {columns.map((column) => (
                  <th key={column.heading} scope="col" className="border-2 border-ink px-1.5 py-1 text-left align-top text-base">
                    {column.heading}
                    {column.help && <span className="block text-[0.7rem] font-normal leading-tight text-ink-soft">{column.help}</span>}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rolls.map((roll) => (
                <tr key={roll} className="h-[7.5mm]">
                  {columns.map((column) => (
                    <td key={column.heading} className="border border-ink/70 px-1.5">
                      {column.csvColumn === "roll" ? <span className="text-ink-soft">{roll}</span> : null}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-xs text-ink-soft">
            Outroll · for the teacher: type this sheet into the run&rsquo;s tally grid, or as Paper import CSV rows (group, roll, die_1,
            faces_1, die_2, faces_2
            {plan.players === 3 ? ", die_3, faces_3" : ""}).
          </p>
        </article>
      ))}
    </>
  );
}
