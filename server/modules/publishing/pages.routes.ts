import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { AppError } from "../../lib/errors.ts";
import { renderIndex } from "../client/client.routes.ts";
import { getPublic, sitemapEntries } from "./public.service.ts";
import { vehicleHeadTags } from "./seo.ts";

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/**
 * The public HTML pages that need the server: each condition page carries its own title, description, canonical
 * URL, Open Graph and Twitter tags and schema.org JSON-LD, and the right status (404 never published, 410 withdrawn).
 */
export function pagesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get(["/vehicles/:slug", "/vehicles/:slug/card", "/vehicles/:slug/revisions/:n"], async (req, res, next) => {
    const slug = String(req.params.slug);
    if (!/^[a-z0-9-]{1,120}$/.test(slug)) return next();
    let status = 200;
    let head = "";
    try {
      const v = await getPublic(ctx, slug);
      head = vehicleHeadTags(v.snapshot, v.status, v.url, ctx.config.publicUrl);
      // The page's own data, so the condition page renders without a second round trip (a data block, never run).
      head += `\n    <script type="application/json" id="fr-page-data">${JSON.stringify({ slug, vehicle: v }).replace(/</g, "\\u003c")}</script>`;
      if (req.path.endsWith("/card")) head += `\n    <meta name="robots" content="noindex" />`;
    } catch (err) {
      if (!(err instanceof AppError) || (err.status !== 404 && err.status !== 410)) throw err;
      status = err.status;
      head = `<title>${status === 410 ? "No longer advertised" : "Not found"}</title>\n    <meta name="robots" content="noindex" />`;
    }
    const html = renderIndex(head);
    if (!html) return next();
    res.status(status).setHeader("Cache-Control", "no-cache").type("html").send(html);
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
