import { bigint, int, mysqlTable, varchar } from "drizzle-orm/mysql-core";

/**
 * Counters for rate-limiter-flexible's MySQL store. Shared by every server instance, so limits hold across
 * them. Column names are the ones that library queries.
 */
export const rateLimits = mysqlTable("rate_limits", {
  key: varchar({ length: 255 }).primaryKey(),
  points: int().notNull().default(0),
  expire: bigint({ mode: "number", unsigned: true }),
});
