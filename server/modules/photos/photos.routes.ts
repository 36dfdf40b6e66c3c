import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { photoUpload } from "../../middleware/upload.ts";
import { badRequest, AppError } from "../../lib/errors.ts";
import { photoParams, vehicleIdParams, versionQuery } from "../../../shared/schemas/common.ts";
import { photoOrderSchema, photoUpdateSchema } from "../../../shared/schemas/evidence.ts";
import { PHOTO_LIMITS } from "../../../shared/constants/evidence.ts";
import * as service from "./photos.service.ts";
import { presentUpload } from "./photos.presenter.ts";

/** Mounted at /api/vehicles/:id/photos. */
export function photosRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get("/limits", ...route({ allow: "vehicles.read" }, () => ({ limits: PHOTO_LIMITS })));

  router.get("/", ...route({ allow: "vehicles.read", params: vehicleIdParams }, async ({ user, params }) => ({ photos: await service.list(ctx, user, params.id) })));

  // Multipart: the guard and the path are checked before multer reads a byte of the upload.
  router.post(
    "/",
    ...route({ allow: "evidence.write", params: vehicleIdParams, uses: [photoUpload], status: 201 }, async ({ user, params, req }) => {
      const files = Array.isArray(req.files) ? req.files : [];
      if (!files.length) throw badRequest("Choose at least one photo.", { photos: "Send one or more files in the field named “photos”." });
      const { accepted, refused } = await service.upload(ctx, user, params.id, files);
      if (!accepted.length) {
        const first = refused[0];
        throw new AppError(first.status, first.code, refused.length === 1 ? first.reason : "None of the files could be used.", undefined, { refused });
      }
      return presentUpload(accepted, refused);
    }),
  );

  router.patch(
    "/:photoId",
    ...route({ allow: "evidence.write", params: photoParams, body: photoUpdateSchema }, async ({ user, params, body }) => ({ photo: await service.update(ctx, user, params.id, params.photoId, body) })),
  );

  router.put("/order", ...route({ allow: "evidence.write", params: vehicleIdParams, body: photoOrderSchema }, async ({ user, params, body }) => ({ photos: await service.reorder(ctx, user, params.id, body.order) })));

  router.delete(
    "/:photoId",
    ...route({ allow: "evidence.write", params: photoParams, query: versionQuery, status: 204 }, ({ user, params, query }) => service.remove(ctx, user, params.id, params.photoId, query.version)),
  );

  return router;
}
