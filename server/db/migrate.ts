import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/mysql2/migrator";
import type { Db } from "./client.ts";

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../drizzle");

export async function applyMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
