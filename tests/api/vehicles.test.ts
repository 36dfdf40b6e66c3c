import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { dieselSuv } from "../support/vehicles.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const count = async () => {
  const [rows] = await t.ctx.database.pool.query("select count(*) as n from vehicles");
  return Number((rows as Array<{ n: number }>)[0].n);
};

async function createAsSales(over: Record<string, unknown> = {}) {
  const a = await t.signIn("sales");
  const res = await a.post("/api/vehicles").send(dieselSuv(over));
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.vehicle;
}

describe("POST /api/vehicles", () => {
  it("when sales creates a vehicle, then 201 with a stock number and the derived figures computed by the server", async () => {
    const v = await createAsSales({ vin: "1G4AH59H45G118341" });
    expect(v.stockNumber).toMatch(/^\d{5}$/);
    expect(v.status).toBe("intake");
    expect(v.version).toBe(1);
    // 68 L at 8.8 L/100 km = 772.727… km (../shared/TRADE.md §4, common practice, no source).
    expect(v.derived.rangeKm).toBeCloseTo(772.7272727, 6);
    // mpg(US) = 235.214583 / 8.8 = 26.7289… (TRADE.md §3, S2 [S19a]).
    expect(v.derived.mpgUs).toBeCloseTo(26.7289, 3);
    // mpg(UK) = 282.480936 / 8.8 = 32.1001… (TRADE.md §3, M: Weights and Measures Act 1985 gallon).
    expect(v.derived.mpgImperial).toBeCloseTo(32.1001, 3);
    // CFR Table V sample VIN, position 7 numeric → 2005 (TRADE.md §1.3, S [S1], S [S3]).
    expect(v.derived.vinCheck).toBe("valid");
    expect(v.derived.modelYearFromVin).toBe(2005);
    // 8.8 L/100 km diesel at the EPA factor 10,180 g/gal → 236.7 g/km (TRADE.md §5, S [S17]).
    expect(v.derived.co2GramsPerKmEstimate).toBeCloseTo(236.66, 1);
    expect(v.odometerReading).toBe(84_210);
    expect(v.odometerUnit).toBe("km");
  });

  it("when the client sends a derived block, then 400: derived figures are never accepted", async () => {
    const a = await t.signIn("sales");
    const before = await count();
    const res = await a.post("/api/vehicles").send({ ...dieselSuv(), derived: { rangeKm: 99999 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.derived ?? res.body.error.fields._).toBeTruthy();
    expect(await count()).toBe(before);
  });

  it("when a figure's inputs are missing, then it is null, never 0", async () => {
    const v = await createAsSales({ fuelTankLitres: null, powerKw: null, kerbWeightKg: null, vin: null });
    expect(v.derived.rangeKm).toBeNull();
    expect(v.derived.powerHp).toBeNull();
    expect(v.derived.powerToWeightKwPerTonne).toBeNull();
    expect(v.derived.vinCheck).toBe("not_applicable");
  });

  it("when the odometer is entered in miles, then the reading and unit are kept and km is derived", async () => {
    const body = dieselSuv();
    delete (body as Record<string, unknown>).odometerKm;
    const a = await t.signIn("sales");
    const res = await a.post("/api/vehicles").send({ ...body, odometerReading: 100_000, odometerUnit: "mi" });
    expect(res.status).toBe(201);
    expect(res.body.vehicle.odometerReading).toBe(100_000);
    expect(res.body.vehicle.odometerUnit).toBe("mi");
    // 100,000 mi = 160,934.4 km (TRADE.md §3, S2 [S19a]).
    expect(res.body.vehicle.odometerKm).toBeCloseTo(160_934.4, 6);
  });

  const bad: Array<[string, Record<string, unknown>, string]> = [
    ["a VIN with I, O or Q", { vin: "1G4AH59HI5G11834O" }, "vin"],
    ["a VIN of 16 characters", { vin: "1G4AH59H45G11834" }, "vin"],
    ["a number as text", { powerKw: "147" }, "powerKw"],
    ["a negative odometer", { odometerKm: -5 }, "odometerKm"],
    ["an enormous price", { priceCents: 1e15 }, "priceCents"],
    ["an unknown fuel type", { fuelType: "steam" }, "fuelType"],
    ["a build year in the future", { buildYear: 2999 }, "buildYear"],
    ["a service date in the future", { serviceHistory: [{ date: "2999-01-01", odometerKm: 1, kind: "scheduled" }] }, "serviceHistory.0.date"],
    ["an impossible date", { firstRegistrationDate: "2021-02-30" }, "firstRegistrationDate"],
    ["a huge description", { description: "x".repeat(20_001) }, "description"],
    ["a huge make", { make: "x".repeat(10_000) }, "make"],
    ["an empty make", { make: "" }, "make"],
    ["an unknown field", { colour2: "red" }, "_"],
    ["features that are not a list", { features: "Tow bar" }, "features"],
    ["a fractional seat count", { seats: 5.5 }, "seats"],
  ];
  it.each(bad)("when the body has %s, then 400 names the field and nothing is stored", async (_what, over, field) => {
    const a = await t.signIn("sales");
    const before = await count();
    const res = await a.post("/api/vehicles").send(dieselSuv(over));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    const names = Object.keys(res.body.error.fields);
    if (field === "_") expect(names.length).toBeGreaterThan(0);
    else expect(names).toContain(field);
    expect(await count()).toBe(before);
  });

  it("when several fields are wrong, then every one is reported at once", async () => {
    const a = await t.signIn("sales");
    const res = await a.post("/api/vehicles").send(dieselSuv({ vin: "OOO", seats: 99, fuelType: 3 }));
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["fuelType", "seats", "vin"]);
  });

  it("when the check digit fails in a market where it is only advisory, then the vehicle is saved with an invalid VIN status", async () => {
    // Table V sample with position 9 changed from 4 to 5 (TRADE.md §1.2, S [S1]).
    const v = await createAsSales({ vin: "1G4AH59H55G118341" });
    expect(v.derived.vinCheck).toBe("invalid");
    expect(v.derived.vinIssues[0].severity).toBe("warning");
  });

  it("when the market makes the check digit mandatory, then a failed check digit is 400 on vin", async () => {
    const admin = await t.signIn("admin");
    const { body } = await admin.get("/api/dealership");
    await admin.patch("/api/dealership").send({ version: body.dealership.version, vinCheckDigitMandatory: true });
    const a = await t.signIn("sales");
    const before = await count();
    const res = await a.post("/api/vehicles").send(dieselSuv({ vin: "1G4AH59H55G118341" }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.vin).toMatch(/check digit/i);
    expect(await count()).toBe(before);
    const now = await admin.get("/api/dealership");
    await admin.patch("/api/dealership").send({ version: now.body.dealership.version, vinCheckDigitMandatory: false });
  });

  it.each(["workshop", "marketing"] as const)("when %s tries to create, then 403", async (role) => {
    const a = await t.signIn(role);
    expect((await a.post("/api/vehicles").send(dieselSuv())).status).toBe(403);
  });

  it("when signed out, then 401", async () => {
    expect((await request(t.app).post("/api/vehicles").set("Origin", ORIGIN).send(dieselSuv())).status).toBe(401);
  });

  it("when two vehicles are created at once, then they get different stock numbers", async () => {
    const a = await t.signIn("sales");
    const results = await Promise.all(Array.from({ length: 6 }, () => a.post("/api/vehicles").send(dieselSuv())));
    const numbers = results.map((r) => r.body.vehicle.stockNumber);
    expect(new Set(numbers).size).toBe(6);
  });
});

describe("PATCH /api/vehicles/:id", () => {
  it("when saved with the current version, then the change is stored, the version rises and the audit names the field", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const res = await a.patch(`/api/vehicles/${v.id}`).send({ version: 1, fuelTankLitres: 80 });
    expect(res.status).toBe(200);
    expect(res.body.vehicle.version).toBe(2);
    // 80 L at 8.8 L/100 km = 909.09 km (computed from the TRADE.md §4 formula).
    expect(res.body.vehicle.derived.rangeKm).toBeCloseTo(909.0909, 3);
    const h = await a.get(`/api/vehicles/${v.id}/history`);
    const change = h.body.audit.find((e: { action: string }) => e.action === "vehicle_updated");
    expect(change.before).toEqual({ fuelTankLitres: 68 });
    expect(change.after).toEqual({ fuelTankLitres: 80 });
    expect(change.by).toBe("sales@demo.test");
  });

  it("when the version is stale, then 409 with the current record, and the newer save stands", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    await a.patch(`/api/vehicles/${v.id}`).send({ version: 1, colour: "Blue" });
    const stale = await a.patch(`/api/vehicles/${v.id}`).send({ version: 1, colour: "Red" });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect(stale.body.error.current.colour).toBe("Blue");
    expect((await a.get(`/api/vehicles/${v.id}`)).body.vehicle.colour).toBe("Blue");
  });

  it("when twenty saves race with the same version, then exactly one wins and the rest get 409", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const results = await Promise.all(Array.from({ length: 20 }, (_, i) => a.patch(`/api/vehicles/${v.id}`).send({ version: 1, keysCount: (i % 3) + 1 })));
    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(results.filter((r) => r.status === 409)).toHaveLength(19);
    expect((await a.get(`/api/vehicles/${v.id}`)).body.vehicle.version).toBe(2);
  });

  it("when workshop changes the odometer and service history, then 200; when it changes the price or copy, then 403", async () => {
    const v = await createAsSales();
    const w = await t.signIn("workshop");
    const ok = await w.patch(`/api/vehicles/${v.id}`).send({ version: 1, odometerKm: 85_000, powerKw: 150 });
    expect(ok.status).toBe(200);
    const price = await w.patch(`/api/vehicles/${v.id}`).send({ version: 2, priceCents: 100 });
    expect(price.status).toBe(403);
    expect(price.body.error.code).toBe("forbidden_fields");
    expect(price.body.error.fields.priceCents).toBeTruthy();
    expect((await w.patch(`/api/vehicles/${v.id}`).send({ version: 2, description: "x" })).status).toBe(403);
  });

  it("when marketing changes the listing copy, then 200; when it changes the odometer, then 403", async () => {
    const v = await createAsSales();
    const m = await t.signIn("marketing");
    expect((await m.patch(`/api/vehicles/${v.id}`).send({ version: 1, description: "New copy." })).status).toBe(200);
    expect((await m.patch(`/api/vehicles/${v.id}`).send({ version: 2, odometerKm: 1 })).status).toBe(403);
  });

  it("when a later service shows a lower odometer, then it is saved and flagged, not refused", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const res = await a.patch(`/api/vehicles/${v.id}`).send({
      version: 1,
      // TRADE.md §10 test: 45,000 km then 44,000 km on a later date → "odometer decreased" (common practice, no source).
      serviceHistory: [
        { date: "2024-03-01", odometerKm: 45_000, kind: "scheduled" },
        { date: "2024-09-01", odometerKm: 44_000, kind: "intermediate" },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.vehicle.derived.odometerFlags).toHaveLength(1);
    expect(res.body.vehicle.derived.odometerFlags[0]).toMatchObject({ code: "odometer_decreased", earlierKm: 45_000, laterKm: 44_000 });
  });

  it("when the body is bad, then 400 and the record is unchanged", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const res = await a.patch(`/api/vehicles/${v.id}`).send({ version: 1, doors: "five", vin: "QQQ" });
    expect(res.status).toBe(400);
    const after = (await a.get(`/api/vehicles/${v.id}`)).body.vehicle;
    expect(after.version).toBe(1);
    expect(after.doors).toBe(5);
  });

  it("when the version is missing, then 400", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const res = await a.patch(`/api/vehicles/${v.id}`).send({ colour: "Red" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.version).toBeTruthy();
  });

  it("when the vehicle does not exist, then 404; when the id is not a number, then 400", async () => {
    const a = await t.signIn("sales");
    expect((await a.patch("/api/vehicles/999999").send({ version: 1, colour: "Red" })).status).toBe(404);
    expect((await a.get("/api/vehicles/abc")).status).toBe(400);
  });
});

describe("GET /api/vehicles", () => {
  it("when searching by VIN, plate or stock number, then the vehicle is found", async () => {
    const v = await createAsSales({ vin: "1M8GDM9AXKP042788", registrationPlate: "QRT 42X" });
    const a = await t.signIn("workshop");
    for (const q of ["1M8GDM9AXKP042788", "042788", "qrt42x", v.stockNumber]) {
      const res = await a.get("/api/vehicles").query({ q });
      expect(res.status).toBe(200);
      expect(res.body.vehicles.map((r: { id: number }) => r.id)).toContain(v.id);
    }
  });

  it("when filtered, sorted and paged, then pages do not overlap and follow the sort", async () => {
    const a = await t.signIn("sales");
    for (const p of [1_000_000, 2_000_000, 3_000_000]) await a.post("/api/vehicles").send(dieselSuv({ make: "Orrin", model: "Fallow", priceCents: p, fuelType: "diesel" }));
    const first = await a.get("/api/vehicles").query({ make: "Orrin", sort: "price_desc", pageSize: 2, page: 1 });
    const second = await a.get("/api/vehicles").query({ make: "Orrin", sort: "price_desc", pageSize: 2, page: 2 });
    expect(first.body.total).toBe(3);
    expect(first.body.vehicles.map((v: { priceCents: number }) => v.priceCents)).toEqual([3_000_000, 2_000_000]);
    expect(second.body.vehicles.map((v: { priceCents: number }) => v.priceCents)).toEqual([1_000_000]);
    const ranged = await a.get("/api/vehicles").query({ make: "Orrin", priceMin: 1_500_000, priceMax: 2_500_000, status: "intake,preparing", fuelType: "diesel" });
    expect(ranged.body.vehicles).toHaveLength(1);
  });

  it("when the query is bad, then 400 names the parameter", async () => {
    const a = await t.signIn("sales");
    const res = await a.get("/api/vehicles").query({ sort: "colour", pageSize: 1000, status: "flying" });
    expect(res.status).toBe(400);
    const names = Object.keys(res.body.error.fields).map((k) => k.split(".")[0]);
    expect([...new Set(names)].sort()).toEqual(["pageSize", "sort", "status"]);
  });

  it("when nobody is signed in, then 401", async () => {
    expect((await request(t.app).get("/api/vehicles")).status).toBe(401);
  });

  it("when asking for suggestions, then features used before are offered", async () => {
    await createAsSales({ features: ["Heated seats", "Tow bar"] });
    const a = await t.signIn("sales");
    const res = await a.get("/api/vehicles/suggestions").query({ q: "He" });
    expect(res.body.features).toContain("Heated seats");
    expect(res.body.makes).toContain("Ambrel");
  });
});

describe("POST /api/vehicles/:id/status", () => {
  it("when a legal move is made, then the status changes and the history records who and why", async () => {
    const v = await createAsSales();
    const w = await t.signIn("workshop");
    const res = await w.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing", note: "Into the prep bay" });
    expect(res.status).toBe(200);
    expect(res.body.vehicle.status).toBe("preparing");
    const h = await w.get(`/api/vehicles/${v.id}/history`);
    expect(h.body.statusHistory[0]).toMatchObject({ from: "intake", to: "preparing", note: "Into the prep bay", by: "Wren Tallis" });
  });

  it("when the move is not on the path, then 409 with the reason", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    const res = await a.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "sold" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("illegal_move");
    expect(res.body.error.message).toMatch(/intake to sold/);
  });

  it("when asked to go live directly, then 409: only publishing makes a vehicle live", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    await a.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing" });
    const res = await a.post(`/api/vehicles/${v.id}/status`).send({ version: 2, to: "live" });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/publish/i);
  });

  it("when the role may not make the move, then 403; marketing may make none", async () => {
    const v = await createAsSales();
    const w = await t.signIn("workshop");
    await w.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing" });
    expect((await w.post(`/api/vehicles/${v.id}/status`).send({ version: 2, to: "intake" })).status).toBe(403);
    const m = await t.signIn("marketing");
    expect((await m.post(`/api/vehicles/${v.id}/status`).send({ version: 2, to: "intake" })).status).toBe(403);
  });

  it("when the version is stale, then 409", async () => {
    const v = await createAsSales();
    const a = await t.signIn("sales");
    await a.patch(`/api/vehicles/${v.id}`).send({ version: 1, colour: "Green" });
    const res = await a.post(`/api/vehicles/${v.id}/status`).send({ version: 1, to: "preparing" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("stale_version");
  });
});
