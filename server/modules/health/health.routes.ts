import { Router } from "express";
import { sql } from "drizzle-orm";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get(
    "/",
    ...route({ allow: "anyone" }, async ({ res }) => {
      res.setHeader("Cache-Control", "no-store");
      try {
        await ctx.database.db.execute(sql`select 1`);
        return { ok: true, db: "up" };
      } catch {
        res.status(503).json({ ok: false, db: "down" });
        return undefined;
      }
    }),
  );
  return router;
}
