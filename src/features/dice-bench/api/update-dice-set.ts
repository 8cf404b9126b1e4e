import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DiceSet, DiceSetUpdate } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";
import { diceSetQueryOptions } from "./get-dice-set";
import { diceSetsQueryOptions } from "./list-dice-sets";

/** Saves a set; the server refuses it with 409 stale_version when `version` is no longer the stored one. */
export function updateDiceSet({ id, update }: { id: string; update: DiceSetUpdate }) {
  return api.put<DiceSet>(`/api/dice-sets/${encodeURIComponent(id)}`, update);
}

export function useUpdateDiceSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDiceSet,
    onSuccess: (set) => {
      queryClient.setQueryData(diceSetQueryOptions(set.id).queryKey, set);
      return queryClient.invalidateQueries({ queryKey: diceSetsQueryOptions.queryKey, exact: true });
    },
  });
}
