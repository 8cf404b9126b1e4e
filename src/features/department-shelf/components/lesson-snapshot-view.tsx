import type { ReactNode } from "react";
import { curriculumStandardByCode } from "@shared/curriculum/standards";
import { lessonMaterials } from "@shared/lessons/lesson-materials";
import { matchupChoiceLabels, tieRuleLabels, type LessonSnapshot } from "@shared/schemas/lessons";
import { DieSwatch } from "@/components/dice/die-swatch";

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm font-bold text-ink-soft">{label}</dt>
      <dd className="text-base">{children}</dd>
    </div>
  );
}

function modeText(mode: LessonSnapshot["lesson"]["mode"]) {
  return `${mode.dicePerPlayer === 1 ? "One die each" : "Two dice each"}, ${mode.players === 2 ? "two players" : "three players"}`;
}

/** A frozen lesson plan as the Department shelf shows it: read-only, every part of the plan, and what it needs printed. */
export function LessonSnapshotView({ snapshot }: { snapshot: LessonSnapshot }) {
  const { lesson, diceSet } = snapshot;
  const materials = lessonMaterials(lesson, diceSet?.dice ?? null).materials;
  const phases = lesson.phases.filter((phase) => phase.included);
  return (
    <div className="flex flex-col gap-6">
      <dl className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <Fact label="Class or year group">{lesson.classGroup || "Not set"}</Fact>
        <Fact label="Duration">{lesson.durationMinutes} minutes</Fact>
        <Fact label="Mode">{modeText(lesson.mode)}</Fact>
        <Fact label="Tie rule">{tieRuleLabels[lesson.tieRule]}</Fact>
        <Fact label="Groups">
          {lesson.groups} groups of {lesson.pupilsPerGroup}, {lesson.rollsPerGroup} rolls per group
        </Fact>
        <Fact label="Matchups">{matchupChoiceLabels[lesson.matchupChoice]}</Fact>
      </dl>

      <section aria-labelledby="snapshot-set-heading">
        <h3 id="snapshot-set-heading" className="text-xl">
          Dice set{diceSet ? `: ${diceSet.name}` : ""}
        </h3>
        {diceSet ? (
          <ul className="mt-2 grid gap-2 sm:grid-cols-2">
            {diceSet.dice.map((die) => (
              <li key={die.name} className="flex items-center gap-3 rounded-xl border-2 border-line bg-white px-3 py-2">
                <DieSwatch colour={die.colour} pattern={die.pattern} className="h-8 w-8" />
                <span className="min-w-0">
                  <span className="block font-bold">{die.name}</span>
                  <span className="block text-ink-soft">
                    <span className="sr-only">Faces: </span>
                    {die.faces.join(", ")}
                  </span>
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-1 text-ink-soft">This template has no dice set; choose one after copying it.</p>
        )}
      </section>

      {lesson.objectives.length > 0 && (
        <section aria-labelledby="snapshot-objectives-heading">
          <h3 id="snapshot-objectives-heading" className="text-xl">
            Learning objectives
          </h3>
          <ul className="mt-2 flex list-disc flex-col gap-1 pl-6">
            {lesson.objectives.map((objective, index) => {
              const standard = objective.curriculumCode ? curriculumStandardByCode(objective.curriculumCode) : undefined;
              return (
                <li key={index}>
                  {objective.text}
                  {standard && (
                    <span
                      className="ml-2 rounded-md border border-line bg-white px-1.5 py-0.5 text-sm text-ink-soft"
                      title={standard.summary}
                    >
                      {standard.label}
                    </span>
                  )}
                </li>
              );
            })}
          </ul>
        </section>
      )}

      <section aria-labelledby="snapshot-phases-heading">
        <h3 id="snapshot-phases-heading" className="text-xl">
          Phases
        </h3>
        <ol className="mt-2 flex flex-col gap-2">
          {phases.map((phase) => (
            <li key={phase.phase} className="rounded-xl border-2 border-line bg-white px-3 py-2">
              <p className="font-bold">
                {phase.phase} <span className="font-normal text-ink-soft">· {phase.minutes} min</span>
              </p>
              {phase.notes && <p className="mt-1 whitespace-pre-line">{phase.notes}</p>}
            </li>
          ))}
        </ol>
        {phases.length < lesson.phases.length && (
          <p className="mt-2 text-sm text-ink-soft">
            Left out:{" "}
            {lesson.phases
              .filter((phase) => !phase.included)
              .map((phase) => phase.phase)
              .join(", ")}
            .
          </p>
        )}
      </section>

      {(lesson.discussionPrompts.length > 0 || lesson.exitTicket) && (
        <section aria-labelledby="snapshot-prompts-heading">
          <h3 id="snapshot-prompts-heading" className="text-xl">
            Discussion and exit ticket
          </h3>
          {lesson.discussionPrompts.length > 0 && (
            <ul className="mt-2 flex list-disc flex-col gap-1 pl-6">
              {lesson.discussionPrompts.map((prompt, index) => (
                <li key={index}>{prompt}</li>
              ))}
            </ul>
          )}
          {lesson.exitTicket && (
            <p className="mt-2">
              <span className="font-bold">Exit ticket:</span> {lesson.exitTicket}
            </p>
          )}
        </section>
      )}

      {(lesson.differentiation.support || lesson.differentiation.stretch) && (
        <section aria-labelledby="snapshot-differentiation-heading">
          <h3 id="snapshot-differentiation-heading" className="text-xl">
            Differentiation
          </h3>
          <dl className="mt-2 grid gap-3 sm:grid-cols-2">
            <Fact label="Support">{lesson.differentiation.support || "None written"}</Fact>
            <Fact label="Stretch">{lesson.differentiation.stretch || "None written"}</Fact>
          </dl>
        </section>
      )}

      <section aria-labelledby="snapshot-materials-heading">
        <h3 id="snapshot-materials-heading" className="text-xl">
          What it needs printed
        </h3>
        {materials.dice.length > 0 ? (
          <ul className="mt-2 flex flex-wrap gap-2">
            {materials.dice.map((die) => (
              <li key={die.name} className="rounded-lg border-2 border-line bg-white px-2 py-1">
                {die.total} × {die.name}
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-1 text-ink-soft">Dice counts appear once the lesson has a dice set.</p>
        )}
        <p className="mt-2">
          {materials.recordingSheets.total} recording sheets
          {materials.exitTicketSlips > 0 ? `, ${materials.exitTicketSlips} exit ticket slips` : ""}.
        </p>
      </section>
    </div>
  );
}
