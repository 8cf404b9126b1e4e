import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ClassRunSummary } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";

/** The teacher's class runs, newest first. */
export function listClassRuns() {
  return api.get<{ runs: ClassRunSummary[] }>("/api/class-runs");
}

export const classRunsQueryOptions = queryOptions({ queryKey: ["class-runs", "list"], queryFn: listClassRuns });

export function useClassRuns() {
  return useQuery(classRunsQueryOptions);
}
