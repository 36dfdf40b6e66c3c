import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { dealershipSettingsSchema } from "../../../shared/schemas/dealership.ts";
import { primaryDealership, updateSettings } from "./dealerships.service.ts";
import { presentDealership, presentPublicDealership } from "./dealerships.presenter.ts";
import { notFound } from "../../lib/errors.ts";

export function dealershipRoutes(ctx: AppContext): Router {
  const router = Router();
  // The request's own dealership row (read once by `day()`), as the settings screen shows it.
  router.get("/", ...route({ allow: "dealership.read" }, async ({ day }) => ({ dealership: presentDealership((await day()).dealership) })));
  router.patch("/", ...route({ allow: "dealership.edit", body: dealershipSettingsSchema }, async ({ user, body }) => ({ dealership: await updateSettings(ctx, user, body) })));
  return router;
}

export function publicDealershipRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get(
    "/",
    ...route({ allow: "anyone" }, async ({ res }) => {
      const d = await primaryDealership(ctx.database.db);
      if (!d) throw notFound("The dealership");
      res.setHeader("Cache-Control", "public, max-age=60");
      return { dealership: presentPublicDealership(d) };
    }),
  );
  return router;
}
