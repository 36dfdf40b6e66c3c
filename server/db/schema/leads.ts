import { boolean, date, index, int, mysqlEnum, mysqlTable, text, varchar } from "drizzle-orm/mysql-core";
import { CONTACT_PREFERENCES, LEAD_STATUSES } from "../../../shared/constants/leads.ts";
import { createdAt, editedRecord, jsonText, parentId, serialId } from "./columns.ts";
import { vehicles } from "./vehicles.ts";

/** A buyer's enquiry about one vehicle, worked by sales as a lead. */
export const leads = mysqlTable(
  "leads",
  {
    id: serialId(),
    dealershipId: int().notNull(),
    vehicleId: parentId(() => vehicles.id),
    /** The revision the buyer was reading when they wrote. */
    revisionNumber: int(),
    name: varchar({ length: 120 }).notNull(),
    email: varchar({ length: 254 }).notNull().default(""),
    phone: varchar({ length: 40 }).notNull().default(""),
    message: text().notNull(),
    preferredContact: mysqlEnum(CONTACT_PREFERENCES).notNull(),
    tradeIn: jsonText<{ make: string; model: string; year?: number | null; odometerKm?: number | null } | null>(),
    consent: boolean().notNull(),
    source: varchar({ length: 40 }).notNull().default("condition_page"),
    status: mysqlEnum(LEAD_STATUSES).notNull().default("waiting"),
    assigneeId: varchar({ length: 255 }),
    followUpOn: date({ mode: "string" }),
    ...editedRecord(),
  },
  (t) => [index("leads_dealership_idx").on(t.dealershipId, t.status, t.createdAt), index("leads_vehicle_idx").on(t.vehicleId)],
);

/** The conversation on a lead: staff notes, status changes, and mails in both directions. */
export const leadNotes = mysqlTable(
  "lead_notes",
  {
    id: serialId(),
    leadId: parentId(() => leads.id, { onDelete: "cascade" }),
    kind: mysqlEnum(["note", "status", "mail_out", "enquiry"]).notNull(),
    body: text().notNull(),
    userId: varchar({ length: 255 }),
    userName: varchar({ length: 120 }),
    outboxId: int(),
    at: createdAt(),
  },
  (t) => [index("lead_notes_lead_idx").on(t.leadId, t.at)],
);

export type Lead = typeof leads.$inferSelect;
