import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CopiedLesson } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { ownLessonsQueryOptions } from "./list-own-lessons";

/** Copies a template version into the teacher's own lessons (the current version when `version` is left out). */
export function copyTemplate({ templateId, version }: { templateId: string; version?: number }) {
  return api.post<CopiedLesson>(`/api/shelf/templates/${encodeURIComponent(templateId)}/copy`, version ? { version } : {});
}

export function useCopyTemplate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: copyTemplate,
    // The new lesson belongs in every lessons query, whichever screen holds it.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ownLessonsQueryOptions.queryKey.slice(0, 1) }),
  });
}
