import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";
import { diceSetsQueryOptions } from "./list-dice-sets";

export function getDiceSet(id: string) {
  return api.get<DiceSet>(`/api/dice-sets/${encodeURIComponent(id)}`);
}

export function diceSetQueryOptions(id: string) {
  return queryOptions({
    queryKey: [...diceSetsQueryOptions.queryKey, id],
    queryFn: () => getDiceSet(id),
    // The editor keeps the version it started from; a background refetch must not look like a reload.
    refetchOnWindowFocus: false,
  });
}

export function useDiceSet(id: string) {
  return useQuery(diceSetQueryOptions(id));
}
