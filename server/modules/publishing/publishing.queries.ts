import { desc, eq } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { revisions } from "../../db/schema/index.ts";

export async function latestRevision(db: DbOrTx, vehicleId: number) {
  const [row] = await db.select().from(revisions).where(eq(revisions.vehicleId, vehicleId)).orderBy(desc(revisions.number)).limit(1);
  return row ?? null;
}

/** Every revision of a vehicle, newest first, with who published it (no snapshots: they are large). */
export const revisionsOf = (db: DbOrTx, vehicleId: number) =>
  db
    .select({
      number: revisions.number,
      publishedAt: revisions.publishedAt,
      publishedByName: revisions.publishedByName,
      overrideReason: revisions.overrideReason,
      changes: revisions.changes,
    })
    .from(revisions)
    .where(eq(revisions.vehicleId, vehicleId))
    .orderBy(desc(revisions.number));
