import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { defectParams, vehicleIdParams, versionQuery } from "../../../shared/schemas/common.ts";
import { createDefectSchema, updateDefectSchema, zoneMarkSchema } from "../../../shared/schemas/evidence.ts";
import * as service from "./walkaround.service.ts";

/** Mounted at /api/vehicles/:id; defects at …/defects, the zone marks at …/walkaround. */
export function walkaroundRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get("/walkaround", ...route({ allow: "vehicles.read", params: vehicleIdParams }, ({ user, params }) => service.walkaround(ctx, user, params.id)));

  router.put(
    "/walkaround/zones",
    ...route({ allow: "evidence.write", params: vehicleIdParams, body: zoneMarkSchema }, async ({ user, params, body }) => ({ zones: await service.markZone(ctx, user, params.id, body.zone, body.nothingFound) })),
  );

  router.post(
    "/defects",
    ...route({ allow: "evidence.write", params: vehicleIdParams, body: createDefectSchema, status: 201 }, async ({ user, params, body }) => ({ defect: await service.createDefect(ctx, user, params.id, body) })),
  );

  router.patch(
    "/defects/:defectId",
    ...route({ allow: "evidence.write", params: defectParams, body: updateDefectSchema }, async ({ user, params, body }) => ({ defect: await service.updateDefect(ctx, user, params.id, params.defectId, body) })),
  );

  router.delete(
    "/defects/:defectId",
    ...route({ allow: "evidence.write", params: defectParams, query: versionQuery, status: 204 }, ({ user, params, query }) => service.deleteDefect(ctx, user, params.id, params.defectId, query.version)),
  );

  return router;
}
