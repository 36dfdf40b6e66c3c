import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { vehicleIdParams } from "../../../shared/schemas/common.ts";
import { checksSchema, tyresSchema } from "../../../shared/schemas/evidence.ts";
import * as service from "./checks.service.ts";

/** Mounted at /api/vehicles/:id: GET …/checks, PUT …/tyres, PUT …/checks. */
export function checksRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get("/checks", ...route({ allow: "vehicles.read", params: vehicleIdParams }, ({ user, params }) => service.get(ctx, user, params.id)));

  // A reading's date may not be after the dealership's today: the schema is built from that day, which the service reuses.
  router.put(
    "/tyres",
    ...route({ allow: "evidence.write", params: vehicleIdParams, body: tyresSchema }, async ({ user, params, body, day }) => service.putTyres(ctx, user, params.id, body, await day())),
  );

  router.put("/checks", ...route({ allow: "evidence.write", params: vehicleIdParams, body: checksSchema }, ({ user, params, body }) => service.putChecks(ctx, user, params.id, body)));

  return router;
}
