import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SetDie } from "@shared/schemas/dice-sets";
import type { Lesson, LessonAttachment } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";

/** What GET /api/lessons/:id answers. */
export type LessonDetail = {
  lesson: Lesson;
  diceSet: { id: string; name: string; description: string; dice: SetDie[] } | null;
  attachments: LessonAttachment[];
};

export function getLesson(id: string) {
  return api.get<LessonDetail>(`/api/lessons/${encodeURIComponent(id)}`);
}

export const lessonQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ["lessons", id],
    queryFn: () => getLesson(id),
  });

export function useLesson(id: string) {
  return useQuery(lessonQueryOptions(id));
}
