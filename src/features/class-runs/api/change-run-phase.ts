import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ClassRun, RunPhaseChange } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";

/** Moves a run to another of its phases (the first Twist starts a fresh tally). */
export function changeRunPhase({ runId, ...change }: RunPhaseChange & { runId: string }) {
  return api.post<ClassRun>(`/api/class-runs/${encodeURIComponent(runId)}/phase`, change);
}

export function useChangeRunPhase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeRunPhase,
    onSuccess: (run) => queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(run.id).queryKey }),
  });
}
