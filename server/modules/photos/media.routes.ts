import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { KEY_PATTERN } from "../../lib/storage.ts";

const TYPES: Record<string, string> = { jpg: "image/jpeg", webp: "image/webp", avif: "image/avif" };

/**
 * Serves stored images by their content-hashed keys: only image types, never a type taken from the upload,
 * nosniff, and cached for a year since a key's bytes never change.
 */
export function mediaRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/media/{*key}", async (req, res, next) => {
    // "/media/" alone matches with no key at all (the wildcard is optional): a 404 like any other unknown key.
    const key = ((req.params as { key?: string[] }).key ?? []).join("/");
    if (!KEY_PATTERN.test(key) || !(await ctx.storage.exists(key))) {
      res.status(404).type("text/plain").send("Not found");
      return;
    }
    res.setHeader("Content-Type", TYPES[key.split(".").pop()!]);
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.setHeader("Cache-Control", "public, max-age=31536000, immutable");
    res.setHeader("Content-Security-Policy", "default-src 'none'; sandbox");
    res.setHeader("Cross-Origin-Resource-Policy", "same-site");
    ctx.storage.stream(key).on("error", next).pipe(res);
  });
  return router;
}
