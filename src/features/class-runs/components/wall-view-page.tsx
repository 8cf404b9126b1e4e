import { useState } from "react";
import { Link } from "react-router-dom";
import type { PooledMatchup } from "@shared/class-results/pooled-results";
import { runPhaseHints, type BoardSnapshot } from "@shared/schemas/class-runs";
import { MatchupTree } from "@/components/tree-diagram";
import { ApiRequestError } from "@/lib/api-client";
import { useRunBoard } from "../api/get-run-board";
import { useLiveBoard } from "../hooks/use-live-board";
import { ConvergenceChart } from "./convergence-chart";
import { JoinPanel, spacedCode } from "./join-panel";
import { decimal } from "./pooled-matchups";
import { VotesVersusTruth } from "./votes-versus-truth";

/** One matchup as a big line: the class's figure beside the exact one. */
function MatchupLine({ entry }: { entry: PooledMatchup }) {
  return (
    <li className="grid grid-cols-[minmax(0,1.6fr)_1fr_1fr] items-baseline gap-6 border-b-2 border-white/25 py-3">
      <span className="text-4xl font-bold">{entry.label}</span>
      <span className="text-4xl tabular-nums">
        <span className="block text-xl text-white/80">Class, {entry.rolls} rolls</span>
        {decimal(entry.frequencyUnderTieRule)}
      </span>
      <span className="text-4xl tabular-nums">
        <span className="block text-xl text-white/80">Exact</span>
        {entry.exact.underTieRule ? `${entry.exact.underTieRule.fraction} ≈ ${entry.exact.underTieRule.decimal}` : "–"}
      </span>
    </li>
  );
}

function WallBody({ snapshot }: { snapshot: BoardSnapshot }) {
  const { run } = snapshot;
  const current = snapshot.tallies.find((entry) => entry.tally.tally === run.currentTally) ?? snapshot.tallies.at(-1)!;
  const pooled = current.pooled;
  const busiest = [...pooled.matchups].sort((x, y) => y.rolls - x.rolls);
  const [chosen, setChosen] = useState(0);
  const proved = busiest[chosen % Math.max(1, busiest.length)];
  const joining = run.status !== "closed" && (run.phase === "Guess" || run.phase === "Roll" || run.phase === "Twist");
  const twistMode = `${current.tally.dicePerPlayer === 2 ? "Two dice each" : "One die each"}, ${current.tally.players === 3 ? "three players" : "two players"}`;

  let main;
  if (run.phase === "Guess") {
    main = <VotesVersusTruth snapshot={snapshot} large showTruth={false} />;
  } else if (run.phase === "Prove") {
    const matchup = proved?.matchup ?? [0, 1];
    main = (
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center gap-4">
          <h2 className="text-4xl">{proved ? proved.label : `${run.dice[0].name} v ${run.dice[1].name}`}</h2>
          {busiest.length > 1 && (
            <button type="button" className="rounded-xl border-2 border-white px-4 py-2 text-2xl font-bold" onClick={() => setChosen(chosen + 1)}>
              Next matchup →
            </button>
          )}
        </div>
        <MatchupTree first={run.dice[matchup[0]]} second={run.dice[matchup[1]]} dicePerPlayer={proved?.dicePerPlayer ?? current.tally.dicePerPlayer} look="projector" />
      </div>
    );
  } else if (run.phase === "Pool" || run.phase === "Reflect" || run.status === "closed") {
    main = (
      <div className="grid gap-8 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <ul>{pooled.matchups.length ? pooled.matchups.map((entry) => <MatchupLine key={entry.key} entry={entry} />) : <li className="text-4xl">No rolls yet.</li>}</ul>
        {busiest[0] && <ConvergenceChart entry={busiest[0]} tieRule={pooled.tieRule} large />}
      </div>
    );
  } else {
    main = (
      <div className="flex flex-col gap-6">
        {run.phase === "Twist" && <p className="rounded-2xl bg-beacon px-6 py-4 text-5xl font-bold text-white">Twist: {twistMode}. A fresh tally starts at zero.</p>}
        <p className="text-5xl font-bold tabular-nums" data-testid="wall-roll-count">
          {pooled.totals.rolls} rolls from {pooled.totals.groups} groups
        </p>
        <ul>{pooled.matchups.map((entry) => <MatchupLine key={entry.key} entry={entry} />)}</ul>
      </div>
    );
  }

  return (
    <div className="flex min-h-dvh flex-col gap-6 bg-ink p-8 text-white">
      <header className="flex flex-wrap items-start justify-between gap-6">
        <div>
          <p className="text-3xl text-white/85">{[run.title, run.classGroup].filter(Boolean).join(" · ")}</p>
          <h1 className="text-7xl text-white">{run.status === "closed" ? "Results" : run.phase}</h1>
          <p className="mt-2 text-4xl">{run.status === "closed" ? "This class run is closed." : runPhaseHints[run.phase]}</p>
        </div>
        {!joining && run.status !== "closed" && (
          <p className="text-right text-3xl">
            Join code <span className="block font-mono text-6xl font-bold tracking-widest">{spacedCode(run.joinCode)}</span>
          </p>
        )}
      </header>
      {run.status === "paused" && <p className="rounded-2xl bg-white px-6 py-4 text-5xl font-bold text-ink">❚❚ Paused: hands off the dice for a moment.</p>}
      <div className={`grid flex-1 gap-10 ${joining ? "xl:grid-cols-[auto_minmax(0,1fr)]" : ""}`}>
        {joining && <JoinPanel run={run} size="wall" />}
        <div className="min-w-0">{main}</div>
      </div>
      <Link to={`/app/runs/${run.id}`} className="self-start text-xl text-white/80 underline">
        Back to the Run board
      </Link>
    </div>
  );
}

/** The class run on the classroom projector: full screen, large type, high contrast, following the teacher's phase. */
export function WallViewPage({ runId }: { runId: string }) {
  const board = useRunBoard(runId);
  useLiveBoard(runId);
  if (board.isPending) return <p className="grid min-h-dvh place-items-center bg-ink text-4xl text-white">Loading the Wall view…</p>;
  if (board.isError) {
    const signedOut = board.error instanceof ApiRequestError && board.error.status === 401;
    return (
      <div className="grid min-h-dvh place-items-center bg-ink p-8 text-center text-3xl text-white">
        <div>
          <p>{signedOut ? "Sign in to show the Wall view." : board.error.message}</p>
          {signedOut && (
            <Link className="mt-4 inline-block underline" to={`/sign-in?next=${encodeURIComponent(`/app/runs/${runId}/wall`)}`}>
              Sign in
            </Link>
          )}
        </div>
      </div>
    );
  }
  return <WallBody snapshot={board.data} />;
}
