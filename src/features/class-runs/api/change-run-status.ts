import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ClassRun, RunStatus } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";
import { classRunsQueryOptions } from "./list-class-runs";

/** Pauses, resumes or closes a run. */
export function changeRunStatus({ runId, status }: { runId: string; status: RunStatus }) {
  return api.post<ClassRun>(`/api/class-runs/${encodeURIComponent(runId)}/status`, { status });
}

export function useChangeRunStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeRunStatus,
    onSuccess: (run) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(run.id).queryKey }),
        queryClient.invalidateQueries({ queryKey: classRunsQueryOptions.queryKey }),
      ]),
  });
}
