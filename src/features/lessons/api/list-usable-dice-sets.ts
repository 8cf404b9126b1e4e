import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DiceSetList } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";

/** The dice sets a lesson may use: the teacher's own, then those shared with the department (GET /api/dice-sets). */
export function listUsableDiceSets() {
  return api.get<DiceSetList>("/api/dice-sets");
}

// Same key and answer as the Dice bench's list, so both areas share one cache entry.
export const usableDiceSetsQueryOptions = queryOptions({
  queryKey: ["dice-sets"],
  queryFn: listUsableDiceSets,
});

export function useUsableDiceSets() {
  return useQuery(usableDiceSetsQueryOptions);
}
