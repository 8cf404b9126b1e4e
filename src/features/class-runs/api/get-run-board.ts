import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BoardSnapshot } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";

/** The Run board's snapshot over HTTP; live updates then arrive over socket.io (hooks/use-live-board.ts). */
export function getRunBoard(runId: string) {
  return api.get<BoardSnapshot>(`/api/class-runs/${encodeURIComponent(runId)}/board`);
}

export const runBoardQueryOptions = (runId: string) =>
  queryOptions({ queryKey: ["class-runs", runId, "board"], queryFn: () => getRunBoard(runId), staleTime: Infinity });

export function useRunBoard(runId: string) {
  return useQuery(runBoardQueryOptions(runId));
}
