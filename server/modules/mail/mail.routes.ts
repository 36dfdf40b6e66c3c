import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { idParams } from "../../../shared/schemas/common.ts";
import * as service from "./mail.service.ts";

/** /api/mail: the admin's view of mail going out, and in demo mode what the local catcher received. */
export function mailRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get("/outbox", ...route({ allow: "mail.read" }, () => service.outboxView(ctx)));

  router.post("/outbox/retry", ...route({ allow: "mail.retry" }, () => service.retryNow(ctx)));

  router.get("/captured", ...route({ allow: "mail.read" }, () => service.capturedList(ctx)));

  router.get("/captured/:id", ...route({ allow: "mail.read", params: idParams }, ({ params }) => service.captured(ctx, params.id)));

  // A mail's HTML as its own document for the viewer's sandboxed frame. Mails carry inline styles, which the app's
  // own policy refuses (a srcdoc frame would inherit it); this answer gets a policy of its own: styles and our images
  // only, no scripts, a sandbox, framed by our pages alone.
  router.get(
    "/captured/:id/html",
    ...route({ allow: "mail.read", params: idParams }, async ({ params, res }) => {
      const html = await service.capturedHtml(ctx, params.id);
      res
        .set({
          "Content-Type": "text/html; charset=utf-8",
          "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; img-src 'self' data:; sandbox; frame-ancestors 'self'",
          "Cache-Control": "no-store",
          "X-Frame-Options": "SAMEORIGIN",
        })
        .send(html);
    }),
  );

  return router;
}
