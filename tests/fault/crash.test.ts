import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { asc } from "drizzle-orm";
import { defects, photos, revisionMedia, revisions, vehicles } from "../../server/db/schema/index.ts";
import { referencedKeys, removeOrphans } from "../../server/modules/photos/cleanup.ts";
import { mediaKeysOf } from "../../server/modules/publishing/snapshot.ts";
import { assertDurable } from "../../server/lib/boot.ts";
import { databaseUrl, findBinary, instanceFor, provisionDatabase, removeDataDir, startMariadb, stopMariadb } from "../../server/db/mariadb.ts";
import { Client, photoForm, releasePort, reservedPort, serverWorld, ServerProcess, type ServerWorld } from "../support/server-process.ts";
import { prepareReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { landscapeJpeg } from "../support/images.ts";
import { seededRandom } from "../support/random.ts";

/**
 * Crash consistency: the real server is SIGKILLed at random moments while photos are uploaded and vehicles published,
 * then started again and checked. The seed is printed; CRASH_SEED=<n> replays a run, CRASH_KILLS=<n> changes the count.
 */
const KILLS = Number(process.env.CRASH_KILLS ?? 20);
const SEED = Number(process.env.CRASH_SEED ?? Date.now() % 1_000_000);
/** Seeded, so a failing run can be replayed. */
const random = seededRandom(SEED);
/** How long a round waits for its first acknowledged upload and publish before the kill is timed: generous, for a busy machine. */
const FIRST_ACK_CAP_MS = 60_000;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

let world: ServerWorld;
let server: ServerProcess;
let workshop: Client;
let sales: Client;
/** A ready vehicle published again and again; vehicles that receive uploads. Kept apart, since a photo still processing rightly blocks a publish. */
const publishIds: number[] = [];
let uploadIds: number[] = [];
const images: Buffer[] = [];
let nextImage = 0;

/** Everything the clients were told succeeded (a 2xx arrived). */
const ackedPhotos = new Map<number, number>(); // photo id → vehicle id
const ackedRevisions: Array<{ vehicleId: number; number: number }> = [];
const unexpected: string[] = [];
const stats = { kills: 0, uploads: 0, publishes: 0, refusedFull: 0, revisionsComparedWithApi: 0, filesChecked: 0 };
/** Acknowledgements in the round under way, and the rounds whose kill came before one of each arrived (the cap ran out). */
const thisRound = { uploads: 0, publishes: 0 };
const roundsShort: string[] = [];
const comparedWithApi = new Set<string>();
/** Photos that were still waiting for their variants when the server was killed; unfinished writes seen after kills. */
const interrupted = new Set<number>();
const partials = new Set<string>();
const timing = { firstAckMs: 0, restartMs: 0, checkMs: 0, drainMs: 0 };

beforeAll(async () => {
  world = await serverWorld();
  const t = world.app;
  publishIds.push((await prepareReadyVehicle(t)).vehicleId);
  for (let i = 0; i < 5; i++) uploadIds.push(await uploadVehicle());
  // 480 × 320: above the 320 px minimum short side, so each photo makes only two widths of variants.
  for (let i = 0; i < 200; i++) images.push(await landscapeJpeg(480, 320));
  server = await world.server();
  await server.start();
  workshop = await new Client(server.url).signIn("workshop");
  sales = await new Client(server.url).signIn("sales");
}, 240_000);

afterAll(async () => {
  await world?.close();
});

const pick = <T>(xs: T[]) => xs[Math.floor(random() * xs.length)];

/** A vehicle for uploads, made through the in-process app on the same database. */
let plates = 0;
async function uploadVehicle() {
  const s = await world.app.signIn("sales");
  const res = await s.post("/api/vehicles").send(dieselSuv({ make: "Drovell", model: "Quill", registrationPlate: `FHM ${400 + plates++}` }));
  if (res.status !== 201) throw new Error(`vehicle not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.vehicle.id as number;
}

/** A vehicle at its photo limit is swapped for a new one, so rounds never stall on uploads that can only be refused. */
const replacing = new Map<number, Promise<void>>();
function replaceFull(vehicleId: number) {
  if (!replacing.has(vehicleId))
    replacing.set(vehicleId, uploadVehicle().then((id) => void (uploadIds = uploadIds.map((x) => (x === vehicleId ? id : x)))));
  return replacing.get(vehicleId)!;
}

/** Uploads until the connection fails (the kill); records what was acknowledged. */
async function uploader() {
  for (;;) {
    const vehicleId = pick(uploadIds);
    const files = Array.from({ length: 1 + Math.floor(random() * 2) }, (_, i) => ({ name: `walkround-${i}.jpg`, data: images[nextImage++ % images.length] }));
    let res;
    try {
      res = await workshop.post(`/api/vehicles/${vehicleId}/photos`, photoForm(files));
    } catch {
      return;
    }
    if (res.status === 201) {
      stats.uploads++;
      thisRound.uploads++;
      for (const p of res.body.photos as Array<{ id: number }>) ackedPhotos.set(p.id, vehicleId);
    } else if (res.status === 409 && res.body?.error?.code === "too_many_photos") {
      stats.refusedFull++;
      await replaceFull(vehicleId);
    } else unexpected.push(`upload ${res.status} ${res.text.slice(0, 200)}`);
  }
}

async function publisher(vehicleId: number) {
  for (;;) {
    let res;
    try {
      res = await sales.post(`/api/vehicles/${vehicleId}/publish`, {});
    } catch {
      return;
    }
    if (res.status === 201) {
      stats.publishes++;
      thisRound.publishes++;
      ackedRevisions.push({ vehicleId, number: res.body.revision.number });
    } else unexpected.push(`publish ${res.status} ${res.text.slice(0, 200)}`);
  }
}

const storage = () => world.app.ctx.storage;
const db = () => world.app.ctx.database.db;

async function processingCount() {
  const [rows] = await world.app.ctx.database.pool.query("select count(*) as n from photos where status = 'processing'");
  return Number((rows as Array<{ n: number }>)[0].n);
}

async function listFiles() {
  const out: Array<{ key: string; partial: boolean }> = [];
  for await (const f of storage().list()) out.push({ key: f.key, partial: f.partial });
  return out;
}

let seen = new Set<string>();
/** Sizes the photo rows record for their variants. */
let variantBytes = new Map<string, number>();
/** The file a row names is there and whole: masters and close-ups are named by their SHA-256, variants' sizes are in the row. */
async function expectFile(key: string, what: string) {
  if (seen.has(key)) return;
  seen.add(key);
  stats.filesChecked++;
  expect(await storage().exists(key), `${what} points to ${key}, which is not in storage (seed ${SEED})`).toBe(true);
  const data = await storage().read(key);
  const named = /\/([a-f0-9]{64})(-master)?\.(jpg|webp|avif)$/.exec(key);
  if (named && (named[2] || key.startsWith("closeups/"))) expect(createHash("sha256").update(data).digest("hex"), `${what}: ${key} is whole`).toBe(named[1]);
  else if (variantBytes.has(key)) expect(data.length, `${what}: ${key} is whole`).toBe(variantBytes.get(key));
  else expect(data.length, `${what}: ${key} has content`).toBeGreaterThan(0);
}

/** The invariants that must hold after any crash. */
async function checkConsistency(when: string) {
  const ctx = `${when} (seed ${SEED})`;
  seen = new Set();
  expect(unexpected, ctx).toEqual([]);

  // Every acknowledged photo is there, on the vehicle it was sent to, and every photo row's files exist and are whole.
  const photoRows = await db().select().from(photos);
  const byId = new Map(photoRows.map((p) => [p.id, p]));
  variantBytes = new Map(photoRows.flatMap((p) => p.variants.map((v) => [v.key, v.bytes] as const)));
  for (const [id, vehicleId] of ackedPhotos) expect(byId.get(id)?.vehicleId, `acknowledged photo ${id} ${ctx}`).toBe(vehicleId);
  for (const p of photoRows) {
    expect(p.status, `photo ${p.id} ${ctx}`).not.toBe("failed");
    await expectFile(p.masterKey, `photo ${p.id}'s master`);
    if (p.status === "ready") {
      expect(p.variants.length, `ready photo ${p.id} has variants ${ctx}`).toBeGreaterThan(0);
      for (const v of p.variants) await expectFile(v.key, `photo ${p.id}'s ${v.width} ${v.format}`);
    } else expect(p.variants, `processing photo ${p.id} ${ctx}`).toEqual([]);
  }
  for (const d of await db().select().from(defects)) if (d.closeupKey) await expectFile(d.closeupKey, `defect ${d.id}'s close-up`);

  // Revisions: every acknowledged one is there; numbers run 1..n with no gap; the vehicle row agrees; each revision is whole.
  const revRows = await db().select().from(revisions).orderBy(asc(revisions.vehicleId), asc(revisions.number));
  const media = await db().select().from(revisionMedia);
  for (const a of ackedRevisions) expect(revRows.some((r) => r.vehicleId === a.vehicleId && r.number === a.number), `acknowledged revision ${a.number} of vehicle ${a.vehicleId} ${ctx}`).toBe(true);
  const vehicleRows = await db().select().from(vehicles);
  for (const vehicleId of publishIds) {
    const mine = revRows.filter((r) => r.vehicleId === vehicleId);
    const v = vehicleRows.find((x) => x.id === vehicleId)!;
    expect(mine.map((r) => r.number), `revision numbers of vehicle ${vehicleId} ${ctx}`).toEqual(mine.map((_, i) => i + 1));
    expect(v.lastRevisionNumber, `vehicle ${vehicleId} last revision number ${ctx}`).toBe(mine.length);
    if (!mine.length) {
      expect(v.currentRevisionId, ctx).toBeNull();
      continue;
    }
    const last = mine.at(-1)!;
    expect(v.currentRevisionId, `vehicle ${vehicleId} points at its newest revision ${ctx}`).toBe(last.id);
    expect(v.status, ctx).toBe("live");
    expect(new Set(mine.map((r) => r.slug)), ctx).toEqual(new Set([v.publicSlug]));
    for (const r of mine) {
      // The ready vehicle has four ready photos and one pinned defect: a whole snapshot shows all of them.
      expect(r.snapshot.photos, `revision ${r.number} of ${vehicleId} photos ${ctx}`).toHaveLength(4);
      expect(r.snapshot.defects.filter((d) => d.closeup), `revision ${r.number} of ${vehicleId} close-ups ${ctx}`).toHaveLength(1);
      const keys = media.filter((m) => m.revisionId === r.id).map((m) => m.key).sort();
      expect(keys, `revision ${r.number} of ${vehicleId}: revision_media is the snapshot's media ${ctx}`).toEqual(mediaKeysOf(r.snapshot).sort());
      expect(keys.length, ctx).toBeGreaterThan(4);
      for (const k of keys) await expectFile(k, `revision ${r.number} of vehicle ${vehicleId}`);
    }
    // What the public API serves is what was written: the list of revisions, and each revision's snapshot.
    const anyone = new Client(server.url);
    const current = await anyone.get(`/api/public/vehicles/${v.publicSlug}`);
    expect(current.status, ctx).toBe(200);
    expect(current.body.vehicle.revision.number, ctx).toBe(last.number);
    expect(current.body.vehicle.revisions.map((x: { number: number }) => x.number), ctx).toEqual(mine.map((r) => r.number).reverse());
    for (const r of mine) {
      if (comparedWithApi.has(`${vehicleId}:${r.number}`)) continue;
      const served = await anyone.get(`/api/public/vehicles/${v.publicSlug}/revisions/${r.number}`);
      expect(served.status, ctx).toBe(200);
      expect(served.body.vehicle.snapshot, `revision ${r.number} of ${vehicleId} as served ${ctx}`).toEqual(r.snapshot);
      comparedWithApi.add(`${vehicleId}:${r.number}`);
      stats.revisionsComparedWithApi++;
    }
  }
}

describe("crash consistency under SIGKILL", () => {
  it(
    "when the server is killed at random moments during uploads and publishes, then after each restart every acknowledged write is there, no revision is partial and no row points to a missing file; after the clean-up no orphan remains",
    async () => {
      for (let round = 1; round <= KILLS; round++) {
        // Two publishers on the one ready vehicle: their publishes queue on its row lock and must still number 1, 2, 3 …
        thisRound.uploads = thisRound.publishes = 0;
        const loops = [uploader(), uploader(), ...publishIds.flatMap((id) => [publisher(id), publisher(id)])];
        // The kill is timed from the round's first acknowledged upload and publish, not from its start: on a busy machine
        // the first answers can take seconds, and a kill before them would test nothing. Then 100–1500 ms more, from
        // the next requests landing to well into the photo worker's variants.
        const roundStart = Date.now();
        while ((!thisRound.uploads || !thisRound.publishes) && Date.now() - roundStart < FIRST_ACK_CAP_MS) await sleep(25);
        timing.firstAckMs += Date.now() - roundStart;
        if (!thisRound.uploads || !thisRound.publishes)
          roundsShort.push(`round ${round}: ${thisRound.uploads} uploads and ${thisRound.publishes} publishes acknowledged in ${FIRST_ACK_CAP_MS} ms\n${server.log(20)}`);
        await sleep(100 + random() * 1400);
        await server.kill("SIGKILL");
        stats.kills++;
        await Promise.all(loops);
        // What the kill left behind, read while nothing runs.
        for (const p of await db().select({ id: photos.id, status: photos.status }).from(photos)) if (p.status === "processing") interrupted.add(p.id);
        for (const f of await listFiles()) if (f.partial) partials.add(f.key);
        let t0 = Date.now();
        await server.start();
        timing.restartMs += Date.now() - t0;
        t0 = Date.now();
        await checkConsistency(`after kill ${round}`);
        timing.checkMs += Date.now() - t0;
      }
      // Every round had something acknowledged to lose: at least one upload and one publish before its kill.
      expect(roundsShort, `rounds without an acknowledged upload and publish (seed ${SEED})`).toEqual([]);

      // The queue the kills left (photos still processing) is picked up by the restarted server and finishes.
      const drainStart = Date.now();
      const deadline = Date.now() + 180_000;
      let processing = Infinity;
      while (Date.now() < deadline) {
        processing = await processingCount();
        if (processing === 0) break;
        await sleep(500);
      }
      expect(processing, `photos still processing after restart\n${server.log()}`).toBe(0);
      timing.drainMs = Date.now() - drainStart;
      await checkConsistency("after the queue drained");

      // The clean-up with no grace period removes every orphan and unfinished write, and nothing a row refers to.
      const before = await listFiles();
      const referenced = await referencedKeys(world.app.ctx.database);
      const orphansBefore = before.filter((f) => f.partial || !referenced.has(f.key));
      // The server's own start-up pass holds the files lock for a moment; a pass that finds it held removes nothing.
      let removed: string[] = [];
      for (let attempt = 0; attempt < 20 && !removed.length && orphansBefore.length; attempt++) {
        if (attempt) await sleep(500);
        removed = await removeOrphans(world.app.ctx.database, storage(), world.uploadsDir, { graceMs: 0 });
      }
      expect(removed.sort()).toEqual(orphansBefore.map((f) => f.key).sort());
      const after = await listFiles();
      expect(after.filter((f) => f.partial)).toEqual([]);
      expect(after.filter((f) => !referenced.has(f.key))).toEqual([]);
      expect(new Set(after.map((f) => f.key))).toEqual(referenced);
      await checkConsistency("after the clean-up");

      // Every file a revision shows is served.
      const anyone = new Client(server.url);
      const shown = [...new Set((await db().select({ key: revisionMedia.key }).from(revisionMedia)).map((r) => r.key))];
      for (const key of shown) expect((await anyone.get(`/media/${key}`)).status, key).toBe(200);

      const photoCount = (await db().select({ id: photos.id }).from(photos)).length;
      const revisionCount = (await db().select({ id: revisions.id }).from(revisions)).length;
      console.log(
        `crash: ${stats.kills} SIGKILLs (seed ${SEED}); acknowledged ${ackedPhotos.size} photos in ${stats.uploads} uploads and ${ackedRevisions.length} revisions, all present ` +
          `(${photoCount - ackedPhotos.size} photos and ${revisionCount - ackedRevisions.length} revisions committed without an answer); ` +
          `${revisionCount} revisions whole and gap-free, ${stats.revisionsComparedWithApi} compared with the public API; ${stats.filesChecked} row→file checks; ` +
          `${interrupted.size} photos left processing by a kill, all finished after restarts; ${partials.size} .partial files left by kills; ` +
          `clean-up removed ${removed.length} files (${orphansBefore.filter((f) => f.partial).length} partial), none left; ${stats.refusedFull} uploads refused as full; ` +
          `first upload and publish acknowledged ${Math.round(timing.firstAckMs / stats.kills)} ms into a round, restart to healthy ${Math.round(timing.restartMs / stats.kills)} ms and checks ${Math.round(timing.checkMs / stats.kills)} ms a round on average, queue drained ${timing.drainMs} ms after the last kill`,
      );
    },
    600_000,
  );
});

describe("durability check at boot", () => {
  it("when MariaDB answers innodb_flush_log_at_trx_commit other than 1, then the boot check refuses with the setting named", () => {
    // MariaDB documents 1 as the only value that writes and flushes the log at each commit (innodb_flush_log_at_trx_commit).
    expect(() => assertDurable(1)).not.toThrow();
    expect(() => assertDurable("1")).not.toThrow();
    for (const bad of [0, 2, 3, null, undefined]) expect(() => assertDurable(bad)).toThrow(/innodb_flush_log_at_trx_commit=.*needs 1/);
  });

  it("when the server's MariaDB has innodb_flush_log_at_trx_commit = 2, then the real server exits at boot with a clear message", async () => {
    // Its own throwaway MariaDB, so SET GLOBAL cannot disturb the other test files on the run's server.
    const dir = mkdtempSync(path.join(tmpdir(), "forthright-fault-db-"));
    const ports = [await reservedPort(), await reservedPort(), await reservedPort()];
    const instance = instanceFor(dir, ports[0]);
    await startMariadb(instance);
    try {
      const credentials = { database: "fault_durability", user: "forthright_test", password: "test-password-not-secret" };
      provisionDatabase(instance, credentials);
      execFileSync(findBinary("mariadb") ?? findBinary("mysql")!, ["--no-defaults", `--socket=${instance.socket}`, "-uroot", "-e", "SET GLOBAL innodb_flush_log_at_trx_commit = 2"]);
      const port = ports[1];
      const uploads = mkdtempSync(path.join(tmpdir(), "forthright-fault-uploads-"));
      const lax = new ServerProcess(port, {
        ...process.env, NODE_ENV: "test", HOST: "127.0.0.1", PORT: String(port), DATABASE_URL: databaseUrl(instance, credentials),
        UPLOADS_DIR: uploads, LOG_LEVEL: "warn", FAKE_SMTP_PORT: String(ports[2]),
      });
      await expect(lax.start(60_000)).rejects.toThrow(/exited before it answered/);
      expect((await lax.waitForExit()).code).toBe(1);
      expect(lax.log()).toContain("MariaDB has innodb_flush_log_at_trx_commit=2; Forthright needs 1 so no acknowledged write is lost.");
      rmSync(uploads, { recursive: true, force: true });
    } finally {
      await stopMariadb(instance);
      removeDataDir(instance);
      for (const p of ports) releasePort(p);
    }
  }, 120_000);
});
