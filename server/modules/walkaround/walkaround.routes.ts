import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole, requireStaff } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { createDefectSchema, updateDefectSchema, zoneMarkSchema, type CreateDefectInput, type UpdateDefectInput } from "../../../shared/schemas/evidence.ts";
import type { Zone } from "../../../shared/constants/evidence.ts";
import * as service from "./walkaround.service.ts";

const vehicleParams = z.object({ id: z.coerce.number().int().positive() });
const defectParams = z.object({ id: z.coerce.number().int().positive(), defectId: z.coerce.number().int().positive() });
const WRITERS = ["admin", "sales", "workshop"] as const;

/** Mounted at /api/vehicles/:id; defects at …/defects, the zone marks at …/walkaround. */
export function walkaroundRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireStaff);
  const vid = (l: unknown) => (l as { id: number }).id;

  router.get("/walkaround", validate("params", vehicleParams), async (_req, res) => {
    res.json(await service.walkaround(ctx, currentUser(res.locals), vid(res.locals.params)));
  });
  router.put("/walkaround/zones", requireRole(...WRITERS), validate("params", vehicleParams), validate("body", zoneMarkSchema), async (_req, res) => {
    const { zone, nothingFound } = res.locals.body as { zone: Zone; nothingFound: boolean };
    res.json({ zones: await service.markZone(ctx, currentUser(res.locals), vid(res.locals.params), zone, nothingFound) });
  });
  router.post("/defects", requireRole(...WRITERS), validate("params", vehicleParams), validate("body", createDefectSchema), async (_req, res) => {
    res.status(201).json({ defect: await service.createDefect(ctx, currentUser(res.locals), vid(res.locals.params), res.locals.body as CreateDefectInput) });
  });
  router.patch("/defects/:defectId", requireRole(...WRITERS), validate("params", defectParams), validate("body", updateDefectSchema), async (_req, res) => {
    const { id, defectId } = res.locals.params as { id: number; defectId: number };
    res.json({ defect: await service.updateDefect(ctx, currentUser(res.locals), id, defectId, res.locals.body as UpdateDefectInput) });
  });
  router.delete("/defects/:defectId", requireRole(...WRITERS), validate("params", defectParams), validate("query", z.object({ version: z.coerce.number().int().min(1) })), async (_req, res) => {
    const { id, defectId } = res.locals.params as { id: number; defectId: number };
    await service.deleteDefect(ctx, currentUser(res.locals), id, defectId, (res.locals.query as { version: number }).version);
    res.status(204).end();
  });
  return router;
}
