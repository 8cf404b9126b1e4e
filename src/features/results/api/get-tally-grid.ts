import { queryOptions, useQuery } from "@tanstack/react-query";
import type { TallyGrid } from "@shared/schemas/tally-grid";
import { api } from "@/lib/api-client";

/** A run's tally grid: its dice, tallies, groups, stored counts and the rows each group's sheet has. */
export function getTallyGrid(runId: string) {
  return api.get<TallyGrid>(`/api/results/runs/${encodeURIComponent(runId)}/tally-grid`);
}

export const tallyGridKey = (runId: string) => ["results", "tally-grid", runId] as const;

export const tallyGridQueryOptions = (runId: string) => queryOptions({ queryKey: tallyGridKey(runId), queryFn: () => getTallyGrid(runId) });

export function useTallyGrid(runId: string) {
  return useQuery(tallyGridQueryOptions(runId));
}
