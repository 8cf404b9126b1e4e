import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DiceSet } from "@shared/schemas/dice-sets";
import { api } from "@/lib/api-client";
import { diceSetQueryOptions } from "./get-dice-set";
import { diceSetsQueryOptions } from "./list-dice-sets";

/** Sends a dice set file's parsed JSON; the server checks it and answers 400 invalid_file with a list of issues. */
export function importDiceSet(content: unknown) {
  return api.post<DiceSet>("/api/dice-sets/import", content as Record<string, unknown>);
}

export function useImportDiceSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importDiceSet,
    onSuccess: (set) => {
      queryClient.setQueryData(diceSetQueryOptions(set.id).queryKey, set);
      return queryClient.invalidateQueries({ queryKey: diceSetsQueryOptions.queryKey, exact: true });
    },
  });
}
