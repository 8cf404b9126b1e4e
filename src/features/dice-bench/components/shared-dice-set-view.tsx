import { useNavigate } from "react-router-dom";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { DieSwatch } from "@/components/dice/die-swatch";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { AnchorButton, LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { useDuplicateDiceSet } from "../api/duplicate-dice-set";
import { diceSetFileUrl } from "../api/export-dice-set";
import { useSetAnalysis } from "../hooks/use-set-analysis";
import { AnalysisPanel } from "./analysis-panel";

/** A set a colleague shares: read it, print it, analyse it; "Duplicate to edit" makes the teacher's own copy. */
export function SharedDiceSetView({ set }: { set: DiceSet }) {
  const navigate = useNavigate();
  const duplicate = useDuplicateDiceSet();
  const analysis = useSetAnalysis(set.dice);
  return (
    <>
      <PageHeader
        title="Dice bench"
        lead={
          <>
            &ldquo;{set.name}&rdquo;, shared by {set.ownerName} (read only)
          </>
        }
        actions={
          <>
            <Button
              busy={duplicate.isPending}
              onClick={() =>
                duplicate.mutate(set.id, {
                  onSuccess: (copy) => navigate(`/app/bench/${copy.id}`, { state: { notice: "Duplicated: this copy is yours to edit." } }),
                })
              }
            >
              Duplicate to edit
            </Button>
            <LinkButton to={`/app/bench/${set.id}/print?kind=nets&paper=a4`}>Print dice</LinkButton>
            <LinkButton to={`/app/bench/${set.id}/print?kind=sheet&paper=a4`}>Print recording sheet</LinkButton>
            <AnchorButton href={diceSetFileUrl(set.id)} download>
              Download set file
            </AnchorButton>
          </>
        }
      />
      {duplicate.error && (
        <div className="mb-4">
          <Alert tone="error" title="Not duplicated">
            {duplicate.error.message}
          </Alert>
        </div>
      )}
      <div className="grid min-w-0 gap-6 lg:grid-cols-[minmax(0,25rem)_minmax(0,1fr)]">
        <section aria-labelledby="shared-dice-heading" className="flex min-w-0 flex-col gap-3">
          <Alert tone="info" title="Only its owner edits this set">
            {set.ownerName} shares it with the department. Duplicate it to make a copy of your own that you can change.
          </Alert>
          {set.description && <p className="text-lg">{set.description}</p>}
          <h2 id="shared-dice-heading" className="text-2xl">
            Dice
          </h2>
          <ul className="flex flex-col gap-2">
            {set.dice.map((die) => (
              <li key={die.name} className="flex items-center gap-3 rounded-xl border-2 border-line bg-shell p-3">
                <DieSwatch colour={die.colour} pattern={die.pattern} className="h-9 w-9" label={`${die.colour}, ${die.pattern}`} />
                <div className="min-w-0">
                  <p className="font-bold">{die.name}</p>
                  <p className="break-words font-mono">{die.faces.join(", ")}</p>
                </div>
              </li>
            ))}
          </ul>
        </section>
        <section aria-labelledby="analysis-heading" className="min-w-0">
          <h2 id="analysis-heading" className="mb-3 text-2xl">
            Exact analysis
          </h2>
          <AnalysisPanel state={analysis} />
        </section>
      </div>
    </>
  );
}
