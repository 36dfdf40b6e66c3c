import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole, requireStaff } from "../../middleware/authenticate.ts";
import { parseOr400, validate } from "../../middleware/validate.ts";
import { numericIdParamSchema } from "../../../shared/schemas/common.ts";
import { createVehicleSchema, statusMoveSchema, updateVehicleSchema, vehicleListQuerySchema, type StatusMoveInput, type VehicleListQuery } from "../../../shared/schemas/vehicles.ts";
import { getDealership } from "../dealerships/dealerships.service.ts";
import * as service from "./vehicles.service.ts";

export function vehiclesRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(requireStaff);

  /** Schemas that know "today" are built per request from the dealership's calendar. */
  const today = async (dealershipId: number) => service.todayFor(ctx, await getDealership(ctx.database.db, dealershipId));
  const id = (params: unknown) => (params as { id: number }).id;

  router.get("/", validate("query", vehicleListQuerySchema), async (_req, res) => {
    res.json(await service.list(ctx, currentUser(res.locals), res.locals.query as VehicleListQuery));
  });

  router.get("/suggestions", validate("query", z.strictObject({ q: z.string().max(40).default("") })), async (_req, res) => {
    res.json(await service.suggestions(ctx, currentUser(res.locals), (res.locals.query as { q: string }).q));
  });

  router.post("/", requireRole("admin", "sales"), async (req, res) => {
    const user = currentUser(res.locals);
    const input = parseOr400(createVehicleSchema(await today(user.dealershipId)), req.body ?? {}, "vehicle");
    res.status(201).json({ vehicle: await service.create(ctx, user, input) });
  });

  router.get("/:id", validate("params", numericIdParamSchema), async (_req, res) => {
    res.json({ vehicle: await service.get(ctx, currentUser(res.locals), id(res.locals.params)) });
  });

  router.get("/:id/history", validate("params", numericIdParamSchema), async (_req, res) => {
    res.json(await service.history(ctx, currentUser(res.locals), id(res.locals.params)));
  });

  router.patch("/:id", validate("params", numericIdParamSchema), async (req, res) => {
    const user = currentUser(res.locals);
    const input = parseOr400(updateVehicleSchema(await today(user.dealershipId)), req.body ?? {}, "vehicle");
    res.json({ vehicle: await service.update(ctx, user, id(res.locals.params), input) });
  });

  router.post("/:id/status", requireRole("admin", "sales", "workshop"), validate("params", numericIdParamSchema), validate("body", statusMoveSchema), async (_req, res) => {
    res.json({ vehicle: await service.moveStatus(ctx, currentUser(res.locals), id(res.locals.params), res.locals.body as StatusMoveInput) });
  });

  return router;
}
