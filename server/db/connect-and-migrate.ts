import { connect as connectPool, type Database } from "./client.ts";
import { applyMigrations } from "./migrate.ts";

/** A connection for scripts (seed, start, backup) with the schema brought up to date first. */
export async function connect(url: string): Promise<Database> {
  const database = connectPool(url, { connectionLimit: 5 });
  const conn = await database.pool.getConnection();
  try {
    await conn.query("SELECT GET_LOCK(CONCAT(DATABASE(), ':migrate'), 60)");
    await applyMigrations(database.db);
  } finally {
    await conn.query("SELECT RELEASE_LOCK(CONCAT(DATABASE(), ':migrate'))").catch(() => undefined);
    conn.release();
  }
  return database;
}
