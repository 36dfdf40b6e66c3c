import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Express } from "express";
import request from "supertest";
import { createHash } from "node:crypto";
import { parse as parseCsv } from "csv-parse/sync";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { eq } from "drizzle-orm";
import { startTestApp, ORIGIN, type TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { auditLog, feeds } from "../../server/db/schema/index.ts";
import type { PublicSnapshot } from "../../shared/schemas/public.ts";

let t: TestApp;
let app: Express;
const agent = () => request.agent(app).set("Origin", ORIGIN);
async function signIn(role: "admin" | "sales" | "workshop" | "marketing") {
  const a = agent();
  const { DEMO_USERS } = await import("../../server/demo/demo.ts");
  const { DEMO_PASSWORD } = await import("../support/app.ts");
  const res = await a.post("/api/auth/sign-in").send({ email: DEMO_USERS.find((u) => u.role === role)!.email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return a;
}

/** The tricky values of the brief: a comma, quotes, a line break, a tick, Greek and an emoji; an empty variant. */
const TRICKY_MODEL = 'Loam, "Crest"\nlong-range ✓ Ωmega 🚙';
let tricky: { vehicleId: number; slug: string; url: string; snapshot: PublicSnapshot; stockNumber: string };
let plain: { vehicleId: number; slug: string; url: string; snapshot: PublicSnapshot; stockNumber: string };

const pathOf = (url: string) => new URL(url).pathname;
const snapshotOf = async (slug: string) => (await request(app).get(`/api/public/vehicles/${slug}`)).body.vehicle.snapshot as PublicSnapshot;

beforeAll(async () => {
  t = await startTestApp();
  app = t.app;
  const a = await publishReadyVehicle(t, { model: TRICKY_MODEL, variant: "", colour: "Blé d'or, «nuit»" });
  const b = await publishReadyVehicle(t, { make: "Corvane", model: "Brindle", variant: "Ute 4×4", bodyType: "ute", priceCents: 2_250_000 });
  for (const [target, v] of [["tricky", a], ["plain", b]] as const) {
    const snapshot = await snapshotOf(v.slug);
    const value = { ...v, snapshot, stockNumber: snapshot.stockNumber };
    if (target === "tricky") tricky = value;
    else plain = value;
  }
}, 120_000);
afterAll(() => t.close());

async function createFeed(body: Record<string, unknown>, role: "admin" | "marketing" = "marketing") {
  const m = await signIn(role);
  const res = await m.post("/api/feeds").send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { m, feed: res.body.feed, url: res.body.url as string, path: pathOf(res.body.url) };
}

describe("who may manage feeds", () => {
  it("when nobody is signed in, then every staff feed route is 401; sales and workshop get 403; admin and marketing pass", async () => {
    const routes: Array<[string, string, Record<string, unknown>?]> = [
      ["get", "/api/feeds"], ["post", "/api/feeds", { name: "x", format: "csv" }], ["post", "/api/feeds/preview", { format: "csv" }], ["get", "/api/feeds/1"],
      ["patch", "/api/feeds/1", { version: 1, name: "y" }], ["post", "/api/feeds/1/rotate"], ["delete", "/api/feeds/1"], ["get", "/api/feeds/1/download"],
    ];
    const sales = await signIn("sales");
    const workshop = await signIn("workshop");
    for (const [method, path, body] of routes) {
      const send = (a: ReturnType<typeof agent>) => (a as unknown as Record<string, (p: string) => request.Test>)[method](path).send(body ?? {});
      expect((await send(agent())).status, `${method} ${path} signed out`).toBe(401);
      expect((await send(sales)).status, `${method} ${path} as sales`).toBe(403);
      expect((await send(workshop)).status, `${method} ${path} as workshop`).toBe(403);
    }
    for (const role of ["admin", "marketing"] as const) expect((await (await signIn(role)).get("/api/feeds")).status).toBe(200);
  });
});

describe("creating a feed", () => {
  it("when marketing creates a feed without columns, then it has the default set and a long secret URL shown this once, stored only as its SHA-256", async () => {
    const { m, feed, url } = await createFeed({ name: "Portal A", format: "csv" });
    const token = /\/feeds\/([A-Za-z0-9_-]+)\.csv$/.exec(url)![1];
    expect(token.length).toBeGreaterThanOrEqual(43); // 256 bits, base64url
    expect(url.startsWith(`${ORIGIN}/feeds/`)).toBe(true);
    expect(feed.defaultColumns).toBe(true);
    expect(feed.columns.map((c: { key: string }) => c.key)).toEqual(expect.arrayContaining(["stockNumber", "make", "model", "price", "url", "photoUrls"]));
    const [row] = await t.ctx.database.db.select().from(feeds).where(eq(feeds.id, feed.id));
    expect(row.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token);
    const listed = (await m.get("/api/feeds")).body.feeds.find((f: { id: number }) => f.id === feed.id);
    expect(JSON.stringify(listed)).not.toContain(token);
    expect(listed.urlHint).toContain(token.slice(-4));
    const audit = await t.ctx.database.db.select().from(auditLog).where(eq(auditLog.entityId, String(feed.id)));
    expect(audit.map((a) => a.action)).toContain("feed_created");
    expect(JSON.stringify(audit)).not.toContain(token);
  });

  it("when the body is wrong, then 400 names every field: columns on JSON, duplicate headers, an XML header with a space, a bad width, a price range upside down", async () => {
    const m = await signIn("marketing");
    const json = await m.post("/api/feeds").send({ name: "j", format: "json", columns: [{ key: "make", header: "make" }] });
    expect(json.status).toBe(400);
    expect(json.body.error.fields.columns).toMatch(/CSV and XML/);
    const bad = await m.post("/api/feeds").send({
      name: "", format: "xml", filter: { priceMinCents: 500, priceMaxCents: 100 },
      columns: [{ key: "make", header: "Make name" }, { key: "model", header: "m" }, { key: "vin", header: "M" }, { key: "photoUrls", header: "p", photoWidth: 333 }],
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields), JSON.stringify(bad.body)).toEqual(expect.arrayContaining(["name", "filter.priceMaxCents", "columns.0.header", "columns.2.header", "columns.3.photoWidth"]));
    const unknown = await m.post("/api/feeds").send({ name: "u", format: "csv", columns: [{ key: "repairCostCents", header: "cost" }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields["columns.0.key"]).toMatch(/from the list/);
    expect((await m.get("/api/feeds")).body.feeds.some((f: { name: string }) => f.name === "")).toBe(false);
  });

  it("when marketing previews a feed, then it gets the first rows as a table and the feed's own text, and nothing is saved", async () => {
    const m = await signIn("marketing");
    const before = (await m.get("/api/feeds")).body.feeds.length;
    const res = await m.post("/api/feeds/preview").send({ format: "csv", filter: { makes: ["Corvane"] }, columns: [{ key: "stockNumber", header: "Stock" }, { key: "model", header: "Model" }] });
    expect(res.status).toBe(200);
    expect(res.body.preview.columns).toEqual([{ key: "stockNumber", header: "Stock" }, { key: "model", header: "Model" }]);
    expect(res.body.preview.rows).toContainEqual([plain.stockNumber, "Brindle"]);
    expect(res.body.preview.total).toBe(1);
    // The sample is the feed's own text: the status and page URL a feed always carries follow the chosen columns.
    expect(res.body.preview.sample.startsWith("Stock,Model,status,url\r\n")).toBe(true);
    expect((await m.get("/api/feeds")).body.feeds.length).toBe(before);
  });
});

const CSV_COLUMNS = [
  { key: "stockNumber", header: "Stock no." },
  { key: "model", header: "Model, as sold" },
  { key: "variant", header: "Variant" },
  { key: "make", header: "Make" },
  { key: "colour", header: "Colour" },
  { key: "price", header: "Price" },
  { key: "odometer", header: "Odometer" },
  { key: "distanceUnit", header: "Unit" },
  { key: "conditionIndex", header: "Condition" },
  { key: "defectCount", header: "Defects" },
  { key: "url", header: "Page" },
  { key: "photoUrls", header: "Photos 640", photoWidth: 640 },
  { key: "status", header: "status" },
];

describe("the formats, parsed back with independent parsers", () => {
  it("when a portal fetches a CSV feed, then csv-parse reads the published revisions back exactly, tricky values and empty fields included", async () => {
    const { path } = await createFeed({ name: "CSV", format: "csv", columns: CSV_COLUMNS });
    const res = await request(app).get(path).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^text\/csv; charset=utf-8/);
    const text = (res.body as Buffer).toString("utf8");
    expect(text.includes("\r\n")).toBe(true); // RFC 4180 line ends
    const records = parseCsv<Record<string, string>>(text, { columns: true, bom: true });
    expect(Object.keys(records[0])).toEqual(CSV_COLUMNS.map((c) => c.header));
    const mine = records.find((r) => r["Stock no."] === tricky.stockNumber)!;
    const s = tricky.snapshot;
    expect(mine["Model, as sold"]).toBe(TRICKY_MODEL);
    expect(mine.Variant).toBe("");
    expect(mine.Colour).toBe("Blé d'or, «nuit»");
    expect(mine.Make).toBe(s.make);
    expect(mine.Price).toBe((s.priceCents! / 100).toFixed(2));
    expect(mine.Odometer).toBe(String(s.odometer.reading));
    expect(mine.Unit).toBe("km");
    expect(mine.Condition).toBe(String(Number(s.condition.index!.toFixed(1))));
    expect(mine.Defects).toBe(String(s.defects.length));
    expect(mine.Page).toBe(tricky.url);
    expect(mine.status).toBe("live");
    const photos = mine["Photos 640"].split("|");
    expect(photos).toHaveLength(s.photos.length);
    for (const p of photos) expect(p).toMatch(new RegExp(`^${ORIGIN}/media/.+-640\\.jpg$`));
    expect(records.find((r) => r["Stock no."] === plain.stockNumber)).toBeTruthy();
  });

  it("when a portal fetches an XML feed, then it is well-formed, fast-xml-parser reads the same values, and element names are the chosen headers", async () => {
    const columns = [{ key: "stockNumber", header: "stock" }, { key: "model", header: "model" }, { key: "variant", header: "variant" }, { key: "features", header: "features" }, { key: "url", header: "url" }, { key: "photoUrls", header: "photos", photoWidth: 320 }];
    const { path } = await createFeed({ name: "XML", format: "xml", columns, units: "metric" });
    const res = await request(app).get(path);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^application\/xml; charset=utf-8/);
    const text = res.text;
    expect(text.startsWith('<?xml version="1.0" encoding="UTF-8"?>')).toBe(true);
    expect(XMLValidator.validate(text)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false, parseTagValue: false, trimValues: false, isArray: (name) => ["vehicle", "url", "item"].includes(name) }).parse(text);
    const v = doc.vehicles.vehicle.find((x: { stock: string }) => x.stock === tricky.stockNumber);
    expect(v.model).toBe(TRICKY_MODEL);
    expect(v.variant).toBe("");
    expect(v.url).toEqual([tricky.url]);
    expect(v.features.item).toEqual(tricky.snapshot.features);
    expect(v.photos.url).toHaveLength(tricky.snapshot.photos.length);
    expect(v.photos.url[0]).toMatch(/^http:\/\/127\.0\.0\.1:3000\/media\/.+-320\.jpg$/);
  });

  it("when a portal fetches the JSON feed, then every vehicle carries the whole catalogue and the tricky values survive", async () => {
    const { path } = await createFeed({ name: "JSON", format: "json" });
    const res = await request(app).get(path);
    expect(res.status).toBe(200);
    const body = JSON.parse(res.text);
    expect(body.count).toBe(body.vehicles.length);
    const v = body.vehicles.find((x: { stockNumber: string }) => x.stockNumber === tricky.stockNumber);
    expect(v).toMatchObject({ model: TRICKY_MODEL, variant: tricky.snapshot.variant, make: tricky.snapshot.make, url: tricky.url, fuelConsumption: 8.8, fuelConsumptionUnit: "L/100 km", status: "live" });
    // 68 L at 8.8 L/100 km = 772.7 km (common practice, no source), rounded to whole km in the feed.
    expect(v.range).toBe(773);
    expect(v.photoUrls).toHaveLength(tricky.snapshot.photos.length);
  });

  it("when a portal fetches the JSON-LD feed, then it is an ItemList of Car with Offer, with the schema.org properties and UN/CEFACT unit codes of TRADE.md §7", async () => {
    const { path } = await createFeed({ name: "LD", format: "jsonld" });
    const res = await request(app).get(path);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^application\/ld\+json/);
    const list = JSON.parse(res.text);
    expect(list["@context"]).toBe("https://schema.org");
    expect(list["@type"]).toBe("ItemList");
    expect(list.numberOfItems).toBe(list.itemListElement.length);
    const item = list.itemListElement.find((e: { item: { sku: string } }) => e.item.sku === tricky.stockNumber);
    expect(item["@type"]).toBe("ListItem");
    const car = item.item;
    // ../shared/TRADE.md §7: Car, KMT for km, LTR, KWT, CMQ, NU; unitText "L/100 km"; Offer with price, ISO 4217 currency, availability.
    expect(car["@type"]).toBe("Car");
    expect(car.model).toBe(TRICKY_MODEL);
    expect(car.vehicleIdentificationNumber).toBe("1G4AH59H45G118341");
    expect(car.itemCondition).toBe("https://schema.org/UsedCondition");
    expect(car.mileageFromOdometer).toEqual({ "@type": "QuantitativeValue", value: tricky.snapshot.odometer.reading, unitCode: "KMT" });
    expect(car.fuelCapacity).toEqual({ "@type": "QuantitativeValue", value: 68, unitCode: "LTR" });
    expect(car.fuelConsumption).toMatchObject({ "@type": "QuantitativeValue", value: 8.8, unitText: "L/100 km" });
    expect(car.vehicleEngine.enginePower).toEqual({ "@type": "QuantitativeValue", value: 147, unitCode: "KWT" });
    expect(car.vehicleEngine.engineDisplacement.unitCode).toBe("CMQ");
    expect(car.vehicleEngine.torque.unitCode).toBe("NU");
    expect(car.driveWheelConfiguration).toBe("https://schema.org/AllWheelDriveConfiguration");
    expect(car.offers).toMatchObject({ "@type": "Offer", price: tricky.snapshot.priceCents! / 100, priceCurrency: tricky.snapshot.currency, availability: "https://schema.org/InStock", url: tricky.url });
    expect(car.url).toBe(tricky.url);
    for (const img of car.image) expect(img).toMatch(/^http:\/\/127\.0\.0\.1:3000\//);
  });
});

describe("tokens", () => {
  it("when a feed's URL is rotated, then the old URL answers 404 and the new one works; when revoked, 404; a wrong extension is 404 too", async () => {
    const { m, feed, path } = await createFeed({ name: "Rotate me", format: "csv" });
    expect((await request(app).get(path)).status).toBe(200);
    expect((await request(app).get(path.replace(/\.csv$/, ".json"))).status).toBe(404);
    const rotated = await m.post(`/api/feeds/${feed.id}/rotate`);
    expect(rotated.status).toBe(200);
    expect((await request(app).get(path)).status).toBe(404);
    const fresh = pathOf(rotated.body.url);
    expect(fresh).not.toBe(path);
    expect((await request(app).get(fresh)).status).toBe(200);
    expect((await m.delete(`/api/feeds/${feed.id}`)).status).toBe(204);
    expect((await request(app).get(fresh)).status).toBe(404);
    expect((await m.get("/api/feeds")).body.feeds.some((f: { id: number }) => f.id === feed.id)).toBe(false);
    expect((await m.post(`/api/feeds/${feed.id}/rotate`)).status).toBe(404);
    const actions = (await t.ctx.database.db.select().from(auditLog).where(eq(auditLog.entityId, String(feed.id)))).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(["feed_created", "feed_token_rotated", "feed_revoked"]));
    expect((await request(app).get("/feeds/not-a-token.csv")).status).toBe(404);
  });
});

describe("incremental sync and validators", () => {
  it("when nothing changed, then If-None-Match and If-Modified-Since both get 304; after a publish the ETag changes", async () => {
    const { path } = await createFeed({ name: "Etag", format: "csv" });
    const first = await request(app).get(path);
    const etag = first.headers.etag;
    const lastModified = first.headers["last-modified"];
    expect(etag).toMatch(/^W\/"/);
    expect(new Date(lastModified).getTime()).toBeGreaterThan(0);
    const again = await request(app).get(path).set("If-None-Match", etag);
    expect(again.status).toBe(304);
    expect(again.text ?? "").toBe("");
    expect((await request(app).get(path).set("If-Modified-Since", lastModified)).status).toBe(304);
    const { sales, vehicleId } = await publishReadyVehicle(t, { make: "Drovell", model: "Sarn" });
    void sales;
    void vehicleId;
    const after = await request(app).get(path).set("If-None-Match", etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(etag);
  }, 60_000);

  it("when a portal asks ?since=, then it gets only vehicles published after it, plus removals of those sold since; a bad since is 400", async () => {
    const { path: csvPath } = await createFeed({ name: "Since CSV", format: "csv", columns: [{ key: "model", header: "Model" }] });
    const { path: jsonPath } = await createFeed({ name: "Since JSON", format: "json" });
    expect((await request(app).get(`${csvPath}?since=yesterday`)).status).toBe(400);
    expect((await request(app).get(`${jsonPath}?since=2026-13-01T00:00:00Z`)).status).toBe(400);
    await new Promise((r) => setTimeout(r, 20));
    const mark = new Date().toISOString();
    await new Promise((r) => setTimeout(r, 20));
    const fresh = await publishReadyVehicle(t, { make: "Lumbrey", model: "Quarrel" });
    const freshStock = (await snapshotOf(fresh.slug)).stockNumber;
    // The plain ute is sold after the mark: it leaves a live/reserved feed.
    const sales = await t.signIn("sales");
    const v = (await sales.get(`/api/vehicles/${plain.vehicleId}`)).body.vehicle;
    expect((await sales.post(`/api/vehicles/${plain.vehicleId}/status`).send({ version: v.version, to: "sold" })).status).toBe(200);

    const json = JSON.parse((await request(app).get(`${jsonPath}?since=${encodeURIComponent(mark)}`)).text);
    expect(json.since).toBe(mark);
    const stocks = json.vehicles.map((x: { stockNumber: string }) => x.stockNumber).sort();
    expect(stocks).toEqual([freshStock, plain.stockNumber].sort());
    expect(json.vehicles.find((x: { stockNumber: string }) => x.stockNumber === freshStock).removed).toBeUndefined();
    const gone = json.vehicles.find((x: { stockNumber: string }) => x.stockNumber === plain.stockNumber);
    expect(gone).toEqual({ stockNumber: plain.stockNumber, url: plain.url, removed: true, removedAt: expect.any(String) });
    expect(Date.parse(gone.removedAt)).toBeGreaterThan(Date.parse(mark));

    const csv = parseCsv<Record<string, string>>((await request(app).get(`${csvPath}?since=${encodeURIComponent(mark)}`)).text, { columns: true });
    // The stock number, status and URL are added when the feed lacks them, with and without since (issue 16: a
    // parser reading columns by position must find the same columns in both).
    expect(Object.keys(csv[0])).toEqual(["Model", "stockNumber", "status", "url"]);
    const wholeCsv = parseCsv<Record<string, string>>((await request(app).get(csvPath)).text, { columns: true });
    expect(Object.keys(wholeCsv[0])).toEqual(["Model", "stockNumber", "status", "url"]);
    expect(csv.find((r) => r.stockNumber === plain.stockNumber)).toEqual({ Model: "", stockNumber: plain.stockNumber, status: "removed", url: plain.url });
    expect(csv.find((r) => r.stockNumber === freshStock)).toMatchObject({ Model: "Quarrel", status: "live" });

    // The whole feed no longer lists the sold ute.
    const whole = JSON.parse((await request(app).get(jsonPath)).text);
    expect(whole.vehicles.some((x: { stockNumber: string }) => x.stockNumber === plain.stockNumber)).toBe(false);
    expect(whole.vehicles.some((x: { removed?: boolean }) => x.removed)).toBe(false);
  }, 60_000);
});

describe("the fetch log", () => {
  it("when a portal fetches a feed, then the fetch is logged with address, user agent, rows and bytes; a feed unfetched for a day is flagged", async () => {
    const { m, feed, path } = await createFeed({ name: "Logged", format: "csv", filter: { makes: ["Ambrel"] } });
    const res = await request(app).get(path).set("User-Agent", "PortalBot/2.1 (+https://portal.example)");
    await new Promise((r) => setTimeout(r, 50));
    const listed = (await m.get("/api/feeds")).body.feeds.find((f: { id: number }) => f.id === feed.id);
    expect(listed.lastFetchedAt).not.toBeNull();
    expect(listed.notFetchedForADay).toBe(false);
    expect(listed.fetches).toHaveLength(1);
    expect(listed.fetches[0]).toMatchObject({ userAgent: "PortalBot/2.1 (+https://portal.example)", status: 200, bytes: Buffer.byteLength(res.text), since: null });
    expect(listed.fetches[0].rows).toBe(parseCsv(res.text, { columns: true }).length);
    expect(listed.fetches[0].ip).toMatch(/127\.0\.0\.1|::1/);
    const realNow = t.ctx.now;
    t.ctx.now = () => new Date(realNow().getTime() + 25 * 3600_000);
    try {
      const later = (await m.get("/api/feeds")).body.feeds.find((f: { id: number }) => f.id === feed.id);
      expect(later.notFetchedForADay).toBe(true);
    } finally {
      t.ctx.now = realNow;
    }
  });

  it("when marketing downloads a feed from the staff area, then it gets the portal's output as an attachment with a BOM, and no portal fetch is logged", async () => {
    const { m, feed, path } = await createFeed({ name: "Fernhollow — Ωmega feed", format: "csv", filter: { makes: ["Ambrel"] } });
    const raw = (r: request.Test) => r.buffer(true).parse((s, cb) => {
      const chunks: Buffer[] = [];
      s.on("data", (c: Buffer) => chunks.push(c));
      s.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    const portal = (await raw(request(app).get(path))).body as Buffer;
    const dl = await raw(m.get(`/api/feeds/${feed.id}/download`));
    expect(dl.status).toBe(200);
    expect(dl.headers["content-disposition"]).toMatch(/^attachment; filename=".+\.csv"; filename\*=UTF-8''Fernhollow-%CE%A9mega-feed\.csv$/);
    // The staff download opens right in spreadsheet programs: UTF-8 with a byte order mark (EF BB BF) before the
    // portal's bytes; the portal's own has none (portal feeds unchanged).
    const BOM = Buffer.from([0xef, 0xbb, 0xbf]);
    expect(portal.subarray(0, 3).equals(BOM)).toBe(false);
    expect((dl.body as Buffer).equals(Buffer.concat([BOM, portal]))).toBe(true);
    const listed = (await m.get(`/api/feeds/${feed.id}`)).body.feed;
    expect(listed.fetches).toHaveLength(1);
  });
});

describe("cautions in the feed", () => {
  it("when a revision carries cautions, then the feed gives the safety count and the cautions in words beside the count", async () => {
    const { vehicleId, sales, workshop } = await (await import("../support/publishing.ts")).prepareReadyVehicle(t);
    const checks = (await workshop.get(`/api/vehicles/${vehicleId}/checks`)).body;
    const put = await workshop.put(`/api/vehicles/${vehicleId}/checks`).send({
      version: checks.checks.version,
      results: [{ item: "brakes", result: "advise", note: "Front pads near their wear line" }, { item: "lights", result: "pass" }, { item: "warning_lamps", result: "pass" }],
    });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const pub = await sales.post(`/api/vehicles/${vehicleId}/publish`).send({});
    expect(pub.status, JSON.stringify(pub.body)).toBe(201);
    const stockNumber = (await snapshotOf(pub.body.slug)).stockNumber;
    const { path } = await createFeed({ name: "Cautions JSON", format: "json" });
    const body = (await request(app).get(path)).body;
    const v = body.vehicles.find((x: { stockNumber: string }) => x.stockNumber === stockNumber);
    expect(v.cautionCount).toBe(1);
    expect(v.safetyCautionCount).toBe(0);
    expect(v.cautionsText).toMatch(/^1 advisory\. Advisory: Brakes: advised\./);
    const quiet = body.vehicles.filter((x: { cautionCount: number }) => x.cautionCount === 0);
    expect(quiet.length).toBeGreaterThan(0);
    for (const q of quiet) expect(q).toMatchObject({ safetyCautionCount: 0, cautionsText: "No cautions." });
  });
});
