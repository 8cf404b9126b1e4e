import { formatDateTime } from "@/lib/format";
import { Button } from "./button";

/** Offers the unsaved edits an editor kept in this browser (after a closed tab or a crash): restore them or discard them. */
export function DraftOffer({
  keptAt,
  what,
  onRestore,
  onDiscard,
}: {
  keptAt: string;
  what: string;
  onRestore: () => void;
  onDiscard: () => void;
}) {
  return (
    <section
      aria-label="Unsaved edits kept in this browser"
      className="rounded-xl border-2 border-amber-500 bg-amber-50 px-4 py-3"
      data-testid="draft-offer"
    >
      <p className="font-bold">
        This browser kept unsaved edits to {what} from {formatDateTime(keptAt)}.
      </p>
      <p className="text-sm">Restore them to carry on where you stopped, or discard them to keep the version shown.</p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button type="button" onClick={onRestore}>
          Restore my edits
        </Button>
        <Button type="button" variant="secondary" onClick={onDiscard}>
          Discard them
        </Button>
      </div>
    </section>
  );
}
