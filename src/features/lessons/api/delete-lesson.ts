import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { lessonQueryOptions } from "./get-lesson";
import { lessonListsKey } from "./list-lessons";

/** Deletes a lesson and its attachments for good. */
export function deleteLesson(id: string) {
  return api.delete<void>(`/api/lessons/${encodeURIComponent(id)}`);
}

export function useDeleteLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteLesson,
    onSuccess: (_nothing, id) => {
      queryClient.removeQueries({ queryKey: lessonQueryOptions(id).queryKey });
      return queryClient.invalidateQueries({ queryKey: lessonListsKey });
    },
  });
}
