import { useLocation } from "react-router-dom";
import { diceSetInputSchema } from "@shared/schemas/dice-sets";
import { blankDiceSet, DiceSetEditor } from "@/features/dice-bench/components/dice-set-editor";

/** A new set: from scratch, or prefilled by another screen (e.g. a Set finder result) through the navigation state. */
export function DiceBenchNewRoute() {
  const location = useLocation();
  const draft = diceSetInputSchema.safeParse((location.state as { draft?: unknown } | null)?.draft);
  return <DiceSetEditor key={location.key} initial={draft.success ? draft.data : blankDiceSet()} saved={null} />;
}
