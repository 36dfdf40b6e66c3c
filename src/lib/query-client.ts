import { QueryClient } from "@tanstack/react-query";
import { ApiError } from "./api-client.ts";

export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // 4xx answers are final; retry only what might succeed a moment later.
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
}

declare module "@tanstack/react-query" {
  interface Register {
    defaultError: ApiError;
  }
}
