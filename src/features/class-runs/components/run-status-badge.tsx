import { runStatusLabels, type RunStatus } from "@shared/schemas/class-runs";

const tones: Record<RunStatus, string> = {
  open: "border-tide bg-tide-light text-ink",
  paused: "border-beacon bg-beacon-light text-ink",
  closed: "border-ink bg-ink text-sand",
};
const marks: Record<RunStatus, string> = { open: "●", paused: "❚❚", closed: "■" };

/** A run's status as a word with its own mark, never by colour alone. */
export function RunStatusBadge({ status }: { status: RunStatus }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold ${tones[status]}`}>
      <span aria-hidden="true">{marks[status]}</span>
      {runStatusLabels[status]}
    </span>
  );
}
