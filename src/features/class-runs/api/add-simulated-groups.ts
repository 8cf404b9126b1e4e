import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { BoardGroup, SimulatedGroupsInput } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";

/** Adds the virtual class: simulated groups with seeded rolls. */
export function addSimulatedGroups({ runId, ...input }: SimulatedGroupsInput & { runId: string }) {
  return api.post<{ seed: number; rolls: number; groups: BoardGroup[] }>(
    `/api/class-runs/${encodeURIComponent(runId)}/simulated-groups`,
    input,
  );
}

export function useAddSimulatedGroups(runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addSimulatedGroups,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(runId).queryKey }),
  });
}
