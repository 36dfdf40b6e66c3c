import { Router } from "express";
import QRCode from "qrcode";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { revisionParams, slugParams, vehicleIdParams } from "../../../shared/schemas/common.ts";
import { publishSchema } from "../../../shared/schemas/publishing.ts";
import { publicListQuerySchema } from "../../../shared/schemas/public-query.ts";
import { publish, vehicleDetail } from "./publishing.service.ts";
import { assertPublic, listPublic, publicVehicleJson, urlFor } from "./public.service.ts";
import { sendRepresentation } from "./public-cache.ts";

/** POST /api/vehicles/:id/publish. */
export function publishingRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.post("/publish", ...route({ allow: "vehicle.publish", params: vehicleIdParams, body: publishSchema, status: 201 }, ({ user, params, body }) => publish(ctx, user, params.id, body)));
  return router;
}

/**
 * GET /api/vehicles/:id: the record with readiness and publishing. Mounted at /api/vehicles/:id after the vehicles
 * router (server/app.ts), so /api/vehicles/suggestions is answered there before this could take it for an id; served
 * from this module because the answer needs readiness, and vehicles must not depend on publishing.
 */
export function vehicleDetailRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.get("/", ...route({ allow: "vehicles.read", params: vehicleIdParams }, async ({ user, params, day }) => ({ vehicle: await vehicleDetail(ctx, user, params.id, day) })));
  return router;
}

/** /api/public/vehicles: published revisions only, for anyone. */
export function publicVehiclesRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get(
    "/",
    ...route({ allow: "anyone", query: publicListQuerySchema }, ({ query, res }) => {
      res.setHeader("Cache-Control", "public, max-age=30");
      return listPublic(ctx, query);
    }),
  );
  // Serialised once per revision (public-cache.ts); the slug's status and current revision are read every time.
  router.get(
    "/:slug",
    ...route({ allow: "anyone", params: slugParams }, async ({ params, req, res }) => {
      sendRepresentation(req, res, await publicVehicleJson(ctx, params.slug), "public, max-age=30");
    }),
  );
  router.get(
    "/:slug/revisions/:number",
    ...route({ allow: "anyone", params: revisionParams }, async ({ params, req, res }) => {
      // Short-lived: the body carries the vehicle's status (withdrawn → 410), and the strong ETag makes revalidation cheap.
      sendRepresentation(req, res, await publicVehicleJson(ctx, params.slug, params.number), "public, max-age=30");
    }),
  );
  router.get(
    "/:slug/qr.svg",
    ...route({ allow: "anyone", params: slugParams }, async ({ params, res }) => {
      await assertPublic(ctx, params.slug); // 404 never published, 410 withdrawn; the code needs no revision read
      const svg = await QRCode.toString(urlFor(ctx, params.slug), { type: "svg", errorCorrectionLevel: "M", margin: 2, color: { dark: "#18212c", light: "#ffffff" } });
      // A published page's code: portals and printed-sheet tools may embed it from anywhere (issue 16).
      res.type("image/svg+xml").setHeader("Cache-Control", "public, max-age=3600").setHeader("Cross-Origin-Resource-Policy", "cross-origin");
      res.send(svg);
    }),
  );
  return router;
}
