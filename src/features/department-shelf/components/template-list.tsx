import { Link } from "react-router-dom";
import type { TemplateSummary } from "@shared/schemas/shelf";
import { shelfDate } from "./shelf-dates";
import { VersionBadge } from "./version-badge";

/** The shelf's templates as cards: what each lesson is, its current version and what changed last. */
export function TemplateList({ templates, emptyText }: { templates: TemplateSummary[]; emptyText: string }) {
  if (templates.length === 0) {
    return <p className="rounded-2xl border-2 border-dashed border-line bg-shell p-6 text-lg text-ink-soft">{emptyText}</p>;
  }
  return (
    <ul className="grid gap-4 md:grid-cols-2" aria-label="Templates">
      {templates.map((template) => (
        <li key={template.id} className="flex flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-5">
          <div className="flex flex-wrap items-start justify-between gap-2">
            <h2 className="text-xl">
              <Link to={`/app/shelf/templates/${template.id}`} className="text-tide underline-offset-4 hover:underline">
                {template.title}
              </Link>
            </h2>
            <VersionBadge version={template.currentVersion} retired={template.status === "retired"} />
          </div>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="font-bold text-ink-soft">Class</dt>
            <dd>{template.classGroup || "Any"}</dd>
            <dt className="font-bold text-ink-soft">Dice set</dt>
            <dd>{template.diceSetName ?? "None"}</dd>
            <dt className="font-bold text-ink-soft">Duration</dt>
            <dd>{template.durationMinutes} minutes</dd>
            <dt className="font-bold text-ink-soft">Phases</dt>
            <dd>{template.phases.join(", ") || "None"}</dd>
          </dl>
          <p className="rounded-xl bg-sand px-3 py-2 text-sm">
            <span className="font-bold">Latest change:</span> {template.changeNote}
          </p>
          <p className="mt-auto text-sm text-ink-soft">
            {template.proposedByName ? (
              <>
                Proposed by <span className="font-bold text-ink">{template.proposedByName}</span>, published by {template.publishedByName}{" "}
                on {shelfDate(template.publishedAt)}
              </>
            ) : (
              <>
                Published by {template.publishedByName} on {shelfDate(template.publishedAt)}
              </>
            )}
          </p>
        </li>
      ))}
    </ul>
  );
}
