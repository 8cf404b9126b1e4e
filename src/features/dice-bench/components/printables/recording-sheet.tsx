import { paperImportColumnHelp, paperImportColumns } from "@shared/schemas/paper-import";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";

/** Rows on one sheet: what fits a landscape A4 or Letter page under the heading. */
export const RECORDING_SHEET_ROWS = 15;

// Names and faces need room to be written by hand; the roll number needs little.
const columnWidths: Record<(typeof paperImportColumns)[number], string> = {
  group: "16%",
  roll: "7%",
  die_1: "13%",
  faces_1: "12%",
  die_2: "13%",
  faces_2: "12%",
  die_3: "13%",
  faces_3: "14%",
};

/**
 * A group recording sheet for a paper lesson: exactly the Paper import CSV columns, in order, with each column's help,
 * then numbered empty rows. Typing it up row by row gives a file Paper import reads.
 */
export function RecordingSheet({ set }: { set: DiceSet }) {
  return (
    <article className="print-page recording-sheet flex flex-col gap-2 bg-white p-4 text-ink print:p-0" data-testid="recording-sheet">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 className="text-2xl">Group recording sheet · {set.name}</h2>
          <p className="text-sm">Write one row per roll. With two dice each, write both faces joined by +, e.g. 3+5.</p>
        </div>
        <p className="text-lg">
          Group nickname: <span className="inline-block w-48 border-b-2 border-ink align-bottom">&nbsp;</span>
        </p>
      </header>
      <p className="text-sm font-bold">Nicknames only: do not write anyone&rsquo;s real name on this sheet.</p>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Dice in this set">
        {set.dice.map((die) => (
          <li key={die.name} className="flex items-center gap-1.5">
            <DieSwatch colour={die.colour} pattern={die.pattern} className="h-4 w-4" />
            <strong>{die.name}</strong> ({die.faces.join(", ")})
          </li>
        ))}
      </ul>
      <div className="relative max-w-full overflow-x-auto print:overflow-visible">
        <table className="w-full min-w-[44rem] table-fixed border-collapse text-sm print:min-w-0">
          <colgroup>
            {paperImportColumns.map((column) => (
              <col key={column} style={{ width: columnWidths[column] }} />
            ))}
          </colgroup>
          <thead>
            <tr>
              {paperImportColumns.map((column) => (
                <th key={column} scope="col" className="border-2 border-ink px-1.5 py-1 text-left align-top font-mono">
                  {column}
                </th>
              ))}
            </tr>
            <tr>
              {paperImportColumns.map((column) => (
                <td key={column} className="border-2 border-ink px-1.5 py-1 align-top text-[0.7rem] leading-tight text-ink-soft">
                  {paperImportColumnHelp[column]}
                </td>
              ))}
            </tr>
          </thead>
          <tbody>
            {Array.from({ length: RECORDING_SHEET_ROWS }, (_, row) => (
              <tr key={row} className="h-[7.5mm]">
                {paperImportColumns.map((column) => (
                  <td key={column} className="border border-ink/70 px-1.5">
                    {column === "roll" ? <span className="text-ink-soft">{row + 1}</span> : null}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-soft">Outroll · type this sheet up as a CSV with the header row above, then use Paper import.</p>
    </article>
  );
}
