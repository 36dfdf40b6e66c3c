import { date, mysqlEnum, mysqlTable, primaryKey, varchar } from "drizzle-orm/mysql-core";
import { parentId } from "./columns.ts";
import { CHECK_ITEMS, CHECK_RESULTS } from "../../../shared/constants/evidence.ts";
import { vehicles } from "./vehicles.ts";

export const checkResults = mysqlTable(
  "check_results",
  {
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    item: mysqlEnum(CHECK_ITEMS).notNull(),
    result: mysqlEnum(CHECK_RESULTS).notNull(),
    note: varchar({ length: 500 }).notNull().default(""),
    checkedOn: date({ mode: "string" }).notNull(),
    checkedBy: varchar({ length: 120 }),
  },
  (t) => [primaryKey({ columns: [t.vehicleId, t.item] })],
);
