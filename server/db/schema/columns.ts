import { bigint, customType, datetime, int, type ReferenceConfig } from "drizzle-orm/mysql-core";

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
export const instant = () => datetime({ mode: "date", fsp: 3 });
/** When the row was written: a record's createdAt, a log entry's `at`. */
export const createdAt = () => instant().notNull().$defaultFn(() => new Date());
export const updatedAt = () =>
  instant()
    .notNull()
    .$defaultFn(() => new Date())
    .$onUpdateFn(() => new Date());
export const version = () => int().notNull().default(1);

/** The columns of a record staff edit: the version that catches a stale save, and when it was made and last changed. */
export const editedRecord = () => ({ version: version(), createdAt: createdAt(), updatedAt: updatedAt() });

/** A table's own key. */
export const serialId = () => int().autoincrement().primaryKey();
/** The key of an append-only log, which may outgrow an int. */
export const logId = () => bigint({ mode: "number", unsigned: true }).autoincrement().primaryKey();

/** A required reference to another table's int key; `actions` say what a delete of the parent does (default: refused). */
export const parentId = (parent: ReferenceConfig["ref"], actions?: ReferenceConfig["actions"]) => int().notNull().references(parent, actions);
