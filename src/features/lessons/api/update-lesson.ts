import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Lesson, LessonUpdate } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";
import { lessonQueryOptions } from "./get-lesson";
import { lessonListsKey } from "./list-lessons";

/** Saves a lesson; the server answers 409 stale_version when `version` is no longer the stored one. */
export function updateLesson({ id, update }: { id: string; update: LessonUpdate }) {
  return api.put<{ lesson: Lesson }>(`/api/lessons/${encodeURIComponent(id)}`, update);
}

export function useUpdateLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateLesson,
    onSuccess: ({ lesson }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lessonQueryOptions(lesson.id).queryKey }),
        queryClient.invalidateQueries({ queryKey: lessonListsKey }),
      ]),
  });
}
