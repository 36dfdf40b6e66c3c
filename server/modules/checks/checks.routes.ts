import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole, requireStaff } from "../../middleware/authenticate.ts";
import { parseOr400, validate } from "../../middleware/validate.ts";
import { checksSchema, tyresSchema, type ChecksInput } from "../../../shared/schemas/evidence.ts";
import { getDealership, todayFor } from "../dealerships/dealerships.service.ts";
import * as service from "./checks.service.ts";

const vehicleParams = z.object({ id: z.coerce.number().int().positive() });
const WRITERS = ["admin", "sales", "workshop"] as const;

/** Mounted at /api/vehicles/:id: GET …/checks, PUT …/tyres, PUT …/checks. */
export function checksRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireStaff);
  const vid = (p: unknown) => (p as { id: number }).id;

  router.get("/checks", validate("params", vehicleParams), async (_req, res) => {
    res.json(await service.get(ctx, currentUser(res.locals), vid(res.locals.params)));
  });
  router.put("/tyres", requireRole(...WRITERS), validate("params", vehicleParams), async (req, res) => {
    const user = currentUser(res.locals);
    const today = todayFor(ctx, await getDealership(ctx.database.db, user.dealershipId));
    const input = parseOr400(tyresSchema(today), req.body ?? {}, "tyre readings");
    res.json(await service.putTyres(ctx, user, vid(res.locals.params), input));
  });
  router.put("/checks", requireRole(...WRITERS), validate("params", vehicleParams), validate("body", checksSchema), async (_req, res) => {
    res.json(await service.putChecks(ctx, currentUser(res.locals), vid(res.locals.params), res.locals.body as ChecksInput));
  });
  return router;
}
