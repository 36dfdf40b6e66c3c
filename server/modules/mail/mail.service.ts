import type { AppContext } from "../../lib/context.ts";
import { notFound } from "../../lib/errors.ts";
import type { capturedMail } from "../../db/schema/index.ts";
import * as queries from "./mail.queries.ts";

/** The admin's view of mail going out; `demo` says whether the local catcher receives it (no SMTP_HOST). */
export async function outboxView(ctx: AppContext) {
  return { outbox: await queries.recentOutbox(ctx.database.db), demo: ctx.config.demoMail };
}

/** Sends what waits in the outbox now instead of at each mail's next attempt. */
export async function retryNow(ctx: AppContext) {
  await ctx.mail.retryNow();
  return { ok: true };
}

// Captured mail exists only in demo mode: outside it the catcher never runs, so the screens answer 404.
function demoOnly(ctx: AppContext) {
  if (!ctx.config.demoMail) throw notFound("Captured mail (demo mode only)");
}

type CapturedMail = typeof capturedMail.$inferSelect;

const presentCaptured = (m: CapturedMail) => ({ ...m, receivedAt: m.receivedAt.toISOString() });

export async function capturedList(ctx: AppContext) {
  demoOnly(ctx);
  return { mail: (await queries.recentCapturedMail(ctx.database.db)).map(presentCaptured) };
}

export async function captured(ctx: AppContext, id: number) {
  demoOnly(ctx);
  const m = await queries.capturedMailById(ctx.database.db, id);
  if (!m) throw notFound("That mail");
  return { mail: presentCaptured(m) };
}

export async function capturedHtml(ctx: AppContext, id: number): Promise<string> {
  demoOnly(ctx);
  const html = await queries.capturedMailHtml(ctx.database.db, id);
  if (!html) throw notFound("That mail's HTML");
  return html;
}
