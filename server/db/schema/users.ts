import { boolean, datetime, index, int, mysqlEnum, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { ROLES } from "../../../shared/constants/roles.ts";
import { createdAt, updatedAt, version } from "./columns.ts";
import { dealerships } from "./dealerships.ts";

export const users = mysqlTable(
  "users",
  {
    // lucia keys users by a string id.
    id: varchar({ length: 255 }).primaryKey(),
    dealershipId: int()
      .notNull()
      .references(() => dealerships.id),
    email: varchar({ length: 254 }).notNull().unique(),
    name: varchar({ length: 120 }).notNull(),
    role: mysqlEnum(ROLES).notNull(),
    active: boolean().notNull().default(true),
    passwordHash: varchar({ length: 255 }).notNull(),
    lastSignInAt: datetime({ mode: "date", fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("users_dealership_idx").on(t.dealershipId)],
);

export type User = typeof users.$inferSelect;
