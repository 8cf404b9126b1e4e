import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PaperRunLesson } from "@shared/schemas/results";
import { api } from "@/lib/api-client";

/** The teacher's lessons, each saying whether a paper run can be made from it. */
export function listPaperRunLessons() {
  return api.get<{ lessons: PaperRunLesson[] }>("/api/results/paper-runs/lessons");
}

export const paperRunLessonsQueryOptions = queryOptions({ queryKey: ["results", "paper-run-lessons"], queryFn: listPaperRunLessons });

export function usePaperRunLessons() {
  return useQuery(paperRunLessonsQueryOptions);
}
