import { useMutation } from "@tanstack/react-query";
import { del, patch, post, put } from "../../../lib/api-client.ts";
import { useEvidenceChanged } from "../../vehicles/api/evidence.ts";
import type { DefectView } from "../../../../server/modules/walkaround/walkaround.presenter.ts";
import type { CreateDefectInput, UpdateDefectInput } from "../../../../shared/schemas/evidence.ts";

export type { DefectView };

/** Walk-around writes; each re-reads the evidence (zones, pins, the condition index) and the readiness made from it. */
export function useWalkaroundWrites(vehicleId: number) {
  const changed = useEvidenceChanged();
  const settle = () => changed(vehicleId);
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
