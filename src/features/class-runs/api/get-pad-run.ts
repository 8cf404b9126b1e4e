import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PadRunPreview } from "@shared/schemas/class-runs";
import { api } from "@/lib/api-client";

/** The open run behind a join code, shown on the Roll pad before a group joins (no account needed). */
export function getPadRun(code: string) {
  return api.get<PadRunPreview>(`/api/pad/${encodeURIComponent(code)}`);
}

export const padRunQueryOptions = (code: string) => queryOptions({ queryKey: ["pad", "code", code], queryFn: () => getPadRun(code), staleTime: 10_000 });

export function usePadRun(code: string | null) {
  return useQuery({ ...padRunQueryOptions(code ?? ""), enabled: code !== null && code.length > 0 });
}
