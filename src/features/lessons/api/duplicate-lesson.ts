import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Lesson } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";
import { lessonListsKey } from "./list-lessons";

/** A new draft copy of one of the teacher's lessons. */
export function duplicateLesson(id: string) {
  return api.post<{ lesson: Lesson }>(`/api/lessons/${encodeURIComponent(id)}/duplicate`);
}

export function useDuplicateLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicateLesson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: lessonListsKey }),
  });
}
