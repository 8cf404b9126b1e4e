import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PublishTemplateInput, TemplateDetail } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** The head publishes one of their lessons as a new template (version 1). */
export function publishTemplate(input: PublishTemplateInput) {
  return api.post<TemplateDetail>("/api/shelf/templates", input);
}

export function usePublishTemplate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: publishTemplate,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shelfKey }),
  });
}
