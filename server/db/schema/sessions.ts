import { datetime, index, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { users } from "./users.ts";

/** lucia's session table: kept in MariaDB so every server instance sees the same sessions. */
export const sessions = mysqlTable(
  "sessions",
  {
    id: varchar({ length: 255 }).primaryKey(),
    userId: varchar({ length: 255 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: datetime({ mode: "date" }).notNull(),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);
