import { queryOptions, useQuery } from "@tanstack/react-query";
import type { TemplateDetail } from "@shared/schemas/shelf";
import { api } from "@/lib/api-client";
import { shelfKey } from "./list-templates";

/** One template with its version history and one version's frozen lesson (the current one when `version` is null). */
export function getTemplate(id: string, version: number | null) {
  const path = `/api/shelf/templates/${encodeURIComponent(id)}`;
  return api.get<TemplateDetail>(version === null ? path : `${path}/versions/${version}`);
}

export const templateQueryOptions = (id: string, version: number | null) =>
  queryOptions({
    queryKey: [...shelfKey, "templates", id, { version }],
    queryFn: () => getTemplate(id, version),
  });

export function useTemplate(id: string, version: number | null) {
  return useQuery(templateQueryOptions(id, version));
}
