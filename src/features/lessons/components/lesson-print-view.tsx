import { useMemo, type ReactNode } from "react";
import { curriculumStandardByCode } from "@shared/curriculum/standards";
import { lessonMaterials } from "@shared/lessons/lesson-materials";
import { lessonSetSummary } from "@shared/lessons/lesson-set-summary";
import { lessonStatusLabels, matchupChoiceLabels, tieRuleLabels } from "@shared/schemas/lessons";
import { Button } from "@/components/ui/button";
import { LinkButton } from "@/components/ui/link-button";
import type { LessonDetail } from "../api/get-lesson";
import { MaterialsList, RollsVerdictView } from "./materials-panel";

/** The printable lesson plan: the plan, the set's exact analysis in sentences and fractions, and the materials list. */
export function LessonPrintView({ detail }: { detail: LessonDetail }) {
  const { lesson, diceSet } = detail;
  const dice = diceSet?.dice ?? null;
  const materials = useMemo(() => lessonMaterials(lesson, dice), [lesson, dice]);
  const summary = useMemo(
    () => (dice && dice.length >= 2 ? lessonSetSummary(dice, lesson.mode.dicePerPlayer) : null),
    [dice, lesson.mode.dicePerPlayer],
  );
  const phases = lesson.phases.filter((entry) => entry.included);
  const minutes = phases.reduce((sum, entry) => sum + entry.minutes, 0);
  return (
    <article
      className="mx-auto flex max-w-4xl flex-col gap-6 bg-white p-4 text-ink sm:p-8 print:max-w-none print:p-0"
      aria-labelledby="print-title"
    >
      <div className="no-print flex flex-wrap gap-2">
        <LinkButton to={`/app/lessons/${lesson.id}`}>Back to the lesson</LinkButton>
        <Button onClick={() => window.print()}>Print this plan</Button>
      </div>
      <header className="border-b-4 border-ink pb-3">
        <p className="text-sm font-bold uppercase tracking-wide text-ink-soft">Outroll lesson plan</p>
        <h1 id="print-title" className="text-3xl">
          {lesson.title}
        </h1>
        <p className="mt-1 text-lg">
          {lesson.classGroup ? `Class ${lesson.classGroup}` : "No class set"} · {lesson.durationMinutes} minutes ·{" "}
          {lessonStatusLabels[lesson.status]} · {lesson.ownerName}
        </p>
        {lesson.fromTemplateId && (
          <p className="text-ink-soft">Copied from a Department shelf template (version {lesson.fromTemplateVersion ?? "?"}).</p>
        )}
      </header>

      <PrintSection title="Learning objectives">
        {lesson.objectives.length === 0 ? (
          <p className="text-ink-soft">None written.</p>
        ) : (
          <ol className="list-decimal pl-6">
            {lesson.objectives.map((objective, index) => {
              const standard = objective.curriculumCode ? curriculumStandardByCode(objective.curriculumCode) : undefined;
              return (
                <li key={index}>
                  {objective.text}
                  {standard && (
                    <span className="text-ink-soft">
                      {" "}
                      — <b>{standard.label}</b>: {standard.summary}
                    </span>
                  )}
                </li>
              );
            })}
          </ol>
        )}
      </PrintSection>

      <PrintSection title="How the class plays">
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
          <dt className="font-bold">Dice set</dt>
          <dd>{diceSet ? `${diceSet.name} (${diceSet.dice.length} dice)` : "None chosen"}</dd>
          <dt className="font-bold">Mode</dt>
          <dd>
            {lesson.mode.dicePerPlayer === 1 ? "One die each" : "Two dice each"},{" "}
            {lesson.mode.players === 2 ? "two players" : "three players"}
          </dd>
          <dt className="font-bold">Tie rule</dt>
          <dd>{tieRuleLabels[lesson.tieRule]}</dd>
          <dt className="font-bold">Groups</dt>
          <dd>
            {lesson.groups} groups of {lesson.pupilsPerGroup}, {lesson.rollsPerGroup} rolls per group (
            {lesson.groups * lesson.rollsPerGroup} pooled)
          </dd>
          <dt className="font-bold">Matchups</dt>
          <dd>{matchupChoiceLabels[lesson.matchupChoice]}</dd>
        </dl>
        {materials.games.length > 0 && lesson.matchupChoice === "assigned" && (
          <p className="mt-2">
            <b>Games, assigned in turn:</b>{" "}
            {materials.games
              .map((game, index) => `group ${index + 1}: ${game.join(" v ")}`)
              .slice(0, lesson.groups)
              .join("; ")}
            {lesson.groups > materials.games.length ? "; then round again." : "."}
          </p>
        )}
      </PrintSection>

      {diceSet && summary && (
        <PrintSection title={`The set: ${diceSet.name}`}>
          <ul className="mb-3 flex flex-wrap gap-x-6 gap-y-1">
            {diceSet.dice.map((die) => (
              <li key={die.name}>
                <b>{die.name}</b> ({die.colour}, {die.pattern}): {die.faces.join(", ")}
              </li>
            ))}
          </ul>
          {summary.cycleSentence && <p>{summary.cycleSentence}</p>}
          {summary.noBestDieSentence && <p className="font-bold">{summary.noBestDieSentence}</p>}
          {summary.matchups.length > 0 && (
            <table className="mt-2 w-full text-left text-sm">
              <caption className="text-left font-bold">
                Exact chances of one roll, {lesson.mode.dicePerPlayer === 1 ? "one die each" : "two dice each"}
              </caption>
              <thead>
                <tr className="border-b-2 border-ink/30">
                  <th scope="col" className="py-1 pr-2">
                    Matchup
                  </th>
                  <th scope="col" className="py-1 pr-2">
                    Win
                  </th>
                  <th scope="col" className="py-1 pr-2">
                    Tie
                  </th>
                  <th scope="col" className="py-1">
                    Loss
                  </th>
                </tr>
              </thead>
              <tbody>
                {summary.matchups.map((entry) => (
                  <tr key={`${entry.winner}-${entry.loser}`} className="border-b border-ink/10">
                    <th scope="row" className="py-1 pr-2 font-normal">
                      {entry.winner} v {entry.loser}
                    </th>
                    <td className="py-1 pr-2">{entry.win}</td>
                    <td className="py-1 pr-2">{entry.tie}</td>
                    <td className="py-1">{entry.loss}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {summary.twoDiceChanges.length > 0 && (
            <>
              <h3 className="mt-3 text-lg">What changes with two dice each</h3>
              <ul className="list-disc pl-6">
                {summary.twoDiceChanges.map((sentence) => (
                  <li key={sentence}>{sentence}</li>
                ))}
              </ul>
            </>
          )}
        </PrintSection>
      )}

      <PrintSection title={`Phases (${minutes} of ${lesson.durationMinutes} minutes)`}>
        <table className="w-full text-left">
          <thead>
            <tr className="border-b-2 border-ink/30">
              <th scope="col" className="py-1 pr-2">
                Phase
              </th>
              <th scope="col" className="py-1 pr-2">
                Minutes
              </th>
              <th scope="col" className="py-1">
                Notes
              </th>
            </tr>
          </thead>
          <tbody>
            {phases.map((entry) => (
              <tr key={entry.phase} className="border-b border-ink/10 align-top">
                <th scope="row" className="py-1 pr-2">
                  {entry.phase}
                </th>
                <td className="py-1 pr-2">{entry.minutes}</td>
                <td className="whitespace-pre-line py-1">{entry.notes || "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </PrintSection>

      {(lesson.discussionPrompts.length > 0 || lesson.exitTicket) && (
        <PrintSection title="Discussion and exit ticket">
          {lesson.discussionPrompts.length > 0 && (
            <ul className="list-disc pl-6">
              {lesson.discussionPrompts.map((prompt) => (
                <li key={prompt}>{prompt}</li>
              ))}
            </ul>
          )}
          {lesson.exitTicket && (
            <p className="mt-2">
              <b>Exit ticket:</b> {lesson.exitTicket}
            </p>
          )}
        </PrintSection>
      )}

      {(lesson.differentiation.support || lesson.differentiation.stretch) && (
        <PrintSection title="Differentiation">
          <p>
            <b>Support:</b> {lesson.differentiation.support || "—"}
          </p>
          <p>
            <b>Stretch:</b> {lesson.differentiation.stretch || "—"}
          </p>
        </PrintSection>
      )}

      <div className="grid gap-4 md:grid-cols-2 print:grid-cols-2">
        <MaterialsList result={materials} dice={dice} />
        <RollsVerdictView result={materials} tieRule={lesson.tieRule} />
      </div>
    </article>
  );
}

function PrintSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="break-inside-avoid">
      <h2 className="mb-2 border-b-2 border-line pb-1 text-2xl">{title}</h2>
      {children}
    </section>
  );
}
