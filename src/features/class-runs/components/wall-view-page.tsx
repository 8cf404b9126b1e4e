import { useState } from "react";
import { Link } from "react-router-dom";
import type { PooledMatchup, PooledResults } from "@shared/class-results/pooled-results";
import { matchupFromSeat, padDieOrder, seatShares, shareMeanings } from "@shared/class-results/seat-shares";
import { runPhaseHints, type BoardSnapshot, type ClassRun, type RunTally } from "@shared/schemas/class-runs";
import { LESSON_PHASES, tieRuleLabels } from "@shared/schemas/lessons";
import { MatchupTree } from "@/components/tree-diagram";
import { ApiRequestError } from "@/lib/api-client";
import { useRunBoard } from "../api/get-run-board";
import { useLiveBoard } from "../hooks/use-live-board";
import { ConvergenceChart } from "./convergence-chart";
import { JoinPanel, spacedCode } from "./join-panel";
import { decimal } from "./pooled-matchups";
import { VotesVersusTruth } from "./votes-versus-truth";

/** Whether the Wall shows exact values now: always once Prove is reached (or the run is closed), before it only when the lesson allows. */
export function wallShowsExact(run: Pick<ClassRun, "hideExactUntilProve" | "phase" | "status">): boolean {
  return !run.hideExactUntilProve || run.status === "closed" || LESSON_PHASES.indexOf(run.phase) >= LESSON_PHASES.indexOf("Prove");
}

/** "one die each, two players". */
function modeText(tally: Pick<RunTally, "dicePerPlayer" | "players">) {
  return `${tally.dicePerPlayer === 2 ? "two dice each" : "one die each"}, ${tally.players === 3 ? "three players" : "two players"}`;
}

type Ordering = (entry: PooledMatchup) => number[];

/**
 * One matchup as a big line, dice in the pads' order: whose share the class found, and its one exact value (or where it
 * will come). Compact lines (beside the join panel, or two tallies side by side) keep each part to one line.
 */
function MatchupLine({
  entry,
  run,
  order,
  showExact,
  compact = false,
  showLabel = true,
}: {
  entry: PooledMatchup;
  run: ClassRun;
  order: Ordering;
  showExact: boolean;
  compact?: boolean;
  showLabel?: boolean;
}) {
  const shares = seatShares(entry, run.tieRule, order(entry));
  const [lead] = shares;
  const meaning = shareMeanings[run.tieRule];
  const big = compact ? "text-3xl" : "text-4xl";
  const exactLabel =
    run.tieRule === "ties-score-nothing" ? "Exact" : `Exact under the tie rule (${tieRuleLabels[run.tieRule].toLowerCase()})`;
  const exactText = lead.exact ? `${lead.exact.fraction} ≈ ${lead.exact.decimal}` : "every roll ties";
  return (
    <li
      className={`grid items-baseline gap-x-6 border-b-2 border-white/25 ${compact ? "gap-y-1 py-2" : "gap-y-2 py-3 xl:grid-cols-[minmax(0,1.2fr)_minmax(0,1.4fr)_minmax(0,1fr)]"}`}
      data-testid="wall-matchup"
    >
      {showLabel && (
        <span className={`${big} font-bold`}>
          {shares.map((share) => share.dieName).join(" v ")}
          <span className={`${compact ? "ml-3 inline" : "block"} text-xl font-normal text-white/80`}>{entry.rolls} rolls</span>
        </span>
      )}
      <span className={`${big} tabular-nums`} data-testid="wall-share">
        {lead.dieName} {meaning.verb} <strong>{decimal(lead.share)}</strong> <span className="text-2xl">{meaning.of}</span>
      </span>
      <span className={`${compact ? "text-2xl" : big} tabular-nums`} data-testid="wall-exact">
        <span className={`${compact ? "mr-3 inline" : "block"} text-xl text-white/80`}>{exactLabel}</span>
        {showExact ? exactText : <span className="text-white/80">Shown in Prove</span>}
      </span>
    </li>
  );
}

/** A tally's pooled matchups as big lines, or a note before any roll. */
function TallyLines({
  pooled,
  run,
  order,
  showExact,
  compact,
}: {
  pooled: PooledResults;
  run: ClassRun;
  order: Ordering;
  showExact: boolean;
  compact?: boolean;
}) {
  if (pooled.matchups.length === 0) return <p className="text-4xl">No rolls yet.</p>;
  return (
    <ul>
      {pooled.matchups.map((entry) => (
        <MatchupLine key={entry.key} entry={entry} run={run} order={order} showExact={showExact} compact={compact} />
      ))}
    </ul>
  );
}

/** Reflect: the main tally's pooled results beside the Twist's, then the lesson's prompts and exit ticket. */
function ReflectPanel({ snapshot, order }: { snapshot: BoardSnapshot; order: Ordering }) {
  const { run } = snapshot;
  const [main, ...twists] = snapshot.tallies;
  return (
    <div className="flex flex-col gap-8">
      <div className={`grid gap-8 ${twists.length ? "xl:grid-cols-2" : ""}`}>
        <section aria-labelledby="wall-main-tally" data-testid="wall-main-tally">
          <h2 id="wall-main-tally" className="text-4xl">
            Main tally: {modeText(main.tally)}
            <span className="block text-2xl font-normal text-white/80">
              {main.pooled.totals.rolls} rolls from {main.pooled.totals.groups} groups
            </span>
          </h2>
          <TallyLines pooled={main.pooled} run={run} order={order} showExact compact={twists.length > 0} />
        </section>
        {twists.map((twist) => (
          <section key={twist.tally.tally} aria-labelledby={`wall-tally-${twist.tally.tally}`} data-testid="wall-twist-tally">
            <h2 id={`wall-tally-${twist.tally.tally}`} className="text-4xl">
              Twist: {modeText(twist.tally)}
              <span className="block text-2xl font-normal text-white/80">
                {twist.pooled.totals.rolls} rolls from {twist.pooled.totals.groups} groups
              </span>
            </h2>
            <TallyLines pooled={twist.pooled} run={run} order={order} showExact compact />
          </section>
        ))}
      </div>
      {(run.discussionPrompts.length > 0 || run.exitTicket) && (
        <div className="grid gap-8 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          {run.discussionPrompts.length > 0 && (
            <section aria-labelledby="wall-prompts" className="rounded-2xl border-2 border-white/40 p-6">
              <h2 id="wall-prompts" className="text-4xl">
                Talk about it
              </h2>
              <ol className="mt-3 list-decimal pl-10 text-3xl leading-snug">
                {run.discussionPrompts.map((prompt, index) => (
                  <li key={index} className="py-1">
                    {prompt}
                  </li>
                ))}
              </ol>
            </section>
          )}
          {run.exitTicket && (
            <section aria-labelledby="wall-exit-ticket" className="rounded-2xl bg-white p-6 text-ink">
              <h2 id="wall-exit-ticket" className="text-4xl text-ink">
                Exit ticket
              </h2>
              <p className="mt-3 text-3xl leading-snug">{run.exitTicket}</p>
            </section>
          )}
        </div>
      )}
    </div>
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
  const showExact = wallShowsExact(run);
  const played = snapshot.groups.map((group) => group.matchup);
  const order: Ordering = (entry) => padDieOrder(entry.matchup, played, run.dice.length);
  const reflecting = run.phase === "Reflect" || run.status === "closed";

  let main;
  if (run.phase === "Guess" && run.status !== "closed") {
    main = <VotesVersusTruth snapshot={snapshot} large showTruth={false} />;
  } else if (run.phase === "Prove" && run.status !== "closed") {
    const matchup = proved ? order(proved) : [0, 1];
    main = (
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center gap-4">
          <h2 className="text-4xl">{matchup.map((index) => run.dice[index].name).join(" v ")}</h2>
          {busiest.length > 1 && (
            <button
              type="button"
              className="rounded-xl border-2 border-white px-4 py-2 text-2xl font-bold"
              onClick={() => setChosen(chosen + 1)}
            >
              Next matchup →
            </button>
          )}
        </div>
        {proved && (
          <ul>
            <MatchupLine entry={proved} run={run} order={order} showExact={showExact} showLabel={false} />
          </ul>
        )}
        <MatchupTree
          first={run.dice[matchup[0]]}
          second={run.dice[matchup[1]]}
          dicePerPlayer={proved?.dicePerPlayer ?? current.tally.dicePerPlayer}
          look="projector"
        />
      </div>
    );
  } else if (reflecting) {
    main = <ReflectPanel snapshot={snapshot} order={order} />;
  } else if (run.phase === "Pool") {
    const charted = busiest[0];
    main = (
      <div className="grid gap-8 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <TallyLines pooled={pooled} run={run} order={order} showExact={showExact} compact />
        {charted && (
          <ConvergenceChart
            entry={matchupFromSeat(charted, run.tieRule, charted.matchup.indexOf(order(charted)[0]))}
            tieRule={pooled.tieRule}
            large
            showExact={showExact}
          />
        )}
      </div>
    );
  } else {
    main = (
      <div className="flex flex-col gap-6">
        {run.phase === "Twist" && (
          <p className="rounded-2xl bg-beacon px-6 py-4 text-5xl font-bold text-white">
            Twist: {modeText(current.tally)}. A fresh tally starts at zero.
          </p>
        )}
        <p className="text-5xl font-bold tabular-nums" data-testid="wall-roll-count">
          {pooled.totals.rolls} rolls from {pooled.totals.groups} groups
        </p>
        <TallyLines pooled={pooled} run={run} order={order} showExact={showExact} compact={joining} />
      </div>
    );
  }

  return (
    <main className="flex min-h-dvh flex-col gap-6 bg-ink p-8 text-white">
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
      {run.status === "paused" && (
        <p className="rounded-2xl bg-white px-6 py-4 text-5xl font-bold text-ink">❚❚ Paused: hands off the dice for a moment.</p>
      )}
      <div className={`grid flex-1 gap-10 ${joining ? "xl:grid-cols-[auto_minmax(0,1fr)]" : ""}`}>
        {joining && <JoinPanel run={run} size="wall" />}
        <div className="min-w-0">{main}</div>
      </div>
      <Link to={`/app/runs/${run.id}`} className="self-start text-xl text-white/80 underline">
        Back to the Run board
      </Link>
    </main>
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
