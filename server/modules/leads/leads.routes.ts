import { Router } from "express";
import { z } from "zod";
import { desc, eq } from "drizzle-orm";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { notFound } from "../../lib/errors.ts";
import { capturedMail, outbox } from "../../db/schema/index.ts";
import { enquirySchema, leadListQuerySchema, leadMessageSchema, shareVehicleSchema, updateLeadSchema, type EnquiryInput, type LeadListQuery, type UpdateLeadInput } from "../../../shared/schemas/enquiries.ts";
import * as service from "./leads.service.ts";

const idParams = z.object({ id: z.coerce.number().int().positive() });
const slugParams = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,120}$/) });

/** /api/leads: sales and admin work leads; marketing sees counts only; workshop none. */
export function leadsRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get("/stats", requireRole("admin", "sales", "marketing"), async (_req, res) => {
    res.json(await service.leadCounts(ctx, currentUser(res.locals)));
  });
  router.use(requireRole("admin", "sales"));
  router.get("/", validate("query", leadListQuerySchema), async (_req, res) => {
    res.json({ leads: await service.listLeads(ctx, currentUser(res.locals), res.locals.query as LeadListQuery) });
  });
  router.get("/:id", validate("params", idParams), async (_req, res) => {
    res.json({ lead: await service.getLead(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id) });
  });
  router.patch("/:id", validate("params", idParams), validate("body", updateLeadSchema), async (_req, res) => {
    res.json({ lead: await service.updateLead(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id, res.locals.body as UpdateLeadInput) });
  });
  router.post("/:id/messages", validate("params", idParams), validate("body", leadMessageSchema), async (_req, res) => {
    res.status(201).json({ lead: await service.replyToLead(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id, (res.locals.body as { body: string }).body) });
  });
  return router;
}

/** POST /api/public/vehicles/:slug/enquiries: anyone. */
export function enquiryRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post("/:slug/enquiries", validate("params", slugParams), validate("body", enquirySchema), async (req, res) => {
    await service.submitEnquiry(ctx, (res.locals.params as { slug: string }).slug, res.locals.body as EnquiryInput, req.ip ?? "unknown");
    res.status(201).json({ accepted: true, next: "A salesperson will reply, usually within one working day. A copy of your message is on its way to your inbox if you gave an e-mail address." });
  });
  return router;
}

/** POST /api/vehicles/:id/share: sales and admin send the condition page. */
export function shareRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.post("/share", requireRole("admin", "sales"), validate("params", idParams), validate("body", shareVehicleSchema), async (_req, res) => {
    res.status(201).json(await service.shareVehicle(ctx, currentUser(res.locals), (res.locals.params as { id: number }).id, res.locals.body as never));
  });
  return router;
}

/** /api/mail: the admin's view of mail going out, and in demo mode what the local catcher received. */
export function mailRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole("admin"));
  router.get("/outbox", async (_req, res) => {
    const rows = await ctx.database.db
      .select({ id: outbox.id, to: outbox.toAddress, subject: outbox.subject, kind: outbox.kind, status: outbox.status, attempts: outbox.attempts, lastError: outbox.lastError, createdAt: outbox.createdAt, sentAt: outbox.sentAt })
      .from(outbox)
      .orderBy(desc(outbox.id))
      .limit(100);
    res.json({ outbox: rows, demo: ctx.config.demoMail });
  });
  router.post("/outbox/retry", async (_req, res) => {
    await ctx.mail.retryNow();
    res.json({ ok: true });
  });
  router.get("/captured", async (_req, res) => {
    if (!ctx.config.demoMail) throw notFound("Captured mail (demo mode only)");
    const rows = await ctx.database.db.select().from(capturedMail).orderBy(desc(capturedMail.id)).limit(100);
    res.json({ mail: rows.map((m) => ({ ...m, receivedAt: m.receivedAt.toISOString() })) });
  });
  router.get("/captured/:id", validate("params", idParams), async (_req, res) => {
    if (!ctx.config.demoMail) throw notFound("Captured mail (demo mode only)");
    const [m] = await ctx.database.db.select().from(capturedMail).where(eq(capturedMail.id, (res.locals.params as { id: number }).id));
    if (!m) throw notFound("That mail");
    res.json({ mail: { ...m, receivedAt: m.receivedAt.toISOString() } });
  });
  // A mail's HTML as its own document for the viewer's sandboxed frame. Mails carry inline styles, which the app's
  // own policy refuses (a srcdoc frame would inherit it); this answer gets a policy of its own: styles and our images
  // only, no scripts, a sandbox, framed by our pages alone.
  router.get("/captured/:id/html", validate("params", idParams), async (_req, res) => {
    if (!ctx.config.demoMail) throw notFound("Captured mail (demo mode only)");
    const [m] = await ctx.database.db.select({ html: capturedMail.html }).from(capturedMail).where(eq(capturedMail.id, (res.locals.params as { id: number }).id));
    if (!m?.html) throw notFound("That mail's HTML");
    res
      .set({
        "Content-Type": "text/html; charset=utf-8",
        "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; img-src 'self' data:; sandbox; frame-ancestors 'self'",
        "Cache-Control": "no-store",
        "X-Frame-Options": "SAMEORIGIN",
      })
      .send(m.html);
  });
  return router;
}
