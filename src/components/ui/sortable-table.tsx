import type { ReactNode } from "react";
import type { ReactTable, RowData } from "@tanstack/react-table";
import type { searchableTableFeatures } from "@/lib/table-features";
import { SortHeading } from "./sort-heading";

/**
 * A searchable list's table: sortable column headings (the "actions" column never sorts), striped rows, per-column
 * classes (to hide columns on narrow screens), and a message in place of the rows when none are left to show.
 */
export function SortableTable<TData extends RowData>({
  table,
  caption,
  columnClass,
  empty,
}: {
  table: ReactTable<typeof searchableTableFeatures, TData>;
  caption: string;
  columnClass: (columnId: string) => string;
  empty: ReactNode;
}) {
  const rows = table.getRowModel().rows;
  return (
    <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b-2 border-line">
              {group.headers.map((header) => (
                <SortHeading
                  key={header.id}
                  sorted={header.column.getIsSorted()}
                  canSort={header.column.getCanSort() && header.column.id !== "actions"}
                  onToggle={header.column.getToggleSortingHandler()}
                  className={columnClass(header.column.id)}
                >
                  <table.FlexRender header={header} />
                </SortHeading>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.id} className="border-b border-line last:border-b-0 even:bg-sand/40">
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={`px-3 py-2 align-top ${columnClass(cell.column.id)}`}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length === 0 && <p className="p-4 text-ink-soft">{empty}</p>}
    </div>
  );
}
