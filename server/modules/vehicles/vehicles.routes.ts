import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { vehicleIdParams } from "../../../shared/schemas/common.ts";
import { createVehicleSchema, statusMoveSchema, updateVehicleSchema, vehicleListQuerySchema, vehicleSuggestionsQuerySchema } from "../../../shared/schemas/vehicles.ts";
import * as service from "./vehicles.service.ts";

export function vehiclesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get("/", ...route({ allow: "vehicles.read", query: vehicleListQuerySchema }, ({ user, query }) => service.list(ctx, user, query)));

  router.get("/suggestions", ...route({ allow: "vehicles.read", query: vehicleSuggestionsQuerySchema }, ({ user, query }) => service.suggestions(ctx, user, query.q)));

  // Schemas that know "today" are built per request from the dealership's calendar day, read once and handed on.
  router.post(
    "/",
    ...route({ allow: "vehicle.create", body: createVehicleSchema, status: 201 }, async ({ user, body, day }) => ({
      vehicle: await service.create(ctx, user, body, await day()),
    })),
  );

  router.get("/:id/history", ...route({ allow: "vehicles.read", params: vehicleIdParams }, ({ user, params }) => service.history(ctx, user, params.id)));

  router.patch(
    "/:id",
    ...route({ allow: "vehicle.edit", params: vehicleIdParams, body: updateVehicleSchema }, async ({ user, params, body, day }) => ({
      vehicle: await service.update(ctx, user, params.id, body, await day()),
    })),
  );

  router.post(
    "/:id/status",
    ...route({ allow: "vehicle.status.move", params: vehicleIdParams, body: statusMoveSchema }, async ({ user, params, body }) => ({
      vehicle: await service.moveStatus(ctx, user, params.id, body),
    })),
  );

  return router;
}
