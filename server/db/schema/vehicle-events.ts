import { index, mysqlEnum, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { createdAt, logId, parentId } from "./columns.ts";
import { VEHICLE_STATUSES } from "../../../shared/constants/vehicle.ts";
import { vehicles } from "./vehicles.ts";

/** A vehicle's path through the yard: each status move, who made it and why. */
export const vehicleEvents = mysqlTable(
  "vehicle_events",
  {
    id: logId(),
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    fromStatus: mysqlEnum(VEHICLE_STATUSES),
    toStatus: mysqlEnum(VEHICLE_STATUSES).notNull(),
    note: varchar({ length: 500 }).notNull().default(""),
    userId: varchar({ length: 255 }),
    userName: varchar({ length: 120 }),
    at: createdAt(),
  },
  (t) => [index("vehicle_events_vehicle_idx").on(t.vehicleId, t.at)],
);
