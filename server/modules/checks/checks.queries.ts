import { eq } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { checkResults, tyreReadings } from "../../db/schema/index.ts";

export const tyresOf = (db: DbOrTx, vehicleId: number) => db.select().from(tyreReadings).where(eq(tyreReadings.vehicleId, vehicleId));
export const checksOf = (db: DbOrTx, vehicleId: number) => db.select().from(checkResults).where(eq(checkResults.vehicleId, vehicleId));
