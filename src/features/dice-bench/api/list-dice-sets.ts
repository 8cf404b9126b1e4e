import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DiceSetList } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";

/** The teacher's own dice sets, then those colleagues share with the department. */
export function listDiceSets() {
  return api.get<DiceSetList>("/api/dice-sets");
}

export const diceSetsQueryOptions = queryOptions({
  queryKey: ["dice-sets"],
  queryFn: listDiceSets,
});

export function useDiceSets() {
  return useQuery(diceSetsQueryOptions);
}
