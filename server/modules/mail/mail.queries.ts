import { desc, eq } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { capturedMail, outbox } from "../../db/schema/index.ts";

/** How many rows the admin's mail screens show, newest first. */
const SHOWN = 100;

export const recentOutbox = (db: DbOrTx) =>
  db
    .select({
      id: outbox.id, to: outbox.toAddress, subject: outbox.subject, kind: outbox.kind, status: outbox.status, attempts: outbox.attempts,
      lastError: outbox.lastError, createdAt: outbox.createdAt, sentAt: outbox.sentAt,
    })
    .from(outbox)
    .orderBy(desc(outbox.id))
    .limit(SHOWN);

export const recentCapturedMail = (db: DbOrTx) => db.select().from(capturedMail).orderBy(desc(capturedMail.id)).limit(SHOWN);

export async function capturedMailById(db: DbOrTx, id: number) {
  const [m] = await db.select().from(capturedMail).where(eq(capturedMail.id, id));
  return m;
}

export async function capturedMailHtml(db: DbOrTx, id: number) {
  const [m] = await db.select({ html: capturedMail.html }).from(capturedMail).where(eq(capturedMail.id, id));
  return m?.html;
}
