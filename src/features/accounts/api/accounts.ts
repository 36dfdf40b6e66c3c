import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, post } from "../../../lib/api-client.ts";
import { sessionKeys } from "../../../lib/auth.ts";
import type { SessionUser } from "../../../../shared/schemas/auth.ts";
import type { Role } from "../../../../shared/constants/roles.ts";
import type { InviteView } from "../../../../server/modules/auth/auth.presenter.ts";

/** GET /api/auth/invitations/:token: who the invitation is for. */
export type Invitation = InviteView;

export const accountKeys = {
  all: ["accounts"] as const,
  invitation: (token: string) => [...accountKeys.all, "invitation", token] as const,
};

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: accountKeys.invitation(token),
    queryFn: () => get<{ invitation: Invitation }>(`/api/auth/invitations/${encodeURIComponent(token)}`),
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useInvitation = (token: string) => useQuery({ ...invitationQueryOptions(token), enabled: token.length > 0 });

export const useRequestReset = () => useMutation({ mutationFn: (input: { email: string }) => post<{ message: string }>("/api/auth/password-reset", input) });

export const useConfirmReset = () =>
  useMutation({ mutationFn: (input: { token: string; password: string }) => post<{ reset: true }>("/api/auth/password-reset/confirm", input) });

export function useAcceptInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { token: string; password: string }) => post<{ user: SessionUser | null }>("/api/auth/invitations/accept", input),
    onSuccess: (data) => {
      // Drop whatever a previous session left, but keep the (now used) invitation: refetching it would only say
      // "no longer valid" to the person who has just used it.
      qc.removeQueries({ predicate: (q) => q.queryKey[0] !== accountKeys.all[0] });
      qc.setQueryData(sessionKeys.all, { user: data.user });
    },
  });
}

export function useInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; name: string; role: Role }) => post<{ invited: string }>("/api/users/invite", input),
    onSuccess: () => qc.invalidateQueries({ queryKey: ["mail"] }),
  });
}
