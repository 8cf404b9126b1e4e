import { useParams, useSearchParams } from "react-router-dom";
import { recordingSheetPlanFromParams } from "@shared/results/recording-sheet-layout";
import { Alert } from "@/components/ui/alert";
import { useDiceSet } from "@/features/dice-bench/api/get-dice-set";
import { PrintView } from "@/features/dice-bench/components/printables/print-view";

/** /app/bench/:id/print?kind=nets|sheet&paper=a4|letter, and for the sheet &rolls=&players=&dice= (a lesson's plan) */
export function DiceBenchPrintRoute() {
  const { id = "" } = useParams();
  const [params] = useSearchParams();
  const set = useDiceSet(id);
  const kind = params.get("kind") === "sheet" ? "sheet" : "nets";
  const paper = params.get("paper") === "letter" ? "letter" : "a4";
  if (set.isPending) return <p role="status">Loading the dice set…</p>;
  if (set.isError) {
    return (
      <Alert tone="error" title="This dice set could not be opened">
        {set.error.message}
      </Alert>
    );
  }
  return <PrintView set={set.data} kind={kind} paper={paper} plan={recordingSheetPlanFromParams(params)} />;
}
