import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch } from "../../../lib/api-client.ts";
import type { DealershipSettingsInput } from "../../../../shared/schemas/dealership.ts";
import { dealershipDay } from "../../../../shared/domain/calendar.ts";

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
};

export const dealershipQueryOptions = () =>
  queryOptions({ queryKey: dealershipKeys.staff(), queryFn: () => get<{ dealership: DealershipView }>("/api/dealership") });

export const useDealership = () => useQuery(dealershipQueryOptions());

/**
 * Today in the dealership's time zone, the day the server judges dates by (shared/domain/calendar.ts), so "overdue"
 * means the same on both sides; null until the dealership has loaded.
 */
export function useDealershipDay(): string | null {
  const { data } = useDealership();
  return data ? dealershipDay(data.dealership.timeZone) : null;
}

export function useUpdateDealership() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: DealershipSettingsInput) => patch<{ dealership: DealershipView }>("/api/dealership", input),
    onSuccess: (data) => qc.setQueryData(dealershipKeys.staff(), data),
  });
}
