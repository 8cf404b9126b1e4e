import { useMemo, useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { createColumnHelper, useTable, type ColumnFiltersState, type SortingState } from "@tanstack/react-table";
import { lessonStatusLabels, type LessonStatus, type LessonSummary } from "@shared/schemas/lessons";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { useArchiveLesson } from "../api/archive-lesson";
import { useDeleteLesson } from "../api/delete-lesson";
import { useDuplicateLesson } from "../api/duplicate-lesson";
import { useLessons } from "../api/list-lessons";
import { StatusBadge } from "./status-badge";
import { SortableTable } from "@/components/ui/sortable-table";
import { searchableTableFeatures } from "@/lib/table-features";
import { formatDate } from "@/lib/format";

const features = searchableTableFeatures;

const statusOrder: Record<LessonStatus, number> = { draft: 0, ready: 1, taught: 2 };
const helper = createColumnHelper<typeof features, LessonSummary>();
const noSet = "none";

const columns = helper.columns([
  helper.accessor("title", {
    header: "Lesson",
    sortFn: "alphanumeric",
    cell: (info) => {
      const lesson = info.row.original;
      return (
        <div className="flex flex-col gap-1">
          <Link to={`/app/lessons/${lesson.id}`} className="font-bold text-tide-dark underline underline-offset-2 hover:text-ink">
            {info.getValue()}
          </Link>
          <p className="text-sm text-ink-soft sm:hidden">
            {lesson.classGroup || "No class"} · {lesson.diceSetName ?? "No set yet"}
          </p>
          <div className="sm:hidden">
            <LessonActions lesson={lesson} />
          </div>
        </div>
      );
    },
  }),
  helper.accessor("classGroup", { header: "Class", sortFn: "alphanumeric", filterFn: "equals", cell: (info) => info.getValue() || "—" }),
  helper.accessor((row) => row.diceSetId ?? noSet, {
    id: "diceSet",
    header: "Dice set",
    filterFn: "equals",
    sortFn: (rowA, rowB) => (rowA.original.diceSetName ?? "").localeCompare(rowB.original.diceSetName ?? ""),
    cell: (info) => info.row.original.diceSetName ?? <span className="text-ink-soft">No set yet</span>,
  }),
  helper.accessor("status", {
    header: "Status",
    filterFn: "equals",
    sortFn: (rowA, rowB) => statusOrder[rowA.original.status] - statusOrder[rowB.original.status],
    cell: (info) => <StatusBadge status={info.getValue()} archived={info.row.original.archivedAt !== null} />,
  }),
  helper.accessor("durationMinutes", { header: "Minutes", sortFn: "basic" }),
  helper.accessor((row) => row.groups * row.rollsPerGroup, {
    id: "pooledRolls",
    header: "Pooled rolls",
    sortFn: "basic",
    cell: (info) => (
      <span>
        {info.getValue()}{" "}
        <span className="text-sm text-ink-soft">
          ({info.row.original.groups} × {info.row.original.rollsPerGroup})
        </span>
      </span>
    ),
  }),
  helper.accessor("updatedAt", {
    header: "Last changed",
    sortFn: "alphanumeric",
    cell: (info) => formatDate(info.getValue()),
  }),
  helper.display({ id: "actions", header: "Actions", cell: (info) => <LessonActions lesson={info.row.original} /> }),
]);

/** Columns a laptop shows but a tablet leaves out, and those a phone folds into the lesson cell. */
const wideOnly = new Set(["durationMinutes", "pooledRolls", "updatedAt"]);
const foldedOnPhone = new Set(["classGroup", "diceSet", "actions"]);
const cellVisibility = (id: string) => (wideOnly.has(id) ? "hidden lg:table-cell" : foldedOnPhone.has(id) ? "hidden sm:table-cell" : "");

/** The Lessons list: the teacher's lessons as a table with search, sort and filters, and each lesson's actions. */
export function LessonsTable() {
  const [showArchived, setShowArchived] = useState(false);
  const lessons = useLessons(showArchived);
  const [sorting, setSorting] = useState<SortingState>([{ id: "updatedAt", desc: true }]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const data = useMemo(() => lessons.data?.lessons ?? [], [lessons.data]);
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
    getColumnCanGlobalFilter: (column) => ["title", "classGroup"].includes(column.id),
  });

  const setOptions = useMemo(() => {
    const named = new Map<string, string>();
    for (const lesson of data) named.set(lesson.diceSetId ?? noSet, lesson.diceSetName ?? "No set yet");
    return [...named].sort((a, b) => a[1].localeCompare(b[1])).map(([value, label]) => ({ value, label }));
  }, [data]);
  const classOptions = useMemo(
    () => [...new Set(data.map((lesson) => lesson.classGroup))].sort().map((value) => ({ value, label: value || "No class" })),
    [data],
  );
  const filterValue = (id: string) => (columnFilters.find((filter) => filter.id === id)?.value as string | undefined) ?? "";
  const setFilter = (id: string, value: string) => table.getColumn(id)?.setFilterValue(value === "" ? undefined : value);
  const rows = table.getRowModel().rows;

  return (
    <>
      <PageHeader
        title="Lessons"
        lead="Your lesson plans, each built around a dice set. Open one to edit it, see its materials list, attach worksheets or print it."
        actions={
          <LinkButton to="/app/lessons/new" variant="primary">
            + New lesson
          </LinkButton>
        }
      />
      <section
        aria-label="Search and filters"
        className="mb-4 grid gap-3 rounded-2xl border-2 border-line bg-shell p-4 sm:grid-cols-2 lg:grid-cols-5"
      >
        <TextField
          label="Search"
          type="search"
          placeholder="Title or class"
          value={globalFilter}
          onChange={(event) => setGlobalFilter(event.target.value)}
          className="lg:col-span-2"
        />
        <SelectField
          label="Dice set"
          value={filterValue("diceSet")}
          onChange={(event) => setFilter("diceSet", event.target.value)}
          options={[{ value: "", label: "Any set" }, ...setOptions]}
        />
        <SelectField
          label="Class"
          value={filterValue("classGroup")}
          onChange={(event) => setFilter("classGroup", event.target.value)}
          options={[{ value: "", label: "Any class" }, ...classOptions]}
        />
        <SelectField
          label="Status"
          value={filterValue("status")}
          onChange={(event) => setFilter("status", event.target.value)}
          options={[
            { value: "", label: "Any status" },
            ...(Object.keys(lessonStatusLabels) as LessonStatus[]).map((value) => ({ value, label: lessonStatusLabels[value] })),
          ]}
        />
        <label className="flex min-h-11 items-center gap-2 font-bold sm:col-span-2 lg:col-span-5">
          <input
            type="checkbox"
            className="h-5 w-5 accent-tide"
            checked={showArchived}
            onChange={(event) => setShowArchived(event.target.checked)}
          />
          Show archived lessons
        </label>
      </section>

      {lessons.isPending && <p role="status">Loading your lessons…</p>}
      {lessons.isError && (
        <Alert tone="error" title="Your lessons could not be loaded">
          {lessons.error.message}
        </Alert>
      )}
      {lessons.data && (
        <>
          <p className="mb-2 text-ink-soft" role="status" aria-live="polite">
            Showing {rows.length} of {data.length} {data.length === 1 ? "lesson" : "lessons"}.
          </p>
          <SortableTable
            table={table}
            caption="Your lessons; choose a column heading to sort by it."
            columnClass={cellVisibility}
            empty={data.length === 0 ? "You have no lessons yet. Start a new one." : "No lesson matches the search and filters."}
          />
        </>
      )}
    </>
  );
}

/** Open, duplicate, archive and delete (with a confirmation) for one row. */
function LessonActions({ lesson }: { lesson: LessonSummary }) {
  const navigate = useNavigate();
  const duplicate = useDuplicateLesson();
  const archive = useArchiveLesson();
  const remove = useDeleteLesson();
  const [confirming, setConfirming] = useState(false);
  const error = duplicate.error ?? archive.error ?? remove.error;
  const archived = lesson.archivedAt !== null;
  return (
    <div className="flex flex-wrap items-start gap-1 lg:flex-nowrap">
      <Button
        variant="secondary"
        className="min-h-9 px-3 py-1 text-sm"
        busy={duplicate.isPending}
        onClick={() =>
          duplicate.mutate(lesson.id, {
            onSuccess: ({ lesson: copy }) => navigate(`/app/lessons/${copy.id}`, { state: { notice: `Duplicated as “${copy.title}”.` } }),
          })
        }
        aria-label={`Duplicate ${lesson.title}`}
      >
        Duplicate
      </Button>
      <Button
        variant="secondary"
        className="min-h-9 px-3 py-1 text-sm"
        busy={archive.isPending}
        onClick={() => archive.mutate({ id: lesson.id, archived: !archived })}
        aria-label={`${archived ? "Unarchive" : "Archive"} ${lesson.title}`}
      >
        {archived ? "Unarchive" : "Archive"}
      </Button>
      <Button
        variant="quiet"
        className="min-h-9 px-3 py-1 text-sm text-alarm"
        onClick={() => setConfirming(true)}
        aria-label={`Delete ${lesson.title}`}
      >
        Delete
      </Button>
      {error && <p className="text-sm font-bold text-alarm">{error.message}</p>}
      <ConfirmDialog
        open={confirming}
        title="Delete this lesson?"
        confirmLabel="Delete lesson"
        busy={remove.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() => remove.mutate(lesson.id, { onSuccess: () => setConfirming(false) })}
      >
        <p>
          “{lesson.title}”
          {lesson.attachmentCount === 0
            ? ""
            : lesson.attachmentCount === 1
              ? " and its attachment"
              : ` and its ${lesson.attachmentCount} attachments`}{" "}
          will be deleted for good. Archive it instead to keep it out of the list.
        </p>
        {remove.error && <p className="mt-2 font-bold text-alarm">{remove.error.message}</p>}
      </ConfirmDialog>
    </div>
  );
}
