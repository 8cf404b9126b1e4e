import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ClassRun, OpenClassRunInput } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { classRunsQueryOptions } from "./list-class-runs";
import { runnableLessonsQueryOptions } from "./list-runnable-lessons";

/** Opens a class run of one of the teacher's lessons. */
export function openClassRun(input: OpenClassRunInput) {
  return api.post<ClassRun>("/api/class-runs", input);
}

export function useOpenClassRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: openClassRun,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: classRunsQueryOptions.queryKey }),
        queryClient.invalidateQueries({ queryKey: runnableLessonsQueryOptions.queryKey }),
      ]),
  });
}
