import { boolean, index, mysqlEnum, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { ROLES } from "../../../shared/constants/roles.ts";
import { editedRecord, instant, parentId } from "./columns.ts";
import { dealerships } from "./dealerships.ts";

export const users = mysqlTable(
  "users",
  {
    // lucia keys users by a string id.
    id: varchar({ length: 255 }).primaryKey(),
    dealershipId: parentId(() => dealerships.id),
    email: varchar({ length: 254 }).notNull().unique(),
    name: varchar({ length: 120 }).notNull(),
    role: mysqlEnum(ROLES).notNull(),
    active: boolean().notNull().default(true),
    passwordHash: varchar({ length: 255 }).notNull(),
    lastSignInAt: instant(),
    ...editedRecord(),
  },
  (t) => [index("users_dealership_idx").on(t.dealershipId)],
);

export type User = typeof users.$inferSelect;
