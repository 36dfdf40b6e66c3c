import { datetime, mysqlEnum, mysqlTable, primaryKey, int, varchar } from "drizzle-orm/mysql-core";
import { ZONES } from "../../../shared/constants/evidence.ts";
import { vehicles } from "./vehicles.ts";

/** A zone checked with nothing found. A zone with defects is checked by having them. */
export const zoneMarks = mysqlTable(
  "zone_marks",
  {
    vehicleId: int()
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    zone: mysqlEnum(ZONES).notNull(),
    checkedBy: varchar({ length: 120 }),
    checkedAt: datetime({ mode: "date", fsp: 3 }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.vehicleId, t.zone] })],
);
