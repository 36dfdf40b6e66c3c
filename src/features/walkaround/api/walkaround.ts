import { useMutation } from "@tanstack/react-query";
import { del, patch, post, put } from "../../../lib/api-client.ts";
import { useInvalidateVehicle } from "../../vehicles/api/vehicles.ts";
import type { DefectView } from "../../../../server/modules/walkaround/walkaround.presenter.ts";
import type { CreateDefectInput, UpdateDefectInput } from "../../../../shared/schemas/evidence.ts";

export type { DefectView };

/** Walk-around writes; each re-reads the vehicle so zones, pins and the condition index stay in step. */
export function useWalkaroundWrites(vehicleId: number) {
  const invalidate = useInvalidateVehicle();
  const settle = () => invalidate(vehicleId);
  return {
    addDefect: useMutation({ mutationFn: (input: CreateDefectInput) => post<{ defect: DefectView }>(`/api/vehicles/${vehicleId}/defects`, input), onSettled: settle }),
    updateDefect: useMutation({
      mutationFn: ({ id, ...input }: UpdateDefectInput & { id: number }) => patch<{ defect: DefectView }>(`/api/vehicles/${vehicleId}/defects/${id}`, input),
      onSettled: settle,
    }),
    removeDefect: useMutation({ mutationFn: (d: { id: number; version: number }) => del<void>(`/api/vehicles/${vehicleId}/defects/${d.id}?version=${d.version}`), onSettled: settle }),
    markZone: useMutation({ mutationFn: (input: { zone: string; nothingFound: boolean }) => put<unknown>(`/api/vehicles/${vehicleId}/walkaround/zones`, input), onSettled: settle }),
  };
}
