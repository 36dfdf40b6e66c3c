import { Router, type Response } from "express";
import { pipeline } from "node:stream";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { numericIdParamSchema } from "../../../shared/schemas/common.ts";
import { createFeedSchema, previewFeedSchema, updateFeedSchema, type CreateFeedInput, type PreviewFeedInput, type UpdateFeedInput } from "../../../shared/schemas/feeds.ts";
import * as service from "./feeds.service.ts";
import type { FeedStream } from "./feeds.service.ts";

/** A file name from the feed's name: letters and digits of any script, the rest as hyphens. */
const fileName = (name: string, ext: string) => `${name.normalize("NFKC").replace(/[^\p{L}\p{N}]+/gu, "-").replace(/^-+|-+$/g, "").slice(0, 80) || "feed"}.${ext}`;

export function sendFeed(res: Response, stream: FeedStream, done?: (complete: boolean) => void) {
  res.status(200).type(stream.contentType);
  pipeline(stream.body, res, (err) => done?.(!err));
}

/** /api/feeds: admin and marketing manage feeds; everyone else gets 403, nobody signed in 401. */
export function feedsRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole("admin", "marketing"));

  router.get("/", async (_req, res) => {
    res.json({ feeds: await service.list(ctx, currentUser(res.locals)) });
  });

  router.post("/", validate("body", createFeedSchema), async (_req, res) => {
    res.status(201).json(await service.create(ctx, currentUser(res.locals), res.locals.body as CreateFeedInput));
  });

  router.post("/preview", validate("body", previewFeedSchema), async (_req, res) => {
    res.json({ preview: await service.preview(ctx, currentUser(res.locals), res.locals.body as PreviewFeedInput) });
  });

  router.get("/:id", validate("params", numericIdParamSchema), async (_req, res) => {
    res.json({ feed: await service.get(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id) });
  });

  router.patch("/:id", validate("params", numericIdParamSchema), validate("body", updateFeedSchema), async (_req, res) => {
    const { id } = res.locals.params as { id: number };
    res.json({ feed: await service.update(ctx, currentUser(res.locals), id, res.locals.body as UpdateFeedInput) });
  });

  router.post("/:id/rotate", validate("params", numericIdParamSchema), async (_req, res) => {
    res.json(await service.rotate(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id));
  });

  router.delete("/:id", validate("params", numericIdParamSchema), async (_req, res) => {
    await service.revoke(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id);
    res.status(204).end();
  });

  /** The same output a portal gets, for a signed-in person to save; not logged as a portal fetch. */
  router.get("/:id/download", validate("params", numericIdParamSchema), async (_req, res) => {
    const feed = await service.feedForDownload(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id);
    const stream = await service.openFeedStream(ctx, feed);
    res.setHeader("Content-Disposition", `attachment; filename="${fileName(feed.name, feed.format).replace(/[^\x20-\x7e]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(fileName(feed.name, feed.format))}`);
    res.setHeader("Cache-Control", "no-store");
    sendFeed(res, stream);
  });

  return router;
}
