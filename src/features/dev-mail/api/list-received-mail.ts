import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReceivedMailList } from "@shared/schemas/dev-mail";
import { api } from "@/lib/api-client";

/** What the local fake mail server received (404 when real mail is configured). */
export function listReceivedMail() {
  return api.get<ReceivedMailList>("/api/dev/mail");
}

export const receivedMailQueryOptions = queryOptions({
  queryKey: ["dev-mail"],
  queryFn: listReceivedMail,
  // New mail arrives while someone follows a flow by hand in another tab.
  refetchInterval: 3_000,
  staleTime: 0,
});

export function useReceivedMail() {
  return useQuery(receivedMailQueryOptions);
}
