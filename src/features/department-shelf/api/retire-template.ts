import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { TemplateDetail } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** The head takes a template off the shelf (`retired: true`) or puts it back. */
export function retireTemplate({ templateId, retired }: { templateId: string; retired: boolean }) {
  return api.post<TemplateDetail>(`/api/shelf/templates/${encodeURIComponent(templateId)}/${retired ? "retire" : "restore"}`);
}

export function useRetireTemplate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retireTemplate,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shelfKey }),
  });
}
