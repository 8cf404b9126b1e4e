import { useMemo, useState } from "react";
import { Link, useLocation } from "react-router-dom";
import { createColumnHelper, useTable, type ColumnFiltersState, type SortingState } from "@tanstack/react-table";
import type { ResultsRunSummary, ResultsScope } from "@shared/schemas/results";
import { Alert } from "@/components/ui/alert";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { useResultsRuns } from "../api/list-results-runs";
import { dayText, plural, runModeText } from "./figures";
import { PupilDataNote } from "./pupil-data-note";
import { SortableTable } from "@/components/ui/sortable-table";
import { searchableTableFeatures } from "@/lib/table-features";
import { formatNumber } from "@/lib/format";

const features = searchableTableFeatures;

const helper = createColumnHelper<typeof features, ResultsRunSummary>();

const recordedOnMarks: Record<ResultsRunSummary["recordedOn"], string> = {
  phones: "▣ Phones",
  paper: "▤ Paper",
  "phones and paper": "▣▤ Phones and paper",
  "no rolls yet": "○ No rolls yet",
};

const columns = helper.columns([
  helper.accessor("title", {
    header: "Lesson",
    sortFn: "alphanumeric",
    cell: (info) => (
      <Link to={`/app/results/${info.row.original.id}`} className="font-bold text-tide-dark underline underline-offset-2 hover:text-ink">
        {info.getValue()}
      </Link>
    ),
  }),
  helper.accessor("diceSetName", {
    header: "Dice set",
    sortFn: "alphanumeric",
    filterFn: "equals",
    cell: (info) => (
      <span>
        {info.getValue()}
        <span className="block text-sm text-ink-soft">{runModeText(info.row.original)}</span>
      </span>
    ),
  }),
  helper.accessor("classGroup", { header: "Class", sortFn: "alphanumeric", filterFn: "equals", cell: (info) => info.getValue() || "—" }),
  helper.accessor("taughtAt", {
    header: "Date",
    sortFn: "alphanumeric",
    filterFn: (row, columnId, range: { from: string; to: string }) => {
      const day = String(row.getValue(columnId)).slice(0, 10);
      return (!range.from || day >= range.from) && (!range.to || day <= range.to);
    },
    cell: (info) => dayText(info.getValue()),
  }),
  helper.accessor("rollCount", {
    header: "Rolls",
    sortFn: "basic",
    cell: (info) => (
      <span>
        {formatNumber(info.getValue())}
        {info.row.original.simulatedRollCount > 0 && (
          <span className="block text-sm text-ink-soft">{info.row.original.simulatedRollCount} simulated</span>
        )}
      </span>
    ),
  }),
  helper.accessor("groupCount", { header: "Groups", sortFn: "basic" }),
  helper.accessor("recordedOn", { header: "Recorded on", sortFn: "alphanumeric", cell: (info) => recordedOnMarks[info.getValue()] }),
  helper.accessor("ownerName", { header: "Teacher", sortFn: "alphanumeric" }),
  helper.display({
    id: "actions",
    header: "Open",
    cell: (info) => (
      <div className="flex flex-col items-start gap-1 sm:flex-row sm:flex-wrap">
        <LinkButton
          to={`/app/results/${info.row.original.id}`}
          variant="secondary"
          className="min-h-9 px-3 py-1 text-sm"
          aria-label={`Results of ${info.row.original.title}`}
        >
          Results
        </LinkButton>
        <LinkButton
          to={`/app/results/${info.row.original.id}/report`}
          variant="quiet"
          className="min-h-9 px-3 py-1 text-sm"
          aria-label={`Class report of ${info.row.original.title}`}
        >
          Report
        </LinkButton>
      </div>
    ),
  }),
]);

/** Columns a phone leaves out (each run's page shows them). */
const wideOnly = new Set(["groupCount", "recordedOn", "ownerName", "diceSetName"]);
/** Columns a phone leaves out because the lesson link already opens the run. */
const tabletUp = new Set(["actions"]);

/** The Results archive: closed class runs as a table with search, sort and filters. */
export function ResultsArchive({ canSeeDepartment }: { canSeeDepartment: boolean }) {
  const notice = (useLocation().state as { notice?: string } | null)?.notice;
  const [scope, setScope] = useState<ResultsScope>("mine");
  const runs = useResultsRuns(scope);
  const [sorting, setSorting] = useState<SortingState>([{ id: "taughtAt", desc: true }]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const [range, setRange] = useState({ from: "", to: "" });
  const data = useMemo(() => runs.data?.runs ?? [], [runs.data]);
  const table = useTable({
    features,
    columns,
    data,
    getRowId: (row) => row.id,
    state: { sorting, columnFilters, globalFilter },
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: "includesString",
    getColumnCanGlobalFilter: (column) => ["title", "classGroup", "diceSetName"].includes(column.id),
  });

  const setOptions = useMemo(
    () => [...new Set(data.map((run) => run.diceSetName))].sort().map((value) => ({ value, label: value })),
    [data],
  );
  const classOptions = useMemo(
    () => [...new Set(data.map((run) => run.classGroup))].sort().map((value) => ({ value, label: value || "No class" })),
    [data],
  );
  const filterValue = (id: string) => (columnFilters.find((filter) => filter.id === id)?.value as string | undefined) ?? "";
  const setFilter = (id: string, value: unknown) => table.getColumn(id)?.setFilterValue(value === "" ? undefined : value);
  const setDates = (next: { from: string; to: string }) => {
    setRange(next);
    setFilter("taughtAt", next.from || next.to ? next : "");
  };
  const rows = table.getRowModel().rows;
  const hidden = (id: string) =>
    id === "ownerName" && scope === "mine"
      ? "hidden"
      : wideOnly.has(id)
        ? "hidden lg:table-cell"
        : tabletUp.has(id)
          ? "hidden sm:table-cell"
          : "";

  return (
    <>
      <PageHeader
        title="Results"
        lead="Closed class runs: the pooled figures, exports, the class report and Paper import of rolls recorded on paper."
        actions={
          <>
            <LinkButton to="/app/results/pooled" variant="secondary">
              Pool several runs
            </LinkButton>
            <LinkButton to="/app/results/paper-runs/new" variant="primary">
              Paper import for a lesson
            </LinkButton>
          </>
        }
      />
      {notice && (
        <div className="mb-4" role="status">
          <Alert tone="info">{notice}</Alert>
        </div>
      )}
      <section
        aria-label="Search and filters"
        className="mb-4 grid grid-cols-2 gap-3 rounded-2xl border-2 border-line bg-shell p-4 lg:grid-cols-6"
      >
        {canSeeDepartment && (
          <ChoiceGroup<ResultsScope>
            legend="Whose runs"
            value={scope}
            onChange={setScope}
            options={[
              { value: "mine", label: "My runs" },
              { value: "department", label: "Whole department" },
            ]}
            className="col-span-2 lg:col-span-6"
          />
        )}
        <TextField
          label="Search"
          type="search"
          placeholder="Lesson, set or class"
          value={globalFilter}
          onChange={(event) => setGlobalFilter(event.target.value)}
          className="col-span-2"
        />
        <SelectField
          className="col-span-2 sm:col-span-1"
          label="Dice set"
          value={filterValue("diceSetName")}
          onChange={(event) => setFilter("diceSetName", event.target.value)}
          options={[{ value: "", label: "Any set" }, ...setOptions]}
        />
        <SelectField
          className="col-span-2 sm:col-span-1"
          label="Class"
          value={filterValue("classGroup")}
          onChange={(event) => setFilter("classGroup", event.target.value)}
          options={[{ value: "", label: "Any class" }, ...classOptions]}
        />
        <TextField
          label="Taught from"
          type="date"
          value={range.from}
          onChange={(event) => setDates({ ...range, from: event.target.value })}
        />
        <TextField label="Taught until" type="date" value={range.to} onChange={(event) => setDates({ ...range, to: event.target.value })} />
      </section>

      {runs.isPending && <p role="status">Loading the closed runs…</p>}
      {runs.isError && (
        <Alert tone="error" title="The closed runs could not be loaded">
          {runs.error.message}
        </Alert>
      )}
      {runs.data && (
        <>
          <p className="mb-2 text-ink-soft" role="status" aria-live="polite">
            Showing {rows.length} of {plural(data.length, "closed run")}.
          </p>
          <SortableTable
            table={table}
            caption="Closed class runs; choose a column heading to sort by it."
            columnClass={hidden}
            empty={
              data.length === 0
                ? "No closed class runs yet. A run appears here once it is closed on the Run board, or once you bring in paper sheets with Paper import."
                : "No run matches the search and filters."
            }
          />
        </>
      )}
      <div className="mt-8 max-w-3xl">
        <PupilDataNote />
      </div>
    </>
  );
}
