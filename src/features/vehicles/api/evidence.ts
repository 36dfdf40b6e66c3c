import { queryOptions, useQuery, useQueryClient } from "@tanstack/react-query";
import { get } from "../../../lib/api-client.ts";
import type { Evidence } from "../../../../server/modules/condition/condition.presenter.ts";
import { putPhotos } from "../../photos/api/photos.ts";
import { vehicleKeys } from "./vehicles.ts";

/**
 * GET /api/vehicles/:id/evidence as the client keeps it: defects and zones, tyres, checks and cautions, the condition
 * index. Its photos go to the one photo cache instead (vehicleKeys.photos, read by every screen and polled while
 * sizes are made), so no second copy goes stale beside it.
 */
export type VehicleEvidence = Omit<Evidence, "photos">;

export const evidenceQueryOptions = (vehicleId: number) =>
  queryOptions({
    queryKey: vehicleKeys.evidence(vehicleId),
    queryFn: async ({ client }): Promise<VehicleEvidence> => {
      const { evidence } = await get<{ evidence: Evidence }>(`/api/vehicles/${vehicleId}/evidence`);
      const { photos, ...rest } = evidence;
      putPhotos(client, vehicleId, photos);
      return rest;
    },
  });

export const useVehicleEvidence = (vehicleId: number) => useQuery(evidenceQueryOptions(vehicleId));

/**
 * After a walk-around or checks write: the evidence (zones, condition index, cautions) and the readiness computed
 * from it are re-read; the record and the stock list show neither, so they are left alone.
 */
export function useEvidenceChanged() {
  const qc = useQueryClient();
  return (vehicleId: number) =>
    Promise.all([qc.invalidateQueries({ queryKey: vehicleKeys.evidence(vehicleId) }), qc.invalidateQueries({ queryKey: vehicleKeys.detail(vehicleId) })]);
}
