import { useState } from "react";
import { Link } from "react-router-dom";
import type { BoardSnapshot, RunTally } from "@shared/schemas/class-runs";
import { tieRuleLabels } from "@shared/schemas/lessons";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Tabs } from "@/components/ui/tabs";
import { useRunBoard } from "../api/get-run-board";
import { useLiveBoard, type LiveState } from "../hooks/use-live-board";
import { GroupTable } from "./group-table";
import { JoinPanel } from "./join-panel";
import { JoiningControls } from "./joining-controls";
import { PhaseControls } from "./phase-controls";
import { PooledMatchups } from "./pooled-matchups";
import { RunStatusBadge } from "./run-status-badge";
import { VirtualClassForm } from "./virtual-class-form";
import { VotesVersusTruth } from "./votes-versus-truth";
import { formatCount, formatDateTime } from "@/lib/format";

/** "one die each, two players". */
function modeText(tally: Pick<RunTally, "dicePerPlayer" | "players">) {
  return `${tally.dicePerPlayer === 2 ? "two dice each" : "one die each"}, ${tally.players === 3 ? "three players" : "two players"}`;
}

/** A tally by its part of the lesson: the first is the run's main mode, a later one its Twist. */
export function tallyLabel(tally: RunTally) {
  return `${tally.tally === 1 ? "Main tally" : "Twist"}: ${modeText(tally)}`;
}

const liveText: Record<LiveState, string> = { connecting: "Connecting…", live: "Live", reconnecting: "Reconnecting…" };

function LiveBadge({ live }: { live: LiveState }) {
  return (
    <span
      role="status"
      data-testid="live-state"
      className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold ${live === "live" ? "border-tide text-ink" : "border-beacon bg-beacon-light"}`}
    >
      <span aria-hidden="true">{live === "live" ? "◉" : "○"}</span>
      {liveText[live]}
    </span>
  );
}

function BoardBody({ snapshot, live }: { snapshot: BoardSnapshot; live: LiveState }) {
  const { run } = snapshot;
  const [tallyNumber, setTallyNumber] = useState<number | null>(null);
  const [withSimulated, setWithSimulated] = useState(true);
  const shown = snapshot.tallies.find((entry) => entry.tally.tally === (tallyNumber ?? run.currentTally)) ?? snapshot.tallies.at(-1)!;
  const pooled = !withSimulated && shown.withoutSimulated ? shown.withoutSimulated : shown.pooled;
  const canManage = run.isOwner;
  const [first, ...twists] = run.tallies;
  const closed = run.status === "closed";

  const results = (
    <div className="flex flex-col gap-3">
      {shown.withoutSimulated && (
        <label className="flex min-h-11 items-center gap-2 font-bold">
          <input type="checkbox" className="h-5 w-5" checked={withSimulated} onChange={(event) => setWithSimulated(event.target.checked)} />
          Include the virtual class ({shown.pooled.totals.bySource.simulated} simulated rolls)
        </label>
      )}
      <p className="text-ink-soft" data-testid="pooled-total">
        {pooled.totals.rolls} rolls from {pooled.totals.groups} {pooled.totals.groups === 1 ? "group" : "groups"}
        {snapshot.undoneRolls > 0 ? ` · ${formatCount(snapshot.undoneRolls, "undone roll")} left out` : ""}
      </p>
      <PooledMatchups pooled={pooled} playedMatchups={snapshot.groups.map((group) => group.matchup)} diceCount={run.dice.length} />
    </div>
  );

  return (
    <>
      <PageHeader
        title={run.title}
        lead={`${run.classGroup ? `${run.classGroup} · ` : ""}${run.diceSetName} · ${modeText(first)}${twists.map((tally) => ` · Twist: ${modeText(tally)}`).join("")} · ${tieRuleLabels[run.tieRule]}`}
        actions={
          <>
            <RunStatusBadge status={run.status} />
            {closed ? (
              <Link
                to={`/app/results/${run.id}`}
                className="inline-flex min-h-11 items-center rounded-xl border-2 border-ink px-4 font-bold text-ink hover:bg-sand"
              >
                See the results
              </Link>
            ) : (
              <LiveBadge live={live} />
            )}
            <Link
              to={`/app/runs/${run.id}/wall`}
              target="_blank"
              className="inline-flex min-h-11 items-center rounded-xl bg-ink px-4 font-bold text-white hover:bg-ink-soft"
            >
              Open the Wall view ↗
            </Link>
          </>
        }
      />
      {!canManage && (
        <div className="mb-4">
          <Alert tone="info">You are viewing a colleague’s class run. Only the teacher who opened it can change it.</Alert>
        </div>
      )}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(18rem,1fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          {canManage && <PhaseControls run={run} />}
          <section aria-labelledby="pooled-heading" className="flex flex-col gap-3">
            <h2 id="pooled-heading" className="text-2xl">
              Pooled results
            </h2>
            {snapshot.tallies.length > 1 ? (
              <Tabs
                label="Tallies"
                items={snapshot.tallies.map((entry) => ({ id: String(entry.tally.tally), label: tallyLabel(entry.tally) }))}
                selected={String(shown.tally.tally)}
                onSelect={(id) => setTallyNumber(Number(id))}
              >
                {results}
              </Tabs>
            ) : (
              results
            )}
          </section>
        </div>
        <aside className="flex flex-col gap-6">
          {run.status !== "closed" ? (
            <section aria-labelledby="join-heading" className="rounded-2xl border-2 border-line bg-shell p-4">
              <h2 id="join-heading" className="mb-3 text-xl">
                Pupils join here
              </h2>
              <JoinPanel run={run} />
              <div className="mt-4 border-t-2 border-line pt-4">
                <JoiningControls snapshot={snapshot} canManage={canManage} />
              </div>
            </section>
          ) : (
            <Alert tone="info" title="This run is closed">
              It took its last roll{run.closedAt ? ` on ${formatDateTime(run.closedAt)}` : ""}. The figures stay on this board;{" "}
              <Link to={`/app/results/${run.id}`} className="font-bold underline">
                its results page
              </Link>{" "}
              has the class report and the downloads.
            </Alert>
          )}
          <section aria-labelledby="votes-heading" className="rounded-2xl border-2 border-line bg-shell p-4">
            <h2 id="votes-heading" className="mb-3 text-xl">
              Guess votes and the truth
            </h2>
            <VotesVersusTruth snapshot={snapshot} />
          </section>
        </aside>
      </div>
      <section aria-labelledby="groups-heading" className="mt-8 flex flex-col gap-3">
        <h2 id="groups-heading" className="text-2xl">
          Groups
        </h2>
        <GroupTable snapshot={snapshot} pooled={pooled} canManage={canManage} />
      </section>
      {canManage && run.status !== "closed" && (
        <section aria-labelledby="virtual-heading" className="mt-8 flex flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-4">
          <h2 id="virtual-heading" className="text-2xl">
            Virtual class
          </h2>
          <VirtualClassForm runId={run.id} />
        </section>
      )}
      <div className="mt-8 max-w-3xl">
        <Alert tone="caution" title="Pupils’ privacy">
          Outroll keeps only group nicknames and rolls. If a group has used a real name, tell them to rejoin with a made-up nickname, and do
          not write pupils’ names into notes or uploads.
        </Alert>
      </div>
    </>
  );
}

/** The teacher's live view of a class run. */
export function RunBoardPage({ runId }: { runId: string }) {
  const board = useRunBoard(runId);
  const { live, problem } = useLiveBoard(runId);
  if (board.isPending) return <p role="status">Loading the Run board…</p>;
  if (board.isError) {
    return (
      <Alert tone="error" title="The Run board could not be loaded">
        {board.error.message}
      </Alert>
    );
  }
  return (
    <>
      {problem && (
        <div className="mb-4">
          <Alert tone="error" title="Live updates stopped">
            {problem}
          </Alert>
        </div>
      )}
      <BoardBody snapshot={board.data} live={live} />
    </>
  );
}
