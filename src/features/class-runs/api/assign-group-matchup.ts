import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { BoardGroup } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";

/** The teacher gives a group its matchup. */
export function assignGroupMatchup({ runId, groupId, matchup }: { runId: string; groupId: string; matchup: number[] }) {
  return api.put<BoardGroup>(`/api/class-runs/${encodeURIComponent(runId)}/groups/${encodeURIComponent(groupId)}/matchup`, { matchup });
}

export function useAssignGroupMatchup(runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: assignGroupMatchup,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(runId).queryKey }),
  });
}
