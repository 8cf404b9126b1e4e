import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RunnableLesson } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";

/** The teacher's lessons, each saying whether a run can be opened from it. */
export function listRunnableLessons() {
  return api.get<{ lessons: RunnableLesson[] }>("/api/class-runs/lessons");
}

export const runnableLessonsQueryOptions = queryOptions({ queryKey: ["class-runs", "lessons"], queryFn: listRunnableLessons });

export function useRunnableLessons() {
  return useQuery(runnableLessonsQueryOptions);
}
