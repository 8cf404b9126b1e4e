import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ProposeLessonInput, ShelfProposal } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { proposalsQueryOptions } from "./list-proposals";

/** A teacher proposes one of their lessons for the Department shelf. */
export function proposeLesson(input: ProposeLessonInput) {
  return api.post<ShelfProposal>("/api/shelf/proposals", input);
}

export function useProposeLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: proposeLesson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: proposalsQueryOptions.queryKey }),
  });
}
