import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "../../../lib/api-client.ts";
import { vehicleKeys } from "../../vehicles/api/vehicles.ts";
import type { PublishBody } from "../../../../shared/schemas/publishing.ts";
import type { PublishResult } from "../../../../server/modules/publishing/publishing.presenter.ts";

export type { PublishResult };

/**
 * A publish changes the record (version, and the status when it goes live), the publishing block (address and the
 * new revision) and the history, so the detail and history are re-read, and the stock list for the status. The
 * evidence is only read by a publish, never changed.
 */
export function usePublish(vehicleId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PublishBody) => post<PublishResult>(`/api/vehicles/${vehicleId}/publish`, body),
    onSettled: () =>
      Promise.all([vehicleKeys.detail(vehicleId), vehicleKeys.history(vehicleId), vehicleKeys.lists()].map((queryKey) => qc.invalidateQueries({ queryKey }))),
  });
}
