import type { BoardSnapshot } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useSetRunJoining } from "../api/set-run-joining";

/** Who may still join: the lock, the groups against the cap the teacher set, and the run's roll ceiling flag. */
export function JoiningControls({ snapshot, canManage }: { snapshot: BoardSnapshot; canManage: boolean }) {
  const { run } = snapshot;
  const joining = useSetRunJoining();
  const phoneGroups = snapshot.groups.filter((group) => group.source === "phone").length;
  return (
    <div className="flex flex-col gap-2" data-testid="joining-controls">
      <p className="font-bold">
        {run.joiningLocked ? "Joining is locked: no new groups." : "Joining is open."}{" "}
        <span className="font-normal text-ink-soft">
          {phoneGroups} of {run.groupCap} groups
        </span>
      </p>
      {canManage && run.status !== "closed" && (
        <Button
          variant="secondary"
          className="self-start"
          busy={joining.isPending}
          onClick={() => joining.mutate({ runId: run.id, locked: !run.joiningLocked })}
        >
          {run.joiningLocked ? "Unlock joining" : "Lock joining"}
        </Button>
      )}
      {joining.error && <Alert tone="error">{joining.error.message}</Alert>}
      {run.rollCeilingReachedAt && (
        <Alert tone="caution" title="This run has taken all the rolls it can">
          Phones sent {run.rollCeiling.toLocaleString("en-GB")} rolls, far more than a class records; the run takes no more. Check the
          groups flagged for sending rolls too fast, and remove or leave out any that spoiled the figures.
        </Alert>
      )}
    </div>
  );
}
