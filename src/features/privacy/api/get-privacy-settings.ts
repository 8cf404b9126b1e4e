import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PrivacyNoticeSettings } from "@shared/schemas/privacy";
import { api } from "@/lib/api-client";

/** The controller's contact the operator configured for the privacy notice (public, no sign-in). */
export function getPrivacySettings() {
  return api.get<PrivacyNoticeSettings>("/api/privacy");
}

export const privacySettingsQueryOptions = queryOptions({
  queryKey: ["privacy"],
  queryFn: getPrivacySettings,
  staleTime: 60 * 60_000,
});

export function usePrivacySettings() {
  return useQuery(privacySettingsQueryOptions);
}
