import { useMutation } from "@tanstack/react-query";
import { post } from "../../../lib/api-client.ts";
import { useInvalidateVehicle } from "../../vehicles/api/vehicles.ts";
import type { PublishBody } from "../../../../shared/schemas/publishing.ts";

export interface PublishResult {
  revision: { number: number; publishedAt: string; changes: string[]; overrideReason: string | null };
  slug: string;
  url: string;
}

export function usePublish(vehicleId: number) {
  const invalidate = useInvalidateVehicle();
  return useMutation({
    mutationFn: (body: PublishBody) => post<PublishResult>(`/api/vehicles/${vehicleId}/publish`, body),
    onSettled: () => invalidate(vehicleId),
  });
}
