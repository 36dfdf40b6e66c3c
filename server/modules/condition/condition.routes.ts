import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { vehicleIdParams } from "../../../shared/schemas/common.ts";
import * as service from "./condition.service.ts";

/** GET /api/vehicles/:id/evidence: photos, defects and zones, tyres and checks with their cautions, the condition index. */
export function conditionRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.get(
    "/evidence",
    ...route({ allow: "vehicles.read", params: vehicleIdParams }, async ({ user, params, day }) => ({ evidence: await service.evidence(ctx, user, params.id, day) })),
  );
  return router;
}
