import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useDeleteResultsRun } from "../api/delete-results-run";
import { plural } from "./figures";

/** Deletes a run for good after a confirmation that says what goes with it. */
export function DeleteRunButton({ runId, title, rolls, groups }: { runId: string; title: string; rolls: number; groups: number }) {
  const navigate = useNavigate();
  const remove = useDeleteResultsRun();
  const [confirming, setConfirming] = useState(false);
  return (
    <>
      <Button variant="quiet" className="text-alarm" onClick={() => setConfirming(true)}>
        Delete run
      </Button>
      <ConfirmDialog
        open={confirming}
        title="Delete this class run?"
        confirmLabel="Delete run and its rolls"
        busy={remove.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(runId, {
            onSuccess: (deleted) =>
              navigate("/app/results", {
                replace: true,
                state: { notice: `Deleted “${title}”: ${plural(deleted.rolls, "roll")} and ${plural(deleted.groups, "group")}.` },
              }),
          })
        }
      >
        <p>
          “{title}” will be deleted for good with its {plural(rolls, "roll")}, its {plural(groups, "group")} and their nicknames, its Guess
          votes and its Paper imports. Download the exports first if you want to keep the figures.
        </p>
        {remove.error && <p className="mt-2 font-bold text-alarm">{remove.error.message}</p>}
      </ConfirmDialog>
    </>
  );
}
