import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { lessonQueryOptions } from "./get-lesson";
import { lessonListsKey } from "./list-lessons";

export function deleteAttachment({ lessonId, attachmentId }: { lessonId: string; attachmentId: string }) {
  return api.delete<void>(`/api/lessons/${encodeURIComponent(lessonId)}/attachments/${encodeURIComponent(attachmentId)}`);
}

export function useDeleteAttachment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAttachment,
    onSuccess: (_nothing, { lessonId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lessonQueryOptions(lessonId).queryKey }),
        queryClient.invalidateQueries({ queryKey: lessonListsKey }),
      ]),
  });
}
