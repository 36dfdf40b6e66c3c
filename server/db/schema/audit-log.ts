import { index, int, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { createdAt, jsonText, logId } from "./columns.ts";

/** Who did what, when, to which record, with the values before and after. Append-only. */
export const auditLog = mysqlTable(
  "audit_log",
  {
    id: logId(),
    dealershipId: int().notNull(),
    // Kept as plain values, not foreign keys, so the trail outlives what it describes.
    userId: varchar({ length: 255 }),
    userEmail: varchar({ length: 254 }),
    action: varchar({ length: 60 }).notNull(),
    entityType: varchar({ length: 40 }).notNull(),
    entityId: varchar({ length: 255 }).notNull(),
    before: jsonText<Record<string, unknown> | null>(),
    after: jsonText<Record<string, unknown> | null>(),
    at: createdAt(),
  },
  (t) => [index("audit_entity_idx").on(t.entityType, t.entityId, t.at), index("audit_dealership_idx").on(t.dealershipId, t.at)],
);

export type AuditEntry = typeof auditLog.$inferSelect;
