import express, { Router } from "express";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { AppContext } from "../../lib/context.ts";

export const clientDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../../dist/client");

/**
 * Serves the built client: hashed assets with a year's cache, and index.html for every other page path so the
 * client router takes over. Public pages that need server-written head tags hook in here.
 */
let cachedIndex: string | null = null;
/** The built index.html with extra tags in its head (the server-written title, Open Graph and JSON-LD). */
export function renderIndex(headTags = ""): string | null {
  cachedIndex ??= existsSync(path.join(clientDir, "index.html")) ? readFileSync(path.join(clientDir, "index.html"), "utf8") : null;
  if (!cachedIndex) return null;
  return headTags ? cachedIndex.replace(/<title>[^<]*<\/title>/, "").replace("<!--head-tags-->", headTags) : cachedIndex;
}

export function clientRoutes(_ctx: AppContext): Router {
  const router = Router();
  router.use(
    "/assets",
    express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "365d", index: false, fallthrough: false }),
  );
  router.use(express.static(clientDir, { index: false, maxAge: "1h" }));
  router.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api/")) return next();
    const indexHtml = renderIndex();
    if (!indexHtml) {
      res.status(503).type("text/plain").send("The client has not been built yet. Run `npm run build` or `npm start`.");
      return;
    }
    res.setHeader("Cache-Control", "no-cache");
    res.type("html").send(indexHtml);
  });
  return router;
}
