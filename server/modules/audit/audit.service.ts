import type { DbOrTx } from "../../db/client.ts";
import { auditLog } from "../../db/schema/index.ts";
import { and, desc, eq } from "drizzle-orm";
import type { User } from "lucia";

export interface Actor {
  id: string | null;
  email: string | null;
  dealershipId: number;
}

/** The audit actor of a signed-in user: who did it, and in which dealership's trail it is written. */
export const actorOf = (u: Pick<User, "id" | "email" | "dealershipId">): Actor => ({ id: u.id, email: u.email, dealershipId: u.dealershipId });

export interface AuditInput {
  action: string;
  entityType: string;
  entityId: string | number;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
}

/** Writes one audit entry inside the caller's transaction, so the trail and the change commit together. */
export async function recordAudit(db: DbOrTx, actor: Actor, entry: AuditInput): Promise<void> {
  await db.insert(auditLog).values({
    dealershipId: actor.dealershipId,
    userId: actor.id,
    userEmail: actor.email,
    action: entry.action,
    entityType: entry.entityType,
    entityId: String(entry.entityId),
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}

/** Only the fields whose values differ, as before/after pairs. */
export function diffFields<T extends Record<string, unknown>>(before: T, after: Partial<T>) {
  const b: Record<string, unknown> = {};
  const a: Record<string, unknown> = {};
  for (const key of Object.keys(after)) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) {
      b[key] = before[key] ?? null;
      a[key] = after[key] ?? null;
    }
  }
  return Object.keys(a).length ? { before: b, after: a } : null;
}

export async function auditFor(db: DbOrTx, dealershipId: number, entityType: string, entityId: string, limit = 200) {
  return db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.dealershipId, dealershipId), eq(auditLog.entityType, entityType), eq(auditLog.entityId, entityId)))
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(limit);
}
