/**
 * `npm run backup -- [--out file]`: the database and the uploaded files in one .tar.gz (see backup-archive.ts for
 * the layout). Uses the server's DATABASE_URL and UPLOADS_DIR; without DATABASE_URL, the local MariaDB under .data/
 * (started if it is not running), as `npm start` does.
 *
 * Consistency while the app keeps writing:
 * - The dump is one snapshot (`--single-transaction`: InnoDB's consistent read), so the rows agree with each other.
 * - Files are content-addressed and written before the row that names them, so every file a snapshot row names
 *   already existed when the snapshot was taken. Files are never changed in place; they are only ever removed.
 * - The one remover is the orphan clean-up (server/modules/photos/cleanup.ts; deleting a photo deletes its row only
 *   and leaves the files to that clean-up). A photo deleted after the snapshot would lose its files to a clean-up
 *   running before we copied them, and the backup would hold a row without its file. So the backup takes a named
 *   MariaDB lock (FILES_LOCK_SQL) BEFORE the dump starts and holds it until every file is copied, and the clean-up
 *   takes the same lock for its whole pass and skips the pass when the backup holds it. A clean-up already running
 *   finishes before our snapshot; none can start until the copy is done. Nothing else is blocked: uploads, edits and
 *   deletions of rows go on (new files written meanwhile are copied too, harmless extras that a later clean-up of
 *   the restored site removes).
 * - Files are hard-linked into the staging folder when it is on the same file system (instant, and the link keeps
 *   the content even if the original is removed later), so the lock is held for the dump and a directory walk only.
 *   Compression happens after the lock is released.
 * A file that vanishes between listing and copying despite the lock (someone deleting by hand) is named in the
 * manifest's `vanished` list; restore then checks that every row's file is present.
 */
import { spawn } from "node:child_process";
import { createReadStream, createWriteStream } from "node:fs";
import { pipeline } from "node:stream/promises";
import { copyFile, link, mkdir, mkdtemp, open, readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { createInterface } from "node:readline";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs } from "node:util";
import mysql from "mysql2/promise";
import * as tar from "tar";
import { localStorage } from "../server/lib/storage.ts";
import { migrationsFolder } from "../server/db/migrate.ts";
import {
  DUMP_NAME, FILES_LOCK_SQL, FORMAT, FORMAT_VERSION, MANIFEST_NAME, UPLOADS_PREFIX, clientBinary, defaultsFileFor, seconds, serverSettings, sha256File, type Manifest,
} from "./backup-archive.ts";

export interface BackupOptions {
  databaseUrl: string;
  uploadsDir: string;
  /** Where to write the archive; default backups/forthright-<timestamp>.tar.gz under the working directory. */
  out?: string;
  log?: (line: string) => void;
  /** Seconds to wait for the files lock (a clean-up pass holds it for a moment). */
  lockWaitSeconds?: number;
  /** Test seam: runs after the dump, while the files lock is held and before any file is copied. */
  afterDump?: () => Promise<void>;
}

export interface BackupResult {
  path: string;
  bytes: number;
  manifest: Manifest;
  timings: { dumpMs: number; copyMs: number; archiveMs: number; totalMs: number };
}

const stamp = (d: Date) => d.toISOString().slice(0, 19).replace(/:/g, "-") + "Z";

function run(binary: string, args: string[], stdoutFile: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const out = createWriteStream(stdoutFile, { mode: 0o600 });
    let writeError: Error | null = null;
    let child: ReturnType<typeof spawn> | null = null;
    // A full disk or a vanished folder: a clear message, and the dump stopped rather than writing into nothing.
    out.on("error", (err) => {
      writeError ??= new Error(`Writing ${stdoutFile} failed: ${err.message}`);
      child?.kill();
    });
    child = spawn(binary, args, { stdio: ["ignore", "pipe", "pipe"] });
    let stderr = "";
    child.stderr!.on("data", (d) => (stderr += d));
    child.stdout!.pipe(out);
    child.on("error", reject);
    child.on("close", (code) => {
      const done = () => {
        if (writeError) reject(writeError);
        else if (code === 0) resolve();
        else reject(new Error(`${path.basename(binary)} failed (exit ${code}): ${stderr.trim()}`));
      };
      out.close(() => done());
    });
  });
}

/** Tables and rows per table, read from the dump itself (one INSERT per row), so the counts are the snapshot's. */
async function countRows(dumpFile: string): Promise<Record<string, number>> {
  const tables: Record<string, number> = {};
  const lines = createInterface({ input: createReadStream(dumpFile), crlfDelay: Infinity });
  for await (const line of lines) {
    let m = /^CREATE TABLE `((?:[^`]|``)+)`/.exec(line);
    if (m) tables[m[1].replace(/``/g, "`")] = 0;
    m = /^INSERT INTO `((?:[^`]|``)+)` VALUES /.exec(line);
    if (m) {
      const name = m[1].replace(/``/g, "`");
      tables[name] = (tables[name] ?? 0) + 1;
    }
  }
  return tables;
}

async function latestMigration(conn: mysql.Connection): Promise<Manifest["migration"]> {
  try {
    const [rows] = (await conn.query("SELECT hash, created_at AS createdAt FROM __drizzle_migrations ORDER BY created_at DESC, id DESC LIMIT 1")) as unknown as [Array<{ hash: string; createdAt: number | string }>];
    const row = rows[0];
    if (!row) return null;
    const journal = JSON.parse(await readFile(path.join(migrationsFolder, "meta", "_journal.json"), "utf8")) as { entries: Array<{ tag: string; when: number }> };
    const createdAt = Number(row.createdAt);
    return { hash: row.hash, createdAt, tag: journal.entries.find((e) => e.when === createdAt)?.tag ?? null };
  } catch (err) {
    if ((err as { code?: string }).code === "ER_NO_SUCH_TABLE") return null;
    throw err;
  }
}

/** Hard link when possible (same file system), else a copy. Returns false when the source is gone. */
async function stageFile(from: string, to: string): Promise<boolean> {
  await mkdir(path.dirname(to), { recursive: true });
  try {
    await link(from, to);
    return true;
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    if (code === "ENOENT") return false;
    if (code !== "EXDEV" && code !== "EPERM" && code !== "EMLINK") throw err;
  }
  try {
    await copyFile(from, to);
    return true;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return false;
    throw err;
  }
}

export async function backup(options: BackupOptions): Promise<BackupResult> {
  const log = options.log ?? (() => undefined);
  const started = Date.now();
  const createdAt = new Date();
  const out = path.resolve(options.out ?? path.join("backups", `forthright-${stamp(createdAt)}.tar.gz`));
  // Backups hold password hashes and session ids: a folder we create is the owner's only (an existing one is left as is).
  await mkdir(path.dirname(out), { recursive: true, mode: 0o700 });
  const uploadsDir = path.resolve(options.uploadsDir);
  const timings = { dumpMs: 0, copyMs: 0, archiveMs: 0, totalMs: 0 };
  let staging: string | null = null;
  let defaults: Awaited<ReturnType<typeof defaultsFileFor>> | null = null;
  let conn: mysql.Connection | null = null;
  try {
    // Staging beside the archive: usually the same file system as the uploads, so files can be hard-linked.
    // mkdtemp makes it 0700, so the dump inside is private too.
    staging = await mkdtemp(path.join(path.dirname(out), ".forthright-backup-"));
    defaults = await defaultsFileFor(options.databaseUrl);
    conn = await mysql.createConnection({ uri: options.databaseUrl });
    const [[server]] = (await conn.query("SELECT VERSION() AS version")) as unknown as [[{ version: string }]];
    const migration = await latestMigration(conn);
    const wait = options.lockWaitSeconds ?? 60;
    const [[lock]] = (await conn.query(`SELECT GET_LOCK(${FILES_LOCK_SQL}, ?) AS got`, [wait])) as unknown as [[{ got: number | null }]];
    if (!lock?.got) throw new Error(`Could not take the files lock within ${wait} s (an orphan clean-up or another backup holds it); try again.`);
    const files: Manifest["files"] = [];
    const vanished: string[] = [];
    try {
      log(`Dumping database ${defaults.database}…`);
      const t0 = Date.now();
      await run(
        clientBinary("mariadb-dump"),
        [`--defaults-file=${defaults.file}`, "--single-transaction", "--routines", "--triggers", "--hex-blob", "--skip-extended-insert", "--no-autocommit", defaults.database],
        path.join(staging, DUMP_NAME),
      );
      timings.dumpMs = Date.now() - t0;
      await options.afterDump?.();
      const t1 = Date.now();
      await mkdir(path.join(staging, "uploads"), { recursive: true });
      for await (const file of localStorage(uploadsDir).list()) {
        if (file.partial) continue;
        if (await stageFile(path.join(uploadsDir, file.key), path.join(staging, UPLOADS_PREFIX, file.key))) files.push({ key: file.key, sha256: "", bytes: 0 });
        else vanished.push(file.key);
      }
      timings.copyMs = Date.now() - t1;
    } finally {
      await conn.query(`SELECT RELEASE_LOCK(${FILES_LOCK_SQL})`).catch(() => undefined);
    }
    const t2 = Date.now();
    for (const f of files) Object.assign(f, await sha256File(path.join(staging, UPLOADS_PREFIX, f.key)));
    files.sort((a, b) => (a.key < b.key ? -1 : 1));
    const dumpFile = path.join(staging, DUMP_NAME);
    const manifest: Manifest = {
      format: FORMAT,
      formatVersion: FORMAT_VERSION,
      createdAt: createdAt.toISOString(),
      database: { name: defaults.database, serverVersion: server.version },
      migration,
      dump: { path: DUMP_NAME, ...(await sha256File(dumpFile)) },
      tables: await countRows(dumpFile),
      files,
      vanished,
    };
    await writeFile(path.join(staging, MANIFEST_NAME), JSON.stringify(manifest, null, 2) + "\n", { mode: 0o600 });
    // Written under a temporary name, flushed, then renamed: a crash never leaves a half archive under the real name.
    const partial = `${out}.partial`;
    // The dump holds password hashes and session ids: the file is created readable by the owner only, before a
    // byte is written ("wx": never into someone else's file). gzip level 1: the photos (nearly all the bytes) are
    // compressed already; the dump still shrinks several-fold.
    await rm(partial, { force: true }); // a crashed earlier run's leftover
    await pipeline(
      tar.create({ gzip: { level: 1 }, cwd: staging, portable: true }, [MANIFEST_NAME, DUMP_NAME, "uploads"]),
      createWriteStream(partial, { flags: "wx", mode: 0o600 }),
    ).catch((err: Error) => {
      throw new Error(`Writing the archive ${partial} failed: ${err.message}`);
    });
    const handle = await open(partial, "r+");
    await handle.sync();
    await handle.close();
    await rename(partial, out);
    const dir = await open(path.dirname(out), "r");
    await dir.sync().catch(() => undefined);
    await dir.close();
    timings.archiveMs = Date.now() - t2;
    timings.totalMs = Date.now() - started;
    const bytes = (await stat(out)).size;
    const rows = Object.values(manifest.tables).reduce((a, b) => a + b, 0);
    log(`Backup written: ${out}`);
    log(`  ${Object.keys(manifest.tables).length} tables, ${rows} rows, ${files.length} files, ${(bytes / 1024 / 1024).toFixed(1)} MiB`);
    log(`  migration ${manifest.migration?.tag ?? "none"}; dump ${seconds(timings.dumpMs)}, files ${seconds(timings.copyMs)}, archive ${seconds(timings.archiveMs)}, total ${seconds(timings.totalMs)}`);
    if (vanished.length) log(`  warning: ${vanished.length} file(s) vanished while copying (deleted by something that does not take the files lock): ${vanished.slice(0, 5).join(", ")}`);
    return { path: out, bytes, manifest, timings };
  } finally {
    await conn?.end().catch(() => undefined);
    await defaults?.remove();
    if (staging) await rm(staging, { recursive: true, force: true });
    await rm(`${out}.partial`, { force: true });
  }
}

async function cli() {
  // Everything this process creates (folder, staging, archive) is the owner's only, whatever the shell's umask.
  process.umask(0o077);
  const { values } = parseArgs({ options: { out: { type: "string", short: "o" }, help: { type: "boolean", short: "h" } } });
  if (values.help) {
    console.log("Usage: npm run backup -- [--out file.tar.gz]\nBacks up the database (DATABASE_URL, or the local MariaDB under .data/) and UPLOADS_DIR.");
    return;
  }
  if (!process.env.DATABASE_URL) {
    const { ensureLocalDatabase } = await import("./local-db.ts");
    await ensureLocalDatabase();
  }
  const settings = serverSettings();
  await backup({ databaseUrl: settings.DATABASE_URL, uploadsDir: settings.UPLOADS_DIR, out: values.out, log: console.log });
}

if (process.argv[1] && pathToFileURL(path.resolve(process.argv[1])).href === import.meta.url) {
  cli().catch((err: Error) => {
    console.error(`Backup failed: ${err.message}`);
    process.exit(1);
  });
}
