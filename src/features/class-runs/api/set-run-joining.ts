import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ClassRun } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";

/** Locks joining (no new groups; groups already in carry on) or unlocks it. */
export function setRunJoining({ runId, locked }: { runId: string; locked: boolean }) {
  return api.put<ClassRun>(`/api/class-runs/${encodeURIComponent(runId)}/joining`, { locked });
}

export function useSetRunJoining() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setRunJoining,
    onSuccess: (run) => queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(run.id).queryKey }),
  });
}
