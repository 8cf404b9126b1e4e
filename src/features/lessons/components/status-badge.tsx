import { lessonStatusLabels, type LessonStatus } from "@shared/schemas/lessons";

const tones: Record<LessonStatus, string> = {
  draft: "border-line bg-white text-ink",
  ready: "border-tide bg-tide-light text-ink",
  taught: "border-ink bg-ink text-sand",
};
const marks: Record<LessonStatus, string> = { draft: "○", ready: "◐", taught: "●" };

/** A lesson's status as a word with its own mark, so it is never told by colour alone. */
export function StatusBadge({ status, archived = false }: { status: LessonStatus; archived?: boolean }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-1">
      <span className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold ${tones[status]}`}>
        <span aria-hidden="true">{marks[status]}</span>
        {lessonStatusLabels[status]}
      </span>
      {archived && <span className="rounded-full border-2 border-dashed border-ink-soft px-2 py-0.5 text-sm text-ink-soft">Archived</span>}
    </span>
  );
}
