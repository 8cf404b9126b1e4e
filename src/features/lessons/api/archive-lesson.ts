import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Lesson } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";
import { lessonQueryOptions } from "./get-lesson";
import { lessonListsKey } from "./list-lessons";

/** Archives a lesson (hidden from the list by default) or brings it back. */
export function archiveLesson({ id, archived }: { id: string; archived: boolean }) {
  return api.post<{ lesson: Lesson }>(`/api/lessons/${encodeURIComponent(id)}/archive`, { archived });
}

export function useArchiveLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: archiveLesson,
    onSuccess: ({ lesson }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lessonQueryOptions(lesson.id).queryKey }),
        queryClient.invalidateQueries({ queryKey: lessonListsKey }),
      ]),
  });
}
