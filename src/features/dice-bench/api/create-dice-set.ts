import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DiceSet, DiceSetInput } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";
import { diceSetQueryOptions } from "./get-dice-set";
import { diceSetsQueryOptions } from "./list-dice-sets";

export function createDiceSet(input: DiceSetInput) {
  return api.post<DiceSet>("/api/dice-sets", input);
}

export function useCreateDiceSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDiceSet,
    onSuccess: (set) => {
      queryClient.setQueryData(diceSetQueryOptions(set.id).queryKey, set);
      return queryClient.invalidateQueries({ queryKey: diceSetsQueryOptions.queryKey, exact: true });
    },
  });
}
