import { customType, datetime, int } from "drizzle-orm/mysql-core";

/**
 * JSON stored as LONGTEXT. MariaDB reports its JSON type to clients as text, so mysql2 hands back a string;
 * this column parses it, whatever the server sends.
 */
export const jsonText = <T>() =>
  customType<{ data: T; driverData: string }>({
    dataType: () => "longtext",
    toDriver: (value) => JSON.stringify(value),
    fromDriver: (value) => (typeof value === "string" ? (JSON.parse(value) as T) : (value as T)),
  })();

/** Timestamps are UTC with millisecond precision. */
export const createdAt = () => datetime({ mode: "date", fsp: 3 }).notNull().$defaultFn(() => new Date());
export const updatedAt = () =>
  datetime({ mode: "date", fsp: 3 })
    .notNull()
    .$defaultFn(() => new Date())
    .$onUpdateFn(() => new Date());
export const version = () => int().notNull().default(1);
