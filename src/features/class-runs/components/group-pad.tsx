import { useRef, useState, type ReactNode } from "react";
import type { PadState } from "@shared/events";
import type { RunPhase } from "@shared/schemas/class-runs";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { LocalRoll, PadConnection, PadSession, PadSnapshot } from "../delivery/pad-connection";
import { usePadConnection } from "../hooks/use-pad-connection";
import { PadFrame } from "./pad-frame";

/** "Saved" or "n waiting", announced politely to screen readers as it changes. */
export function deliveryStatusText(connected: boolean, waiting: number): string {
  if (waiting > 0) return connected ? `${waiting} waiting` : `${waiting} waiting · offline`;
  return connected ? "Saved" : "Offline";
}

function DeliveryStatus({ snapshot }: { snapshot: PadSnapshot }) {
  const settled = snapshot.connected && snapshot.waiting === 0;
  const tone = settled ? "bg-tide-light text-ink" : "bg-beacon-light text-ink";
  return (
    <span
      role="status"
      aria-live="polite"
      data-testid="delivery-status"
      className={`whitespace-nowrap rounded-full px-3 py-1 text-base font-bold ${tone}`}
    >
      {settled && <span aria-hidden="true">✓ </span>}
      {deliveryStatusText(snapshot.connected, snapshot.waiting)}
    </span>
  );
}

/** What each phase asks of pupils, in the pad's words; outside Roll and Twist the class looks at the board. */
const phaseText: Record<RunPhase, string> = {
  Guess: "Vote for the die you think is best.",
  Roll: "Play your matchup and record every roll.",
  Pool: "Look at the board: we are putting the class’s rolls together.",
  Prove: "Look at the board: we are proving it.",
  Twist: "A new way to play: record again from zero.",
  Reflect: "Look at the board: talk it through. Was there a best die?",
};

const ROLL_PHASES: readonly RunPhase[] = ["Roll", "Twist"];

function LookAtTheBoard({ phase, waiting }: { phase: RunPhase; waiting: number }) {
  return (
    <section
      aria-labelledby="board-heading"
      className="flex flex-col gap-3 rounded-2xl border-4 border-tide bg-tide-light p-4"
      data-testid="look-at-board"
    >
      <h2 id="board-heading" className="text-2xl">
        {phase}: eyes on the board
      </h2>
      <p className="text-xl">{phaseText[phase]}</p>
      <p>No rolls to record now. Your teacher will tell you when to pick the dice up again.</p>
      {waiting > 0 && (
        <p>
          {waiting} {waiting === 1 ? "roll is" : "rolls are"} kept on this phone and will be sent when the class rolls again.
        </p>
      )}
    </section>
  );
}

function dieLabel(state: PadState, index: number) {
  return state.run.dice[index]?.name ?? `Die ${index + 1}`;
}

function VotePanel({ state, connection }: { state: PadState; connection: PadConnection }) {
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState<number | null>(null);
  return (
    <section aria-labelledby="vote-heading" className="flex flex-col gap-3">
      <h2 id="vote-heading" className="text-2xl">
        Which die is best?
      </h2>
      <p>Talk it over, then vote as a group. You can change your vote until the teacher moves on.</p>
      {problem && <Alert tone="error">{problem}</Alert>}
      <div className="flex flex-col gap-3">
        {state.run.dice.map((die, index) => {
          const chosen = state.vote === index;
          return (
            <button
              key={die.name}
              type="button"
              aria-pressed={chosen}
              // Not disabled while busy: a disabled button drops keyboard focus to the page body.
              aria-disabled={busy !== null || undefined}
              onClick={async () => {
                if (busy !== null) return;
                setBusy(index);
                const ack = await connection.vote(index);
                setBusy(null);
                setProblem(ack.ok ? null : ack.error.message);
              }}
              className={`flex min-h-16 items-center gap-3 rounded-2xl border-4 px-4 py-3 text-left ${chosen ? "border-ink bg-tide-light" : "border-line bg-white"}`}
            >
              <DieSwatch colour={die.colour} pattern={die.pattern} className="h-10 w-10" />
              <span className="flex-1">
                <span className="block text-xl font-bold">{die.name}</span>
                <span className="block text-base text-ink-soft">Faces {die.faces.join(" ")}</span>
              </span>
              <span className="text-lg font-bold">{chosen ? "✓ Our vote" : busy === index ? "…" : "Vote"}</span>
            </button>
          );
        })}
      </div>
    </section>
  );
}

function MatchupChooser({ state, connection }: { state: PadState; connection: PadConnection }) {
  const [seats, setSeats] = useState<number[]>(() => Array.from({ length: state.run.players }, (_, seat) => seat % state.run.dice.length));
  const [problem, setProblem] = useState<string | null>(null);
  const distinct = new Set(seats).size === seats.length;
  return (
    <section className="flex flex-col gap-3" aria-labelledby="choose-heading">
      <h2 id="choose-heading" className="text-2xl">
        Choose your matchup
      </h2>
      {seats.map((chosen, seat) => (
        <fieldset key={seat} className="flex flex-col gap-2">
          <legend className="font-bold">Player {seat + 1} plays</legend>
          <div className="flex flex-wrap gap-2">
            {state.run.dice.map((die, index) => (
              <button
                key={die.name}
                type="button"
                aria-pressed={chosen === index}
                onClick={() => setSeats(seats.map((value, other) => (other === seat ? index : value)))}
                className={`flex min-h-14 items-center gap-2 rounded-xl border-4 px-3 font-bold ${chosen === index ? "border-ink bg-tide-light" : "border-line bg-white"}`}
              >
                <DieSwatch colour={die.colour} pattern={die.pattern} className="h-7 w-7" />
                {chosen === index && <span aria-hidden="true">✓</span>}
                {die.name}
              </button>
            ))}
          </div>
        </fieldset>
      ))}
      {!distinct && <Alert tone="caution">Each player needs a different die.</Alert>}
      {problem && <Alert tone="error">{problem}</Alert>}
      <Button
        className="min-h-14 text-xl"
        disabled={!distinct}
        onClick={async () => {
          const ack = await connection.chooseMatchup(seats);
          setProblem(ack.ok ? null : ack.error.message);
        }}
      >
        Play {seats.map((index) => dieLabel(state, index)).join(" v ")}
      </Button>
    </section>
  );
}

function scoreOf(log: LocalRoll[], tally: number, matchup: number[]) {
  const kept = log.filter(
    (entry) =>
      entry.tally === tally &&
      entry.matchup.join() === matchup.join() &&
      (entry.state === "waiting" || entry.state === "saved" || entry.state === "undoing"),
  );
  const wins = matchup.map(() => 0);
  let ties = 0;
  for (const entry of kept) {
    if (entry.winnerSeat === null) ties += 1;
    else wins[entry.winnerSeat] += 1;
  }
  return { rolls: kept.length, wins, ties };
}

const rollStateText: Record<LocalRoll["state"], string> = {
  waiting: "waiting",
  saved: "✓ saved",
  undoing: "undoing…",
  undone: "undone",
  refused: "not saved",
};

function RecordPanel({ state, connection, snapshot }: { state: PadState; connection: PadConnection; snapshot: PadSnapshot }) {
  const matchup = state.group.matchup!;
  const perPlayer = state.run.dicePerPlayer;
  const empty = () => matchup.map(() => Array.from({ length: perPlayer }, () => null as number | null));
  const [faces, setFaces] = useState<(number | null)[][]>(empty);
  const firstFace = useRef<HTMLButtonElement>(null);
  const complete = faces.every((seat) => seat.every((face) => face !== null));
  const paused = state.run.status === "paused";
  const score = scoreOf(snapshot.log, state.run.tally, matchup);
  const recent = snapshot.log
    .filter((entry) => entry.tally === state.run.tally)
    .slice(-4)
    .reverse();
  const names = matchup.map((index) => dieLabel(state, index));
  const summary = complete ? faces.map((seat) => (seat as number[]).reduce((sum, face) => sum + face, 0)).join(" v ") : "";

  return (
    <section className="flex flex-col gap-4" aria-labelledby="record-heading">
      <div className="rounded-2xl bg-ink p-3 text-white">
        <h2 id="record-heading" className="text-2xl text-white">
          {names.join(" v ")}
        </h2>
        <p className="text-base">
          {perPlayer === 2 ? "Two dice each, faces added. " : ""}
          {score.rolls} {score.rolls === 1 ? "roll" : "rolls"} so far
        </p>
        <p className="mt-1 text-xl font-bold" data-testid="running-score">
          {names.map((name, seat) => `${name} ${score.wins[seat]}`).join(" · ")} · ties {score.ties}
        </p>
      </div>
      {paused && (
        <Alert tone="caution" title="Paused">
          Your teacher has paused the run. Wait for it to go on; nothing you recorded is lost.
        </Alert>
      )}
      {matchup.map((dieIndex, seat) => {
        const die = state.run.dice[dieIndex];
        const values = [...new Set(die.faces)].sort((x, y) => x - y);
        return (
          <fieldset key={seat} className="flex flex-col gap-2 rounded-2xl border-2 border-line p-3">
            <legend className="flex items-center gap-2 px-1 text-xl font-bold">
              <DieSwatch colour={die.colour} pattern={die.pattern} className="h-8 w-8" />
              {die.name}
            </legend>
            {faces[seat].map((picked, slot) => (
              <div
                key={slot}
                role="group"
                aria-label={perPlayer === 2 ? `${die.name}, die ${slot + 1}` : die.name}
                className="flex flex-wrap gap-2"
              >
                {perPlayer === 2 && <span className="w-full text-base font-bold text-ink-soft">Die {slot + 1}</span>}
                {values.map((value, valueIndex) => (
                  <button
                    key={value}
                    ref={seat === 0 && slot === 0 && valueIndex === 0 ? firstFace : undefined}
                    type="button"
                    aria-pressed={picked === value}
                    aria-label={`${die.name}${perPlayer === 2 ? ` die ${slot + 1}` : ""} shows ${value}`}
                    disabled={paused}
                    onClick={() => setFaces(faces.map((row, r) => (r === seat ? row.map((cell, c) => (c === slot ? value : cell)) : row)))}
                    className={`h-16 min-w-16 flex-1 rounded-xl border-4 text-3xl font-bold disabled:opacity-50 ${picked === value ? "border-ink bg-ink text-white" : "border-ink/30 bg-white text-ink"}`}
                  >
                    {value}
                  </button>
                ))}
              </div>
            ))}
          </fieldset>
        );
      })}
      {complete && !paused ? (
        <button
          type="button"
          className="min-h-16 rounded-2xl bg-tide px-4 text-2xl font-bold text-white shadow-sm hover:bg-tide-dark"
          onClick={() => {
            connection.recordRoll(state, faces as number[][]);
            setFaces(empty());
            // The Record button goes away; the next useful control is the first face of the next roll.
            firstFace.current?.focus();
          }}
        >
          Record {summary}
        </button>
      ) : (
        <p className="grid min-h-16 place-items-center rounded-2xl border-4 border-dashed border-ink/40 px-4 text-center text-xl font-bold">
          {paused ? "Paused by your teacher" : "Tap a face for each die, then record"}
        </p>
      )}
      <Button
        variant="secondary"
        className="min-h-14 text-xl aria-disabled:cursor-not-allowed aria-disabled:opacity-60"
        aria-disabled={paused || score.rolls === 0 || undefined}
        onClick={() => {
          if (!paused && score.rolls > 0) connection.undoLast(state.run.tally);
        }}
      >
        Undo last roll
      </Button>
      {recent.length > 0 && (
        <div>
          <h3 className="text-lg">Latest rolls</h3>
          <ol className="mt-1 flex flex-col gap-1 text-base">
            {recent.map((entry) => (
              <li
                key={entry.id}
                className={`flex justify-between gap-2 rounded-lg px-2 py-1 ${entry.state === "refused" ? "bg-alarm-light" : "bg-sand"}`}
              >
                <span className={entry.state === "undone" ? "line-through" : ""}>
                  {entry.totals.join(" v ")} · {entry.winnerSeat === null ? "tie" : `${names[entry.winnerSeat]} wins`}
                </span>
                <span className="font-bold">{rollStateText[entry.state]}</span>
                {entry.message && <span className="w-full text-sm">{entry.message}</span>}
              </li>
            ))}
          </ol>
        </div>
      )}
    </section>
  );
}

/** A joined group's pad: its status, then what the current phase asks of it. */
export function GroupPad({ session, onLeave }: { session: PadSession; onLeave: () => void }) {
  const { connection, snapshot } = usePadConnection(session);
  const padState = snapshot.state;
  const nickname = padState?.group.nickname ?? session.nickname;

  if (snapshot.removed) {
    return (
      <PadFrame>
        <Alert tone="caution" title="Your teacher removed this group">
          The group “{nickname}” is no longer in this class run, so this phone has forgotten it. If that was a mistake, join again with a
          new nickname.
        </Alert>
        <Button className="min-h-14 text-xl" onClick={onLeave}>
          Join the class again
        </Button>
      </PadFrame>
    );
  }

  let body: ReactNode;
  if (!padState || !connection) {
    body = snapshot.problem ? (
      <Alert tone="error" title="Could not rejoin your group">
        {snapshot.problem}
      </Alert>
    ) : (
      <p role="status">Connecting to your class run…</p>
    );
  } else if (padState.run.status === "closed") {
    body = (
      <Alert tone="info" title="The class run is closed">
        Thank you! Your teacher has closed this run, so it takes no more rolls. Look at the board for the class’s results.
      </Alert>
    );
  } else if (padState.run.phase === "Guess") {
    body = <VotePanel state={padState} connection={connection} />;
  } else if (!ROLL_PHASES.includes(padState.run.phase)) {
    body = <LookAtTheBoard phase={padState.run.phase} waiting={snapshot.waiting} />;
  } else if (!padState.group.matchup) {
    body =
      padState.run.matchupChoice === "group-choice" ? (
        <MatchupChooser state={padState} connection={connection} />
      ) : (
        <Alert tone="info" title="Waiting for a matchup">
          Your teacher will give your group its dice in a moment.
        </Alert>
      );
  } else {
    body = (
      <RecordPanel
        key={`${padState.run.tally}-${padState.group.matchup.join("-")}`}
        state={padState}
        connection={connection}
        snapshot={snapshot}
      />
    );
  }

  return (
    <PadFrame status={<DeliveryStatus snapshot={snapshot} />}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-xl font-bold" data-testid="group-nickname">
          {nickname}
        </h1>
        {padState && (padState.run.phase === "Guess" || ROLL_PHASES.includes(padState.run.phase)) && (
          <p className="text-base text-ink-soft">
            {padState.run.phase}: {phaseText[padState.run.phase]}
          </p>
        )}
      </div>
      {snapshot.notice &&
        snapshot.waiting > 0 &&
        (!padState || padState.run.phase === "Guess" || ROLL_PHASES.includes(padState.run.phase)) && (
          <p className="text-base text-ink-soft">{snapshot.notice}</p>
        )}
      {body}
      <p className="text-sm text-ink-soft">
        Outroll keeps only your group’s nickname and rolls. Please do not type real names.{" "}
        <a href="/privacy" className="underline">
          How Outroll looks after your data
        </a>
      </p>
      <button type="button" className="self-start text-base underline" onClick={onLeave}>
        Not your group? Join with another nickname
      </button>
    </PadFrame>
  );
}
