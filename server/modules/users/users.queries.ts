import { and, asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { users } from "../../db/schema/index.ts";

export const listUsers = (db: DbOrTx, dealershipId: number) =>
  db.select().from(users).where(eq(users.dealershipId, dealershipId)).orderBy(asc(users.name));

export async function findUser(db: DbOrTx, dealershipId: number, id: string, forUpdate = false) {
  const q = db.select().from(users).where(and(eq(users.dealershipId, dealershipId), eq(users.id, id))).limit(1);
  const [row] = forUpdate ? await q.for("update") : await q;
  return row ?? null;
}

export async function countActiveAdmins(db: DbOrTx, dealershipId: number) {
  const [row] = await db
    .select({ n: sql<number>`count(*)` })
    .from(users)
    .where(and(eq(users.dealershipId, dealershipId), eq(users.role, "admin"), eq(users.active, true)));
  return Number(row?.n ?? 0);
}
