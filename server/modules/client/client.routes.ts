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

/**
 * The page paths the client router draws (src/app/router.tsx; tests/api/not-found.test.ts keeps the two lists
 * together). The condition pages (/vehicles/:slug…) are answered by publishing/pages.routes.ts, which knows which
 * slugs exist. Anything else gets the app shell with status 404, where the client draws its not-found page.
 */
export const CLIENT_PAGES = [
  "/",
  "/sign-in",
  "/forgot-password",
  "/reset-password",
  "/accept-invite",
  "/app",
  "/app/vehicles",
  "/app/vehicles/new",
  "/app/vehicles/:id",
  "/app/vehicles/:id/photos",
  "/app/vehicles/:id/walkaround",
  "/app/vehicles/:id/checks",
  "/app/leads",
  "/app/leads/:id",
  "/app/mail",
  "/app/feeds",
  "/app/users",
  "/app/settings",
];

// One route answers every page path (the route inventory and policy table list it once); the patterns match here.
const pagePatterns = CLIENT_PAGES.map((p) => new RegExp(`^${p.replace(/:[a-z]+/g, "[^/]+").replace(/\/$/, "")}/?$`, "i"));
const isClientPage = (path: string) => pagePatterns.some((re) => re.test(path));

const NOT_FOUND_HEAD = `<title>Not found</title>\n    <meta name="robots" content="noindex" />`;

export function clientRoutes(_ctx: AppContext): Router {
  const router = Router();
  router.use(
    "/assets",
    express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "365d", index: false, fallthrough: false }),
  );
  router.use(express.static(clientDir, { index: false, maxAge: "1h" }));
  const shell = (status: 200 | 404, head?: string): express.RequestHandler => (_req, res) => {
    const indexHtml = renderIndex(head);
    if (!indexHtml) {
      res.status(503).type("text/plain").send("The client has not been built yet. Run `npm run build` or `npm start`.");
      return;
    }
    res.status(status).setHeader("Cache-Control", "no-cache");
    res.type("html").send(indexHtml);
  };
  const page = shell(200);
  // A soft 404 (the shell with 200) reads as content to search engines; the status says there is nothing here.
  const notFound = shell(404, NOT_FOUND_HEAD);
  router.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api/")) return next();
    (isClientPage(req.path) ? page : notFound)(req, res, next);
  });
  return router;
}
