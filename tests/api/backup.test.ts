import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync, mkdirSync, readdirSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { createTestDatabase } from "../support/database.ts";
import { landscapeJpeg } from "../support/images.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { connect } from "../../server/db/client.ts";
import { referencedKeys, removeOrphans } from "../../server/modules/photos/cleanup.ts";
import { backup } from "../../scripts/backup.ts";
import { restore } from "../../scripts/restore.ts";
import * as tar from "tar";

const exec = promisify(execFile);
const root = path.resolve(import.meta.dirname, "../..");

let t: TestApp;
let work: string;
let slug: string;
const targets: Array<ReturnType<typeof createTestDatabase>> = [];

/** An empty database and a not-yet-existing uploads folder to restore into. */
function freshTarget() {
  const db = createTestDatabase();
  targets.push(db);
  return { db, uploadsDir: path.join(work, `uploads-${db.name}`) };
}

function filesOf(dir: string): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (rel: string) => {
    for (const name of readdirSync(path.join(dir, rel))) {
      const r = rel ? `${rel}/${name}` : name;
      if (statSync(path.join(dir, r)).isDirectory()) walk(r);
      else if (!name.endsWith(".partial")) out.set(r, createHash("sha256").update(readFileSync(path.join(dir, r))).digest("hex"));
    }
  };
  walk("");
  return out;
}

async function rows<T>(sql: string, params: unknown[] = []): Promise<T[]> {
  return (await t.ctx.database.pool.query(sql, params))[0] as T[];
}

/** CHECKSUM TABLE of every base table in a database (the test user may read every test database). */
async function checksums(database: string): Promise<Record<string, string>> {
  const tables = await rows<{ name: string }>("SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = ? AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME", [database]);
  const out: Record<string, string> = {};
  for (const { name } of tables) {
    const [r] = await rows<{ Checksum: string | number | null }>(`CHECKSUM TABLE \`${database}\`.\`${name}\``);
    out[name] = String(r.Checksum);
  }
  return out;
}

const npm = (args: string[], env: Record<string, string>) =>
  exec("npm", ["run", "--silent", ...args], { cwd: root, env: { ...process.env, NODE_ENV: "test", LOG_LEVEL: "silent", ...env }, maxBuffer: 16 * 1024 * 1024 });

const enquiry = () => ({
  name: "Jo Marlowe", email: "jo.marlowe@example.test", phone: "", message: "Could I see it on Saturday morning?", preferredContact: "email",
  consent: true, website: "", startedAt: Date.now() - 20_000, revision: 1,
});

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), "forthright-backup-test-"));
  t = await startTestApp();
  ({ slug } = await publishReadyVehicle(t));
  const res = await request(t.app).post(`/api/public/vehicles/${slug}/enquiries`).set("Origin", ORIGIN).send(enquiry());
  expect(res.status).toBe(201);
}, 300_000);

afterAll(async () => {
  await t?.close();
  for (const db of targets) db.drop();
  rmSync(work, { recursive: true, force: true });
});

describe("backup and restore", () => {
  let consistentArchive = "";

  it("when the app keeps writing during a backup, then the restore is one snapshot: every write acknowledged before it began is there, and every file a row names is there with its hash", async () => {
    const sales = await t.signIn("sales");
    const workshop = await t.signIn("workshop");
    // A photo with all its sizes, deleted while the backup copies files: the snapshot still has its row.
    const doomed = (await sales.post("/api/vehicles").send(dieselSuv({ colour: "Moss green" }))).body.vehicle;
    const doomedPhoto = (await workshop.post(`/api/vehicles/${doomed.id}/photos`).attach("photos", await landscapeJpeg(1200, 800), "doomed.jpg")).body.photos[0];
    await t.ctx.photoWorker.settled();
    // The worker bumps a photo's version when it stores the sizes, so a deletion asks for the current one.
    const deletePhoto = async (vehicleId: number, photoId: number) => {
      const [p] = await rows<{ version: number }>("SELECT version FROM photos WHERE id = ?", [photoId]);
      return workshop.delete(`/api/vehicles/${vehicleId}/photos/${photoId}?version=${p.version}`);
    };

    // The writer: create a vehicle, upload a photo, edit, delete the previous photo and clean up orphans, again and again.
    const acked: Array<{ vehicleId: number; version: number }> = [];
    const failures: string[] = [];
    let stop = false;
    let iterations = 0;
    const writer = (async () => {
      let previous: { vehicleId: number; photoId: number } | null = null;
      while (!stop) {
        const created = await sales.post("/api/vehicles").send(dieselSuv({ colour: `Batch ${iterations}` }));
        if (created.status !== 201) failures.push(`create ${created.status}`);
        const v = created.body.vehicle;
        acked.push({ vehicleId: v.id, version: v.version });
        const up = await workshop.post(`/api/vehicles/${v.id}/photos`).attach("photos", await landscapeJpeg(800, 600), "w.jpg");
        if (up.status !== 201) failures.push(`upload ${up.status}`);
        const edited = await sales.patch(`/api/vehicles/${v.id}`).send({ version: v.version, colour: `Edited ${iterations}` });
        if (edited.status !== 200) failures.push(`edit ${edited.status} ${JSON.stringify(edited.body)}`);
        else acked.push({ vehicleId: v.id, version: edited.body.vehicle.version });
        if (previous) {
          // Once the worker has written every size: it bumps the photo's version, and the clean-up below has no grace
          // period, so it must not race a write of ours.
          await t.ctx.photoWorker.settled();
          const del = await deletePhoto(previous.vehicleId, previous.photoId);
          if (del.status !== 204 && del.status !== 200) failures.push(`delete ${del.status} ${JSON.stringify(del.body)}`);
          await removeOrphans(t.ctx.database, t.ctx.storage, t.ctx.uploadsDir, { graceMs: 0 });
        }
        previous = { vehicleId: v.id, photoId: up.body.photos[0].id };
        iterations++;
      }
    })().catch((err: Error) => void failures.push(`writer stopped: ${err.message}`));
    // The editor: one vehicle edited as fast as the API answers, so writes land before, during and after the dump.
    const edited = (await sales.post("/api/vehicles").send(dieselSuv({ colour: "Ochre" }))).body.vehicle;
    let editedVersion = edited.version as number;
    const editor = (async () => {
      for (let n = 0; !stop; n++) {
        const r = await sales.patch(`/api/vehicles/${edited.id}`).send({ version: editedVersion, keysCount: (n % 3) + 1 });
        if (r.status !== 200) failures.push(`editor ${r.status}`);
        else editedVersion = r.body.vehicle.version;
      }
    })().catch((err: Error) => void failures.push(`editor stopped: ${err.message}`));
    // Two rounds of writes before the backup starts; a writer or editor that fails stops the wait (and the test).
    while (iterations < 2 && failures.length === 0) await new Promise((r) => setTimeout(r, 50));

    const before = [...acked];
    const editedBefore = editedVersion;
    let editedAtHook = 0;
    const iterationsBefore = iterations;
    let cleanupDuringCopy: string[] | null = null;
    let deletedDuringCopy = 0;
    const result = await backup({
      databaseUrl: t.ctx.config.DATABASE_URL,
      uploadsDir: t.ctx.uploadsDir,
      out: path.join(work, "during-writes.tar.gz"),
      afterDump: async () => {
        // The dump is done: whatever is acknowledged from here on is after the snapshot and must not be in it.
        editedAtHook = editedVersion;
        while (editedVersion === editedAtHook && failures.length === 0) await new Promise((r) => setTimeout(r, 10));
        deletedDuringCopy = (await deletePhoto(doomed.id, doomedPhoto.id)).status;
        cleanupDuringCopy = await removeOrphans(t.ctx.database, t.ctx.storage, t.ctx.uploadsDir, { graceMs: 0 });
      },
    }).finally(async () => {
      stop = true;
      await Promise.all([writer, editor]);
    });
    const iterationsDuring = iterations - iterationsBefore;
    expect(deletedDuringCopy).toBe(204);
    expect(failures).toEqual([]);
    // The clean-up found the files lock held and skipped its pass.
    expect(cleanupDuringCopy).toEqual([]);
    console.log(`backup during writes: ${result.manifest.files.length} files, ${result.bytes} bytes; dump ${result.timings.dumpMs} ms, files ${result.timings.copyMs} ms, archive ${result.timings.archiveMs} ms, total ${result.timings.totalMs} ms; writer iterations during it: ${iterationsDuring}`);

    const firstTarget = freshTarget();
    const restored = await restore({ archive: result.path, databaseUrl: firstTarget.db.url, uploadsDir: firstTarget.uploadsDir });
    console.log(`restore of it: ${restored.rows} rows, ${restored.files} files; verify ${restored.timings.verifyMs} ms, load ${restored.timings.loadMs} ms, files ${restored.timings.filesMs} ms, checks ${restored.timings.checkMs} ms, total ${restored.timings.totalMs} ms`);

    const target = firstTarget.db.name;
    const vehicles = new Map((await rows<{ id: number; version: number }>(`SELECT id, version FROM \`${target}\`.vehicles`)).map((v) => [v.id, v.version]));
    for (const a of before) expect(vehicles.get(a.vehicleId), `vehicle ${a.vehicleId} at version ${a.version}`).toBeGreaterThanOrEqual(a.version);
    // The edited vehicle is as the snapshot saw it: at least what was acknowledged before, nothing from after the dump.
    expect(vehicles.get(edited.id)).toBeGreaterThanOrEqual(editedBefore);
    expect(vehicles.get(edited.id)).toBeLessThanOrEqual(editedAtHook);
    expect(editedVersion).toBeGreaterThan(editedAtHook);
    console.log(`edited vehicle: version ${editedBefore} before the backup, ${vehicles.get(edited.id)} in it, ${editedAtHook} when the dump ended, ${editedVersion} at the end`);
    // The doomed photo was deleted after the snapshot: its row is in the backup, and so are all its files.
    const [photo] = await rows<{ masterKey: string; variants: unknown }>(`SELECT master_key AS masterKey, variants FROM \`${target}\`.photos WHERE id = ?`, [doomedPhoto.id]);
    expect(photo).toBeDefined();
    const variants = (typeof photo.variants === "string" ? JSON.parse(photo.variants) : photo.variants) as Array<{ key: string }>;
    expect(variants.length).toBeGreaterThan(0);
    // Rows the writer did not touch are there as they were.
    for (const table of ["revisions", "revision_media", "leads", "users", "defects"]) {
      const [src] = await rows<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``);
      const [dst] = await rows<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${target}\`.\`${table}\``);
      expect(Number(dst.n), table).toBe(Number(src.n));
    }

    // Every file a restored row names is restored, with the content the backup recorded; masters and close-ups are
    // named by the sha256 of their own bytes, so for them the content is checked against the name as well.
    const files = filesOf(firstTarget.uploadsDir);
    const recorded = new Map(result.manifest.files.map((f) => [f.key, f.sha256]));
    const database = connect(firstTarget.db.url, { connectionLimit: 2 });
    try {
      const keys = await referencedKeys(database);
      expect(keys.has(photo.masterKey)).toBe(true);
      for (const v of variants) expect(keys.has(v.key)).toBe(true);
      for (const key of keys) {
        expect(files.get(key), key).toBe(recorded.get(key));
        const named = /\/([a-f0-9]{64})\.(jpg|webp)$/.exec(key);
        if (named) expect(files.get(key), key).toBe(named[1]);
      }
    } finally {
      await database.close();
    }
  }, 300_000);

  it("when writes have stopped, then a backup and restore through npm run give the same CHECKSUM TABLE for every table and the same bytes for every file", async () => {
    await t.ctx.photoWorker.settled();
    const archive = path.join(work, "quiet.tar.gz");
    let started = Date.now();
    const made = await npm(["backup", "--", "--out", archive], { DATABASE_URL: t.ctx.config.DATABASE_URL, UPLOADS_DIR: t.ctx.uploadsDir });
    const backupMs = Date.now() - started;
    expect(made.stdout).toMatch(/Backup written: .*quiet\.tar\.gz/);
    // It holds password hashes and session ids: the owner's only.
    expect(statSync(archive).mode & 0o777).toBe(0o600);
    consistentArchive = archive;

    const target = freshTarget();
    started = Date.now();
    const done = await npm(["restore", "--", archive], { DATABASE_URL: target.db.url, UPLOADS_DIR: target.uploadsDir });
    const restoreMs = Date.now() - started;
    expect(done.stdout).toMatch(/Restored \d+ tables/);
    console.log(`npm run backup (quiet): ${backupMs} ms\n${made.stdout.trim()}\nnpm run restore: ${restoreMs} ms\n${done.stdout.trim()}`);

    const source = await checksums(t.ctx.config.DATABASE_URL.split("/").pop()!);
    const copy = await checksums(target.db.name);
    expect(Object.keys(source).length).toBeGreaterThan(10);
    expect(copy).toEqual(source);
    const sourceFiles = filesOf(t.ctx.uploadsDir);
    expect(sourceFiles.size).toBeGreaterThan(0);
    expect(filesOf(target.uploadsDir)).toEqual(sourceFiles);
  }, 300_000);

  it("when the target database has rows or the uploads folder has files, then restore refuses and says which, and --force replaces them", async () => {
    await expect(restore({ archive: consistentArchive, databaseUrl: t.ctx.config.DATABASE_URL, uploadsDir: t.ctx.uploadsDir })).rejects.toThrow(
      /Refusing to restore over existing data: database t_\w+ has rows in \d+ table\(s\) \(audit_log, .*\) and the uploads folder .* holds \d+ file\(s\)/,
    );
    const target = freshTarget();
    mkdirSync(path.join(target.uploadsDir, "photos"), { recursive: true });
    writeFileSync(path.join(target.uploadsDir, "photos", "left-behind.jpg"), "x");
    await expect(restore({ archive: consistentArchive, databaseUrl: target.db.url, uploadsDir: target.uploadsDir })).rejects.toThrow(/the uploads folder .* holds 1 file/);
    // A full target (the backup taken during writes, restored) is replaced with --force.
    const full = freshTarget();
    await restore({ archive: path.join(work, "during-writes.tar.gz"), databaseUrl: full.db.url, uploadsDir: full.uploadsDir });
    await expect(restore({ archive: consistentArchive, databaseUrl: full.db.url, uploadsDir: full.uploadsDir })).rejects.toThrow(/Refusing/);
    const forced = await restore({ archive: consistentArchive, databaseUrl: full.db.url, uploadsDir: full.uploadsDir, force: true });
    expect(filesOf(full.uploadsDir).size).toBe(forced.files);
    expect(await checksums(full.db.name)).toEqual(await checksums(t.ctx.config.DATABASE_URL.split("/").pop()!));
  }, 300_000);

  it("when the uploads folder holds only a .gitkeep (a fresh checkout), then restore takes it as empty and keeps the .gitkeep; when it holds anything the app never stores there, restore refuses even with --force and leaves it alone", async () => {
    const fresh = freshTarget();
    mkdirSync(fresh.uploadsDir, { recursive: true });
    writeFileSync(path.join(fresh.uploadsDir, ".gitkeep"), "");
    const done = await restore({ archive: consistentArchive, databaseUrl: fresh.db.url, uploadsDir: fresh.uploadsDir });
    expect(readFileSync(path.join(fresh.uploadsDir, ".gitkeep"), "utf8")).toBe("");
    expect(filesOf(fresh.uploadsDir).size).toBe(done.files + 1);

    const stray = freshTarget();
    mkdirSync(path.join(stray.uploadsDir, "invoices"), { recursive: true });
    writeFileSync(path.join(stray.uploadsDir, "invoices", "march.pdf"), "not ours");
    for (const force of [false, true]) {
      await expect(restore({ archive: consistentArchive, databaseUrl: stray.db.url, uploadsDir: stray.uploadsDir, force })).rejects.toThrow(
        /Refusing to restore: the uploads folder .* holds invoices, which the app never stores there .*--force does not remove it/,
      );
    }
    expect(readFileSync(path.join(stray.uploadsDir, "invoices", "march.pdf"), "utf8")).toBe("not ours");
    const [tables] = await rows<{ n: number }>("SELECT COUNT(*) AS n FROM information_schema.TABLES WHERE TABLE_SCHEMA = ?", [stray.db.name]);
    expect(Number(tables.n)).toBe(0);
  }, 300_000);

  it("when something holds the target's files lock (a clean-up pass or a backup of it), then restore waits for it, and gives up without changing anything", async () => {
    const target = freshTarget();
    const holder = await t.ctx.database.pool.getConnection();
    try {
      // The same name the backup and the orphan clean-up use: CONCAT(DATABASE(), ':files') on the target.
      const [[got]] = (await holder.query("SELECT GET_LOCK(?, 0) AS got", [`${target.db.name}:files`])) as unknown as [[{ got: number }]];
      expect(got.got).toBe(1);
      await expect(restore({ archive: consistentArchive, databaseUrl: target.db.url, uploadsDir: target.uploadsDir, lockWaitSeconds: 1 })).rejects.toThrow(
        /Could not take the files lock within 1 s .*nothing was changed/,
      );
    } finally {
      await holder.query("SELECT RELEASE_LOCK(?)", [`${target.db.name}:files`]);
      holder.release();
    }
    expect(() => readdirSync(target.uploadsDir)).toThrow();
    await restore({ archive: consistentArchive, databaseUrl: target.db.url, uploadsDir: target.uploadsDir, lockWaitSeconds: 1 });
  }, 300_000);

  it("when loading the dump fails during a --force restore, then the old uploads are put back exactly as they were", async () => {
    // A well-formed archive whose dump the client rejects part-way (its manifest hashes the damaged dump, so it verifies).
    const unpacked = path.join(work, "bad-dump");
    mkdirSync(unpacked);
    await tar.extract({ file: consistentArchive, cwd: unpacked });
    const dumpFile = path.join(unpacked, "database.sql");
    writeFileSync(dumpFile, readFileSync(dumpFile, "utf8") + "\nTHIS IS NOT SQL;\n");
    const manifestFile = path.join(unpacked, "manifest.json");
    const manifest = JSON.parse(readFileSync(manifestFile, "utf8")) as { dump: { sha256: string; bytes: number } };
    const dump = readFileSync(dumpFile);
    manifest.dump = { ...manifest.dump, sha256: createHash("sha256").update(dump).digest("hex"), bytes: dump.length };
    writeFileSync(manifestFile, JSON.stringify(manifest));
    const badArchive = path.join(work, "bad-dump.tar.gz");
    await tar.create({ gzip: true, file: badArchive, cwd: unpacked }, ["manifest.json", "database.sql", "uploads"]);

    const target = freshTarget();
    await restore({ archive: path.join(work, "during-writes.tar.gz"), databaseUrl: target.db.url, uploadsDir: target.uploadsDir });
    const before = filesOf(target.uploadsDir);
    expect(before.size).toBeGreaterThan(0);
    await expect(restore({ archive: badArchive, databaseUrl: target.db.url, uploadsDir: target.uploadsDir, force: true })).rejects.toThrow(/Loading the dump failed/);
    expect(filesOf(target.uploadsDir)).toEqual(before);
    // Nothing moved aside is left behind.
    expect(readdirSync(target.uploadsDir).filter((name) => name.startsWith("."))).toEqual([]);
  }, 300_000);

  it("when the archive is truncated or corrupt, then restore refuses with a clear message and leaves the target untouched", async () => {
    const whole = readFileSync(consistentArchive);
    const truncated = path.join(work, "truncated.tar.gz");
    writeFileSync(truncated, whole.subarray(0, Math.floor(whole.length / 2)));
    const flipped = path.join(work, "flipped.tar.gz");
    const damaged = Buffer.from(whole);
    damaged[Math.floor(damaged.length * 0.6)] ^= 0xff;
    writeFileSync(flipped, damaged);
    const notOurs = path.join(work, "not-a-backup.tar.gz");
    writeFileSync(notOurs, "this is not an archive at all\n");

    // A file changed inside an otherwise well-formed archive: the manifest's sha256 catches it.
    const unpacked = path.join(work, "unpacked");
    mkdirSync(unpacked);
    await tar.extract({ file: consistentArchive, cwd: unpacked });
    const victim = (JSON.parse(readFileSync(path.join(unpacked, "manifest.json"), "utf8")) as { files: Array<{ key: string }> }).files[0].key;
    writeFileSync(path.join(unpacked, "uploads", victim), "not the photo");
    const tampered = path.join(work, "tampered.tar.gz");
    await tar.create({ gzip: true, file: tampered, cwd: unpacked }, ["manifest.json", "database.sql", "uploads"]);

    const target = freshTarget();
    const refusal = (archive: string) => restore({ archive, databaseUrl: target.db.url, uploadsDir: target.uploadsDir }).then(() => "restored", (err: Error) => err.message);
    const messages = { truncated: await refusal(truncated), flipped: await refusal(flipped), notOurs: await refusal(notOurs), tampered: await refusal(tampered) };
    console.log(messages);
    expect(messages.truncated).toMatch(/^The archive .*truncated\.tar\.gz is corrupt or truncated and was not restored/);
    expect(messages.flipped).toMatch(/corrupt or truncated|is damaged/);
    expect(messages.notOurs).toMatch(/corrupt or truncated|not a Forthright backup/);
    expect(messages.tampered).toBe(`The archive is damaged (1 file): ${victim} does not match its sha256.`);
    await expect(restore({ archive: truncated, databaseUrl: target.db.url, uploadsDir: target.uploadsDir })).rejects.toThrow(/corrupt or truncated|damaged|truncated/);
    await expect(restore({ archive: flipped, databaseUrl: target.db.url, uploadsDir: target.uploadsDir })).rejects.toThrow(/corrupt or truncated|damaged/);
    await expect(restore({ archive: notOurs, databaseUrl: target.db.url, uploadsDir: target.uploadsDir })).rejects.toThrow(/corrupt or truncated|not a Forthright backup/);
    // Through the command line: exit code 1 and the reason on stderr.
    const cli = await npm(["restore", "--", truncated], { DATABASE_URL: target.db.url, UPLOADS_DIR: target.uploadsDir }).then(
      () => null,
      (err: { code: number; stderr: string }) => err,
    );
    expect(cli?.code).toBe(1);
    expect(cli?.stderr).toMatch(/Restore stopped: The archive .*truncated\.tar\.gz is corrupt or truncated/);
    const [tables] = await rows<{ n: number }>("SELECT COUNT(*) AS n FROM information_schema.TABLES WHERE TABLE_SCHEMA = ?", [target.db.name]);
    expect(Number(tables.n)).toBe(0);
    expect(() => readdirSync(target.uploadsDir)).toThrow();
  }, 300_000);
});
