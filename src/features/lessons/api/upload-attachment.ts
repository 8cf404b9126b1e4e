import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { LessonAttachment } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";
import { lessonQueryOptions } from "./get-lesson";
import { lessonListsKey } from "./list-lessons";

/** Attaches one file; the server checks its type from the content and refuses anything but PDF, PNG and JPEG. */
export function uploadAttachment({ lessonId, file }: { lessonId: string; file: File }) {
  const form = new FormData();
  form.append("file", file, file.name);
  return api.post<{ attachment: LessonAttachment }>(`/api/lessons/${encodeURIComponent(lessonId)}/attachments`, form);
}

export function useUploadAttachment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadAttachment,
    onSuccess: (_answer, { lessonId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lessonQueryOptions(lessonId).queryKey }),
        queryClient.invalidateQueries({ queryKey: lessonListsKey }),
      ]),
  });
}

/** Where the browser fetches an attachment (the server serves it to members of the lesson's department only). */
export function attachmentUrl(lessonId: string, attachmentId: string, download = false) {
  return `/api/lessons/${encodeURIComponent(lessonId)}/attachments/${encodeURIComponent(attachmentId)}${download ? "?download=1" : ""}`;
}
