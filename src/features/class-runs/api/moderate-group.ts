import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { BoardGroup } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";
import { runBoardQueryOptions } from "./get-run-board";

const groupPath = (runId: string, groupId: string) => `/api/class-runs/${encodeURIComponent(runId)}/groups/${encodeURIComponent(groupId)}`;

/** The teacher renames a group; its phone reads the new nickname. */
export function renameGroup({ runId, groupId, nickname }: { runId: string; groupId: string; nickname: string }) {
  return api.patch<BoardGroup>(groupPath(runId, groupId), { nickname });
}

/** The teacher removes a group from the run: off the board and out of every figure; its phone is told. */
export function removeGroup({ runId, groupId }: { runId: string; groupId: string }) {
  return api.delete<{ id: string; removedAt: string }>(groupPath(runId, groupId));
}

/** The teacher leaves a group's rolls out of every figure (the group stays, marked), or counts them again. */
export function setGroupLeftOut({ runId, groupId, leftOut }: { runId: string; groupId: string; leftOut: boolean }) {
  return api.put<BoardGroup>(`${groupPath(runId, groupId)}/left-out`, { leftOut });
}

function useBoardMutation<Input, Output>(runId: string, mutationFn: (input: Input) => Promise<Output>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => queryClient.invalidateQueries({ queryKey: runBoardQueryOptions(runId).queryKey }) });
}

export const useRenameGroup = (runId: string) => useBoardMutation(runId, renameGroup);
export const useRemoveGroup = (runId: string) => useBoardMutation(runId, removeGroup);
export const useSetGroupLeftOut = (runId: string) => useBoardMutation(runId, setGroupLeftOut);
