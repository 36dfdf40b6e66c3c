import { asc, eq } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { defects, zoneMarks } from "../../db/schema/index.ts";

export const defectsOf = (db: DbOrTx, vehicleId: number) => db.select().from(defects).where(eq(defects.vehicleId, vehicleId)).orderBy(asc(defects.number));
export const marksOf = (db: DbOrTx, vehicleId: number) => db.select().from(zoneMarks).where(eq(zoneMarks.vehicleId, vehicleId));
