import { queryOptions, useQuery } from "@tanstack/react-query";
import type { LessonSummary } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";

/** The teacher's own lessons; archived ones only when asked (search, sort and filters run in the table). */
export function listLessons(includeArchived: boolean) {
  return api.get<{ lessons: LessonSummary[] }>(`/api/lessons${includeArchived ? "?includeArchived=true" : ""}`);
}

/** Every list query shares this prefix, so a mutation can invalidate all of them at once. */
export const lessonListsKey = ["lessons", "list"] as const;

export const lessonsQueryOptions = (includeArchived: boolean) =>
  queryOptions({
    queryKey: [...lessonListsKey, { includeArchived }],
    queryFn: () => listLessons(includeArchived),
  });

export function useLessons(includeArchived: boolean) {
  return useQuery(lessonsQueryOptions(includeArchived));
}
