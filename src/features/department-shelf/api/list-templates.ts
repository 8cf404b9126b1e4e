import { queryOptions, useQuery } from "@tanstack/react-query";
import type { TemplateStatus, TemplateSummary } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";

/** The department's templates in one status (retired ones for the head of department only). */
export function listTemplates(status: TemplateStatus) {
  return api.get<{ templates: TemplateSummary[] }>(`/api/shelf/templates?status=${status}`);
}

/** Every shelf query starts with this key, so a shelf mutation refreshes lists and details at once. */
export const shelfKey = ["shelf"] as const;

export const templatesQueryOptions = (status: TemplateStatus) =>
  queryOptions({
    queryKey: [...shelfKey, "templates", { status }],
    queryFn: () => listTemplates(status),
  });

export function useTemplates(status: TemplateStatus, enabled = true) {
  return useQuery({ ...templatesQueryOptions(status), enabled });
}
