import mysql from "mysql2/promise";
import { drizzle, type MySql2Database } from "drizzle-orm/mysql2";
import * as schema from "./schema/index.ts";

export type Db = MySql2Database<typeof schema>;
/** A transaction handle; query functions take `Db | Tx` so services decide where transactions begin. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;

export interface Database {
  db: Db;
  pool: mysql.Pool;
  close: () => Promise<void>;
}

export function connect(url: string, options: { connectionLimit?: number } = {}): Database {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: options.connectionLimit ?? 20,
    timezone: "Z",
    charset: "utf8mb4_unicode_ci",
    supportBigNumbers: true,
    decimalNumbers: true,
  });
  pool.on("connection", (conn) => {
    // The event hands over mysql2's callback connection (the promise typings say otherwise), so there is no promise
    // to await: the statement is queued ahead of every query the pool sends on this connection.
    void conn.query("SET time_zone = '+00:00'");
  });
  const db = drizzle(pool, { schema, mode: "default", casing: "snake_case" });
  return { db, pool, close: () => pool.end() };
}
