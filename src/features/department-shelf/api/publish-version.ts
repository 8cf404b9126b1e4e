import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PublishVersionInput, TemplateDetail } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** The head publishes one of their lessons as the template's next version. */
export function publishVersion({ templateId, ...input }: PublishVersionInput & { templateId: string }) {
  return api.post<TemplateDetail>(`/api/shelf/templates/${encodeURIComponent(templateId)}/versions`, input);
}

export function usePublishVersion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: publishVersion,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shelfKey }),
  });
}
