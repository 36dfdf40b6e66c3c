import path from "node:path";
import {
  databaseUrl,
  ensureMariadbInstalled,
  instanceFor,
  loadOrCreateCredentials,
  provisionDatabase,
  startMariadb,
} from "../server/db/mariadb.ts";

export const DATA_DIR = path.resolve(process.env.FORTHRIGHT_DATA_DIR ?? ".data/mariadb");
export const DB_PORT = Number(process.env.DB_PORT ?? 3406);

/**
 * The database for local commands. With DATABASE_URL set (production, or a server of your own) it is used as is;
 * otherwise a MariaDB of our own is started (or reused) under .data/ on 127.0.0.1:DB_PORT.
 */
export async function ensureLocalDatabase(log: (line: string) => void = console.log): Promise<string> {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  ensureMariadbInstalled(log);
  const instance = instanceFor(DATA_DIR, DB_PORT);
  const { reused } = await startMariadb(instance);
  log(reused ? `Using the MariaDB already running on 127.0.0.1:${DB_PORT}.` : `Started MariaDB on 127.0.0.1:${DB_PORT} (data in ${DATA_DIR}).`);
  const credentials = loadOrCreateCredentials(instance);
  provisionDatabase(instance, credentials);
  const url = databaseUrl(instance, credentials);
  process.env.DATABASE_URL = url;
  return url;
}
