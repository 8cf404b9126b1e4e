import { queryOptions, useQuery } from "@tanstack/react-query";
import type { CurrentTeacher } from "@shared/schemas/account";
import { api, ApiRequestError } from "@/lib/api-client";

/** The signed-in teacher, or null when nobody is signed in. */
export async function getCurrentTeacher(): Promise<CurrentTeacher | null> {
  try {
    return await api.get<CurrentTeacher>("/api/me");
  } catch (error) {
    if (error instanceof ApiRequestError && error.status === 401) return null;
    throw error;
  }
}

export const currentTeacherQueryOptions = queryOptions({
  queryKey: ["me"],
  queryFn: getCurrentTeacher,
  staleTime: 60_000,
});

export function useCurrentTeacher() {
  return useQuery(currentTeacherQueryOptions);
}
