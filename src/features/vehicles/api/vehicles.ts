import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { get, patch, post } from "../../../lib/api-client.ts";
import type { StatusMoveInput, VehicleListQuery } from "../../../../shared/schemas/vehicles.ts";
import type { VehicleHistory, VehicleList, VehicleRecord, VehicleRow, VehicleSuggestions } from "../../../../server/modules/vehicles/vehicles.presenter.ts";
import type { PublishingView, VehicleDetail } from "../../../../server/modules/publishing/publishing.presenter.ts";

/** VehicleRecord: what a write answers. VehicleDetail: GET /api/vehicles/:id, the record with readiness and publishing. */
export type { PublishingView, VehicleDetail, VehicleHistory, VehicleList, VehicleRecord, VehicleRow };

/**
 * One vehicle's reads sit side by side under `one(id)`, so a write names exactly the ones it changed: the detail
 * (record, readiness, publishing), the evidence (features/vehicles/api/evidence.ts), the photos (the one photo cache,
 * features/photos/api) and the history.
 */
export const vehicleKeys = {
  all: ["vehicles"] as const,
  lists: () => [...vehicleKeys.all, "list"] as const,
  list: (filters: VehicleListQuery) => [...vehicleKeys.lists(), filters] as const,
  one: (id: number) => [...vehicleKeys.all, "one", id] as const,
  detail: (id: number) => [...vehicleKeys.one(id), "detail"] as const,
  evidence: (id: number) => [...vehicleKeys.one(id), "evidence"] as const,
  photos: (id: number) => [...vehicleKeys.one(id), "photos"] as const,
  history: (id: number) => [...vehicleKeys.one(id), "history"] as const,
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
  queryOptions({ queryKey: vehicleKeys.detail(id), queryFn: () => get<{ vehicle: VehicleDetail }>(`/api/vehicles/${id}`) });

export const vehicleHistoryQueryOptions = (id: number) =>
  queryOptions({ queryKey: vehicleKeys.history(id), queryFn: () => get<VehicleHistory>(`/api/vehicles/${id}/history`) });

export const suggestionsQueryOptions = (q: string) =>
  queryOptions({
    queryKey: vehicleKeys.suggestions(q),
    queryFn: () => get<VehicleSuggestions>(`/api/vehicles/suggestions?q=${encodeURIComponent(q)}`),
    staleTime: 5 * 60_000,
  });

export const useVehicleList = (filters: VehicleListQuery) => useQuery(vehicleListQueryOptions(filters));
export const useVehicle = (id: number) => useQuery(vehicleQueryOptions(id));
export const useVehicleHistory = (id: number) => useQuery(vehicleHistoryQueryOptions(id));

/** A write's record goes into the detail already loaded; its readiness and publishing stay until they are re-read. */
function putRecord(qc: QueryClient, record: VehicleRecord) {
  qc.setQueryData<{ vehicle: VehicleDetail }>(vehicleKeys.detail(record.id), (old) => (old ? { vehicle: { ...old.vehicle, ...record } } : old));
}

export function useCreateVehicle() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: Record<string, unknown>) => post<{ vehicle: VehicleRecord }>("/api/vehicles", input),
    onSuccess: () => qc.invalidateQueries({ queryKey: vehicleKeys.lists() }),
  });
}

/** A field save: the record from the answer, then readiness re-read behind it (the VIN, price and copy count). */
export function useUpdateVehicle(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: Record<string, unknown>) => patch<{ vehicle: VehicleRecord }>(`/api/vehicles/${id}`, input),
    onSuccess: ({ vehicle }) => {
      putRecord(qc, vehicle);
      void qc.invalidateQueries({ queryKey: vehicleKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: vehicleKeys.history(id) });
      void qc.invalidateQueries({ queryKey: vehicleKeys.lists() });
    },
  });
}

/** A status move changes the record and its history only: readiness does not depend on the status. */
export function useMoveStatus(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: StatusMoveInput) => post<{ vehicle: VehicleRecord }>(`/api/vehicles/${id}/status`, input),
    onSuccess: ({ vehicle }) => {
      putRecord(qc, vehicle);
      void qc.invalidateQueries({ queryKey: vehicleKeys.history(id) });
      void qc.invalidateQueries({ queryKey: vehicleKeys.lists() });
    },
  });
}
