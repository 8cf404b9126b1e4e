import { useState } from "react";
import { runPhaseHints, twistModeLabels, type ClassRun, type RunPhase, type TwistMode } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useChangeRunPhase } from "../api/change-run-phase";
import { useChangeRunStatus } from "../api/change-run-status";

/** The twists this run may still take: two dice each (if it plays one die each) and three players (with three dice or more). */
function possibleTwists(run: ClassRun): TwistMode[] {
  const first = run.tallies[0];
  const twists: TwistMode[] = [];
  if (first.dicePerPlayer === 1) twists.push("two-dice-each");
  if (first.players === 2 && run.dice.length >= 3) twists.push("three-players");
  return twists;
}

/** The lesson's phases as steps the teacher moves through (skipped phases are not shown), with pause, resume and close. */
export function PhaseControls({ run }: { run: ClassRun }) {
  const phase = useChangeRunPhase();
  const status = useChangeRunStatus();
  const twists = possibleTwists(run);
  const [twist, setTwist] = useState<TwistMode>(twists[0] ?? "two-dice-each");
  const [closing, setClosing] = useState(false);
  const twistStarted = run.tallies.length > 1;
  const closed = run.status === "closed";
  const index = run.phases.indexOf(run.phase);
  const next = run.phases[index + 1] as RunPhase | undefined;
  const move = (target: RunPhase) =>
    phase.mutate({ runId: run.id, phase: target, ...(target === "Twist" && !twistStarted ? { twist } : {}) });

  return (
    <section aria-labelledby="phases-heading" className="flex flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="phases-heading" className="text-xl">
          Phase: {run.phase}
        </h2>
        <div className="flex flex-wrap gap-2">
          {!closed && run.status === "open" && (
            <Button variant="secondary" busy={status.isPending} onClick={() => status.mutate({ runId: run.id, status: "paused" })}>
              Pause
            </Button>
          )}
          {run.status === "paused" && (
            <Button busy={status.isPending} onClick={() => status.mutate({ runId: run.id, status: "open" })}>
              Resume
            </Button>
          )}
          {!closed && (
            <Button variant="danger" onClick={() => setClosing(true)}>
              Close the run
            </Button>
          )}
        </div>
      </div>
      <ol className="flex flex-wrap gap-2" aria-label="Phases of this lesson">
        {run.phases.map((step, stepIndex) => {
          const current = step === run.phase;
          return (
            <li key={step}>
              <button
                type="button"
                disabled={closed || phase.isPending || current}
                aria-current={current ? "step" : undefined}
                onClick={() => move(step)}
                className={`min-h-11 rounded-xl border-2 px-3 py-1 font-bold ${current ? "border-ink bg-ink text-white" : stepIndex < index ? "border-line bg-white text-ink-soft" : "border-line bg-white text-ink hover:border-ink/50"}`}
              >
                <span aria-hidden="true">{current ? "▶ " : stepIndex < index ? "✓ " : ""}</span>
                {stepIndex + 1}. {step}
              </button>
            </li>
          );
        })}
      </ol>
      <p className="text-ink-soft">{runPhaseHints[run.phase]}</p>
      {run.phases.includes("Twist") && !twistStarted && twists.length > 0 && !closed && (
        <ChoiceGroup
          legend="The Twist will play"
          hint="Entering the Twist starts a fresh tally; the first tally stays on the board."
          value={twist}
          options={twists.map((value) => ({ value, label: twistModeLabels[value] }))}
          onChange={setTwist}
        />
      )}
      {next && !closed && (
        <Button className="self-start" busy={phase.isPending} onClick={() => move(next)}>
          Move on to {next}
        </Button>
      )}
      {(phase.error || status.error) && <Alert tone="error">{(phase.error ?? status.error)!.message}</Alert>}
      <ConfirmDialog
        open={closing}
        title="Close the class run?"
        confirmLabel="Close the run"
        busy={status.isPending}
        onCancel={() => setClosing(false)}
        onConfirm={() => status.mutate({ runId: run.id, status: "closed" }, { onSettled: () => setClosing(false) })}
      >
        A closed run takes no more rolls or votes, and its join code stops working. The results stay on the board.
      </ConfirmDialog>
    </section>
  );
}
