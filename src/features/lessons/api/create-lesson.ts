import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Lesson, LessonInput } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";
import { lessonListsKey } from "./list-lessons";

export function createLesson(input: LessonInput) {
  return api.post<{ lesson: Lesson }>("/api/lessons", input);
}

export function useCreateLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLesson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: lessonListsKey }),
  });
}
