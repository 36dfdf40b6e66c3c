import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, post } from "./api-client.ts";
import type { SessionUser, SignInInput } from "../../shared/schemas/auth.ts";

export const sessionKeys = { all: ["session"] as const };

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.all,
    queryFn: () => get<{ user: SessionUser | null }>("/api/auth/session"),
    staleTime: 60_000,
  });

export const useSession = () => useQuery(sessionQueryOptions());

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => post<{ user: SessionUser }>("/api/auth/sign-in", input),
    onSuccess: (data) => {
      qc.clear();
      qc.setQueryData(sessionKeys.all, { user: data.user });
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<{ ok: true }>("/api/auth/sign-out"),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(sessionKeys.all, { user: null });
    },
  });
}
