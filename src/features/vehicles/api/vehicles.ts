import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch, post } from "../../../lib/api-client.ts";
import type { StatusMoveInput, VehicleListQuery } from "../../../../shared/schemas/vehicles.ts";
import type { VehicleRow, VehicleView as VehicleRecord } from "../../../../server/modules/vehicles/vehicles.presenter.ts";
import type { Evidence } from "../../../../server/modules/condition/condition.service.ts";
import type { publishingOf } from "../../../../server/modules/publishing/publishing.service.ts";
import type { Readiness } from "../../../../shared/domain/readiness.ts";

export type Publishing = Awaited<ReturnType<typeof publishingOf>>;

/** The record as a write returns it; the detail read adds the evidence. */
export type { VehicleRow, VehicleRecord, Evidence };
export type VehicleView = VehicleRecord & { evidence: Evidence; readiness: Readiness; publishing: Publishing };

export interface VehicleList {
  vehicles: VehicleRow[];
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
}

export interface VehicleHistory {
  statusHistory: Array<{ from: string | null; to: string; note: string; by: string | null; at: string }>;
  audit: Array<{ action: string; by: string | null; at: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null }>;
}

export const vehicleKeys = {
  all: ["vehicles"] as const,
  lists: () => [...vehicleKeys.all, "list"] as const,
  list: (filters: VehicleListQuery) => [...vehicleKeys.lists(), filters] as const,
  details: () => [...vehicleKeys.all, "detail"] as const,
  detail: (id: number) => [...vehicleKeys.details(), id] as const,
  history: (id: number) => [...vehicleKeys.detail(id), "history"] as const,
  suggestions: (q: string) => [...vehicleKeys.all, "suggestions", q] as const,
};

const toSearch = (q: VehicleListQuery) => {
  const s = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) {
    if (v === undefined || v === "" || (Array.isArray(v) && !v.length)) continue;
    s.set(k, Array.isArray(v) ? v.join(",") : String(v));
  }
  return s.toString();
};

export const vehicleListQueryOptions = (filters: VehicleListQuery) =>
  queryOptions({
    queryKey: vehicleKeys.list(filters),
    queryFn: () => get<VehicleList>(`/api/vehicles?${toSearch(filters)}`),
    placeholderData: keepPreviousData,
  });

export const vehicleQueryOptions = (id: number) =>
  queryOptions({ queryKey: vehicleKeys.detail(id), queryFn: () => get<{ vehicle: VehicleView }>(`/api/vehicles/${id}`) });

export const vehicleHistoryQueryOptions = (id: number) =>
  queryOptions({ queryKey: vehicleKeys.history(id), queryFn: () => get<VehicleHistory>(`/api/vehicles/${id}/history`) });

export const suggestionsQueryOptions = (q: string) =>
  queryOptions({
    queryKey: vehicleKeys.suggestions(q),
    queryFn: () => get<{ features: string[]; makes: string[] }>(`/api/vehicles/suggestions?q=${encodeURIComponent(q)}`),
    staleTime: 5 * 60_000,
  });

export const useVehicleList = (filters: VehicleListQuery) => useQuery(vehicleListQueryOptions(filters));
export const useVehicle = (id: number) => useQuery(vehicleQueryOptions(id));
export const useVehicleHistory = (id: number) => useQuery(vehicleHistoryQueryOptions(id));

function useVehicleWrite<I>(fn: (input: I) => Promise<{ vehicle: VehicleRecord }>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: ({ vehicle }) => {
      // Keep the evidence already loaded; the record part is the server's new answer. Readiness and publishing are
      // not in that answer and a price or copy changes them, so the detail is re-read behind it.
      qc.setQueryData<{ vehicle: VehicleView }>(vehicleKeys.detail(vehicle.id), (old) => (old ? { vehicle: { ...old.vehicle, ...vehicle } } : old));
      qc.invalidateQueries({ queryKey: vehicleKeys.detail(vehicle.id) });
      qc.invalidateQueries({ queryKey: vehicleKeys.lists() });
      qc.invalidateQueries({ queryKey: vehicleKeys.history(vehicle.id) });
    },
  });
}

export const useCreateVehicle = () => useVehicleWrite((input: Record<string, unknown>) => post<{ vehicle: VehicleRecord }>("/api/vehicles", input));
export const useUpdateVehicle = (id: number) =>
  useVehicleWrite((input: Record<string, unknown>) => patch<{ vehicle: VehicleRecord }>(`/api/vehicles/${id}`, input));
export const useMoveStatus = (id: number) =>
  useVehicleWrite((input: StatusMoveInput) => post<{ vehicle: VehicleRecord }>(`/api/vehicles/${id}/status`, input));

/** After any evidence write: the detail (evidence, condition index) and lists are re-read. */
export function useInvalidateVehicle() {
  const qc = useQueryClient();
  return (id: number) => Promise.all([qc.invalidateQueries({ queryKey: vehicleKeys.detail(id) }), qc.invalidateQueries({ queryKey: vehicleKeys.lists() })]);
}
