import { bigint, datetime, index, int, mysqlEnum, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { VEHICLE_STATUSES } from "../../../shared/constants/vehicle.ts";
import { vehicles } from "./vehicles.ts";

/** A vehicle's path through the yard: each status move, who made it and why. */
export const vehicleEvents = mysqlTable(
  "vehicle_events",
  {
    id: bigint({ mode: "number", unsigned: true }).autoincrement().primaryKey(),
    vehicleId: int()
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    fromStatus: mysqlEnum(VEHICLE_STATUSES),
    toStatus: mysqlEnum(VEHICLE_STATUSES).notNull(),
    note: varchar({ length: 500 }).notNull().default(""),
    userId: varchar({ length: 255 }),
    userName: varchar({ length: 120 }),
    at: datetime({ mode: "date", fsp: 3 })
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [index("vehicle_events_vehicle_idx").on(t.vehicleId, t.at)],
);
