import { useNavigate } from "react-router-dom";
import { useState } from "react";
import type { DiceSet, SetDie } from "@shared/schemas/dice-sets";
import { RECORDING_SHEET_ROWS_MAX, type RecordingSheetPlan } from "@shared/results/recording-sheet-layout";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { TextField } from "@/components/ui/text-field";
import { CubeNet } from "./cube-net";
import { FaceCards } from "./face-cards";
import { RecordingSheet } from "./recording-sheet";

export type PrintKind = "nets" | "sheet";
export type PaperSize = "a4" | "letter";

const paperNames: Record<PaperSize, string> = { a4: "A4", letter: "US Letter" };
const netsPerPage = 4;

/** The page rule for the chosen paper: nets and the recording sheet (a column per player) print portrait. */
function pageStyle(paper: PaperSize) {
  const size = `${paper === "a4" ? "A4" : "letter"} portrait`;
  return `@page { size: ${size}; margin: 10mm; }
@media print {
  html, body, #root > div { min-height: 0 !important; }
  #main { max-width: none; padding: 0; margin: 0; }
  .print-page { break-after: page; }
  .print-page:last-child { break-after: auto; }
}`;
}

function chunks<T>(items: T[], size: number): T[][] {
  return Array.from({ length: Math.ceil(items.length / size) }, (_, index) => items.slice(index * size, (index + 1) * size));
}

/** Printables of a set: cut-and-fold nets (six faces) or face cards (other counts), or the group recording sheet, for A4 or Letter. */
export function PrintView({ set, kind, paper, plan }: { set: DiceSet; kind: PrintKind; paper: PaperSize; plan: RecordingSheetPlan }) {
  const navigate = useNavigate();
  const [rollsText, setRollsText] = useState(String(plan.rolls));
  const choose = (next: { kind?: PrintKind; paper?: PaperSize } & Partial<RecordingSheetPlan>) => {
    const sheet = { ...plan, ...next };
    navigate(
      `?kind=${next.kind ?? kind}&paper=${next.paper ?? paper}&rolls=${sheet.rolls}&players=${sheet.players}&dice=${sheet.dicePerPlayer}`,
      { replace: true },
    );
  };
  const rollsValue = Number(rollsText);
  const rollsValid = Number.isInteger(rollsValue) && rollsValue >= 1 && rollsValue <= RECORDING_SHEET_ROWS_MAX;
  const cubes = set.dice.filter((die) => die.faces.length === 6);
  const others = set.dice.filter((die) => die.faces.length !== 6);
  return (
    <>
      <style>{pageStyle(paper)}</style>
      <div className="no-print">
        <PageHeader
          title="Dice bench"
          lead={
            <>
              Print &ldquo;{set.name}&rdquo;: {kind === "nets" ? "dice to cut out" : "a group recording sheet"}, {paperNames[paper]}.
            </>
          }
          actions={
            <>
              <Button onClick={() => window.print()}>Print…</Button>
              <LinkButton to={`/app/bench/${set.id}`}>Back to the set</LinkButton>
            </>
          }
        />
        <div className="mb-6 flex flex-wrap gap-6">
          <ChoiceGroup
            legend="What to print"
            value={kind}
            onChange={(value) => choose({ kind: value })}
            options={[
              { value: "nets", label: "Dice to cut out" },
              { value: "sheet", label: "Recording sheet" },
            ]}
          />
          <ChoiceGroup
            legend="Paper"
            value={paper}
            onChange={(value) => choose({ paper: value })}
            options={[
              { value: "a4", label: "A4" },
              { value: "letter", label: "US Letter" },
            ]}
          />
        </div>
        {kind === "sheet" && (
          <div className="mb-6 flex flex-wrap items-start gap-6" data-testid="sheet-plan">
            <ChoiceGroup
              legend="Players"
              value={String(plan.players)}
              onChange={(value) => choose({ players: Number(value) })}
              options={[
                { value: "2", label: "Two players" },
                { value: "3", label: "Three players" },
              ]}
            />
            <ChoiceGroup
              legend="Dice each"
              value={String(plan.dicePerPlayer)}
              onChange={(value) => choose({ dicePerPlayer: Number(value) })}
              options={[
                { value: "1", label: "One die each" },
                { value: "2", label: "Two dice each" },
              ]}
            />
            <div className="max-w-48">
              <TextField
                label="Rolls per group"
                inputMode="numeric"
                value={rollsText}
                onChange={(event) => {
                  setRollsText(event.target.value);
                  const value = Number(event.target.value);
                  if (Number.isInteger(value) && value >= 1 && value <= RECORDING_SHEET_ROWS_MAX) choose({ rolls: value });
                }}
                error={rollsValid ? undefined : `Enter a whole number of rolls from 1 to ${RECORDING_SHEET_ROWS_MAX}.`}
              />
            </div>
          </div>
        )}
        <p className="mb-4 max-w-3xl text-ink-soft">
          {kind === "nets"
            ? "Print at 100% (actual size), not “fit to page”. Cut along solid lines, fold along dashed lines, glue the grey tabs inside."
            : "Print one sheet per group: a line for every planned roll and a column for each player. Opened from a lesson, the sheet follows its rolls, players and dice each. Type the filled-in sheets into the run's tally grid in Results, or up as a Paper import CSV."}
        </p>
      </div>
      <div className="flex flex-col gap-6 print:gap-0" data-testid="printables" data-paper={paper}>
        {kind === "sheet" ? (
          <RecordingSheet set={set} plan={plan} />
        ) : (
          <>
            {chunks(cubes, netsPerPage).map((page, index) => (
              <section key={`nets-${index}`} className="print-page bg-white p-4 print:p-0" aria-label={`Nets, page ${index + 1}`}>
                <PageTitle set={set} />
                <div className="flex flex-wrap gap-x-[6mm] gap-y-[4mm]">
                  {page.map((die) => (
                    <figure key={die.name} className="flex flex-col gap-[1mm]">
                      <DieCaption die={die} />
                      <CubeNet die={die} />
                    </figure>
                  ))}
                </div>
              </section>
            ))}
            {others.length > 0 && (
              <section className="print-page flex flex-col gap-[4mm] bg-white p-4 print:p-0" aria-label="Face cards">
                <PageTitle set={set} />
                <p className="text-sm">
                  These dice do not have six faces: cut out the cards and draw one from a bag (put it back each time), or stick them round a
                  spinner.
                </p>
                {others.map((die) => (
                  <figure key={die.name} className="flex flex-col gap-[1mm]">
                    <DieCaption die={die} />
                    <FaceCards die={die} />
                  </figure>
                ))}
              </section>
            )}
          </>
        )}
      </div>
    </>
  );
}

function PageTitle({ set }: { set: DiceSet }) {
  return <h2 className="mb-[3mm] text-xl">{set.name}</h2>;
}

function DieCaption({ die }: { die: SetDie }) {
  return (
    <figcaption className="flex items-center gap-1.5 text-sm">
      <DieSwatch colour={die.colour} pattern={die.pattern} className="h-4 w-4" />
      <strong>{die.name}</strong>
      <span className="text-ink-soft">
        · {die.colour}, {die.pattern} · {die.faces.length} faces
      </span>
    </figcaption>
  );
}
