import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { parseOr400 } from "../../middleware/validate.ts";
import { feedQuerySchema } from "../../../shared/schemas/feeds.ts";
import { notFound } from "../../lib/errors.ts";
import * as service from "./feeds.service.ts";
import { sendFeed } from "./feeds.routes.ts";

const FILE = /^([A-Za-z0-9_-]+)\.(csv|json|jsonld|xml)$/;

/**
 * GET /feeds/:token.(csv|json|jsonld|xml)[?since=ISO]: the secret URL a portal polls. Validators first (one small
 * query), so an unchanged feed answers 304 without reading a row; then the rows stream. Every fetch is logged.
 */
export function feedsPublicRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/feeds/:file", async (req, res) => {
    const m = FILE.exec(req.params.file);
    if (!m) throw notFound("That feed");
    const feed = await service.feedForToken(ctx, m[1], m[2]);
    const { since: sinceText } = parseOr400(feedQuerySchema, req.query, "query");
    const since = sinceText ? new Date(sinceText) : undefined;
    const log = (status: number, rows: number, bytes: number) =>
      service.recordFetch(ctx, feed.id, { ip: req.ip ?? null, userAgent: req.get("user-agent") ?? null, rows, bytes, status, since }).catch((err: unknown) => ctx.logger.error({ err }, "feed fetch not logged"));

    const v = await service.validators(ctx, feed, since);
    res.setHeader("ETag", v.etag);
    res.setHeader("Last-Modified", v.lastModified.toUTCString());
    res.setHeader("Cache-Control", "private, no-cache");
    res.setHeader("X-Robots-Tag", "noindex");
    if (req.fresh) {
      res.status(304).end();
      await log(304, 0, 0);
      return;
    }
    const stream = await service.openFeedStream(ctx, feed, since);
    sendFeed(res, stream, (complete) => {
      const { rows, bytes } = stream.counts();
      void log(complete ? 200 : 499, rows, bytes);
    });
  });
  return router;
}
