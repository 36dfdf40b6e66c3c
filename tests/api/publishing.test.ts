import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import jsQR from "jsqr";
import { XMLParser } from "fast-xml-parser";
import { startTestApp, type TestApp } from "../support/app.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { prepareReadyVehicle, publishReadyVehicle } from "../support/publishing.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe("readiness and publishing", () => {
  it("when a vehicle is not ready, then publishing is 409 with the list of what is missing, and nothing is published", async () => {
    const sales = await t.signIn("sales");
    const v = (await sales.post("/api/vehicles").send(dieselSuv({ priceCents: null, vin: null }))).body.vehicle;
    await sales.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing" });
    const res = await sales.post(`/api/vehicles/${v.id}/publish`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("not_ready");
    const missing = res.body.error.readiness.missing.map((m: { code: string }) => m.code);
    expect(missing).toEqual(expect.arrayContaining(["vin", "price", "photos", "walkaround", "tyres"]));
    const detail = (await sales.get(`/api/vehicles/${v.id}`)).body.vehicle;
    expect(detail.readiness.ready).toBe(false);
    expect(detail.publishing.revisions).toHaveLength(0);
    expect((await request(t.app).get(`/api/public/vehicles/${detail.publishing.slug ?? "nothing"}`)).status).toBe(404);
  });

  it("when an admin overrides a block with a reason, then it publishes and the reason is on record; sales cannot override", async () => {
    const sales = await t.signIn("sales");
    const v = (await sales.post("/api/vehicles").send(dieselSuv({ vin: "1G4AH59H45G118341", description: "Being sold to the trade as is, on a short notice." }))).body.vehicle;
    await sales.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing" });
    const bySales = await sales.post(`/api/vehicles/${v.id}/publish`).send({ overrideReason: "Customer waiting, checks tomorrow" });
    expect(bySales.status).toBe(403);
    const admin = await t.signIn("admin");
    const short = await admin.post(`/api/vehicles/${v.id}/publish`).send({ overrideReason: "ok" });
    expect(short.status).toBe(400);
    const res = await admin.post(`/api/vehicles/${v.id}/publish`).send({ overrideReason: "Trade sale listing: sold as is, no walk-around" });
    expect(res.status).toBe(201);
    expect(res.body.revision.overrideReason).toBe("Trade sale listing: sold as is, no walk-around");
    const detail = (await admin.get(`/api/vehicles/${v.id}`)).body.vehicle;
    expect(detail.status).toBe("live");
    expect(detail.publishing.revisions[0].overrideReason).toMatch(/Trade sale/);
    const audit = (await admin.get(`/api/vehicles/${v.id}/history`)).body.audit;
    expect(audit.some((a: { action: string }) => a.action === "published_with_override")).toBe(true);
  });

  it("when a ready vehicle is published, then it goes live with revision 1 at its public address", async () => {
    const { vehicleId, slug, url } = await publishReadyVehicle(t);
    expect(slug).toMatch(/^2019-ambrel-loam-\d+$/);
    expect(url).toBe(`http://127.0.0.1:3000/vehicles/${slug}`);
    const pub = await request(t.app).get(`/api/public/vehicles/${slug}`);
    expect(pub.status).toBe(200);
    expect(pub.body.vehicle.status).toBe("live");
    expect(pub.body.vehicle.revision).toMatchObject({ number: 1, changes: ["First published."] });
    // 68 L at 8.8 L/100 km = 772.7 km (common practice, no source).
    expect(pub.body.vehicle.snapshot.derived.rangeKm).toBeCloseTo(772.727, 2);
    const staff = (await (await t.signIn("sales")).get(`/api/vehicles/${vehicleId}`)).body.vehicle;
    expect(staff.status).toBe("live");
  });
});

describe("the public side reads only revisions", () => {
  it("when a published vehicle is edited, then the public page does not change until the next publish, which says what changed", async () => {
    const { vehicleId, slug, sales } = await publishReadyVehicle(t);
    const v = (await sales.get(`/api/vehicles/${vehicleId}`)).body.vehicle;
    await sales.patch(`/api/vehicles/${vehicleId}`).send({ version: v.version, priceCents: 3_299_000, odometerKm: 84_400, powerKw: 150 });
    const before = await request(t.app).get(`/api/public/vehicles/${slug}`);
    expect(before.body.vehicle.snapshot.priceCents).toBe(3_499_000);
    const w = await t.signIn("workshop");
    const evidence = (await sales.get(`/api/vehicles/${vehicleId}/evidence`)).body.evidence;
    const dent = await w.post(`/api/vehicles/${vehicleId}/defects`).send({ zone: "rear", kind: "dent", severity: "moderate", sizeMm: 18, note: "Tailgate", repairPlan: "to_be_repaired" });
    const scratch = evidence.defects[0];
    await w.patch(`/api/vehicles/${vehicleId}/defects/${scratch.id}`).send({ version: scratch.version, repairPlan: "repaired_before_sale" });
    const second = await sales.post(`/api/vehicles/${vehicleId}/publish`).send({});
    expect(second.status).toBe(201);
    expect(second.body.revision.number).toBe(2);
    const changes: string[] = second.body.revision.changes;
    expect(changes).toEqual(expect.arrayContaining([
      expect.stringMatching(/^Price changed from .*34,990.* to .*32,990/),
      expect.stringMatching(/^Odometer reading updated from 84,210.km to 84,400.km\.$/),
      `Added item ${dent.body.defect.number}: moderate dent (rear).`,
      "Item 1 (minor scratch (left side)) repaired.",
      "Specification updated: power.",
    ]));
    const after = await request(t.app).get(`/api/public/vehicles/${slug}`);
    expect(after.body.vehicle.snapshot.priceCents).toBe(3_299_000);
    expect(after.body.vehicle.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    const old = await request(t.app).get(`/api/public/vehicles/${slug}/revisions/1`);
    expect(old.body.vehicle.snapshot.priceCents).toBe(3_499_000);
  });

  it("when a defect affecting safety is not repaired, then it is a caution on the record, publishing is 409 until an admin overrides with a reason, and the older revision reads as it did", async () => {
    const { vehicleId, slug, sales } = await publishReadyVehicle(t);
    const first = (await request(t.app).get(`/api/public/vehicles/${slug}`)).body.vehicle.snapshot;
    const w = await t.signIn("workshop");
    const fault = (await w.post(`/api/vehicles/${vehicleId}/defects`).send({
      zone: "underbody", kind: "corrosion", severity: "major", note: "Sill, rear left", repairPlan: "disclosed_as_is", safetyRelevant: true,
    })).body.defect;
    const code = `defect_safety_${fault.number}`;
    const evidence = (await sales.get(`/api/vehicles/${vehicleId}/evidence`)).body.evidence;
    expect(evidence.cautions.find((c: { code: string }) => c.code === code)).toMatchObject({ level: "block" });
    const refused = await sales.post(`/api/vehicles/${vehicleId}/publish`).send({});
    expect(refused.status).toBe(409);
    const item = refused.body.error.readiness.missing.find((m: { code: string }) => m.code === "safety_defects");
    expect(item.detail).toMatch(new RegExp(`^Item ${fault.number} affects safety and is not repaired`));
    expect((await sales.post(`/api/vehicles/${vehicleId}/publish`).send({ overrideReason: "Sold to the trade as is" })).status).toBe(403);
    const admin = await t.signIn("admin");
    const res = await admin.post(`/api/vehicles/${vehicleId}/publish`).send({ overrideReason: "Trade sale: sold as is, the buyer has the inspection report" });
    expect(res.status).toBe(201);
    expect(res.body.revision).toMatchObject({ number: 2, overrideReason: expect.stringMatching(/^Trade sale/) });
    const now = (await request(t.app).get(`/api/public/vehicles/${slug}`)).body.vehicle.snapshot;
    const caution = now.cautions.find((c: { code: string }) => c.code === code);
    expect(caution.text).toMatch(/licensed inspector before driving/);
    const old = (await request(t.app).get(`/api/public/vehicles/${slug}/revisions/1`)).body.vehicle.snapshot;
    expect(old.cautions).toEqual(first.cautions);
    expect(old.cautions.some((c: { code: string }) => c.code === code)).toBe(false);
  });

  it("when any public response is read, then nothing internal is in it: no repair costs, no plate, no staff ids, no audit", async () => {
    const { slug } = await publishReadyVehicle(t);
    const bodies = [
      (await request(t.app).get(`/api/public/vehicles/${slug}`)).text,
      (await request(t.app).get(`/api/public/vehicles/${slug}/revisions/1`)).text,
      (await request(t.app).get("/api/public/vehicles")).text,
      (await request(t.app).get(`/vehicles/${slug}`)).text,
    ];
    for (const body of bodies) {
      expect(body).not.toMatch(/repairCost|15000|FHM 204|registrationPlate|passwordHash|audit|userId|publishedBy/);
    }
  });

  it("when a draft is asked for by its would-be address or a made-up one, then 404", async () => {
    expect((await request(t.app).get("/api/public/vehicles/2019-ambrel-loam-99999")).status).toBe(404);
    expect((await request(t.app).get("/vehicles/2019-ambrel-loam-99999")).status).toBe(404);
  });

  it("when the vehicle is withdrawn, then its page answers 410 politely; when sold, it shows as sold", async () => {
    const a = await publishReadyVehicle(t);
    let v = (await a.sales.get(`/api/vehicles/${a.vehicleId}`)).body.vehicle;
    await a.sales.post(`/api/vehicles/${a.vehicleId}/status`).send({ version: v.version, to: "withdrawn" });
    const gone = await request(t.app).get(`/api/public/vehicles/${a.slug}`);
    expect(gone.status).toBe(410);
    expect(gone.body.error.message).toMatch(/no longer advertised/);
    expect((await request(t.app).get(`/vehicles/${a.slug}`)).status).toBe(410);
    const b = await publishReadyVehicle(t);
    v = (await b.sales.get(`/api/vehicles/${b.vehicleId}`)).body.vehicle;
    await b.sales.post(`/api/vehicles/${b.vehicleId}/status`).send({ version: v.version, to: "sold" });
    const sold = await request(t.app).get(`/api/public/vehicles/${b.slug}`);
    expect(sold.status).toBe(200);
    expect(sold.body.vehicle.status).toBe("sold");
    const list = await request(t.app).get("/api/public/vehicles");
    expect(list.body.vehicles.map((c: { slug: string }) => c.slug)).not.toContain(b.slug);
  });

  it("when twenty publishes of one vehicle race, then each gets its own revision in order and none is broken", async () => {
    const { vehicleId, sales } = await prepareReadyVehicle(t);
    const results = await Promise.all(Array.from({ length: 20 }, () => sales.post(`/api/vehicles/${vehicleId}/publish`).send({})));
    const ok = results.filter((r) => r.status === 201);
    expect(ok.length + results.filter((r) => r.status === 409).length).toBe(20);
    const numbers = ok.map((r) => r.body.revision.number).sort((x, y) => x - y);
    expect(numbers).toEqual(Array.from({ length: ok.length }, (_, i) => i + 1));
    const [rows] = await t.ctx.database.pool.query("select number, json_valid(snapshot) as ok, length(snapshot) as len from revisions where vehicle_id = ? order by number", [vehicleId]);
    for (const r of rows as Array<{ ok: number; len: number }>) {
      expect(r.ok).toBe(1);
      expect(r.len).toBeGreaterThan(1000);
    }
  });

  it("when the storefront is searched and filtered, then only vehicles on sale appear, with their cover and figures", async () => {
    const { slug } = await publishReadyVehicle(t, { make: "Vantrel", model: "Sparrel", fuelType: "plug_in_hybrid", bodyType: "wagon", priceCents: 2_150_000, batteryKwh: 12, energyKwh100km: 18 });
    const res = await request(t.app).get("/api/public/vehicles").query({ q: "Sparrel", bodyType: "wagon", priceMax: 2_200_000 });
    expect(res.status).toBe(200);
    expect(res.body.vehicles.map((c: { slug: string }) => c.slug)).toEqual([slug]);
    const card = res.body.vehicles[0];
    expect(card.cover.srcsetAvif).toMatch(/\.avif 320w/);
    expect(card.conditionIndex).toBeGreaterThan(50);
    expect(res.body.facets.makes).toContain("Vantrel");
    const bad = await request(t.app).get("/api/public/vehicles").query({ bodyType: "tank", sort: "random" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["bodyType", "sort"]);
  });
});

describe("what search engines and link previews read", () => {
  it("when the condition page is fetched, then its HTML carries the title, canonical, Open Graph, Twitter and a schema.org Car with Offer", async () => {
    const { slug, url } = await publishReadyVehicle(t);
    const res = await request(t.app).get(`/vehicles/${slug}`);
    expect(res.status).toBe(200);
    const html = res.text;
    expect(html).toMatch(/<title>2019 Ambrel Loam 2\.2 diesel seven-seat · Fernhollow Motors<\/title>/);
    expect(html).toContain(`<link rel="canonical" href="${url}" />`);
    expect(html).toMatch(/<meta property="og:image" content="http:\/\/127\.0\.0\.1:3000\/media\/photos\/[a-f0-9]{2}\/[a-f0-9]{64}-(1024|800)\.jpg" \/>/);
    expect(html).toMatch(/<meta name="twitter:card" content="summary_large_image" \/>/);
    const json = JSON.parse(html.match(/<script type="application\/ld\+json">([\s\S]*?)<\/script>/)![1]);
    // ../shared/TRADE.md §7 (schema.org [S23]): Car → Offer; UN/CEFACT codes KMT, LTR, KWT, CMQ, NU; L/100 km as unitText.
    expect(json["@context"]).toBe("https://schema.org");
    expect(json["@type"]).toBe("Car");
    expect(json.vehicleIdentificationNumber).toBe("1G4AH59H45G118341");
    expect(json.itemCondition).toBe("https://schema.org/UsedCondition");
    expect(json.mileageFromOdometer).toEqual({ "@type": "QuantitativeValue", value: 84_210, unitCode: "KMT" });
    expect(json.fuelCapacity).toEqual({ "@type": "QuantitativeValue", value: 68, unitCode: "LTR" });
    expect(json.fuelConsumption).toMatchObject({ "@type": "QuantitativeValue", value: 8.8, unitText: "L/100 km", valueReference: "WLTP combined" });
    expect(json.vehicleEngine).toMatchObject({ "@type": "EngineSpecification", enginePower: { value: 147, unitCode: "KWT" }, engineDisplacement: { value: 2199, unitCode: "CMQ" }, torque: { value: 440, unitCode: "NU" } });
    expect(json.driveWheelConfiguration).toBe("https://schema.org/AllWheelDriveConfiguration");
    expect(json.offers).toMatchObject({ "@type": "Offer", price: 34_990, priceCurrency: "AUD", availability: "https://schema.org/InStock", url });
    expect(json.knownVehicleDamages).toMatch(/Minor scratch, left side, 30 mm/);
    expect(res.headers["content-security-policy"]).toMatch(/script-src 'self'(;|$)/);
  });

  it("when sitemap.xml and robots.txt are read, then the live vehicles are listed and the staff area is excluded", async () => {
    const { url } = await publishReadyVehicle(t);
    const sitemap = await request(t.app).get("/sitemap.xml");
    expect(sitemap.headers["content-type"]).toMatch(/application\/xml/);
    const parsed = new XMLParser().parse(sitemap.text);
    const locs = [parsed.urlset.url].flat().map((u: { loc: string }) => u.loc);
    expect(locs).toContain(url);
    const robots = await request(t.app).get("/robots.txt");
    expect(robots.text).toMatch(/Disallow: \/app/);
    expect(robots.text).toMatch(/Sitemap: http:\/\/127\.0\.0\.1:3000\/sitemap\.xml/);
  });

  it("when the window card's QR code is decoded by an independent decoder, then it reads back the page's URL", async () => {
    const { slug, url } = await publishReadyVehicle(t);
    const res = await request(t.app).get(`/api/public/vehicles/${slug}/qr.svg`).buffer(true).parse((r, cb) => {
      const c: Buffer[] = [];
      r.on("data", (d: Buffer) => c.push(d));
      r.on("end", () => cb(null, Buffer.concat(c)));
    });
    expect(res.headers["content-type"]).toMatch(/image\/svg\+xml/);
    const { data, info } = await sharp(res.body as Buffer, { density: 300 }).resize(600).flatten({ background: "#ffffff" }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    // jsQR (npm) is a decoder independent of the qrcode package that made the image.
    const code = jsQR(new Uint8ClampedArray(data), info.width, info.height);
    expect(code?.data).toBe(url);
  });
});

describe("who may publish", () => {
  it.each(["workshop", "marketing"] as const)("when %s publishes, then 403", async (role) => {
    const { vehicleId } = await prepareReadyVehicle(t);
    const a = await t.signIn(role);
    expect((await a.post(`/api/vehicles/${vehicleId}/publish`).send({})).status).toBe(403);
  });
  it("when signed out, then 401", async () => {
    expect((await request(t.app).post("/api/vehicles/1/publish").set("Origin", "http://127.0.0.1:3000").send({})).status).toBe(401);
  });
});
