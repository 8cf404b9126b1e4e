import { useNavigate } from "react-router-dom";
import type { DiceSet, SetDie } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { CubeNet } from "./cube-net";
import { FaceCards } from "./face-cards";
import { RecordingSheet } from "./recording-sheet";

export type PrintKind = "nets" | "sheet";
export type PaperSize = "a4" | "letter";

const paperNames: Record<PaperSize, string> = { a4: "A4", letter: "US Letter" };
const netsPerPage = 4;

/** The page rule for the chosen paper: nets print portrait, the recording sheet landscape. */
function pageStyle(kind: PrintKind, paper: PaperSize) {
  const size = `${paper === "a4" ? "A4" : "letter"} ${kind === "sheet" ? "landscape" : "portrait"}`;
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
export function PrintView({ set, kind, paper }: { set: DiceSet; kind: PrintKind; paper: PaperSize }) {
  const navigate = useNavigate();
  const choose = (next: { kind?: PrintKind; paper?: PaperSize }) =>
    navigate(`?kind=${next.kind ?? kind}&paper=${next.paper ?? paper}`, { replace: true });
  const cubes = set.dice.filter((die) => die.faces.length === 6);
  const others = set.dice.filter((die) => die.faces.length !== 6);
  return (
    <>
      <style>{pageStyle(kind, paper)}</style>
      <div className="no-print">
        <PageHeader
          title="Dice bench"
          lead={<>Print &ldquo;{set.name}&rdquo;: {kind === "nets" ? "dice to cut out" : "a group recording sheet"}, {paperNames[paper]}.</>}
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
        <p className="mb-4 max-w-3xl text-ink-soft">
          {kind === "nets"
            ? "Print at 100% (actual size), not “fit to page”. Cut along solid lines, fold along dashed lines, glue the grey tabs inside."
            : "Print one sheet per group. The columns are those of the Paper import CSV, in the same order."}
        </p>
      </div>
      <div className="flex flex-col gap-6 print:gap-0" data-testid="printables" data-paper={paper}>
        {kind === "sheet" ? (
          <RecordingSheet set={set} />
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
                <p className="text-sm">These dice do not have six faces: cut out the cards and draw one from a bag (put it back each time), or stick them round a spinner.</p>
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
