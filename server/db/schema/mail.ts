import { index, int, mysqlEnum, mysqlTable, text, varchar } from "drizzle-orm/mysql-core";
import { createdAt, instant, serialId } from "./columns.ts";

/**
 * Mail waiting to go, written in the same transaction as whatever caused it and sent after the commit; retried with
 * backoff while the SMTP server is away, so nothing is lost to an outage.
 */
export const outbox = mysqlTable(
  "outbox",
  {
    id: serialId(),
    toAddress: varchar({ length: 254 }).notNull(),
    subject: varchar({ length: 300 }).notNull(),
    text: text().notNull(),
    html: text().notNull(),
    kind: varchar({ length: 40 }).notNull(),
    status: mysqlEnum(["pending", "sent", "failed"]).notNull().default("pending"),
    attempts: int().notNull().default(0),
    nextAttemptAt: instant().notNull(),
    lastError: varchar({ length: 500 }),
    sentAt: instant(),
    createdAt: createdAt(),
  },
  (t) => [index("outbox_due_idx").on(t.status, t.nextAttemptAt)],
);

/** Mail the demo's local fake SMTP server received (demo mode only), for the admin's outbox screen. */
export const capturedMail = mysqlTable("captured_mail", {
  id: serialId(),
  fromAddress: varchar({ length: 300 }).notNull(),
  toAddress: varchar({ length: 1000 }).notNull(),
  subject: varchar({ length: 300 }).notNull(),
  text: text().notNull(),
  html: text().notNull(),
  receivedAt: createdAt(),
});

/** Single-use tokens for invitations and password resets, stored as SHA-256 hashes only. */
export const authTokens = mysqlTable(
  "auth_tokens",
  {
    id: serialId(),
    kind: mysqlEnum(["invite", "reset"]).notNull(),
    tokenHash: varchar({ length: 64 }).notNull().unique(),
    dealershipId: int().notNull(),
    email: varchar({ length: 254 }).notNull(),
    name: varchar({ length: 120 }).notNull().default(""),
    role: mysqlEnum(["admin", "sales", "workshop", "marketing"]),
    userId: varchar({ length: 255 }),
    expiresAt: instant().notNull(),
    usedAt: instant(),
    createdBy: varchar({ length: 255 }),
    createdAt: createdAt(),
  },
  (t) => [index("auth_tokens_email_idx").on(t.email, t.kind)],
);
