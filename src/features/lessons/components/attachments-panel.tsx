import { useRef, useState } from "react";
import type { LessonAttachment } from "@shared/schemas/lessons";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useDeleteAttachment } from "../api/delete-attachment";
import { attachmentUrl, useUploadAttachment } from "../api/upload-attachment";

function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

const typeNames: Record<string, string> = { "application/pdf": "PDF", "image/png": "PNG image", "image/jpeg": "JPEG image" };

/** Worksheets and images attached to a lesson: upload (owner), open, delete (owner). */
export function AttachmentsPanel({
  lessonId,
  attachments,
  canEdit,
}: {
  lessonId: string;
  attachments: LessonAttachment[];
  canEdit: boolean;
}) {
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadAttachment();
  const remove = useDeleteAttachment();
  const [removing, setRemoving] = useState<LessonAttachment | null>(null);
  const [uploaded, setUploaded] = useState<string | null>(null);

  const send = (file: File | undefined) => {
    if (!file) return;
    setUploaded(null);
    upload.mutate(
      { lessonId, file },
      {
        onSuccess: ({ attachment }) => setUploaded(`Attached “${attachment.fileName}”.`),
        onSettled: () => {
          if (input.current) input.current.value = "";
        },
      },
    );
  };

  return (
    <section aria-labelledby="attachments-heading" className="flex flex-col gap-3 rounded-2xl border-2 border-line bg-shell p-4">
      <h2 id="attachments-heading" className="text-2xl">
        Worksheets and images
      </h2>
      <p className="text-sm text-ink-soft">
        PDF, PNG or JPEG, up to 10 MB each; colleagues in your department can open them. Pupils are minors: leave their names, faces and
        work with names on it out of what you attach.
      </p>
      {canEdit && (
        <div className="flex flex-wrap items-end gap-2">
          <div className="flex w-full min-w-0 max-w-md flex-col gap-1">
            <label htmlFor="attachment-file" className="font-bold">
              Attach a file
            </label>
            <input
              ref={input}
              id="attachment-file"
              type="file"
              accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg"
              disabled={upload.isPending}
              onChange={(event) => send(event.target.files?.[0])}
              className="min-h-11 w-full min-w-0 rounded-lg border-2 border-line bg-white px-2 py-1.5 file:mr-3 file:rounded-lg file:border-0 file:bg-tide file:px-3 file:py-1 file:font-bold file:text-white"
            />
          </div>
          {upload.isPending && <p role="status">Uploading…</p>}
        </div>
      )}
      {upload.error && (
        <Alert tone="error" title="That file was not attached">
          {upload.error.message}
        </Alert>
      )}
      {uploaded && !upload.error && (
        <p role="status" className="font-bold text-tide-dark">
          {uploaded}
        </p>
      )}
      {attachments.length === 0 ? (
        <p className="text-ink-soft">No files attached yet.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Attached files">
          {attachments.map((attachment) => (
            <li
              key={attachment.id}
              className="flex flex-wrap items-center justify-between gap-2 rounded-xl border border-line bg-white p-3"
            >
              <div className="min-w-0">
                <a
                  href={attachmentUrl(lessonId, attachment.id)}
                  target="_blank"
                  rel="noreferrer"
                  className="break-all font-bold text-tide-dark underline underline-offset-2"
                >
                  {attachment.fileName}
                </a>
                <p className="text-sm text-ink-soft">
                  {typeNames[attachment.mimeType] ?? attachment.mimeType} · {sizeText(attachment.sizeBytes)} · added by{" "}
                  {attachment.uploadedByName}
                </p>
              </div>
              <div className="flex gap-1">
                <a
                  href={attachmentUrl(lessonId, attachment.id, true)}
                  className="inline-flex min-h-11 items-center rounded-xl px-3 font-bold hover:bg-ink/5"
                >
                  Download<span className="sr-only"> {attachment.fileName}</span>
                </a>
                {canEdit && (
                  <Button variant="quiet" className="text-alarm" onClick={() => setRemoving(attachment)}>
                    Remove<span className="sr-only"> {attachment.fileName}</span>
                  </Button>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
      <ConfirmDialog
        open={removing !== null}
        title="Remove this file?"
        confirmLabel="Remove file"
        busy={remove.isPending}
        onCancel={() => setRemoving(null)}
        onConfirm={() => removing && remove.mutate({ lessonId, attachmentId: removing.id }, { onSuccess: () => setRemoving(null) })}
      >
        <p>“{removing?.fileName}” will be deleted from the server.</p>
        {remove.error && <p className="mt-2 font-bold text-alarm">{remove.error.message}</p>}
      </ConfirmDialog>
    </section>
  );
}
