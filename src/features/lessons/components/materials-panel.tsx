import { Link } from "react-router-dom";
import { fractionToPercent, fractionToString } from "@shared/probability/index";
import type { LessonMaterialsResult } from "@shared/lessons/lesson-materials";
import type { SetDie } from "@shared/schemas/dice-sets";
import { tieRuleLabels } from "@shared/schemas/lessons";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Button } from "@/components/ui/button";
import type { LessonMaterialsState } from "../hooks/use-lesson-materials";

const verdictLook = {
  enough: { mark: "✓", title: "Enough rolls for a convincing class result", box: "border-tide bg-tide-light" },
  "not-enough": { mark: "!", title: "Not enough rolls yet", box: "border-beacon bg-beacon-light" },
  "no-set": { mark: "?", title: "No dice set chosen", box: "border-line bg-white" },
  "no-winner": { mark: "=", title: "No winner to show", box: "border-line bg-white" },
} as const;

/** The rolls verdict: whether the pooled rolls are enough, per main matchup, with a suggestion to apply. */
export function RollsVerdictView({
  result,
  tieRule,
  onUseRolls,
  onUseGroups,
}: {
  result: LessonMaterialsResult;
  tieRule: keyof typeof tieRuleLabels;
  onUseRolls?: (rolls: number) => void;
  onUseGroups?: (groups: number) => void;
}) {
  const { verdict } = result;
  const look = verdictLook[verdict.status];
  return (
    <section aria-labelledby="verdict-heading" className={`rounded-2xl border-2 p-4 ${look.box}`} data-testid="rolls-verdict">
      <h3 id="verdict-heading" className="flex items-center gap-2 text-xl">
        <span
          aria-hidden="true"
          className="inline-flex h-7 w-7 items-center justify-center rounded-full border-2 border-ink bg-white font-bold"
        >
          {look.mark}
        </span>
        {look.title}
      </h3>
      <p className="mt-2" data-testid="verdict-message">
        {verdict.message}
      </p>
      <p className="mt-1 text-sm text-ink-soft" data-testid="roll-pace">
        {verdict.budget === null
          ? "The lesson has no Roll phase with minutes, so the rolls are not checked against the time."
          : `Time budget: a ${verdict.budget.minutes}-minute Roll phase at about ${verdict.budget.rollsPerMinute} rolls a minute (a common-practice pace for rolling and writing each roll down, not a published rule) gives about ${verdict.budget.rollsPerGroup} rolls per group.`}
      </p>
      {(verdict.suggestedRollsPerGroup !== null || verdict.suggestedGroups !== null) && (onUseRolls || onUseGroups) && (
        <div className="mt-3 flex flex-wrap gap-2 no-print">
          {verdict.suggestedGroups !== null && onUseGroups && (
            <Button variant="secondary" type="button" onClick={() => onUseGroups(verdict.suggestedGroups!)}>
              Use {verdict.suggestedGroups} groups
            </Button>
          )}
          {verdict.suggestedRollsPerGroup !== null && onUseRolls && (
            <Button variant="secondary" type="button" onClick={() => onUseRolls(verdict.suggestedRollsPerGroup!)}>
              Use {verdict.suggestedRollsPerGroup} rolls per group
            </Button>
          )}
        </div>
      )}
      {verdict.matchups.length > 0 && (
        <div className="mt-3 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Main matchups: exact chance, planned and needed rolls</caption>
            <thead>
              <tr className="border-b-2 border-ink/20">
                <th scope="col" className="py-1 pr-2">
                  Matchup
                </th>
                <th scope="col" className="py-1 pr-2">
                  Winner's chance ({tieRuleLabels[tieRule].toLowerCase()})
                </th>
                <th scope="col" className="py-1 pr-2">
                  Planned
                </th>
                <th scope="col" className="py-1 pr-2">
                  Needed
                </th>
                <th scope="col" className="py-1">
                  Verdict
                </th>
              </tr>
            </thead>
            <tbody>
              {verdict.matchups.map((entry) => (
                <tr key={`${entry.winner}-${entry.loser}`} className="border-b border-ink/10 last:border-b-0">
                  <th scope="row" className="py-1 pr-2 font-normal">
                    <b>{entry.winner}</b> over {entry.loser}
                  </th>
                  <td className="py-1 pr-2">
                    {fractionToString(entry.winChance)} <span className="text-ink-soft">({fractionToPercent(entry.winChance)})</span>
                  </td>
                  <td className="py-1 pr-2">{entry.plannedRolls}</td>
                  <td className="py-1 pr-2">{entry.neededRolls ?? "no number"}</td>
                  <td className="whitespace-nowrap py-1 font-bold">{entry.enough ? "✓ enough" : "✗ short"}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-2 text-sm text-ink-soft">
            Needed: the rolls after which the 95% Wilson interval for the winner's share is expected to leave out 1/2 (a roll-off a class
            could not put down to luck).
          </p>
        </div>
      )}
    </section>
  );
}

/** The materials list: printed dice of each kind, recording sheets and exit ticket slips. */
export function MaterialsList({
  result,
  dice,
  sheetHref,
}: {
  result: LessonMaterialsResult;
  dice: SetDie[] | null;
  sheetHref?: (rowsPerSheet: number) => string;
}) {
  const { materials } = result;
  const look = (name: string) => dice?.find((die) => die.name === name);
  return (
    <section aria-labelledby="materials-heading" className="rounded-2xl border-2 border-line bg-shell p-4" data-testid="materials-list">
      <h3 id="materials-heading" className="text-xl">
        Materials list
      </h3>
      {materials.dice.length > 0 && (
        <table className="mt-2 w-full text-left text-sm">
          <caption className="sr-only">Printed dice to prepare</caption>
          <thead>
            <tr className="border-b-2 border-line">
              <th scope="col" className="py-1 pr-2">
                Die
              </th>
              <th scope="col" className="py-1 pr-2">
                For groups
              </th>
              <th scope="col" className="py-1 pr-2">
                Spares
              </th>
              <th scope="col" className="py-1">
                To print
              </th>
            </tr>
          </thead>
          <tbody>
            {materials.dice.map((entry) => {
              const die = look(entry.name);
              return (
                <tr key={entry.name} className="border-b border-line last:border-b-0">
                  <th scope="row" className="py-1 pr-2 font-normal">
                    <span className="inline-flex items-center gap-2">
                      {die && <DieSwatch colour={die.colour} pattern={die.pattern} className="h-5 w-5" />}
                      {entry.name}
                    </span>
                  </th>
                  <td className="py-1 pr-2">{entry.forGroups}</td>
                  <td className="py-1 pr-2">{entry.spares}</td>
                  <td className="py-1 font-bold">{entry.total}</td>
                </tr>
              );
            })}
            <tr className="border-t-2 border-line">
              <th scope="row" className="py-1 pr-2">
                All dice
              </th>
              <td colSpan={2} />
              <td className="py-1 font-bold" data-testid="total-dice">
                {materials.totalDice}
              </td>
            </tr>
          </tbody>
        </table>
      )}
      <ul className="mt-3 flex flex-col gap-1">
        <li data-testid="recording-sheets">
          <b>{materials.recordingSheets.total} recording sheets</b> ({materials.recordingSheets.forGroups} for groups +{" "}
          {materials.recordingSheets.spares} spare), room for {materials.recordingSheets.rowsPerSheet} rolls each
          {sheetHref && (
            <>
              {" · "}
              <Link
                to={sheetHref(materials.recordingSheets.rowsPerSheet)}
                className="font-bold text-tide-dark underline underline-offset-2"
              >
                Print the recording sheet
              </Link>
            </>
          )}
        </li>
        {materials.exitTicketSlips > 0 && (
          <li>
            <b>{materials.exitTicketSlips} exit ticket slips</b>, one per pupil
          </li>
        )}
      </ul>
      <ul className="mt-3 list-disc pl-5 text-sm text-ink-soft">
        {materials.notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
    </section>
  );
}

/** The live panel beside the editor: verdict first (it may change the plan), then the materials list. */
export function LiveMaterialsPanel({
  state,
  dice,
  tieRule,
  onUseRolls,
  onUseGroups,
  sheetHref,
}: {
  state: LessonMaterialsState;
  dice: SetDie[] | null;
  tieRule: keyof typeof tieRuleLabels;
  onUseRolls?: (rolls: number) => void;
  onUseGroups?: (groups: number) => void;
  /** The recording sheet's print address for the plan, given its rows (absent until the lesson has a dice set). */
  sheetHref?: (rowsPerSheet: number) => string;
}) {
  if (!state.ok) {
    return (
      <div className="rounded-2xl border-2 border-line bg-shell p-4" role="status">
        <p className="font-bold">Fix the plan to see the materials list and the rolls verdict:</p>
        <ul className="mt-1 list-disc pl-5">
          {state.problems.slice(0, 4).map((problem) => (
            <li key={problem}>{problem}</li>
          ))}
        </ul>
      </div>
    );
  }
  return (
    <div
      className={`flex flex-col gap-4 transition-opacity ${state.isStale ? "opacity-70" : ""}`}
      aria-live="polite"
      aria-busy={state.isStale}
    >
      <RollsVerdictView result={state.result} tieRule={tieRule} onUseRolls={onUseRolls} onUseGroups={onUseGroups} />
      <MaterialsList result={state.result} dice={dice} sheetHref={sheetHref} />
    </div>
  );
}
