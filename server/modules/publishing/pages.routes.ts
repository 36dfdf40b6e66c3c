import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { AppError } from "../../lib/errors.ts";
import { renderIndex } from "../client/client.routes.ts";
import { publicRepresentation, sitemapEntries } from "./public.service.ts";
import { representation, sendRepresentation } from "./public-cache.ts";
import { vehicleHeadTags } from "./seo.ts";
import { slugParams } from "../../../shared/schemas/common.ts";

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/**
 * The public HTML pages that need the server: each condition page carries its own title, description, canonical
 * URL, Open Graph and Twitter tags and schema.org JSON-LD, and the right status (404 never published, 410 withdrawn).
 */
export function pagesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get(["/vehicles/:slug", "/vehicles/:slug/card", "/vehicles/:slug/revisions/:n"], async (req, res, next) => {
    // Not a slug a vehicle could have: the client's own not-found page, not a server-written one.
    const parsed = slugParams.safeParse(req.params);
    if (!parsed.success) return next();
    const { slug } = parsed.data;
    if (!renderIndex()) return next();
    const card = req.path.endsWith("/card");
    try {
      // Made once per revision (public-cache.ts); the slug's status and current revision are read every time.
      const page = await publicRepresentation(ctx, card ? "page-card" : "page", slug, undefined, (v) => {
        let head = vehicleHeadTags(v.snapshot, v.status, v.url, ctx.config.publicUrl);
        // The page's own data, so the condition page renders without a second round trip (a data block, never run).
        head += `\n    <script type="application/json" id="fr-page-data">${JSON.stringify({ slug, vehicle: v }).replace(/</g, "\\u003c")}</script>`;
        if (card) head += `\n    <meta name="robots" content="noindex" />`;
        return representation("text/html; charset=utf-8", renderIndex(head)!);
      });
      sendRepresentation(req, res, page, "no-cache");
    } catch (err) {
      if (!(err instanceof AppError) || (err.status !== 404 && err.status !== 410)) throw err;
      const head = `<title>${err.status === 410 ? "No longer advertised" : "Not found"}</title>\n    <meta name="robots" content="noindex" />`;
      res.status(err.status).setHeader("Cache-Control", "no-cache").type("html").send(renderIndex(head));
    }
  });

  router.get("/sitemap.xml", async (_req, res) => {
    const entries = [{ loc: `${ctx.config.publicUrl}/`, lastmod: null as string | null }, ...(await sitemapEntries(ctx))];
    const body = entries.map((e) => `  <url><loc>${esc(e.loc)}</loc>${e.lastmod ? `<lastmod>${e.lastmod}</lastmod>` : ""}</url>`).join("\n");
    res.type("application/xml").send(`<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${body}\n</urlset>\n`);
  });

  // No icon file: answer plainly rather than with the app's HTML.
  router.get("/favicon.ico", (_req, res) => {
    res.status(204).setHeader("Cache-Control", "public, max-age=86400").end();
  });

  router.get("/robots.txt", (_req, res) => {
    res.type("text/plain").send(`User-agent: *\nDisallow: /app\nDisallow: /api/\nDisallow: /sign-in\nAllow: /\nSitemap: ${ctx.config.publicUrl}/sitemap.xml\n`);
  });

  return router;
}
