/**
 * The staff stock list (GET /api/vehicles) over 10,000 generated vehicles: p50 and p95 of filtered, sorted pages
 * through the whole app over HTTP, against the very same statements (rows + count(*)) run on a bare mysql2 pool.
 * App and baseline alternate sample by sample, so both see the same noise on this shared machine.
 */
import mysql from "mysql2/promise";
import { pino } from "pino";
import { eq, sql } from "drizzle-orm";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import type { Db } from "../../server/db/client.ts";
import { dealerships, vehicles, type Dealership } from "../../server/db/schema/index.ts";
import { DEMO_DEALERSHIP, seedDemo } from "../../server/demo/demo.ts";
import { listConditions, SORT_SQL } from "../../server/modules/vehicles/vehicles.queries.ts";
import { deriveFor } from "../../server/modules/vehicles/vehicles.service.ts";
import { dayIn, DAY_MS } from "../../server/lib/clock.ts";
import { milesToKm } from "../../shared/domain/units.ts";
import { vehicleListQuerySchema, type VehicleListQuery } from "../../shared/schemas/vehicles.ts";
import type { VehicleStatus } from "../../shared/constants/vehicle.ts";
import type { FuelType } from "../../shared/domain/fuel.ts";
import { listen } from "../support/http-server.ts";
import { gaussian, intBetween, percentile, pickOne, pickWeighted, type Rng } from "./stats.ts";
import { seededRandom } from "../support/random.ts";
import type { BenchEnv, BenchResult } from "./types.ts";

export const name = "stock-list";

const ORIGIN = "http://127.0.0.1:3000";
const PASSWORD = "bench-password-123";
const VEHICLE_COUNT = 10_000;
const INSERT_BATCH = 500;
const WARMUP_ROUNDS = 2;
const SAMPLES = 300;

// ---------------------------------------------------------------------------------------------------------------
// Generated stock. Every make and model is an invented word; the spreads are those of a mid-sized used yard.

const MAKES: ReadonlyArray<readonly [string, number]> = [
  ["Vorsel", 18], ["Quillet", 14], ["Tarnby", 12], ["Brennic", 10], ["Ostrel", 9], ["Kavrin", 8],
  ["Morvane", 7], ["Elbrin", 6], ["Thessic", 5], ["Dunmere", 4], ["Yarlow", 4], ["Pentrel", 3],
];
const MODEL_WORDS = [
  "Fescue", "Tussock", "Shale", "Marram", "Bracken", "Sedge", "Corrie", "Scree", "Wold", "Holm", "Spinney", "Sorrel",
  "Tamarisk", "Osier", "Linnet", "Plover", "Dunlin", "Brackish", "Cobble", "Runnel", "Gorse", "Tarnside", "Fallow", "Millrace",
];
const VARIANT_WORDS = ["Base", "Trek", "Plus", "Select", "Tour", "Sport", "Field", "Crest", "Prime", "Ridge"];
const COLOURS = ["White", "Silver", "Slate grey", "Black", "Deep blue", "Red", "Bronze", "Forest green", "Sand", "Graphite"];
const FEATURES = [
  "Reversing camera", "Tow bar", "Roof racks", "Heated seats", "Sat nav", "Cruise control", "Adaptive cruise", "Leather trim",
  "Sunroof", "Parking sensors", "Bluetooth audio", "Alloy wheels", "Bull bar", "Third-row seats", "Wireless charging",
];
const WORKSHOPS = ["Quarry Lane Workshop", "Tallowbridge Auto Care", "Eastern Downs Service Centre"];

const STATUSES: ReadonlyArray<readonly [VehicleStatus, number]> = [
  ["sold", 34], ["live", 30], ["archived", 10], ["preparing", 8], ["intake", 7], ["reserved", 6], ["withdrawn", 5],
];
const FUELS: ReadonlyArray<readonly [FuelType | null, number]> = [
  ["petrol", 50], ["diesel", 24], ["hybrid", 11], ["electric", 6], ["plug_in_hybrid", 4], ["lpg", 3], [null, 2],
];
const BODIES = [
  ["suv", 30], ["hatchback", 20], ["sedan", 16], ["ute", 14], ["wagon", 8], ["van", 5], ["people_mover", 3], ["coupe", 2],
  ["convertible", 1], ["cab_chassis", 1],
] as const;

const VIN_CHARS = "ABCDEFGHJKLMNPRSTUVWXYZ0123456789";
const PLATE_LETTERS = "BCDFGHJKLMNPRSTVWXZ"; // consonants only, so no plate spells a word

type NewVehicle = typeof vehicles.$inferInsert;

function modelsByMake(rng: Rng): Map<string, string[]> {
  const map = new Map<string, string[]>();
  for (const [make] of MAKES) {
    const models = new Set<string>();
    const want = intBetween(rng, 3, 6);
    while (models.size < want) models.add(pickOne(rng, MODEL_WORDS));
    map.set(make, [...models]);
  }
  return map;
}

const clamp = (n: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, n));
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);

function generateVehicle(rng: Rng, i: number, ctx: { d: Dealership; today: string; nowMs: number; firstStock: number; models: Map<string, string[]> }): NewVehicle {
  const { d, today, nowMs } = ctx;
  const year = Number(today.slice(0, 4));
  const status = pickWeighted(rng, STATUSES);
  const make = pickWeighted(rng, MAKES);
  const model = pickOne(rng, ctx.models.get(make)!);
  const age = clamp(Math.round(7 + gaussian(rng) * 4), 0, 25);
  const buildYear = rng() < 0.02 ? null : year - age;
  const fuelType = pickWeighted(rng, FUELS);
  const electric = fuelType === "electric";
  const plugIn = fuelType === "plug_in_hybrid";

  // Odometer: about 14,000 km a year, with a long tail; a few read in miles, a few not read yet.
  const km = Math.round(Math.max(0.2, age) * 14_000 * Math.exp(gaussian(rng) * 0.35));
  const odoMissing = status === "intake" && rng() < 0.3;
  const inMiles = rng() < 0.03;
  const odometerReading = odoMissing ? null : inMiles ? Math.round(km / 1.609344) : clamp(km, 5, 1_200_000);
  const odometerUnit = inMiles ? ("mi" as const) : ("km" as const);
  const odometerKmIndex = odometerReading == null ? null : inMiles ? milesToKm(odometerReading) : odometerReading;

  // Price: depreciates with age, spread about ±35 %, ending in 990 dollars; intake stock often has no price yet.
  const dollars = clamp(46_000 * Math.pow(0.88, age) * Math.exp(gaussian(rng) * 0.35), 2_500, 180_000);
  const priceCents = (status === "intake" && rng() < 0.5) || rng() < 0.02 ? null : (Math.round(dollars / 1000) * 1000 - 10) * 100;

  const daysAgo =
    status === "sold" || status === "archived" || status === "withdrawn" ? intBetween(rng, 20, 1100)
    : status === "live" || status === "reserved" ? intBetween(rng, 2, 160)
    : intBetween(rng, 0, 21);
  const stockedAt = new Date(nowMs - daysAgo * DAY_MS - intBetween(rng, 0, DAY_MS - 1));
  const updatedAt = new Date(Math.min(nowMs, stockedAt.getTime() + intBetween(rng, 0, daysAgo) * DAY_MS + intBetween(rng, 0, DAY_MS - 1)));

  const serviceHistory: NonNullable<NewVehicle["serviceHistory"]> = [];
  if (buildYear !== null && rng() < 0.7) {
    const entries = intBetween(rng, 1, Math.min(5, age + 1));
    for (let s = 1; s <= entries; s++) {
      const fraction = s / (entries + 1);
      const date = iso(Date.parse(`${buildYear}-06-01`) + fraction * (nowMs - 30 * DAY_MS - Date.parse(`${buildYear}-06-01`)));
      if (date > today) break;
      serviceHistory.push({ date, odometerKm: Math.round(km * fraction), kind: s % 3 === 0 ? ("intermediate" as const) : ("scheduled" as const), workshop: pickOne(rng, WORKSHOPS), notes: "" });
    }
  }

  const cc = electric ? null : fuelType === "diesel" ? pickOne(rng, [1998, 2198, 2393, 2755, 2999]) : pickOne(rng, [1198, 1497, 1598, 1798, 1998, 2488, 3456]);
  const powerKw = Math.round(electric ? intBetween(rng, 100, 300) : ((cc ?? 1600) / 1000) * intBetween(rng, 45, 85));
  const body = pickWeighted(rng, BODIES);
  const features = [...new Set(Array.from({ length: intBetween(rng, 0, 6) }, () => pickOne(rng, FEATURES)))];

  const row: NewVehicle = {
    dealershipId: d.id,
    stockNumber: String(ctx.firstStock + i),
    status,
    vin: rng() < 0.85 ? Array.from({ length: 17 }, () => pickOne(rng, [...VIN_CHARS])).join("") : null,
    registrationPlate:
      status !== "intake" && rng() < 0.75
        ? `${Array.from({ length: 3 }, () => pickOne(rng, [...PLATE_LETTERS])).join("")} ${String(intBetween(rng, 0, 999)).padStart(3, "0")}`
        : null,
    make,
    model,
    variant: rng() < 0.8 ? `${pickOne(rng, VARIANT_WORDS)}${cc ? ` ${(cc / 1000).toFixed(1)}` : " EV"}` : null,
    buildYear,
    firstRegistrationDate: buildYear !== null && rng() < 0.6 ? `${buildYear}-${String(intBetween(rng, 1, 12)).padStart(2, "0")}-15` : null,
    bodyType: body,
    colour: pickOne(rng, COLOURS),
    doors: body === "coupe" || body === "convertible" ? 2 : body === "cab_chassis" ? 2 : body === "ute" ? 4 : 5,
    seats: body === "people_mover" ? 8 : body === "suv" && rng() < 0.3 ? 7 : body === "cab_chassis" || body === "coupe" ? 2 : 5,
    odometerReading,
    odometerUnit,
    odometerKmIndex,
    driveType: body === "ute" || body === "suv" ? pickOne(rng, ["4wd", "awd", "fwd"] as const) : pickOne(rng, ["fwd", "fwd", "rwd", "awd"] as const),
    fuelType,
    engineCapacityCc: cc,
    cylinders: electric ? 0 : cc && cc > 3000 ? 6 : cc && cc < 1300 ? 3 : 4,
    aspiration: electric ? null : fuelType === "diesel" || rng() < 0.4 ? "turbo" : "natural",
    powerKw,
    torqueNm: Math.round(powerKw * (fuelType === "diesel" ? 3.0 : electric ? 2.4 : 1.7)),
    transmission: electric ? "automatic" : pickWeighted(rng, [["automatic", 70], ["manual", 15], ["cvt", 10], ["dual_clutch", 5]] as const),
    gears: electric ? 1 : intBetween(rng, 5, 8),
    fuelTankLitres: electric ? null : intBetween(rng, 40, 80),
    fuelConsumptionL100km: electric ? null : Math.round((fuelType === "hybrid" || plugIn ? 4.2 : 6.5 + rng() * 4) * 10) / 10,
    consumptionTestCycle: rng() < 0.8 ? pickOne(rng, ["wltp", "nedc"] as const) : null,
    batteryKwh: electric ? intBetween(rng, 40, 100) : plugIn ? intBetween(rng, 10, 20) : null,
    energyKwh100km: electric || plugIn ? Math.round((14 + rng() * 8) * 10) / 10 : null,
    kerbWeightKg: intBetween(rng, 1050, 2400),
    keysCount: intBetween(rng, 1, 2),
    previousOwners: Math.min(age, intBetween(rng, 0, 4)),
    features,
    priceCents,
    description:
      `${buildYear ?? ""} ${make} ${model} in ${pickOne(rng, COLOURS).toLowerCase()}. ` +
      (serviceHistory.length ? `Serviced ${serviceHistory.length} times on record. ` : "No service book with the car. ") +
      (features.length ? `Comes with ${features.join(", ").toLowerCase()}. ` : "") +
      "Inspected on our yard before sale; independent inspections welcome.",
    serviceHistory,
    derived: undefined as never,
    stockedAt,
    createdAt: stockedAt,
    updatedAt,
  };
  row.derived = deriveFor(row, d, today);
  return row;
}

async function seedStock(db: Db, env: BenchEnv): Promise<Dealership> {
  const [d] = await db.select().from(dealerships).where(eq(dealerships.slug, DEMO_DEALERSHIP.slug));
  if (!d) throw new Error("the demo dealership was not seeded");
  const rng = seededRandom(20_240_611);
  const now = new Date();
  const gen = { d, today: dayIn(d.timeZone, now), nowMs: now.getTime(), firstStock: d.lastStockNumber + 1, models: modelsByMake(rng) };
  const started = performance.now();
  for (let from = 0; from < VEHICLE_COUNT; from += INSERT_BATCH) {
    const batch = Array.from({ length: Math.min(INSERT_BATCH, VEHICLE_COUNT - from) }, (_, k) => generateVehicle(rng, from + k, gen));
    await db.insert(vehicles).values(batch);
  }
  await db.update(dealerships).set({ lastStockNumber: d.lastStockNumber + VEHICLE_COUNT }).where(eq(dealerships.id, d.id));
  await db.execute(sql.raw("ANALYZE TABLE vehicles"));
  env.log(`inserted ${VEHICLE_COUNT} vehicles in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  return d;
}

// ---------------------------------------------------------------------------------------------------------------
// The query mixes: what staff actually click in the stock table. Fixed, so every run measures the same pages.

interface Mix {
  group: string;
  search: string; // the query string the browser would send
}

function queryMixes(models: string[]): Mix[] {
  const rng = seededRandom(7);
  const mixes: Mix[] = [];
  const add = (group: string, params: Record<string, string | number>) =>
    mixes.push({ group, search: new URLSearchParams(Object.entries(params).map(([k, v]) => [k, String(v)])).toString() });

  for (const page of [1, 2, 3]) add("status live,reserved · price_asc", { status: "live,reserved", sort: "price_asc", page });
  for (const [make] of MAKES.slice(0, 6)) add("make · days_desc · page 3", { make, sort: "days_desc", page: 3 });
  for (const q of ["Vor", "Qui", "Tarnby Sh", "105", pickOne(rng, models).slice(0, 4)]) add("q prefix", { q });
  for (const [min, max] of [[1_500_000, 3_000_000], [800_000, 2_000_000], [2_500_000, 6_000_000]] as const)
    add("diesel · price range · odometer_asc", { fuelType: "diesel", priceMin: min, priceMax: max, sort: "odometer_asc" });
  for (let page = 1; page <= 20; page++) add("year_desc · pages 1–20", { sort: "year_desc", page });
  for (const sort of ["days_desc", "price_desc", "updated_desc"]) add("live · pageSize 50", { status: "live", sort, pageSize: 50 });
  for (const page of [1, 4]) add("all · pageSize 25", { sort: "days_asc", pageSize: 25, page });
  add("live · odometer ≤ 100k · price_desc", { status: "live", odometerMax: 100_000, sort: "price_desc" });
  add("sold · petrol,hybrid · year_asc", { status: "sold", fuelType: "petrol,hybrid", sort: "year_asc", page: 2 });
  return mixes;
}

/** Parses a query string exactly as the route does (Express's simple parser gives strings; the schema coerces). */
const parseQuery = (search: string): VehicleListQuery => vehicleListQuerySchema.parse(Object.fromEntries(new URLSearchParams(search)));

/** The statements listVehicles() issues, built with the same builder calls, as SQL text and parameters. */
function listStatements(db: Db, dealershipId: number, q: VehicleListQuery) {
  const where = listConditions(dealershipId, q);
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 25;
  return {
    rows: db.select().from(vehicles).where(where).orderBy(...SORT_SQL[q.sort ?? "days_desc"]).limit(pageSize).offset((page - 1) * pageSize).toSQL(),
    count: db.select({ n: sql<number>`count(*)` }).from(vehicles).where(where).toSQL(),
  };
}

type Statements = ReturnType<typeof listStatements>;

// ---------------------------------------------------------------------------------------------------------------

export async function run(env: BenchEnv): Promise<BenchResult[]> {
  const database = env.createDatabase();
  const ctx = await createContext({
    env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" },
    logger: pino({ level: "silent" }),
  });
  // The baseline pool is configured as the app's own (server/db/client.ts), but shares nothing with it.
  const bare = mysql.createPool({ uri: database.url, connectionLimit: 20, timezone: "Z", charset: "utf8mb4_unicode_ci", supportBigNumbers: true, decimalNumbers: true });
  bare.on("connection", (conn) => {
    void conn.query("SET time_zone = '+00:00'");
  });
  let server: Awaited<ReturnType<typeof listen>> | undefined;
  try {
    const db = ctx.database.db;
    await seedDemo(db, { password: PASSWORD });
    const d = await seedStock(db, env);

    server = await listen(createApp(ctx));
    const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
      method: "POST",
      headers: { Origin: ORIGIN, "Content-Type": "application/json" },
      body: JSON.stringify({ email: "sales@demo.test", password: PASSWORD }),
    });
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
    const cookie = signIn.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");

    const models = (await db.selectDistinct({ model: vehicles.model }).from(vehicles).where(eq(vehicles.dealershipId, d.id))).map((r) => r.model);
    const mixes = queryMixes(models).map((m) => ({ ...m, statements: listStatements(db, d.id, parseQuery(m.search)) }));
    env.log(`${mixes.length} query mixes, ${SAMPLES} samples each way, app and bare mysql2 alternating`);

    const viaApp = async (search: string) => {
      const t0 = performance.now();
      const res = await fetch(`${server!.url}/api/vehicles?${search}`, { headers: { Cookie: cookie } });
      const body = (await res.json()) as { total: number; vehicles: Array<{ id: number }> };
      const ms = performance.now() - t0;
      if (res.status !== 200) throw new Error(`GET /api/vehicles?${search}: ${res.status} ${JSON.stringify(body)}`);
      return { ms, total: body.total, ids: body.vehicles.map((v) => v.id) };
    };
    // Same statements, same order, issued together as listVehicles() does with Promise.all.
    const viaMysql2 = async ({ rows, count }: Statements) => {
      const t0 = performance.now();
      const [[rowResult], [countResult]] = await Promise.all([bare.query(rows.sql, rows.params), bare.query(count.sql, count.params)]);
      const ms = performance.now() - t0;
      const list = rowResult as Array<{ id: number }>;
      return { ms, total: Number(Object.values((countResult as Array<Record<string, unknown>>)[0])[0]), ids: list.map((r) => r.id) };
    };
    let checked = 0;
    const check = (search: string, app: { total: number; ids: number[] }, base: { total: number; ids: number[] }) => {
      if (app.total !== base.total) throw new Error(`row count differs for ?${search}: app ${app.total}, mysql2 ${base.total}`);
      if (app.ids.join() !== base.ids.join()) throw new Error(`page rows differ for ?${search}: app [${app.ids.join()}] mysql2 [${base.ids.join()}]`);
      checked++;
    };

    // Once: the app must send byte-for-byte the statements the baseline runs. Watch its pool while each mix is fetched.
    const seen: Array<{ sql: string; params: string }> = [];
    const appPool = ctx.database.pool as unknown as { query: (...args: unknown[]) => unknown };
    const realQuery = appPool.query;
    appPool.query = function (this: unknown, ...args: unknown[]) {
      const [first, params] = args as [string | { sql: string }, unknown];
      seen.push({ sql: typeof first === "string" ? first : first.sql, params: JSON.stringify(params ?? []) });
      return realQuery.apply(this, args);
    };
    try {
      for (const m of mixes) {
        seen.length = 0;
        await viaApp(m.search);
        for (const s of [m.statements.rows, m.statements.count]) {
          if (!seen.some((q) => q.sql === s.sql && q.params === JSON.stringify(s.params)))
            throw new Error(`the app did not issue the baseline's statement for ?${m.search}:\n${s.sql}\nit issued:\n${seen.map((q) => q.sql).join("\n")}`);
        }
      }
    } finally {
      appPool.query = realQuery;
    }
    env.log(`statements match the app's byte for byte for all ${mixes.length} mixes`);

    for (let round = 0; round < WARMUP_ROUNDS; round++) {
      for (const m of mixes) check(m.search, await viaApp(m.search), await viaMysql2(m.statements));
    }

    const appMs: number[] = [];
    const bareMs: number[] = [];
    const byGroup = new Map<string, { app: number[]; bare: number[] }>();
    for (let i = 0; i < SAMPLES; i++) {
      const m = mixes[i % mixes.length];
      let app, base;
      if (i % 2 === 0) {
        app = await viaApp(m.search);
        base = await viaMysql2(m.statements);
      } else {
        base = await viaMysql2(m.statements);
        app = await viaApp(m.search);
      }
      check(m.search, app, base);
      appMs.push(app.ms);
      bareMs.push(base.ms);
      const g = byGroup.get(m.group) ?? { app: [], bare: [] };
      g.app.push(app.ms);
      g.bare.push(base.ms);
      byGroup.set(m.group, g);
    }
    env.log(`row counts and page ids identical both ways on all ${checked} pages (warm-up included)`);
    for (const [group, g] of byGroup)
      env.log(`  p50 ${percentile(g.app, 50).toFixed(2).padStart(6)} ms app / ${percentile(g.bare, 50).toFixed(2).padStart(6)} ms mysql2 (n=${g.app.length})  ${group}`);

    const figure = (label: string, p: number): BenchResult => ({
      figure: `stock list page ${label}`,
      unit: "ms",
      value: percentile(appMs, p),
      baseline: percentile(bareMs, p),
      baselineLabel: "bare mysql2",
      samples: SAMPLES,
    });
    return [figure("p50", 50), figure("p95", 95)];
  } finally {
    await server?.close();
    await bare.end();
    await ctx.database.close();
    database.drop();
  }
}
