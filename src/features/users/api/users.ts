import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch, post } from "../../../lib/api-client.ts";
import type { CreateUserInput, UpdateUserInput, UserView } from "../../../../shared/schemas/users.ts";

export const userKeys = {
  all: ["users"] as const,
  lists: () => [...userKeys.all, "list"] as const,
};

export const usersQueryOptions = () =>
  queryOptions({ queryKey: userKeys.lists(), queryFn: () => get<{ users: UserView[] }>("/api/users") });

export const useUsers = () => useQuery(usersQueryOptions());

export function useCreateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateUserInput) => post<{ user: UserView }>("/api/users", input),
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: UpdateUserInput & { id: string }) => patch<{ user: UserView }>(`/api/users/${id}`, input),
    onSettled: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}
