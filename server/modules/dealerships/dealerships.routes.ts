import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole, requireStaff } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { dealershipSettingsSchema, type DealershipSettingsInput } from "../../../shared/schemas/dealership.ts";
import { getDealership, presentDealership, presentPublicDealership, primaryDealership, updateSettings } from "./dealerships.service.ts";
import { notFound } from "../../lib/errors.ts";

export function dealershipRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/", requireStaff, async (_req, res) => {
    res.json({ dealership: presentDealership(await getDealership(ctx.database.db, currentUser(res.locals).dealershipId)) });
  });
  router.patch("/", requireRole("admin"), validate("body", dealershipSettingsSchema), async (_req, res) => {
    res.json({ dealership: await updateSettings(ctx, currentUser(res.locals), res.locals.body as DealershipSettingsInput) });
  });
  return router;
}

export function publicDealershipRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    const d = await primaryDealership(ctx.database.db);
    if (!d) throw notFound("The dealership");
    res.setHeader("Cache-Control", "public, max-age=60");
    res.json({ dealership: presentPublicDealership(d) });
  });
  return router;
}
