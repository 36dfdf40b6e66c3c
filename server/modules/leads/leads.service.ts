import { and, asc, desc, eq, inArray, like, lt, or, sql, type SQL } from "drizzle-orm";
import { can } from "../../../shared/permissions.ts";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import { leadNotes, leads, outbox, revisions, users, vehicles } from "../../db/schema/index.ts";
import { AppError, badRequest, notFound, staleVersion } from "../../lib/errors.ts";
import { consume } from "../../lib/rate-limit.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import { getDealership, primaryDealership, todayFor } from "../dealerships/dealerships.service.ts";
import { enqueueMail } from "../mail/outbox.ts";
import { requireVehicle } from "../vehicles/vehicles.service.ts";
import { enquiryConfirmation, enquiryToStaff, leadReply, shareMail, type EnquiryMailData } from "../mail/templates.ts";
import { MIN_FILL_MS, CONTACT_LABELS, LEAD_STATUS_LABELS } from "../../../shared/constants/leads.ts";
import { presentLeadCounts, presentLeadDetail, presentLeadRow, type LeadCounts, type LeadDetail } from "./leads.presenter.ts";
import { leadsWithVehicle } from "./leads.queries.ts";
import type { EnquiryInput, LeadListQuery, UpdateLeadInput } from "../../../shared/schemas/enquiries.ts";

/**
 * A buyer's enquiry: spam defences (honeypot, minimum fill time, rate limits per address and per vehicle), then the
 * lead and both mails in one transaction. The mails go out after the commit; an SMTP outage only delays them.
 */
export async function submitEnquiry(ctx: AppContext, slug: string, input: EnquiryInput, ip: string) {
  const { db } = ctx.database;
  const [v] = await db.select().from(vehicles).where(eq(vehicles.publicSlug, slug)).limit(1);
  if (!v || !v.currentRevisionId || !["live", "reserved"].includes(v.status)) throw notFound("That vehicle");
  // A filled honeypot or an instant submit is a script: answer as if accepted, store nothing.
  if (input.website || ctx.now().getTime() - input.startedAt < MIN_FILL_MS) return { accepted: true as const };
  await consume(ctx.limiters.enquiryPerAddress, ip, "enquiries from your network");
  await consume(ctx.limiters.enquiryPerVehicle, String(v.id), "enquiries about this vehicle just now");
  const d = await getDealership(db, v.dealershipId);
  const [rev] = await db.select({ number: revisions.number, title: revisions.title }).from(revisions).where(eq(revisions.id, v.currentRevisionId));
  const revisionNumber = input.revision && input.revision <= v.lastRevisionNumber ? input.revision : rev.number;
  const url = `${ctx.config.publicUrl}/vehicles/${slug}`;
  const [assignee] = v.salespersonId ? await db.select().from(users).where(and(eq(users.id, v.salespersonId), eq(users.active, true))) : [];
  const staffAddress = assignee?.email ?? d.email;
  await db.transaction(async (tx) => {
    const tradeIn = input.tradeIn && (input.tradeIn.make || input.tradeIn.model) ? input.tradeIn : null;
    const [res] = await tx.insert(leads).values({
      dealershipId: d.id, vehicleId: v.id, revisionNumber, name: input.name, email: input.email, phone: input.phone, message: input.message,
      preferredContact: input.preferredContact, tradeIn, consent: input.consent, assigneeId: assignee?.id ?? null,
    });
    await tx.insert(leadNotes).values({ leadId: res.insertId, kind: "enquiry", body: input.message, userName: input.name });
    const data: EnquiryMailData = {
      vehicleTitle: rev.title, stockNumber: v.stockNumber, url, name: input.name, email: input.email, phone: input.phone, message: input.message,
      preferredContact: CONTACT_LABELS[input.preferredContact], leadUrl: `${ctx.config.publicUrl}/app/leads/${res.insertId}`,
      tradeIn: tradeIn ? [tradeIn.year, tradeIn.make, tradeIn.model, tradeIn.odometerKm ? `${tradeIn.odometerKm} km` : null].filter(Boolean).join(" ") : null,
    };
    if (staffAddress) await enqueueMail(tx, { to: staffAddress, kind: "enquiry_staff", ...enquiryToStaff(d, data) }, ctx.now());
    if (input.email) await enqueueMail(tx, { to: input.email, kind: "enquiry_confirmation", ...enquiryConfirmation(d, data) }, ctx.now());
  });
  ctx.mail.kick();
  return { accepted: true as const };
}

export async function listLeads(ctx: AppContext, actor: User, q: LeadListQuery) {
  const { db } = ctx.database;
  const d = await getDealership(db, actor.dealershipId);
  const where: Array<SQL | undefined> = [eq(leads.dealershipId, actor.dealershipId)];
  if (q.status?.length) where.push(inArray(leads.status, q.status));
  if (q.assignee === "me") where.push(eq(leads.assigneeId, actor.id));
  else if (q.assignee === "none") where.push(sql`${leads.assigneeId} is null`);
  else if (q.assignee) where.push(eq(leads.assigneeId, q.assignee));
  if (q.vehicleId) where.push(eq(leads.vehicleId, q.vehicleId));
  if (q.q) where.push(or(like(leads.name, `%${q.q}%`), like(leads.email, `%${q.q}%`), like(leads.phone, `%${q.q}%`)));
  const today = todayFor(ctx, d);
  if (q.due === "overdue") where.push(lt(leads.followUpOn, today));
  if (q.due === "today") where.push(eq(leads.followUpOn, today));
  const page = q.page ?? 1;
  const rows = await leadsWithVehicle(db)
    .where(and(...where))
    .orderBy(sql`field(${leads.status}, 'waiting', 'talking', 'test_drive', 'offer', 'won', 'lost')`, desc(leads.createdAt))
    .limit(50)
    .offset((page - 1) * 50);
  const now = ctx.now();
  return rows.map((r) => presentLeadRow(r, now));
}

export async function getLead(ctx: AppContext, actor: User, id: number): Promise<LeadDetail> {
  const { db } = ctx.database;
  const [r] = await leadsWithVehicle(db)
    .where(and(eq(leads.dealershipId, actor.dealershipId), eq(leads.id, id)));
  if (!r) throw notFound("That lead");
  const notes = await db.select().from(leadNotes).where(eq(leadNotes.leadId, id)).orderBy(asc(leadNotes.at), asc(leadNotes.id));
  const mailIds = notes.map((n) => n.outboxId).filter((x): x is number => x != null);
  const mails = mailIds.length
    ? await db.select({ id: outbox.id, status: outbox.status, sentAt: outbox.sentAt }).from(outbox).where(inArray(outbox.id, mailIds))
    : [];
  return presentLeadDetail(presentLeadRow(r, ctx.now()), notes, mails);
}

export async function updateLead(ctx: AppContext, actor: User, id: number, input: UpdateLeadInput) {
  await ctx.database.db.transaction(async (tx) => {
    const [l] = await tx.select().from(leads).where(and(eq(leads.dealershipId, actor.dealershipId), eq(leads.id, id))).for("update");
    if (!l) throw notFound("That lead");
    if (l.version !== input.version) throw staleVersion({ version: l.version, status: l.status });
    if (input.assigneeId) {
      const [u] = await tx.select().from(users).where(and(eq(users.id, input.assigneeId), eq(users.dealershipId, actor.dealershipId), eq(users.active, true)));
      if (!u || !can(u, "leads.work")) throw badRequest("Assign the lead to an active salesperson or admin.", { assigneeId: "Choose an active salesperson or admin." });
    }
    const set = {
      ...(input.status ? { status: input.status } : {}),
      ...(input.assigneeId !== undefined ? { assigneeId: input.assigneeId } : {}),
      ...(input.followUpOn !== undefined ? { followUpOn: input.followUpOn } : {}),
    };
    await tx.update(leads).set({ ...set, version: l.version + 1 }).where(eq(leads.id, id));
    if (input.status && input.status !== l.status) {
      await tx.insert(leadNotes).values({ leadId: id, kind: "status", body: `${LEAD_STATUS_LABELS[l.status]} → ${LEAD_STATUS_LABELS[input.status]}`, userId: actor.id, userName: actor.name });
    }
    if (input.note) await tx.insert(leadNotes).values({ leadId: id, kind: "note", body: input.note, userId: actor.id, userName: actor.name });
    await recordAudit(tx, actorOf(actor), { action: "lead_updated", entityType: "lead", entityId: id, before: { status: l.status, assigneeId: l.assigneeId, followUpOn: l.followUpOn }, after: set });
  });
  return getLead(ctx, actor, id);
}

/** A reply to the buyer by e-mail, kept in the lead's conversation. */
export async function replyToLead(ctx: AppContext, actor: User, id: number, body: string) {
  const lead = await getLead(ctx, actor, id);
  if (!lead.email) throw new AppError(409, "no_email", "This buyer gave no e-mail address; call them instead.");
  const d = await getDealership(ctx.database.db, actor.dealershipId);
  await ctx.database.db.transaction(async (tx) => {
    const url = lead.vehicle?.slug ? `${ctx.config.publicUrl}/vehicles/${lead.vehicle.slug}` : ctx.config.publicUrl;
    const outboxId = await enqueueMail(tx, { to: lead.email, kind: "lead_reply", ...leadReply(d, { toName: lead.name, fromName: actor.name, vehicleTitle: lead.vehicle?.title ?? "vehicle", body, url }) }, ctx.now());
    await tx.insert(leadNotes).values({ leadId: id, kind: "mail_out", body, userId: actor.id, userName: actor.name, outboxId });
    if (lead.status === "waiting") await tx.update(leads).set({ status: "talking", version: sql`${leads.version} + 1` }).where(eq(leads.id, id));
  });
  ctx.mail.kick();
  return getLead(ctx, actor, id);
}

/** For marketing: enquiries per vehicle and per source, never the buyers' details. */
export async function leadCounts(ctx: AppContext, actor: User): Promise<LeadCounts> {
  const { db } = ctx.database;
  const perVehicle = await db
    .select({ vehicleId: leads.vehicleId, stockNumber: vehicles.stockNumber, title: revisions.title, n: sql<number>`count(*)` })
    .from(leads)
    .innerJoin(vehicles, eq(vehicles.id, leads.vehicleId))
    .leftJoin(revisions, eq(revisions.id, vehicles.currentRevisionId))
    .where(eq(leads.dealershipId, actor.dealershipId))
    .groupBy(leads.vehicleId, vehicles.stockNumber, revisions.title)
    .orderBy(desc(sql`count(*)`));
  const perSource = await db.select({ source: leads.source, n: sql<number>`count(*)` }).from(leads).where(eq(leads.dealershipId, actor.dealershipId)).groupBy(leads.source);
  return presentLeadCounts(perVehicle, perSource);
}

/** A salesperson sends a buyer the condition page. */
export async function shareVehicle(ctx: AppContext, actor: User, vehicleId: number, input: { email: string; name: string; message: string }) {
  const { db } = ctx.database;
  const v = await requireVehicle(db, actor.dealershipId, vehicleId);
  if (!v.publicSlug || !["live", "reserved"].includes(v.status)) throw new AppError(409, "not_public", "Publish the vehicle first: buyers can only open a published condition page.");
  const d = await getDealership(db, actor.dealershipId);
  const [rev] = await db.select({ title: revisions.title }).from(revisions).where(eq(revisions.id, v.currentRevisionId!));
  await db.transaction(async (tx) => {
    await enqueueMail(tx, { to: input.email, kind: "share", ...shareMail(d, { toName: input.name, fromName: actor.name, vehicleTitle: rev.title, url: `${ctx.config.publicUrl}/vehicles/${v.publicSlug}`, message: input.message }) }, ctx.now());
    await recordAudit(tx, actorOf(actor), { action: "shared_by_mail", entityType: "vehicle", entityId: vehicleId, after: { to: input.email } });
  });
  ctx.mail.kick();
  return { queued: true };
}

export { primaryDealership };
