import { queryOptions, useQuery } from "@tanstack/react-query";
import type { LessonSummary } from "@shared/schemas/lessons";
import { api } from "@/lib/api-client";

/** The teacher's own lessons, to pick one to publish or propose. */
export function listOwnLessons() {
  return api.get<{ lessons: LessonSummary[] }>("/api/lessons");
}

export const ownLessonsQueryOptions = queryOptions({
  queryKey: ["lessons", "list", "for-shelf"],
  queryFn: listOwnLessons,
});

export function useOwnLessons() {
  return useQuery(ownLessonsQueryOptions);
}
