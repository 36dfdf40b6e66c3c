import { mysqlEnum, mysqlTable, primaryKey, varchar } from "drizzle-orm/mysql-core";
import { instant, parentId } from "./columns.ts";
import { ZONES } from "../../../shared/constants/evidence.ts";
import { vehicles } from "./vehicles.ts";

/** A zone checked with nothing found. A zone with defects is checked by having them. */
export const zoneMarks = mysqlTable(
  "zone_marks",
  {
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    zone: mysqlEnum(ZONES).notNull(),
    checkedBy: varchar({ length: 120 }),
    checkedAt: instant().notNull(),
  },
  (t) => [primaryKey({ columns: [t.vehicleId, t.zone] })],
);
