import { Router, type Response } from "express";
import { pipeline } from "node:stream";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { idParams } from "../../../shared/schemas/common.ts";
import { createFeedSchema, previewFeedSchema, updateFeedSchema } from "../../../shared/schemas/feeds.ts";
import * as service from "./feeds.service.ts";
import type { FeedStream } from "./feeds.service.ts";

/** A file name from the feed's name: letters and digits of any script, the rest as hyphens. */
const fileName = (name: string, ext: string) => `${name.normalize("NFKC").replace(/[^\p{L}\p{N}]+/gu, "-").replace(/^-+|-+$/g, "").slice(0, 80) || "feed"}.${ext}`;

export function sendFeed(res: Response, stream: FeedStream, done?: (complete: boolean) => void) {
  res.status(200).type(stream.contentType);
  pipeline(stream.body, res, (err) => done?.(!err));
}

/** /api/feeds: the roles of `feeds.manage` manage feeds; everyone else gets 403, nobody signed in 401. */
export function feedsRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get("/", ...route({ allow: "feeds.manage" }, async ({ user }) => ({ feeds: await service.list(ctx, user) })));

  router.post("/", ...route({ allow: "feeds.manage", body: createFeedSchema, status: 201 }, ({ user, body }) => service.create(ctx, user, body)));

  router.post("/preview", ...route({ allow: "feeds.manage", body: previewFeedSchema }, async ({ user, body }) => ({ preview: await service.preview(ctx, user, body) })));

  router.get("/:id", ...route({ allow: "feeds.manage", params: idParams }, async ({ user, params }) => ({ feed: await service.get(ctx, user, params.id) })));

  router.patch("/:id", ...route({ allow: "feeds.manage", params: idParams, body: updateFeedSchema }, async ({ user, params, body }) => ({ feed: await service.update(ctx, user, params.id, body) })));

  router.post("/:id/rotate", ...route({ allow: "feeds.manage", params: idParams }, ({ user, params }) => service.rotate(ctx, user, params.id)));

  router.delete("/:id", ...route({ allow: "feeds.manage", params: idParams, status: 204 }, ({ user, params }) => service.revoke(ctx, user, params.id)));

  /**
   * The same output a portal gets, for a signed-in person to save; not logged as a portal fetch. A CSV starts with a
   * byte order mark here only: a spreadsheet program opening the file then reads UTF-8 (portals parse without one).
   */
  router.get(
    "/:id/download",
    ...route({ allow: "feeds.manage", params: idParams }, async ({ user, params, res }) => {
      const feed = await service.feedForDownload(ctx, user, params.id);
      const stream = await service.openFeedStream(ctx, feed, undefined, { bom: true });
      res.setHeader("Content-Disposition", `attachment; filename="${fileName(feed.name, feed.format).replace(/[^\x20-\x7e]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(fileName(feed.name, feed.format))}`);
      res.setHeader("Cache-Control", "no-store");
      sendFeed(res, stream);
    }),
  );

  return router;
}
