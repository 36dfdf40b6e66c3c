/**
 * `npm run restore -- <archive.tar.gz> [--force]`: loads a backup made by `npm run backup` into the server's
 * DATABASE_URL and UPLOADS_DIR (without DATABASE_URL, the local MariaDB under .data/).
 *
 * 1. Unpacks into a private staging folder and checks the manifest and the sha256 of the dump and of every file
 *    before anything in the target is touched. A truncated or corrupt archive stops here with a message saying so.
 * 2. Finds the `mariadb` client and runs `SELECT 1` through it with the target's credentials, and takes the files
 *    lock (`<db>:files`, as the backup and the orphan clean-up do) for the whole restore, so no clean-up deletes
 *    files under it.
 * 3. Refuses a target database with rows in any table, or an uploads folder with files under photos/ or closeups/,
 *    unless --force (which replaces them). Empty tables, such as a freshly migrated database, are fine; so are
 *    dotfiles in the uploads folder (the checkout's .gitkeep). Anything else in the uploads folder is refused even
 *    with --force: the restore removes only what storage holds, never unrelated data.
 * 4. Only now touches the target: moves the old photos/ and closeups/ aside (renamed to .restore-old-<id>-<name>
 *    beside them), drops the tables, loads the dump with the `mariadb` client and moves the files into place
 *    (rename, never a half file under a key).
 * 5. Checks again: each restored file's sha256, each table's row count against the manifest, and that every file a
 *    restored row refers to is present. Prints a summary. Only then are the old files deleted; if the load or a
 *    check fails, the restored files are removed and the old ones put back.
 *    The database is not kept aside like that: the tables are dropped and the dump is loaded in place, so a load
 *    that fails part-way (the client was checked just before, and the archive verified) leaves a partial database;
 *    restore it again.
 * Stop the server (or every instance) while restoring: the restore replaces what it reads.
 */
import { spawn } from "node:child_process";
import { createReadStream, existsSync } from "node:fs";
import { copyFile, mkdir, mkdtemp, readFile, readdir, rename, rm } from "node:fs/promises";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs } from "node:util";
import mysql from "mysql2/promise";
import * as tar from "tar";
import { connect } from "../server/db/client.ts";
import { migrationsFolder } from "../server/db/migrate.ts";
import { KEY_PATTERN } from "../server/lib/storage.ts";
import { referencedKeys } from "../server/modules/photos/cleanup.ts";
import {
  DUMP_NAME, FILES_LOCK_SQL, MANIFEST_NAME, UPLOADS_PREFIX, clientBinary, defaultsFileFor, manifestSchema, seconds, serverSettings, sha256File, type Manifest,
} from "./backup-archive.ts";

export interface RestoreOptions {
  archive: string;
  databaseUrl: string;
  uploadsDir: string;
  force?: boolean;
  log?: (line: string) => void;
  /** Seconds to wait for the files lock (a clean-up pass or a backup holds it for a while). */
  lockWaitSeconds?: number;
}

export interface RestoreResult {
  manifest: Manifest;
  rows: number;
  files: number;
  bytes: number;
  timings: { verifyMs: number; loadMs: number; filesMs: number; checkMs: number; totalMs: number };
}

/** A restore that stopped for a reason the operator can act on (the CLI prints only the message). */
export class RestoreError extends Error {}

async function filesUnder(dir: string, prefix = ""): Promise<string[]> {
  const entries = await readdir(path.join(dir, prefix), { withFileTypes: true }).catch((err: NodeJS.ErrnoException) => {
    if (err.code === "ENOENT") return [];
    throw err;
  });
  const out: string[] = [];
  for (const e of entries) {
    const rel = prefix ? `${prefix}/${e.name}` : e.name;
    if (e.isDirectory()) out.push(...(await filesUnder(dir, rel)));
    else out.push(rel);
  }
  return out;
}

const quoteIdent = (name: string) => "`" + name.replace(/`/g, "``") + "`";

async function unpack(archive: string, staging: string): Promise<Manifest> {
  const unexpected: string[] = [];
  try {
    await tar.extract({
      file: archive,
      cwd: staging,
      strict: true,
      // Only what a backup holds: the manifest, the dump and files under storage keys; no links, devices or odd paths.
      filter: (p, entry) => {
        const type = "type" in entry ? entry.type : "File";
        const name = p.replace(/^\.\//, "").replace(/\/$/, "");
        const ok =
          (type === "File" && (name === MANIFEST_NAME || name === DUMP_NAME || (name.startsWith(UPLOADS_PREFIX) && KEY_PATTERN.test(name.slice(UPLOADS_PREFIX.length))))) ||
          (type === "Directory" && (name === "uploads" || /^uploads\/(photos|closeups)(\/[a-f0-9]{2})?$/.test(name)));
        if (!ok) unexpected.push(`${name} (${type})`);
        return ok;
      },
    });
  } catch (err) {
    throw new RestoreError(`The archive ${archive} is corrupt or truncated and was not restored (${(err as Error).message}).`);
  }
  if (unexpected.length) throw new RestoreError(`The archive ${archive} holds entries a Forthright backup never has, so it was not restored: ${unexpected.slice(0, 5).join(", ")}`);
  const manifestFile = path.join(staging, MANIFEST_NAME);
  if (!existsSync(manifestFile)) throw new RestoreError(`The archive ${archive} has no ${MANIFEST_NAME}: it is not a Forthright backup, or it is truncated.`);
  let raw: unknown;
  try {
    raw = JSON.parse(await readFile(manifestFile, "utf8"));
  } catch {
    throw new RestoreError(`The archive's ${MANIFEST_NAME} is not valid JSON: the archive is damaged.`);
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) {
    throw new RestoreError(`The archive's ${MANIFEST_NAME} is not one this version can restore: ${parsed.error.issues.slice(0, 3).map((i) => `${i.path.join(".") || "(root)"} ${i.message}`).join("; ")}`);
  }
  return parsed.data;
}

/** Every byte against the manifest, and no file more or less than it lists. */
async function verifyStaged(staging: string, manifest: Manifest) {
  const dumpFile = path.join(staging, DUMP_NAME);
  if (!existsSync(dumpFile)) throw new RestoreError(`The archive has no ${DUMP_NAME}: it is truncated.`);
  if ((await sha256File(dumpFile)).sha256 !== manifest.dump.sha256) throw new RestoreError(`The archive is damaged: ${DUMP_NAME} does not match the sha256 in its manifest.`);
  const staged = new Set((await filesUnder(path.join(staging, "uploads"))).map((f) => f));
  const bad: string[] = [];
  for (const f of manifest.files) {
    if (!staged.delete(f.key)) {
      bad.push(`${f.key} is missing`);
      continue;
    }
    const got = await sha256File(path.join(staging, UPLOADS_PREFIX, f.key));
    if (got.sha256 !== f.sha256 || got.bytes !== f.bytes) bad.push(`${f.key} does not match its sha256`);
  }
  for (const extra of staged) bad.push(`${extra} is not in the manifest`);
  if (bad.length) throw new RestoreError(`The archive is damaged (${bad.length} file${bad.length === 1 ? "" : "s"}): ${bad.slice(0, 5).join("; ")}.`);
}

async function tablesWithRows(conn: mysql.Connection): Promise<{ all: string[]; withRows: string[] }> {
  const [rows] = (await conn.query("SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME")) as unknown as [Array<{ name: string }>];
  const withRows: string[] = [];
  for (const { name } of rows) {
    const [[r]] = (await conn.query(`SELECT EXISTS(SELECT 1 FROM ${quoteIdent(name)}) AS has`)) as unknown as [[{ has: number }]];
    if (r.has) withRows.push(name);
  }
  return { all: rows.map((r) => r.name), withRows };
}

/** The folders storage keeps files in (server/lib/storage.ts, list()); the only ones a restore replaces. */
const STORED = ["photos", "closeups"] as const;
const ASIDE_PREFIX = ".restore-old-";

/**
 * What the uploads folder holds: files under the stored folders, and anything else that is not a dotfile (a
 * checkout's .gitkeep is fine). Moved-aside folders from an interrupted restore count as unexpected, so they are seen.
 */
async function inspectUploads(uploadsDir: string): Promise<{ files: number; unexpected: string[] }> {
  const entries = await readdir(uploadsDir, { withFileTypes: true }).catch((err: NodeJS.ErrnoException) => {
    if (err.code === "ENOENT") return [];
    throw err;
  });
  let files = 0;
  const unexpected: string[] = [];
  for (const e of entries) {
    if ((STORED as readonly string[]).includes(e.name) && e.isDirectory()) files += (await filesUnder(uploadsDir, e.name)).length;
    else if (e.name.startsWith(ASIDE_PREFIX)) unexpected.push(`${e.name} (left by an interrupted restore: the files it replaced)`);
    else if (!e.name.startsWith(".")) unexpected.push(e.name);
  }
  return { files, unexpected };
}

/** Runs one statement through the client binary, so a missing or misconfigured client stops us before any change. */
function checkClient(binary: string, defaultsFile: string, database: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(binary, [`--defaults-file=${defaultsFile}`, "--batch", "--skip-column-names", "-e", "SELECT 1", database], { stdio: ["ignore", "pipe", "pipe"] });
    let output = "";
    child.stdout.on("data", (d) => (output += d));
    child.stderr.on("data", (d) => (output += d));
    child.on("error", (err) => reject(new RestoreError(`The MariaDB client ${binary} could not be started (${err.message}); nothing was changed.`)));
    child.on("close", (code) =>
      code === 0 && output.trim() === "1"
        ? resolve()
        : reject(new RestoreError(`The MariaDB client ${path.basename(binary)} could not query ${database} (exit ${code}): ${output.trim().slice(0, 500)}; nothing was changed.`)),
    );
  });
}

function load(binary: string, defaultsFile: string, database: string, dumpFile: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(binary, [`--defaults-file=${defaultsFile}`, "--batch", database], { stdio: ["pipe", "ignore", "pipe"] });
    let stderr = "";
    child.stderr.on("data", (d) => (stderr += d));
    child.on("error", reject);
    child.on("close", (code) => (code === 0 ? resolve() : reject(new RestoreError(`Loading the dump failed (mariadb exit ${code}): ${stderr.trim().slice(0, 2000)}`))));
    createReadStream(dumpFile).on("error", reject).pipe(child.stdin);
    child.stdin.on("error", () => undefined); // the exit code and stderr say why
  });
}

export async function restore(options: RestoreOptions): Promise<RestoreResult> {
  const log = options.log ?? (() => undefined);
  const started = Date.now();
  const archive = path.resolve(options.archive);
  if (!existsSync(archive)) throw new RestoreError(`No such archive: ${archive}`);
  const mariadb = (() => {
    try {
      return clientBinary("mariadb");
    } catch (err) {
      throw new RestoreError(`${(err as Error).message}; nothing was changed.`);
    }
  })();
  const uploadsDir = path.resolve(options.uploadsDir);
  const timings = { verifyMs: 0, loadMs: 0, filesMs: 0, checkMs: 0, totalMs: 0 };
  let staging: string | null = null;
  let defaults: Awaited<ReturnType<typeof defaultsFileFor>> | null = null;
  let conn: mysql.Connection | null = null;
  let locked = false;
  // Old stored folders moved aside (name -> aside path) and whether the restore got far enough to keep the new ones.
  const aside = new Map<string, string>();
  let committed = false;
  try {
    await mkdir(path.dirname(uploadsDir), { recursive: true });
    // Staging beside the uploads folder, so files can be renamed into place.
    staging = await mkdtemp(path.join(path.dirname(uploadsDir), ".forthright-restore-"));
    defaults = await defaultsFileFor(options.databaseUrl);
    conn = await mysql.createConnection({ uri: options.databaseUrl });
    await checkClient(mariadb, defaults.file, defaults.database);
    const wait = options.lockWaitSeconds ?? 60;
    const [[lock]] = (await conn.query(`SELECT GET_LOCK(${FILES_LOCK_SQL}, ?) AS got`, [wait])) as unknown as [[{ got: number | null }]];
    if (!lock?.got) throw new RestoreError(`Could not take the files lock within ${wait} s (an orphan clean-up or a backup holds it; is the server still running?); nothing was changed.`);
    locked = true;

    log(`Checking ${archive}…`);
    const manifest = await unpack(archive, staging);
    await verifyStaged(staging, manifest);
    timings.verifyMs = Date.now() - started;
    log(`  archive intact: made ${manifest.createdAt} from database ${manifest.database.name}, migration ${manifest.migration?.tag ?? "none"}`);
    const journal = JSON.parse(await readFile(path.join(migrationsFolder, "meta", "_journal.json"), "utf8")) as { entries: Array<{ tag: string }> };
    if (manifest.migration?.tag && !journal.entries.some((e) => e.tag === manifest.migration!.tag)) {
      log(`  warning: the backup's schema (${manifest.migration.tag}) is newer than this code knows; run the matching version of Forthright on it.`);
    }

    const target = await tablesWithRows(conn);
    const existing = await inspectUploads(uploadsDir);
    if (existing.unexpected.length) {
      throw new RestoreError(
        `Refusing to restore: the uploads folder ${uploadsDir} holds ${existing.unexpected.slice(0, 5).join(", ")}${existing.unexpected.length > 5 ? ", …" : ""}, which the app never stores there (only photos/ and closeups/). Move it elsewhere, or point UPLOADS_DIR at the right folder; --force does not remove it.`,
      );
    }
    if (!options.force && (target.withRows.length || existing.files)) {
      const why = [
        target.withRows.length ? `database ${defaults.database} has rows in ${target.withRows.length} table(s) (${target.withRows.slice(0, 5).join(", ")}${target.withRows.length > 5 ? ", …" : ""})` : null,
        existing.files ? `the uploads folder ${uploadsDir} holds ${existing.files} file(s)` : null,
      ].filter(Boolean);
      throw new RestoreError(`Refusing to restore over existing data: ${why.join(" and ")}. Restore into an empty database and folder, or pass --force to replace them.`);
    }

    // From here on the target changes. The old stored files go aside first, so a failure can put them back.
    const id = randomBytes(4).toString("hex");
    for (const name of STORED) {
      const to = path.join(uploadsDir, `${ASIDE_PREFIX}${id}-${name}`);
      try {
        await rename(path.join(uploadsDir, name), to);
        aside.set(name, to);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== "ENOENT") throw err;
      }
    }
    if (existing.files) log(`  --force: ${existing.files} existing file(s) in ${uploadsDir} moved aside until the restore is checked`);
    // Empty (or, with --force, doomed) tables go, so the target holds exactly what the dump creates.
    await conn.query("SET FOREIGN_KEY_CHECKS = 0");
    for (const name of target.all) await conn.query(`DROP TABLE IF EXISTS ${quoteIdent(name)}`);
    await conn.query("SET FOREIGN_KEY_CHECKS = 1");

    const t1 = Date.now();
    log(`Loading the dump into ${defaults.database}…`);
    await load(mariadb, defaults.file, defaults.database, path.join(staging, DUMP_NAME));
    timings.loadMs = Date.now() - t1;
    const t2 = Date.now();
    let bytes = 0;
    for (const f of manifest.files) {
      const from = path.join(staging, UPLOADS_PREFIX, f.key);
      const to = path.join(uploadsDir, f.key);
      await mkdir(path.dirname(to), { recursive: true });
      try {
        await rename(from, to);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== "EXDEV") throw err;
        const tmp = `${to}.${randomBytes(6).toString("hex")}.partial`;
        await copyFile(from, tmp);
        await rename(tmp, to);
      }
      bytes += f.bytes;
    }
    timings.filesMs = Date.now() - t2;

    const t3 = Date.now();
    const problems: string[] = [];
    for (const f of manifest.files) {
      if ((await sha256File(path.join(uploadsDir, f.key))).sha256 !== f.sha256) problems.push(`restored file ${f.key} does not match its sha256`);
    }
    const restored = await tablesWithRows(conn);
    let rows = 0;
    for (const [name, expected] of Object.entries(manifest.tables)) {
      if (!restored.all.includes(name)) {
        problems.push(`table ${name} was not created`);
        continue;
      }
      const [[r]] = (await conn.query(`SELECT COUNT(*) AS n FROM ${quoteIdent(name)}`)) as unknown as [[{ n: number }]];
      const n = Number(r.n);
      rows += n;
      if (n !== expected) problems.push(`table ${name} has ${n} rows, the backup ${expected}`);
    }
    const present = new Set(manifest.files.map((f) => f.key));
    // A backup of a database the server never migrated has no tables to refer to files.
    const schemaPresent = ["photos", "defects", "revision_media"].every((name) => restored.all.includes(name));
    if (schemaPresent) {
      const database = connect(options.databaseUrl, { connectionLimit: 2 });
      try {
        const missing = [...(await referencedKeys(database))].filter((k) => !present.has(k));
        if (missing.length) problems.push(`${missing.length} file(s) that restored rows refer to are not in the backup (${missing.slice(0, 5).join(", ")})`);
      } finally {
        await database.close();
      }
    }
    timings.checkMs = Date.now() - t3;
    timings.totalMs = Date.now() - started;
    if (problems.length) throw new RestoreError(`The restore finished but does not match the backup:\n  ${problems.join("\n  ")}`);
    committed = true;
    for (const dir of aside.values()) await rm(dir, { recursive: true, force: true });
    aside.clear();
    log(`Restored ${Object.keys(manifest.tables).length} tables (${rows} rows) and ${manifest.files.length} files (${(bytes / 1024 / 1024).toFixed(1)} MiB) into ${defaults.database} and ${uploadsDir}.`);
    log(`  checked: every file's sha256, every table's row count, every referenced file present`);
    log(`  verify ${seconds(timings.verifyMs)}, load ${seconds(timings.loadMs)}, files ${seconds(timings.filesMs)}, checks ${seconds(timings.checkMs)}, total ${seconds(timings.totalMs)}`);
    return { manifest, rows, files: manifest.files.length, bytes, timings };
  } catch (err) {
    if (!committed && aside.size) {
      // Put the old files back: the restored ones (if any got there) go, the moved-aside folders return.
      try {
        for (const [name, dir] of aside) {
          await rm(path.join(uploadsDir, name), { recursive: true, force: true });
          await rename(dir, path.join(uploadsDir, name));
        }
        for (const name of STORED) if (!aside.has(name)) await rm(path.join(uploadsDir, name), { recursive: true, force: true });
        log(`  the old files in ${uploadsDir} were put back`);
      } catch (undo) {
        log(`  warning: could not put the old files back (${(undo as Error).message}); they are in ${[...aside.values()].join(", ")}`);
      }
    }
    throw err;
  } finally {
    if (locked) await conn?.query(`SELECT RELEASE_LOCK(${FILES_LOCK_SQL})`).catch(() => undefined);
    await conn?.end().catch(() => undefined);
    await defaults?.remove();
    // Retries: after a failed unpack, tar may still be closing files it had started.
    if (staging) await rm(staging, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
  }
}

async function cli() {
  const { values, positionals } = parseArgs({ allowPositionals: true, options: { force: { type: "boolean" }, help: { type: "boolean", short: "h" } } });
  if (values.help || positionals.length !== 1) {
    console.log("Usage: npm run restore -- <archive.tar.gz> [--force]\nRestores into DATABASE_URL (or the local MariaDB under .data/) and UPLOADS_DIR; stop the server first.");
    process.exit(values.help ? 0 : 2);
  }
  if (!process.env.DATABASE_URL) {
    const { ensureLocalDatabase } = await import("./local-db.ts");
    await ensureLocalDatabase();
  }
  const settings = serverSettings();
  await restore({ archive: positionals[0], databaseUrl: settings.DATABASE_URL, uploadsDir: settings.UPLOADS_DIR, force: values.force, log: console.log });
}

if (process.argv[1] && pathToFileURL(path.resolve(process.argv[1])).href === import.meta.url) {
  cli().catch((err: Error) => {
    console.error(err instanceof RestoreError ? `Restore stopped: ${err.message}` : `Restore failed: ${err.stack ?? err.message}`);
    process.exit(1);
  });
}
