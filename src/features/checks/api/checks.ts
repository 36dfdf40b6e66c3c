import { useMutation, useQueryClient } from "@tanstack/react-query";
import { get, put } from "../../../lib/api-client.ts";
import { vehicleKeys } from "../../vehicles/api/vehicles.ts";
import { useEvidenceChanged, type VehicleEvidence } from "../../vehicles/api/evidence.ts";
import { isDefectCaution } from "../../../../shared/domain/cautions.ts";
import type { ChecksInput, TyresInput } from "../../../../shared/schemas/evidence.ts";
import type { ChecksSetView, ChecksView, TyresView } from "../../../../server/modules/checks/checks.presenter.ts";

/** What GET …/checks, PUT …/tyres and PUT …/checks all answer: readings with their assessments, results, cautions. */
export type { ChecksSetView, ChecksView, TyresView };

export const fetchChecks = (vehicleId: number) => get<ChecksView>(`/api/vehicles/${vehicleId}/checks`);

/**
 * After a save the server's answer goes into the evidence already loaded (so the screen and the side panel agree at
 * once); then the evidence is re-read for the condition index, and readiness (tyres measured, safety) behind it. The
 * record is not touched: tyres and checks keep versions of their own.
 */
function useChecksWrite<I>(vehicleId: number, send: (input: I) => Promise<ChecksView>) {
  const qc = useQueryClient();
  const changed = useEvidenceChanged();
  return useMutation({
    mutationFn: send,
    onSuccess: (data) => {
      const { tyres, checks, cautions } = data;
      // The answer's cautions are the tyres' and checks' own; a defect's caution stays until the evidence is re-read.
      qc.setQueryData<VehicleEvidence>(vehicleKeys.evidence(vehicleId), (old) =>
        old ? { ...old, tyres, checks, cautions: [...cautions, ...old.cautions.filter(isDefectCaution)] } : old,
      );
      void changed(vehicleId);
    },
  });
}

export const useSaveTyres = (vehicleId: number) =>
  useChecksWrite(vehicleId, (input: TyresInput) => put<ChecksView>(`/api/vehicles/${vehicleId}/tyres`, input));

export const useSaveChecks = (vehicleId: number) =>
  useChecksWrite(vehicleId, (input: ChecksInput) => put<ChecksView>(`/api/vehicles/${vehicleId}/checks`, input));

/** "Load theirs" after a 409: the newest tyres and checks, and the evidence and readiness re-read so the panels show them too. */
export function useReloadChecks(vehicleId: number) {
  const changed = useEvidenceChanged();
  return useMutation({
    mutationFn: () => fetchChecks(vehicleId),
    onSuccess: () => void changed(vehicleId),
  });
}
