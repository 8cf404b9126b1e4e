import { useLocation, useParams } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/link-button";
import { useDiceSet } from "@/features/dice-bench/api/get-dice-set";
import { DiceSetEditor, diceSetInputOf } from "@/features/dice-bench/components/dice-set-editor";
import { SharedDiceSetView } from "@/features/dice-bench/components/shared-dice-set-view";

/** One stored set: its owner edits it; colleagues read it and may duplicate it. */
export function DiceBenchSetRoute() {
  const { id = "" } = useParams();
  const location = useLocation();
  const set = useDiceSet(id);
  const notice = (location.state as { notice?: string } | null)?.notice;
  if (set.isPending) return <p role="status">Loading the dice set…</p>;
  if (set.isError) {
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <Alert tone="error" title="This dice set could not be opened">
          {set.error.message}
        </Alert>
        <LinkButton to="/app/bench">Back to your dice sets</LinkButton>
      </div>
    );
  }
  if (!set.data.isOwner) return <SharedDiceSetView key={set.data.id} set={set.data} />;
  return <DiceSetEditor key={set.data.id} initial={diceSetInputOf(set.data)} saved={set.data} notice={notice} />;
}
