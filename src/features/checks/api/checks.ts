import { useMutation, useQueryClient } from "@tanstack/react-query";
import { get, put } from "../../../lib/api-client.ts";
import { useInvalidateVehicle, vehicleKeys, type VehicleView } from "../../vehicles/api/vehicles.ts";
import type { ChecksInput, TyresInput } from "../../../../shared/schemas/evidence.ts";
import type { presentChecks } from "../../../../server/modules/checks/checks.service.ts";

/** What GET …/checks, PUT …/tyres and PUT …/checks all answer: readings with their assessments, results, cautions. */
export type ChecksView = ReturnType<typeof presentChecks>;
export type TyresView = ChecksView["tyres"];
export type ChecksSetView = ChecksView["checks"];

export const fetchChecks = (vehicleId: number) => get<ChecksView>(`/api/vehicles/${vehicleId}/checks`);

/**
 * After a save the server's answer goes into the vehicle already loaded (so the screen and the layout agree at once),
 * then the vehicle is re-read for the condition index, which only the detail read computes.
 */
function useChecksWrite<I>(vehicleId: number, send: (input: I) => Promise<ChecksView>) {
  const qc = useQueryClient();
  const invalidate = useInvalidateVehicle();
  return useMutation({
    mutationFn: send,
    onSuccess: (data) => {
      qc.setQueryData<{ vehicle: VehicleView }>(vehicleKeys.detail(vehicleId), (old) =>
        old ? { vehicle: { ...old.vehicle, evidence: { ...old.vehicle.evidence, tyres: data.tyres, checks: data.checks, cautions: data.cautions } } } : old,
      );
      void invalidate(vehicleId);
    },
  });
}

export const useSaveTyres = (vehicleId: number) =>
  useChecksWrite(vehicleId, (input: TyresInput) => put<ChecksView>(`/api/vehicles/${vehicleId}/tyres`, input));

export const useSaveChecks = (vehicleId: number) =>
  useChecksWrite(vehicleId, (input: ChecksInput) => put<ChecksView>(`/api/vehicles/${vehicleId}/checks`, input));

/** "Load theirs" after a 409: the newest tyres and checks, and the vehicle re-read so the layout shows them too. */
export function useReloadChecks(vehicleId: number) {
  const invalidate = useInvalidateVehicle();
  return useMutation({
    mutationFn: () => fetchChecks(vehicleId),
    onSuccess: () => void invalidate(vehicleId),
  });
}
