import type { ReactNode } from "react";

type SortDirection = false | "asc" | "desc";

/** A table column heading that sorts on click, telling screen readers the current order. */
export function SortHeading({
  sorted,
  canSort,
  onToggle,
  className = "",
  children,
}: {
  sorted: SortDirection;
  canSort: boolean;
  onToggle?: (event: unknown) => void;
  className?: string;
  children: ReactNode;
}) {
  return (
    <th
      scope="col"
      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
      className={`px-3 py-2 align-bottom text-sm ${className}`}
    >
      {canSort ? (
        <button type="button" onClick={onToggle} className="inline-flex min-h-11 items-center gap-1 font-bold hover:underline">
          {children}
          <span aria-hidden="true" className="w-4 text-tide">
            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
          </span>
          <span className="sr-only">{sorted ? `, sorted ${sorted === "asc" ? "ascending" : "descending"}` : ", sort"}</span>
        </button>
      ) : (
        <span className="font-bold">{children}</span>
      )}
    </th>
  );
}
