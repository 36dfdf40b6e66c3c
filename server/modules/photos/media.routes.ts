import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { KEY_PATTERN } from "../../lib/storage.ts";
import { publishedMedia } from "./published-media.ts";

const TYPES: Record<string, string> = { jpg: "image/jpeg", webp: "image/webp", avif: "image/avif" };

/**
 * Serves stored images by their content-hashed keys: only image types, never a type taken from the upload,
 * nosniff, and cached for a year since a key's bytes never change. Media a published revision shows may be
 * embedded by any site (portals hot-link the feed's photo URLs) and kept by shared caches; the rest (photos still
 * being prepared, or of vehicles never published) stays same-origin and private, so no shared cache keeps a copy
 * that would block a portal once the photo is published.
 */
export function mediaRoutes(ctx: AppContext): Router {
  const router = Router();
  const isPublished = publishedMedia(ctx.database.db);
  router.get("/media/{*key}", async (req, res, next) => {
    // "/media/" alone matches with no key at all (the wildcard is optional): a 404 like any other unknown key.
    const key = ((req.params as { key?: string[] }).key ?? []).join("/");
    const exists = KEY_PATTERN.test(key) && (await ctx.storage.exists(key));
    if (!exists) {
      res.status(404).type("text/plain").send("Not found");
      return;
    }
    // Only for a key that is stored: a missing or mistyped one costs no query.
    const published = await isPublished(key);
    res.setHeader("Content-Type", TYPES[key.split(".").pop()!]);
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.setHeader("Cache-Control", `${published ? "public" : "private"}, max-age=31536000, immutable`);
    res.setHeader("Content-Security-Policy", "default-src 'none'; sandbox");
    res.setHeader("Cross-Origin-Resource-Policy", published ? "cross-origin" : "same-origin");
    ctx.storage.stream(key).on("error", next).pipe(res);
  });
  return router;
}
