import Fraction from "fraction.js";
import { useMemo } from "react";
import type { TwoWayTable } from "@shared/probability/index";
import { fractionToString, sumCountDistribution, twoWayTable } from "@shared/probability/index";
import { modeLabel, probabilityText } from "@/lib/probability-text";
import { outcomeMarks } from "@/components/tree-diagram";
import { formatNumber } from "@/lib/format";
import { useGroupedTree } from "@/lib/use-grouped-tree";

/** Largest table drawn, in cells. */
const CELLS_MAX = 900;

/**
 * The two-way table of a matchup, whatever the dice: built on the page when it has at most CELLS_MAX cells; above that no cell
 * is built, and the exact totals come from the grouped tree worked out in a Web Worker.
 */
export function MatchupTable({
  first,
  second,
  dicePerPlayer,
}: {
  first: { name: string; faces: number[] };
  second: { name: string; faces: number[] };
  dicePerPlayer: number;
}) {
  const cellCount = useMemo(
    () => sumCountDistribution(first.faces, dicePerPlayer).values.length * sumCountDistribution(second.faces, dicePerPlayer).values.length,
    [first.faces, second.faces, dicePerPlayer],
  );
  const large = cellCount > CELLS_MAX;
  const table = useMemo(
    () => (large ? null : twoWayTable(first.faces, second.faces, { dicePerPlayer })),
    [large, first.faces, second.faces, dicePerPlayer],
  );
  const grouped = useGroupedTree(large ? { first: first.faces, second: second.faces, dicePerPlayer } : null);
  if (table) return <TwoWayTableFigure table={table} first={first.name} second={second.name} />;
  const tree = grouped.tree;
  return (
    <div className="flex flex-col gap-2">
      <p className="rounded-lg border-2 border-line bg-shell p-3">
        This table would have {formatNumber(cellCount)} cells, too many to read here; the totals below are exact.
      </p>
      {tree ? (
        <p data-testid="two-way-totals">
          Out of {tree.total.toString()} equally likely outcomes: {first.name} wins{" "}
          {probabilityText(new Fraction(tree.totals.win, tree.total))}, ties {probabilityText(new Fraction(tree.totals.tie, tree.total))},{" "}
          {second.name} wins {probabilityText(new Fraction(tree.totals.loss, tree.total))}.
        </p>
      ) : (
        <p role="status">Working out the totals…</p>
      )}
    </div>
  );
}

/** The two-way table of a matchup's totals: every equally likely pair, who wins it, and its probability. */
export function TwoWayTableFigure({ table, first, second }: { table: TwoWayTable; first: string; second: string }) {
  const cellCount = table.rows.length * table.columns.length;
  const what = table.dicePerPlayer === 1 ? "face" : "total";
  return (
    <div className="flex flex-col gap-2">
      {cellCount > CELLS_MAX ? (
        <p className="rounded-lg border-2 border-line bg-shell p-3">
          This table would have {cellCount} cells, too many to read here; the totals below are exact.
        </p>
      ) : (
        <div
          className="relative max-w-full overflow-x-auto rounded-xl border-2 border-line bg-shell"
          tabIndex={0}
          role="region"
          aria-label="Two-way table"
        >
          <table className="border-collapse text-sm" data-testid="two-way-table">
            <caption className="px-3 py-2 text-left text-base text-ink-soft">
              Two-way table, {modeLabel(table.dicePerPlayer)}: rows are {first}&rsquo;s {what}, columns {second}&rsquo;s {what} (with the
              chance of each). Each cell says whether {first} wins, ties or loses, and how likely that cell is.
            </caption>
            <thead>
              <tr>
                <th scope="col" className="border-b-2 border-r-2 border-line p-2 text-left">
                  {first} ↓ · {second} →
                </th>
                {table.columns.map((column) => (
                  <th key={column.value} scope="col" className="border-b-2 border-line p-2 text-center">
                    {column.value}
                    <span className="block text-xs font-normal text-ink-soft">{fractionToString(column.probability)}</span>
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {table.rows.map((row, r) => (
                <tr key={row.value}>
                  <th scope="row" className="border-r-2 border-line p-2 text-center">
                    {row.value}
                    <span className="block text-xs font-normal text-ink-soft">{fractionToString(row.probability)}</span>
                  </th>
                  {table.cells[r].map((cell, c) => {
                    const mark = outcomeMarks[cell.outcome];
                    return (
                      <td
                        key={table.columns[c].value}
                        className={`border border-line/60 px-2 py-1 text-center ${cell.outcome === "win" ? "bg-tide-light font-bold" : cell.outcome === "tie" ? "bg-sand" : "bg-white"}`}
                      >
                        <span className="whitespace-nowrap">
                          {mark.symbol} {mark.word}
                        </span>
                        <span className="block text-xs text-ink-soft">{fractionToString(cell.probability)}</span>
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <p data-testid="two-way-totals">
        Out of {table.totalWays.toString()} equally likely outcomes: {first} wins {probabilityText(table.totals.win)}, ties{" "}
        {probabilityText(table.totals.tie)}, {second} wins {probabilityText(table.totals.loss)}.
      </p>
    </div>
  );
}
