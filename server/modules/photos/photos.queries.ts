import { and, asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { photos } from "../../db/schema/index.ts";

export const photosOf = (db: DbOrTx, vehicleId: number) =>
  db.select().from(photos).where(eq(photos.vehicleId, vehicleId)).orderBy(asc(photos.position), asc(photos.id));

export async function findPhoto(db: DbOrTx, vehicleId: number, id: number, forUpdate = false) {
  const q = db.select().from(photos).where(and(eq(photos.vehicleId, vehicleId), eq(photos.id, id))).limit(1);
  const [row] = forUpdate ? await q.for("update") : await q;
  return row ?? null;
}

export async function photoCount(db: DbOrTx, vehicleId: number) {
  const [row] = await db.select({ n: sql<number>`count(*)`, last: sql<number>`coalesce(max(${photos.position}), 0)` }).from(photos).where(eq(photos.vehicleId, vehicleId));
  return { count: Number(row?.n ?? 0), lastPosition: Number(row?.last ?? 0) };
}

export const processingPhotos = (db: DbOrTx, limit = 50) =>
  db.select({ id: photos.id }).from(photos).where(eq(photos.status, "processing")).orderBy(asc(photos.id)).limit(limit);
