import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole, requireStaff } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { photoUpload } from "../../middleware/upload.ts";
import { badRequest, AppError } from "../../lib/errors.ts";
import { photoOrderSchema, photoUpdateSchema } from "../../../shared/schemas/evidence.ts";
import { PHOTO_LIMITS } from "../../../shared/constants/evidence.ts";
import * as service from "./photos.service.ts";

const vehicleParams = z.object({ id: z.coerce.number().int().positive() });
const photoParams = z.object({ id: z.coerce.number().int().positive(), photoId: z.coerce.number().int().positive() });
const EVIDENCE_WRITERS = ["admin", "sales", "workshop"] as const;

export function photosRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireStaff);

  router.get("/limits", (_req, res) => {
    res.json({ limits: PHOTO_LIMITS });
  });

  router.get("/", validate("params", vehicleParams), async (_req, res) => {
    const { id } = res.locals.params as { id: number };
    res.json({ photos: await service.list(ctx, currentUser(res.locals), id) });
  });

  router.post("/", requireRole(...EVIDENCE_WRITERS), validate("params", vehicleParams), photoUpload, async (req, res) => {
    const { id } = res.locals.params as { id: number };
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    if (!files.length) throw badRequest("Choose at least one photo.", { photos: "Send one or more files in the field named “photos”." });
    const { accepted, refused } = await service.upload(ctx, currentUser(res.locals), id, files);
    if (!accepted.length) {
      const first = refused[0]!;
      throw new AppError(first.status, first.code, refused.length === 1 ? first.reason : "None of the files could be used.", undefined, { refused });
    }
    res.status(201).json({ photos: accepted, refused });
  });

  router.patch("/:photoId", requireRole(...EVIDENCE_WRITERS), validate("params", photoParams), validate("body", photoUpdateSchema), async (_req, res) => {
    const { id, photoId } = res.locals.params as { id: number; photoId: number };
    res.json({ photo: await service.update(ctx, currentUser(res.locals), id, photoId, res.locals.body as never) });
  });

  router.put("/order", requireRole(...EVIDENCE_WRITERS), validate("params", vehicleParams), validate("body", photoOrderSchema), async (_req, res) => {
    const { id } = res.locals.params as { id: number };
    res.json({ photos: await service.reorder(ctx, currentUser(res.locals), id, (res.locals.body as { order: number[] }).order) });
  });

  router.delete("/:photoId", requireRole(...EVIDENCE_WRITERS), validate("params", photoParams), validate("query", z.object({ version: z.coerce.number().int().min(1) })), async (_req, res) => {
    const { id, photoId } = res.locals.params as { id: number; photoId: number };
    await service.remove(ctx, currentUser(res.locals), id, photoId, (res.locals.query as { version: number }).version);
    res.status(204).end();
  });

  return router;
}
