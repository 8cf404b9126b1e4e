import { useState } from "react";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { GROUP_CAP_DEFAULT, GROUP_CAP_MAX, groupCapSchema } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { useClassRuns } from "../api/list-class-runs";
import { useRunnableLessons } from "../api/list-runnable-lessons";
import { useOpenClassRun } from "../api/open-class-run";
import { spacedCode } from "./join-panel";
import { RunStatusBadge } from "./run-status-badge";
import { formatDateTime } from "@/lib/format";

const when = (iso: string) => formatDateTime(iso);

function OpenFromLesson() {
  const lessons = useRunnableLessons();
  const open = useOpenClassRun();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const wanted = params.get("lesson");
  const [groupCap, setGroupCap] = useState(String(GROUP_CAP_DEFAULT));
  const cap = groupCapSchema.safeParse(Number(groupCap));
  if (lessons.isPending) return <p role="status">Loading your lessons…</p>;
  if (lessons.isError) return <Alert tone="error">{lessons.error.message}</Alert>;
  if (lessons.data.lessons.length === 0) {
    return (
      <Alert tone="info" title="No lessons yet">
        Plan a lesson around a dice set in{" "}
        <Link className="font-bold underline" to="/app/lessons">
          Lessons
        </Link>
        , then open a class run of it here.
      </Alert>
    );
  }
  const ordered = [...lessons.data.lessons].sort((a, b) => Number(b.id === wanted) - Number(a.id === wanted));
  return (
    <div className="flex flex-col gap-3">
      {open.error && (
        <Alert tone="error" title="The run was not opened">
          {open.error.message}
        </Alert>
      )}
      <label className="flex max-w-md flex-col gap-1 font-bold">
        Most groups that may join
        <span className="text-sm font-normal text-ink-soft">
          A class working in pairs needs about 15; up to {GROUP_CAP_MAX}. Joining stops at this number, so one phone cannot fill the run.
        </span>
        <input
          type="number"
          inputMode="numeric"
          min={1}
          max={GROUP_CAP_MAX}
          className="min-h-11 w-28 rounded-lg border-2 border-line bg-white px-2 text-base font-normal"
          value={groupCap}
          aria-invalid={!cap.success}
          onChange={(event) => setGroupCap(event.target.value)}
        />
        {!cap.success && <span className="text-sm text-alarm">{cap.error.issues[0]?.message}</span>}
      </label>
      <ul className="grid gap-3 md:grid-cols-2">
        {ordered.map((lesson) => (
          <li
            key={lesson.id}
            className={`flex flex-col gap-2 rounded-2xl border-2 bg-shell p-4 ${lesson.id === wanted ? "border-tide" : "border-line"}`}
          >
            <h3 className="text-lg">{lesson.title}</h3>
            <p className="text-ink-soft">{[lesson.classGroup, lesson.diceSetName ?? "No dice set"].filter(Boolean).join(" · ")}</p>
            {lesson.problem ? (
              <p className="text-sm font-bold text-alarm">
                <span aria-hidden="true">⚠ </span>
                {lesson.problem}
              </p>
            ) : (
              <div className="flex flex-wrap gap-2">
                <Button
                  busy={open.isPending && open.variables?.lessonId === lesson.id}
                  disabled={!cap.success}
                  onClick={() =>
                    open.mutate({ lessonId: lesson.id, groupCap: cap.data }, { onSuccess: (run) => navigate(`/app/runs/${run.id}`) })
                  }
                >
                  Open a class run
                </Button>
                {lesson.openRunId && (
                  <LinkButton to={`/app/runs/${lesson.openRunId}`} variant="secondary">
                    Go to its open run
                  </LinkButton>
                )}
              </div>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}

function RunsTable() {
  const runs = useClassRuns();
  if (runs.isPending) return <p role="status">Loading your class runs…</p>;
  if (runs.isError) return <Alert tone="error">{runs.error.message}</Alert>;
  if (runs.data.runs.length === 0) return <p className="text-ink-soft">No class runs yet.</p>;
  return (
    <div className="overflow-x-auto rounded-2xl border-2 border-line bg-shell">
      <table className="w-full min-w-[44rem] text-left">
        <caption className="sr-only">Your class runs</caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="px-3 py-2">
              Run
            </th>
            <th scope="col" className="px-3 py-2">
              Status
            </th>
            <th scope="col" className="px-3 py-2">
              Phase
            </th>
            <th scope="col" className="px-3 py-2">
              Join code
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Groups
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Rolls
            </th>
            <th scope="col" className="px-3 py-2">
              Opened
            </th>
          </tr>
        </thead>
        <tbody>
          {runs.data.runs.map((run) => (
            <tr key={run.id} className="border-b border-line/60">
              <th scope="row" className="px-3 py-2">
                <Link to={`/app/runs/${run.id}`} className="font-bold text-tide underline">
                  {run.title}
                </Link>
                <span className="block text-sm text-ink-soft">{[run.classGroup, run.diceSetName].filter(Boolean).join(" · ")}</span>
              </th>
              <td className="px-3 py-2">
                <RunStatusBadge status={run.status} />
              </td>
              <td className="px-3 py-2">{run.phase}</td>
              <td className="px-3 py-2 font-mono">{run.status === "closed" ? "–" : spacedCode(run.joinCode)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{run.groupCount}</td>
              <td className="px-3 py-2 text-right tabular-nums">{run.rollCount}</td>
              <td className="px-3 py-2 text-sm">{when(run.createdAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Class runs: open a run of one of your lessons, and find your runs, live or closed. */
export function ClassRunsPage() {
  return (
    <>
      <PageHeader
        title="Class runs"
        lead="Run a lesson live: groups join on phones with a code, record their rolls, and the Run board pools them beside the exact chances."
      />
      <div className="mb-6 max-w-3xl">
        <Alert tone="caution" title="Before you start">
          Pupils need only a browser on the same network as Outroll: no app and no account. Ask each group for a made-up nickname; Outroll
          stores nicknames and rolls, nothing about the pupils themselves, until you delete the run.{" "}
          <Link to="/privacy" className="font-bold underline">
            Privacy notice
          </Link>
        </Alert>
      </div>
      <section aria-labelledby="open-heading" className="mb-8 flex flex-col gap-3">
        <h2 id="open-heading" className="text-2xl">
          Open a class run
        </h2>
        <OpenFromLesson />
      </section>
      <section aria-labelledby="runs-heading" className="flex flex-col gap-3">
        <h2 id="runs-heading" className="text-2xl">
          Your class runs
        </h2>
        <RunsTable />
      </section>
    </>
  );
}
