import type { Blocker } from "react-router-dom";
import { ConfirmDialog } from "./confirm-dialog";

/** Asks before leaving a page with unsaved changes; `onLeave` runs before the navigation goes on (e.g. to drop the browser draft). */
export function LeavePageDialog({ blocker, what, onLeave }: { blocker: Blocker; what: string; onLeave?: () => void }) {
  return (
    <ConfirmDialog
      open={blocker.state === "blocked"}
      title="Leave without saving?"
      confirmLabel="Leave and lose the changes"
      cancelLabel="Stay and keep editing"
      onConfirm={() => {
        onLeave?.();
        blocker.proceed?.();
      }}
      onCancel={() => blocker.reset?.()}
    >
      <p>{what} has changes that are not saved. If you leave now they are lost.</p>
    </ConfirmDialog>
  );
}
