import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { idParams, slugParams, vehicleIdParams } from "../../../shared/schemas/common.ts";
import { enquirySchema, leadListQuerySchema, leadMessageSchema, shareVehicleSchema, updateLeadSchema } from "../../../shared/schemas/enquiries.ts";
import * as service from "./leads.service.ts";

/** /api/leads: sales and admin work leads; marketing sees counts only; workshop none (shared/permissions.ts). */
export function leadsRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/stats", ...route({ allow: "leads.stats" }, ({ user }) => service.leadCounts(ctx, user)));
  router.get("/", ...route({ allow: "leads.read", query: leadListQuerySchema }, async ({ user, query }) => ({ leads: await service.listLeads(ctx, user, query) })));
  router.get("/:id", ...route({ allow: "leads.read", params: idParams }, async ({ user, params }) => ({ lead: await service.getLead(ctx, user, params.id) })));
  router.patch("/:id", ...route({ allow: "leads.work", params: idParams, body: updateLeadSchema }, async ({ user, params, body }) => ({ lead: await service.updateLead(ctx, user, params.id, body) })));
  router.post(
    "/:id/messages",
    ...route({ allow: "leads.work", params: idParams, body: leadMessageSchema, status: 201 }, async ({ user, params, body }) => ({ lead: await service.replyToLead(ctx, user, params.id, body.body) })),
  );
  return router;
}

/** POST /api/public/vehicles/:slug/enquiries: anyone. */
export function enquiryRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post(
    "/:slug/enquiries",
    ...route({ allow: "anyone", params: slugParams, body: enquirySchema, status: 201 }, async ({ params, body, req }) => {
      await service.submitEnquiry(ctx, params.slug, body, req.ip ?? "unknown");
      return { accepted: true, next: "A salesperson will reply, usually within one working day. A copy of your message is on its way to your inbox if you gave an e-mail address." };
    }),
  );
  return router;
}

/** POST /api/vehicles/:id/share: sales and admin send the condition page. */
export function shareRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.post("/share", ...route({ allow: "vehicle.share", params: vehicleIdParams, body: shareVehicleSchema, status: 201 }, ({ user, params, body }) => service.shareVehicle(ctx, user, params.id, body)));
  return router;
}
