import { QueryClient } from "@tanstack/react-query";
import { ApiRequestError } from "./api-client";

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      retry: (failureCount, error) => !(error instanceof ApiRequestError && error.status < 500) && failureCount < 2,
    },
  },
});
