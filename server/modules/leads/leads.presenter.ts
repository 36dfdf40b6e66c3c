import type { Lead, leadNotes } from "../../db/schema/index.ts";
import { LEAD_STATUS_LABELS } from "../../../shared/constants/leads.ts";

export interface LeadVehicle {
  title: string;
  stockNumber: string;
  slug: string | null;
}

/** A lead as the list shows it: the buyer's details, where it stands, and its age in whole days. */
export function presentLead(l: Lead, extra: { vehicle?: LeadVehicle; assigneeName?: string | null; now: Date }) {
  return {
    id: l.id,
    vehicleId: l.vehicleId,
    vehicle: extra.vehicle ?? null,
    revisionNumber: l.revisionNumber,
    name: l.name,
    email: l.email,
    phone: l.phone,
    message: l.message,
    preferredContact: l.preferredContact,
    tradeIn: l.tradeIn,
    status: l.status,
    statusLabel: LEAD_STATUS_LABELS[l.status],
    assigneeId: l.assigneeId,
    assigneeName: extra.assigneeName ?? null,
    followUpOn: l.followUpOn,
    ageDays: Math.floor((extra.now.getTime() - l.createdAt.getTime()) / 86_400_000),
    createdAt: l.createdAt.toISOString(),
    version: l.version,
  };
}
export type LeadView = ReturnType<typeof presentLead>;

/** A lead read with its vehicle and assignee (leads.queries.ts); a vehicle never published is named by its stock number. */
export const presentLeadRow = (r: { lead: Lead; title: string | null; stockNumber: string; slug: string | null; assigneeName: string | null }, now: Date) =>
  presentLead(r.lead, { vehicle: { title: r.title ?? r.stockNumber, stockNumber: r.stockNumber, slug: r.slug }, assigneeName: r.assigneeName, now });

/** The state of the mail behind a conversation entry, in the three words the page shows. */
const mailState = (status: string) => (status === "sent" ? "sent" : status === "failed" ? "failed" : "queued");

/** GET /api/leads/:id (inside `{ lead }`): the lead and its whole conversation, each mail with whether it went. */
export function presentLeadDetail(lead: LeadView, notes: Array<typeof leadNotes.$inferSelect>, mails: Array<{ id: number; status: string }>) {
  return {
    ...lead,
    conversation: notes.map((n) => {
      const m = mails.find((x) => x.id === n.outboxId);
      return { id: n.id, kind: n.kind, body: n.body, by: n.userName, at: n.at.toISOString(), mailStatus: m ? mailState(m.status) : null };
    }),
  };
}
export type LeadDetail = ReturnType<typeof presentLeadDetail>;
export type ConversationItem = LeadDetail["conversation"][number];

/** GET /api/leads/stats: enquiries per vehicle and per source, never the buyers' details. */
export function presentLeadCounts(
  perVehicle: Array<{ vehicleId: number; stockNumber: string; title: string | null; n: number | string }>,
  perSource: Array<{ source: string; n: number | string }>,
) {
  return { perVehicle: perVehicle.map((r) => ({ ...r, n: Number(r.n) })), perSource: perSource.map((r) => ({ ...r, n: Number(r.n) })) };
}
export type LeadCounts = ReturnType<typeof presentLeadCounts>;
