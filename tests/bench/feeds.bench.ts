/**
 * The feed export: 10,000 published vehicles as CSV through GET /feeds/:token.csv, against the mariadb command-line
 * client writing the same columns (read from the same revision snapshots) to a file, in the same run. The app runs
 * in a child process of its own, so its peak RSS (VmHWM, reset before each export) is the feed's alone: at 1,000 and
 * at 10,000 rows the two peaks should be close, because rows stream from MariaDB to the socket.
 *
 * Run as a child (FEEDS_BENCH_CHILD=1) this file is the server: createApp() with the feed routes, on a free port.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { readFileSync, writeFileSync, mkdtempSync, statSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import http from "node:http";
import express from "express";
import { pino } from "pino";
import { eq, sql } from "drizzle-orm";
import type { User } from "lucia";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import { dealerships, revisions, users, vehicles } from "../../server/db/schema/index.ts";
import { DEMO_DEALERSHIP, seedDemo } from "../../server/demo/demo.ts";
import { feedsPublicRoutes } from "../../server/modules/feeds/feeds.public.routes.ts";
import { create as createFeed } from "../../server/modules/feeds/feeds.service.ts";
import { DAY_MS } from "../../server/lib/clock.ts";
import type { PublicSnapshot } from "../../shared/schemas/public.ts";
import type { FeedColumn } from "../../shared/schemas/feeds.ts";
import { percentile } from "./stats.ts";
import type { BenchEnv, BenchResult } from "./types.ts";

export const name = "feeds";

const ORIGIN = "http://127.0.0.1:3000";
const TOTAL = 10_000;
const SMALL = 1_000;
const SAMPLES = 3;
const SELF = fileURLToPath(import.meta.url);

// ---------------------------------------------------------------------------------------------------------------
// Child: the server.

if (process.env.FEEDS_BENCH_CHILD) {
  const ctx = await createContext({ env: { NODE_ENV: "test", DATABASE_URL: process.env.DATABASE_URL!, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" }, logger: pino({ level: "silent" }) });
  // Mounted in front of the app as server/app.ts mounts it (before the client routes); harmless once app.ts has it.
  const outer = express();
  outer.use(feedsPublicRoutes(ctx));
  outer.use(createApp(ctx));
  const server = http.createServer(outer).listen(0, "127.0.0.1", () => {
    process.stdout.write(`LISTENING ${(server.address() as { port: number }).port}\n`);
  });
  process.on("SIGTERM", () => server.close(() => void ctx.database.close().then(() => process.exit(0))));
}

// ---------------------------------------------------------------------------------------------------------------
// Stock: 10,000 live vehicles, each with one published revision whose snapshot has the public page's full shape.

const MAKES = ["Quillet", "Tarnby", "Brennic", "Ostrel", "Kavrin", "Morvane", "Elbrin", "Thessic", "Dunmere"];
const MODELS = ["Fescue", "Tussock", "Shale", "Marram", "Bracken", "Sedge", "Corrie", "Scree"];

function snapshotFor(i: number, make: string, d: { name: string; currency: string }): PublicSnapshot {
  const photo = (n: number) => {
    const key = `/media/photos/${(i % 256).toString(16).padStart(2, "0")}/${i.toString(16).padStart(8, "0")}${n}`;
    const set = (ext: string) => [320, 640, 1024, 1600].map((w) => `${key}-${w}.${ext} ${w}w`).join(", ");
    return { src: `${key}-1024.jpg`, srcsetAvif: set("avif"), srcsetWebp: set("webp"), srcsetJpeg: set("jpg"), width: 1600, height: 1200, placeholder: "data:image/webp;base64,UklGRlYAAABXRUJQVlA4IEoAAADQAQCdASoQAAwAAUAmJaQAA3AA/v89WAAAAA==", caption: `Photo ${n}`, zone: null, isCover: n === 0 };
  };
  const km = 20_000 + ((i * 7919) % 180_000);
  return {
    title: `${2012 + (i % 12)} ${make} ${MODELS[i % MODELS.length]}`, stockNumber: String(20_000 + i), make, model: MODELS[i % MODELS.length], variant: i % 5 ? `Trek ${1 + (i % 3)}.${i % 10}` : null,
    buildYear: 2012 + (i % 12), firstRegistrationDate: null, vin: null, bodyType: ["suv", "hatchback", "sedan", "ute"][i % 4], colour: "Slate grey", doors: 5, seats: 5, driveType: "fwd",
    fuelType: ["petrol", "diesel", "hybrid"][i % 3], engineCapacityCc: 1998, cylinders: 4, aspiration: "turbo", powerKw: 110 + (i % 60), torqueNm: 300, transmission: "automatic", gears: 8,
    kerbWeightKg: 1500, fuelTankLitres: 60, fuelConsumptionL100km: 6.5, consumptionTestCycle: "wltp", batteryKwh: null, energyKwh100km: null, odometer: { reading: km, unit: "km", km },
    keysCount: 2, previousOwners: 1, features: ["Tow bar", "Reversing camera", "Heated seats"],
    descriptionHtml: `<p>${"Inspected on our yard before sale; independent inspections welcome. Serviced on time, with the book. ".repeat(5)}</p>`,
    priceCents: (8_000 + (i % 400) * 100) * 100, currency: d.currency,
    derived: { rangeKm: 923, mpgUs: null, mpgImperial: null, powerHp: 147.5, powerPs: 149.6, torqueLbft: 221.3, powerToWeightKwPerTonne: 73.3, co2GramsPerKmEstimate: 151, vinCheck: "absent", modelYearFromVin: null, averageKmPerYear: 14_000, nextService: null } as unknown as PublicSnapshot["derived"],
    serviceHistory: [{ date: "2024-03-01", odometerKm: km - 10_000, kind: "scheduled", workshop: "Quarry Lane Workshop", notes: "" }],
    photos: Array.from({ length: 8 }, (_, n) => photo(n)),
    defects: Array.from({ length: i % 4 }, (_, n) => ({ number: n + 1, zone: "left_side", kind: "scratch", severity: "minor" as const, sizeMm: 30, note: "Rear door, below the handle", repairPlan: "disclosed_as_is" as const, safetyRelevant: false, pin: null, closeup: null })),
    zones: [], tyres: { measuredOn: null, legalMinTreadMm: 1.5, readings: [] }, checks: [], cautions: [],
    condition: { index: 70 + (i % 30), sentence: "A few items noted, none affecting safety.", bySeverity: { minor: i % 4, moderate: 0, major: 0 }, byZone: {}, explanation: [] },
    inspectedOn: null, inspectedBy: null, disclaimerHtml: "<p>Checked by us; not a roadworthy certificate.</p>",
    dealership: { name: d.name } as PublicSnapshot["dealership"],
  };
}

async function seedStock(ctx: Awaited<ReturnType<typeof createContext>>, env: BenchEnv) {
  const { db } = ctx.database;
  const [d] = await db.select().from(dealerships).where(eq(dealerships.slug, DEMO_DEALERSHIP.slug));
  const now = Date.now();
  const started = performance.now();
  for (let from = 0; from < TOTAL; from += 500) {
    const rows = Array.from({ length: Math.min(500, TOTAL - from) }, (_, k) => {
      const i = from + k;
      // Exactly SMALL vehicles are Vorsels: the 1,000-row feed is the same query with a make filter.
      const make = i % (TOTAL / SMALL) === 0 ? "Vorsel" : MAKES[i % MAKES.length];
      return { i, make, snapshot: snapshotFor(i, make, d) };
    });
    await db.insert(vehicles).values(rows.map(({ i, make, snapshot }) => ({
      dealershipId: d.id, stockNumber: snapshot.stockNumber, status: "live" as const, make, model: snapshot.model, features: [], serviceHistory: [], derived: snapshot.derived,
      stockedAt: new Date(now - (i % 120) * DAY_MS), publicSlug: `bench-${i}`, lastRevisionNumber: 1,
    })));
    const ids = await db.select({ id: vehicles.id, stockNumber: vehicles.stockNumber }).from(vehicles).where(sql`${vehicles.publicSlug} like 'bench-%' and ${vehicles.currentRevisionId} is null`);
    const byStock = new Map(ids.map((r) => [r.stockNumber, r.id]));
    await db.insert(revisions).values(rows.map(({ i, make, snapshot }) => ({
      vehicleId: byStock.get(snapshot.stockNumber)!, number: 1, slug: `bench-${i}`, snapshot, changes: ["First published."], publishedAt: new Date(now - (i % 120) * DAY_MS), title: snapshot.title,
      make, model: snapshot.model, bodyType: snapshot.bodyType, fuelType: snapshot.fuelType, priceCents: snapshot.priceCents, odometerKm: snapshot.odometer.km, buildYear: snapshot.buildYear, conditionIndex: snapshot.condition.index,
    })));
    await db.execute(sql`UPDATE vehicles v JOIN revisions r ON r.vehicle_id = v.id SET v.current_revision_id = r.id WHERE v.current_revision_id IS NULL`);
  }
  await db.execute(sql.raw("ANALYZE TABLE vehicles, revisions"));
  env.log(`inserted ${TOTAL} published vehicles in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  return d;
}

// The bench's columns: the record, the condition figures and the page URL, all read from the snapshot.
const COLUMNS: FeedColumn[] = [
  { key: "stockNumber", header: "stockNumber" }, { key: "status", header: "status" }, { key: "make", header: "make" }, { key: "model", header: "model" }, { key: "variant", header: "variant" },
  { key: "buildYear", header: "buildYear" }, { key: "bodyType", header: "bodyType" }, { key: "fuelType", header: "fuelType" }, { key: "odometer", header: "odometer" }, { key: "price", header: "price" },
  { key: "currency", header: "currency" }, { key: "conditionIndex", header: "conditionIndex" }, { key: "defectCount", header: "defectCount" }, { key: "url", header: "url" },
];

/** The same columns from the same snapshots, as the mariadb client would write them. */
const cliSelect = (dealershipId: number) => `SELECT v.stock_number AS stockNumber, v.status, JSON_VALUE(r.snapshot, '$.make') AS make, JSON_VALUE(r.snapshot, '$.model') AS model,
  JSON_VALUE(r.snapshot, '$.variant') AS variant, JSON_VALUE(r.snapshot, '$.buildYear') AS buildYear, JSON_VALUE(r.snapshot, '$.bodyType') AS bodyType,
  JSON_VALUE(r.snapshot, '$.fuelType') AS fuelType, JSON_VALUE(r.snapshot, '$.odometer.reading') AS odometer, ROUND(JSON_VALUE(r.snapshot, '$.priceCents') / 100, 2) AS price,
  JSON_VALUE(r.snapshot, '$.currency') AS currency, JSON_VALUE(r.snapshot, '$.condition.index') AS conditionIndex, JSON_LENGTH(r.snapshot, '$.defects') AS defectCount,
  CONCAT('${ORIGIN}/vehicles/', r.slug) AS url
  FROM vehicles v JOIN revisions r ON r.id = v.current_revision_id WHERE v.dealership_id = ${dealershipId} AND v.status IN ('live', 'reserved') ORDER BY v.id`;

// ---------------------------------------------------------------------------------------------------------------

function startChild(databaseUrl: string): Promise<{ child: ChildProcess; port: number }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", SELF], { env: { ...process.env, FEEDS_BENCH_CHILD: "1", DATABASE_URL: databaseUrl }, stdio: ["ignore", "pipe", "inherit"] });
    let out = "";
    child.stdout.on("data", (c: Buffer) => {
      out += c.toString();
      const m = /LISTENING (\d+)/.exec(out);
      if (m) resolve({ child, port: Number(m[1]) });
    });
    child.once("exit", (code) => reject(new Error(`feed server exited with ${code}`)));
  });
}

const resetPeak = (pid: number) => writeFileSync(`/proc/${pid}/clear_refs`, "5");
const peakRssMb = (pid: number) => Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))![1]) / 1024;

/** Fetches a feed, counting bytes and lines without keeping them: time to first byte and to the last. */
function fetchFeed(port: number, p: string): Promise<{ ttfbMs: number; totalMs: number; bytes: number; lines: number; status: number }> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    http.get({ host: "127.0.0.1", port, path: p, headers: { "User-Agent": "feeds-bench" } }, (res) => {
      let ttfb = 0;
      let bytes = 0;
      let lines = 0;
      res.on("data", (c: Buffer) => {
        if (!ttfb) ttfb = performance.now() - t0;
        bytes += c.length;
        for (let k = c.indexOf(10); k !== -1; k = c.indexOf(10, k + 1)) lines++;
      });
      res.on("end", () => resolve({ ttfbMs: ttfb, totalMs: performance.now() - t0, bytes, lines, status: res.statusCode ?? 0 }));
      res.on("error", reject);
    }).on("error", reject);
  });
}

export async function run(env: BenchEnv): Promise<BenchResult[]> {
  const database = env.createDatabase();
  const ctx = await createContext({ env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" }, logger: pino({ level: "silent" }) });
  const scratch = mkdtempSync(path.join(tmpdir(), "forthright-feeds-bench-"));
  let child: ChildProcess | undefined;
  try {
    await seedDemo(ctx.database.db, { password: "bench-password-123" });
    const d = await seedStock(ctx, env);
    const [marketing] = await ctx.database.db.select().from(users).where(eq(users.role, "marketing"));
    const actor = marketing as unknown as User;
    const all = await createFeed(ctx, actor, { name: "Bench 10,000", format: "csv", units: "metric", columns: COLUMNS });
    const small = await createFeed(ctx, actor, { name: "Bench 1,000", format: "csv", units: "metric", columns: COLUMNS, filter: { makes: ["Vorsel"] } });
    const started = await startChild(database.url);
    child = started.child;
    const pid = child.pid!;
    const run1 = async (url: string, rows: number) => {
      resetPeak(pid);
      const r = await fetchFeed(started.port, new URL(url).pathname);
      if (r.status !== 200 || r.lines !== rows + 1) throw new Error(`feed of ${rows}: status ${r.status}, ${r.lines} lines`);
      return { ...r, rssMb: peakRssMb(pid) };
    };
    await run1(small.url, SMALL); // warm-up: module load, JIT, pool
    await run1(all.url, TOTAL);

    const db = new URL(database.url);
    const cliArgs = ["--no-defaults", "-h", db.hostname, "-P", db.port, `-u${decodeURIComponent(db.username)}`, `-p${decodeURIComponent(db.password)}`, "-B", "-e", cliSelect(d.id), db.pathname.slice(1)];
    const outFile = path.join(scratch, "cli.tsv");
    const cli = () => {
      const t0 = performance.now();
      const fd = spawnSync("sh", ["-c", `exec mariadb "$@" > ${JSON.stringify(outFile)}`, "sh", ...cliArgs], { stdio: ["ignore", "ignore", "pipe"] });
      const ms = performance.now() - t0;
      if (fd.status !== 0) throw new Error(`mariadb client failed: ${fd.stderr.toString()}`);
      const lines = readFileSync(outFile, "utf8").split("\n").filter(Boolean).length;
      if (lines !== TOTAL + 1) throw new Error(`mariadb client wrote ${lines} lines`);
      return { ms, bytes: statSync(outFile).size };
    };
    cli();

    const big: Array<Awaited<ReturnType<typeof run1>>> = [];
    const little: Array<Awaited<ReturnType<typeof run1>>> = [];
    const base: Array<ReturnType<typeof cli>> = [];
    for (let s = 0; s < SAMPLES; s++) {
      little.push(await run1(small.url, SMALL));
      if (s % 2) {
        base.push(cli());
        big.push(await run1(all.url, TOTAL));
      } else {
        big.push(await run1(all.url, TOTAL));
        base.push(cli());
      }
    }
    const med = (xs: number[]) => percentile(xs, 50);
    env.log(`app CSV ${big[0].bytes} bytes for ${TOTAL} rows; mariadb client ${base[0].bytes} bytes (tab-separated, unquoted)`);
    env.log(`peak RSS of the app process: ${little.map((x) => x.rssMb.toFixed(0)).join(", ")} MB at ${SMALL}; ${big.map((x) => x.rssMb.toFixed(0)).join(", ")} MB at ${TOTAL}`);
    return [
      { figure: `CSV feed, ${TOTAL} vehicles, whole response`, unit: "ms", value: med(big.map((x) => x.totalMs)), baseline: med(base.map((x) => x.ms)), baselineLabel: "mariadb -B to a file", samples: SAMPLES },
      { figure: `CSV feed, ${TOTAL} vehicles, first byte`, unit: "ms", value: med(big.map((x) => x.ttfbMs)), baseline: med(base.map((x) => x.ms)), baselineLabel: "mariadb -B, whole", samples: SAMPLES },
      { figure: `CSV feed, ${SMALL} vehicles, whole response`, unit: "ms", value: med(little.map((x) => x.totalMs)), samples: SAMPLES },
      { figure: `peak RSS of the app, ${TOTAL} vs ${SMALL} rows`, unit: "MB", value: Math.max(...big.map((x) => x.rssMb)), baseline: Math.max(...little.map((x) => x.rssMb)), baselineLabel: `at ${SMALL} rows`, samples: SAMPLES },
    ];
  } finally {
    if (child && child.exitCode === null) {
      const exited = new Promise((r) => child!.once("exit", r));
      child.kill("SIGTERM");
      await exited;
    }
    rmSync(scratch, { recursive: true, force: true });
    await ctx.database.close();
    database.drop();
  }
}
