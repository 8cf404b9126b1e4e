import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { diceSetQueryOptions } from "./get-dice-set";
import { diceSetsQueryOptions } from "./list-dice-sets";

export function deleteDiceSet(id: string) {
  return api.delete<void>(`/api/dice-sets/${encodeURIComponent(id)}`);
}

export function useDeleteDiceSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteDiceSet,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: diceSetQueryOptions(id).queryKey });
      return queryClient.invalidateQueries({ queryKey: diceSetsQueryOptions.queryKey, exact: true });
    },
  });
}
