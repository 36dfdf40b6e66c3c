/**
 * What `npm run backup` and `npm run restore` share: the archive's layout, the manifest, the MariaDB client
 * binaries and a private defaults file for their credentials.
 *
 * Archive (one .tar.gz):
 *   database.sql     mariadb-dump of the whole database (one INSERT per row, so rows can be counted from the dump)
 *   uploads/<key>    every stored file, under its storage key (photos/ab/<sha256>-640.webp …); `.partial` files skipped
 *   manifest.json    written last: format version, created at, schema migration, sha256 of the dump and every file,
 *                    rows per table as the dump holds them
 */
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { z } from "zod";
import { configSchema } from "../server/config/index.ts";
import { findBinary } from "../server/db/mariadb.ts";

export const FORMAT = "forthright-backup";
export const FORMAT_VERSION = 1;
export const DUMP_NAME = "database.sql";
export const MANIFEST_NAME = "manifest.json";
export const UPLOADS_PREFIX = "uploads/";

/**
 * The named lock that stops stored files from being deleted while a backup copies them. The orphan clean-up
 * (server/modules/photos/cleanup.ts) takes it too; it is scoped to the database like the server's other locks.
 */
export const FILES_LOCK_SQL = "CONCAT(DATABASE(), ':files')";

const sha256Hex = z.string().regex(/^[a-f0-9]{64}$/);
export const manifestSchema = z.object({
  format: z.literal(FORMAT),
  formatVersion: z.literal(FORMAT_VERSION),
  createdAt: z.iso.datetime(),
  database: z.object({ name: z.string(), serverVersion: z.string() }),
  migration: z.object({ tag: z.string().nullable(), hash: z.string(), createdAt: z.number() }).nullable(),
  dump: z.object({ path: z.literal(DUMP_NAME), sha256: sha256Hex, bytes: z.number().int().min(0) }),
  tables: z.record(z.string(), z.number().int().min(0)),
  files: z.array(z.object({ key: z.string(), sha256: sha256Hex, bytes: z.number().int().min(0) })),
  /** Files listed in the uploads folder that were gone when they were copied (never referenced ones, given the lock). */
  vanished: z.array(z.string()),
});
export type Manifest = z.infer<typeof manifestSchema>;

/** The server's own settings for the database and the uploads folder (server/config). */
export function serverSettings(env: NodeJS.ProcessEnv = process.env) {
  return configSchema.pick({ DATABASE_URL: true, UPLOADS_DIR: true }).parse(env);
}

export function clientBinary(name: "mariadb-dump" | "mariadb"): string {
  const fallback = name === "mariadb" ? "mysql" : "mysqldump";
  const found = findBinary(name) ?? findBinary(fallback);
  if (!found) throw new Error(`${name} was not found; install the MariaDB client (apt-get install mariadb-client)`);
  return found;
}

/** Escapes a value for a MariaDB option file ("…" with backslash escapes). */
const optionValue = (v: string) => `"${v.replace(/\\/g, "\\\\").replace(/"/g, '\\"')}"`;

/**
 * Writes the connection settings of a mysql:// URL to a temporary option file (mode 0600, in a private temp folder),
 * so the password never appears on a command line or in `ps`. Returns the database name and a clean-up.
 */
export async function defaultsFileFor(url: string) {
  const u = new URL(url);
  const database = decodeURIComponent(u.pathname.replace(/^\//, ""));
  if (!database) throw new Error("DATABASE_URL names no database");
  const dir = await mkdtemp(path.join(tmpdir(), "forthright-client-"));
  const file = path.join(dir, "client.cnf");
  const lines = [
    "[client]",
    `user=${optionValue(decodeURIComponent(u.username))}`,
    `password=${optionValue(decodeURIComponent(u.password))}`,
    `host=${optionValue(u.hostname || "127.0.0.1")}`,
    `port=${u.port || "3306"}`,
    "protocol=TCP",
    "default-character-set=utf8mb4",
  ];
  await writeFile(file, lines.join("\n") + "\n", { mode: 0o600 });
  return { file, database, remove: () => rm(dir, { recursive: true, force: true }) };
}

export function sha256File(file: string): Promise<{ sha256: string; bytes: number }> {
  return new Promise((resolve, reject) => {
    const hash = createHash("sha256");
    let bytes = 0;
    createReadStream(file)
      .on("data", (chunk) => {
        hash.update(chunk);
        bytes += chunk.length;
      })
      .on("error", reject)
      .on("end", () => resolve({ sha256: hash.digest("hex"), bytes }));
  });
}

export const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
