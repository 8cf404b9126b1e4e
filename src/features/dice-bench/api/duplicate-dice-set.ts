import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";
import { diceSetQueryOptions } from "./get-dice-set";
import { diceSetsQueryOptions } from "./list-dice-sets";

/** Copies a set (one's own, or one shared with the department) into a new private set of the teacher's. */
export function duplicateDiceSet(id: string) {
  return api.post<DiceSet>(`/api/dice-sets/${encodeURIComponent(id)}/duplicate`);
}

export function useDuplicateDiceSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicateDiceSet,
    onSuccess: (set) => {
      queryClient.setQueryData(diceSetQueryOptions(set.id).queryKey, set);
      return queryClient.invalidateQueries({ queryKey: diceSetsQueryOptions.queryKey, exact: true });
    },
  });
}
