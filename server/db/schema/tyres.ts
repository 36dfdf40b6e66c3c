import { date, double, mysqlEnum, mysqlTable, primaryKey, varchar } from "drizzle-orm/mysql-core";
import { parentId } from "./columns.ts";
import { TYRE_POSITIONS } from "../../../shared/constants/evidence.ts";
import { vehicles } from "./vehicles.ts";

export const tyreReadings = mysqlTable(
  "tyre_readings",
  {
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    position: mysqlEnum(TYRE_POSITIONS).notNull(),
    treadInnerMm: double(),
    treadCentreMm: double(),
    treadOuterMm: double(),
    sizeDesignation: varchar({ length: 40 }),
    dotCode: varchar({ length: 4 }),
    pressureKpa: double(),
    measuredOn: date({ mode: "string" }).notNull(),
    measuredBy: varchar({ length: 120 }),
  },
  (t) => [primaryKey({ columns: [t.vehicleId, t.position] })],
);
