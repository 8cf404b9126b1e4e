import { useState } from "react";
import { Link } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { LinkButton } from "@/components/ui/link-button";
import { useCopyTemplate } from "../api/copy-template";
import { useTemplate } from "../api/get-template";
import { usePublishVersion } from "../api/publish-version";
import { useRetireTemplate } from "../api/retire-template";
import { LessonSnapshotView } from "./lesson-snapshot-view";
import { PublishLessonForm } from "./publish-lesson-form";
import { shelfDate } from "./shelf-dates";
import { VersionBadge } from "./version-badge";

/** One template: a version of its frozen lesson, its history with change notes, copying, and the head's actions. */
export function TemplateDetailPanel({ templateId, version, isHead }: { templateId: string; version: number | null; isHead: boolean }) {
  const template = useTemplate(templateId, version);
  const copy = useCopyTemplate();
  const publishVersion = usePublishVersion();
  const retire = useRetireTemplate();
  const [updating, setUpdating] = useState(false);
  const [confirmRetire, setConfirmRetire] = useState(false);

  if (template.isPending) return <p role="status">Loading the template…</p>;
  if (template.isError) {
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <Alert tone="error" title="This template could not be opened">
          {template.error.message}
        </Alert>
        <LinkButton to="/app/shelf">Back to the shelf</LinkButton>
      </div>
    );
  }
  const { template: summary, versions, shown } = template.data;
  const retired = summary.status === "retired";
  const isCurrent = shown.version === summary.currentVersion;

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0">
          <p className="mb-1">
            <Link to="/app/shelf" className="font-bold text-tide underline">
              ← All templates
            </Link>
          </p>
          <h2 className="text-3xl">{summary.title}</h2>
          <div className="mt-2 flex flex-wrap items-center gap-2">
            <VersionBadge version={shown.version} retired={retired} />
            <span className="text-ink-soft">
              {isCurrent ? "Current version" : `An older version; the current one is version ${summary.currentVersion}`} ·{" "}
              {shown.proposedByName && (
                <>
                  proposed by <span className="font-bold text-ink">{shown.proposedByName}</span>,{" "}
                </>
              )}
              published by {shown.publishedByName} on {shelfDate(shown.publishedAt)}
            </span>
          </div>
        </div>
        {!retired && (
          <Button busy={copy.isPending} onClick={() => copy.mutate({ templateId, version: shown.version })}>
            Copy version {shown.version} into my lessons
          </Button>
        )}
      </div>

      {copy.error && (
        <Alert tone="error" title="Not copied">
          {copy.error.message}
        </Alert>
      )}
      {copy.data && (
        <Alert tone="info" title="Copied into your lessons">
          <p>
            “{copy.data.title}” is now one of your lessons, as a draft made from version {copy.data.fromTemplateVersion}. Changes you make
            to it stay yours.
          </p>
          <p className="mt-2">
            <Link to={`/app/lessons/${copy.data.lessonId}`} className="font-bold text-tide underline">
              Open your copy
            </Link>
          </p>
        </Alert>
      )}
      {retired && (
        <Alert tone="caution" title="Retired">
          Teachers no longer see this template on the shelf. Lessons already copied from it keep working.
        </Alert>
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(16rem,1fr)]">
        <section aria-labelledby="shown-heading" className="min-w-0 rounded-2xl border-2 border-line bg-shell p-5">
          <h3 id="shown-heading" className="sr-only">
            The lesson in version {shown.version}
          </h3>
          <p className="mb-4 rounded-xl bg-sand px-3 py-2">
            <span className="font-bold">Change note:</span> {shown.changeNote}
          </p>
          <LessonSnapshotView snapshot={shown.snapshot} />
        </section>

        <aside className="flex min-w-0 flex-col gap-6">
          <section aria-labelledby="history-heading" className="rounded-2xl border-2 border-line bg-shell p-5">
            <h3 id="history-heading" className="text-xl">
              Versions
            </h3>
            <ol className="mt-3 flex flex-col gap-3">
              {versions.map((entry) => {
                const here = entry.version === shown.version;
                return (
                  <li
                    key={entry.version}
                    className={`rounded-xl border-2 px-3 py-2 ${here ? "border-tide bg-tide-light" : "border-line bg-white"}`}
                  >
                    <p className="font-bold">
                      Version {entry.version}
                      {entry.version === summary.currentVersion ? " (current)" : ""}
                      {here ? " · shown" : ""}
                    </p>
                    <p className="mt-1">{entry.changeNote}</p>
                    <p className="mt-1 text-sm text-ink-soft">
                      {entry.proposedByName
                        ? `Proposed by ${entry.proposedByName}, published by ${entry.publishedByName}`
                        : entry.publishedByName}
                      , {shelfDate(entry.publishedAt)}
                    </p>
                    {!here && (
                      <Link
                        to={
                          entry.version === summary.currentVersion
                            ? `/app/shelf/templates/${templateId}`
                            : `/app/shelf/templates/${templateId}?version=${entry.version}`
                        }
                        className="mt-1 inline-block font-bold text-tide underline"
                      >
                        View version {entry.version}
                      </Link>
                    )}
                  </li>
                );
              })}
            </ol>
          </section>

          {isHead && (
            <section aria-labelledby="head-actions-heading" className="rounded-2xl border-2 border-line bg-shell p-5">
              <h3 id="head-actions-heading" className="text-xl">
                Head of department
              </h3>
              <div className="mt-3 flex flex-col gap-3">
                {!retired && (
                  <Button variant="secondary" aria-expanded={updating} onClick={() => setUpdating((open) => !open)}>
                    {updating ? "Close" : "Publish a new version"}
                  </Button>
                )}
                {updating && !retired && (
                  <PublishLessonForm
                    title="Publish a new version"
                    submitLabel={`Publish as version ${summary.currentVersion + 1}`}
                    notePlaceholder="What changed, e.g. Shorter Prove phase, more rolls per group"
                    busy={publishVersion.isPending}
                    error={publishVersion.error}
                    onSubmit={(values) => publishVersion.mutate({ templateId, ...values }, { onSuccess: () => setUpdating(false) })}
                  />
                )}
                {retire.error && (
                  <Alert tone="error" title="Not changed">
                    {retire.error.message}
                  </Alert>
                )}
                {retired ? (
                  <Button variant="secondary" busy={retire.isPending} onClick={() => retire.mutate({ templateId, retired: false })}>
                    Put back on the shelf
                  </Button>
                ) : (
                  <Button variant="danger" onClick={() => setConfirmRetire(true)}>
                    Retire this template
                  </Button>
                )}
              </div>
            </section>
          )}
        </aside>
      </div>

      <ConfirmDialog
        open={confirmRetire}
        title="Retire this template?"
        confirmLabel="Retire it"
        busy={retire.isPending}
        onCancel={() => setConfirmRetire(false)}
        onConfirm={() => retire.mutate({ templateId, retired: true }, { onSettled: () => setConfirmRetire(false) })}
      >
        Teachers will no longer see “{summary.title}” on the shelf or copy it. Lessons already copied from it stay as they are, and you can
        put it back later.
      </ConfirmDialog>
    </div>
  );
}
