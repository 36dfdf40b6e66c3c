import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch } from "../../../lib/api-client.ts";
import type { DealershipSettingsInput, PublicDealership } from "../../../../shared/schemas/dealership.ts";

export type DealershipView = Required<Omit<DealershipSettingsInput, "version">> & {
  id: number;
  slug: string;
  country: string;
  locale: string;
  timeZone: string;
  version: number;
  updatedAt: string;
};

export const dealershipKeys = {
  all: ["dealership"] as const,
  staff: () => [...dealershipKeys.all, "staff"] as const,
  public: () => [...dealershipKeys.all, "public"] as const,
};

export const dealershipQueryOptions = () =>
  queryOptions({ queryKey: dealershipKeys.staff(), queryFn: () => get<{ dealership: DealershipView }>("/api/dealership") });

export const publicDealershipQueryOptions = () =>
  queryOptions({
    queryKey: dealershipKeys.public(),
    queryFn: () => get<{ dealership: PublicDealership }>("/api/public/dealership"),
    staleTime: 5 * 60_000,
  });

export const useDealership = () => useQuery(dealershipQueryOptions());

export function useUpdateDealership() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: DealershipSettingsInput) => patch<{ dealership: DealershipView }>("/api/dealership", input),
    onSuccess: (data) => {
      qc.setQueryData(dealershipKeys.staff(), data);
      qc.invalidateQueries({ queryKey: dealershipKeys.public() });
    },
  });
}
