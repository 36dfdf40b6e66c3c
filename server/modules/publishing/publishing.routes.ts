import { Router } from "express";
import { z } from "zod";
import QRCode from "qrcode";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { publishSchema, type PublishBody } from "../../../shared/schemas/publishing.ts";
import { publicListQuerySchema, type PublicListQuery } from "../../../shared/schemas/public-query.ts";
import { publish } from "./publishing.service.ts";
import { assertPublic, listPublic, publicVehicleJson, urlFor } from "./public.service.ts";
import { sendRepresentation } from "./public-cache.ts";

const vehicleParams = z.object({ id: z.coerce.number().int().positive() });
const slugParams = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,120}$/) });

/** POST /api/vehicles/:id/publish. */
export function publishingRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.post("/publish", requireRole("admin", "sales"), validate("params", vehicleParams), validate("body", publishSchema), async (_req, res) => {
    const { id } = res.locals.params as { id: number };
    res.status(201).json(await publish(ctx, currentUser(res.locals), id, res.locals.body as PublishBody));
  });
  return router;
}

/** /api/public/vehicles: published revisions only, for anyone. */
export function publicVehiclesRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/", validate("query", publicListQuerySchema), async (_req, res) => {
    res.setHeader("Cache-Control", "public, max-age=30");
    res.json(await listPublic(ctx, res.locals.query as PublicListQuery));
  });
  // Serialised once per revision (public-cache.ts); the slug's status and current revision are read every time.
  router.get("/:slug", validate("params", slugParams), async (req, res) => {
    sendRepresentation(req, res, await publicVehicleJson(ctx, (res.locals.params as { slug: string }).slug), "public, max-age=30");
  });
  router.get("/:slug/revisions/:number", validate("params", slugParams.extend({ number: z.coerce.number().int().positive() })), async (req, res) => {
    const { slug, number } = res.locals.params as { slug: string; number: number };
    // Short-lived: the body carries the vehicle's status (withdrawn → 410), and the strong ETag makes revalidation cheap.
    sendRepresentation(req, res, await publicVehicleJson(ctx, slug, number), "public, max-age=30");
  });
  router.get("/:slug/qr.svg", validate("params", slugParams), async (_req, res) => {
    const { slug } = res.locals.params as { slug: string };
    await assertPublic(ctx, slug); // 404 never published, 410 withdrawn; the code needs no revision read
    const svg = await QRCode.toString(urlFor(ctx, slug), { type: "svg", errorCorrectionLevel: "M", margin: 2, color: { dark: "#18212c", light: "#ffffff" } });
    res.type("image/svg+xml").setHeader("Cache-Control", "public, max-age=3600");
    res.send(svg);
  });
  return router;
}
