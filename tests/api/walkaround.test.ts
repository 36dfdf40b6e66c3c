import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { landscapeJpeg } from "../support/images.ts";
import { ZONES } from "../../shared/constants/evidence.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function vehicleWithPhoto() {
  const s = await t.signIn("sales");
  const v = (await s.post("/api/vehicles").send(dieselSuv())).body.vehicle;
  const w = await t.signIn("workshop");
  const up = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", await landscapeJpeg(1200, 800), "side.jpg");
  return { v, w, photo: up.body.photos[0] };
}

const defect = (over: Record<string, unknown> = {}) => ({ zone: "left_side", kind: "scratch", severity: "minor", sizeMm: 20, note: "Above the rear wheel arch", repairPlan: "disclosed_as_is", repairCostCents: 18000, ...over });

describe("defects", () => {
  it("when a defect is pinned on a photo, then it is numbered, stored as fractions, and gets a close-up cut around the pin", async () => {
    const { v, w, photo } = await vehicleWithPhoto();
    const res = await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ pin: { photoId: photo.id, x: 0.25, y: 0.5 } }));
    expect(res.status).toBe(201);
    expect(res.body.defect).toMatchObject({ number: 1, pin: { photoId: photo.id, x: 0.25, y: 0.5 }, repairCostCents: 18000 });
    const img = await request(t.app).get(res.body.defect.closeup).buffer(true).parse((r, cb) => {
      const c: Buffer[] = [];
      r.on("data", (d: Buffer) => c.push(d));
      r.on("end", () => cb(null, Buffer.concat(c)));
    });
    expect(img.status).toBe(200);
    const meta = await sharp(img.body as Buffer).metadata();
    expect(meta.width).toBe(meta.height);
    // The pin sits in the red (left) half of the test photo, so the close-up is red.
    const { data } = await sharp(img.body as Buffer).resize(1, 1).raw().toBuffer({ resolveWithObject: true });
    expect(data[0]).toBeGreaterThan(data[2]);
    const second = await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ kind: "dent", severity: "moderate" }));
    expect(second.body.defect.number).toBe(2);
  });

  it("when a defect is moved, edited with a stale version, or removed, then numbers are never reused", async () => {
    const { v, w, photo } = await vehicleWithPhoto();
    const d1 = (await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ pin: { photoId: photo.id, x: 0.1, y: 0.1 } }))).body.defect;
    const moved = await w.patch(`/api/vehicles/${v.id}/defects/${d1.id}`).send({ version: d1.version, pin: { photoId: photo.id, x: 0.9, y: 0.9 } });
    expect(moved.status).toBe(200);
    expect(moved.body.defect.pin).toEqual({ photoId: photo.id, x: 0.9, y: 0.9 });
    expect(moved.body.defect.closeup).not.toBe(d1.closeup);
    expect((await w.patch(`/api/vehicles/${v.id}/defects/${d1.id}`).send({ version: d1.version, note: "x" })).status).toBe(409);
    const unpinned = await w.patch(`/api/vehicles/${v.id}/defects/${d1.id}`).send({ version: moved.body.defect.version, pin: null });
    expect(unpinned.body.defect.pin).toBeNull();
    expect((await w.delete(`/api/vehicles/${v.id}/defects/${d1.id}?version=${unpinned.body.defect.version}`)).status).toBe(204);
    const next = await w.post(`/api/vehicles/${v.id}/defects`).send(defect());
    expect(next.body.defect.number).toBe(2);
  });

  it("when the pin is off the image or on another vehicle's photo, then 400", async () => {
    const { v, w, photo } = await vehicleWithPhoto();
    const off = await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ pin: { photoId: photo.id, x: 1.2, y: 0.5 } }));
    expect(off.status).toBe(400);
    expect(Object.keys(off.body.error.fields)).toContain("pin.x");
    const other = await vehicleWithPhoto();
    const foreign = await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ pin: { photoId: other.photo.id, x: 0.5, y: 0.5 } }));
    expect(foreign.status).toBe(400);
  });

  it("when fields are bad, then 400 names each and nothing is stored", async () => {
    const { v, w } = await vehicleWithPhoto();
    const res = await w.post(`/api/vehicles/${v.id}/defects`).send({ zone: "boot lid", kind: "ding", severity: "tiny", sizeMm: -3, repairPlan: "later", repairCostCents: -1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["kind", "repairCostCents", "repairPlan", "severity", "sizeMm", "zone"]);
    expect((await w.get(`/api/vehicles/${v.id}/walkaround`)).body.defects).toHaveLength(0);
  });

  it("when marketing records a defect, then 403; signed out, then 401", async () => {
    const { v } = await vehicleWithPhoto();
    const m = await t.signIn("marketing");
    expect((await m.post(`/api/vehicles/${v.id}/defects`).send(defect())).status).toBe(403);
    expect((await request(t.app).post(`/api/vehicles/${v.id}/defects`).set("Origin", ORIGIN).send(defect())).status).toBe(401);
    expect((await m.get(`/api/vehicles/${v.id}/walkaround`)).status).toBe(200);
  });
});

describe("the walk-around", () => {
  it("when zones are checked clear or get defects, then the list shows what is still unchecked", async () => {
    const { v, w } = await vehicleWithPhoto();
    let zones = (await w.get(`/api/vehicles/${v.id}/walkaround`)).body.zones;
    expect(zones.every((z: { state: string }) => z.state === "unchecked")).toBe(true);
    await w.put(`/api/vehicles/${v.id}/walkaround/zones`).send({ zone: "roof", nothingFound: true });
    await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ zone: "front", kind: "stone_chip", sizeMm: 2 }));
    zones = (await w.get(`/api/vehicles/${v.id}/walkaround`)).body.zones;
    const by = Object.fromEntries(zones.map((z: { zone: string; state: string }) => [z.zone, z.state]));
    expect(by.roof).toBe("nothing_found");
    expect(by.front).toBe("defects");
    expect(zones.filter((z: { state: string }) => z.state === "unchecked")).toHaveLength(ZONES.length - 2);
    const clash = await w.put(`/api/vehicles/${v.id}/walkaround/zones`).send({ zone: "front", nothingFound: true });
    expect(clash.status).toBe(409);
    // A defect found later in a zone marked clear replaces the mark.
    await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ zone: "roof", kind: "dent", sizeMm: 10 }));
    const roof = (await w.get(`/api/vehicles/${v.id}/walkaround`)).body.zones.find((z: { zone: string }) => z.zone === "roof");
    expect(roof.state).toBe("defects");
  });
});

describe("tyres and checks", () => {
  const tyres = (over: Record<string, unknown>[] = []) => [
    { position: "front_left", treadInnerMm: 5.1, treadCentreMm: 5.4, treadOuterMm: 4.9, sizeDesignation: "235/60 R18 103V", dotCode: "2319" },
    { position: "front_right", treadInnerMm: 5.0, treadCentreMm: 5.2, treadOuterMm: 5.0, sizeDesignation: "235/60 R18 103V", dotCode: "2319" },
    { position: "rear_left", treadInnerMm: 1.4, treadCentreMm: 1.6, treadOuterMm: 1.7, sizeDesignation: "235/60 R18 103V", dotCode: "0414" },
    { position: "rear_right", treadInnerMm: 3.0, treadCentreMm: 3.2, treadOuterMm: 3.1, sizeDesignation: "235/60 R18 103V", dotCode: "2319" },
    ...over,
  ];

  it("when tyres are recorded, then each is decoded and judged against the market's minimum with the usual cautions", async () => {
    const { v, w } = await vehicleWithPhoto();
    const res = await w.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: "2025-06-20", readings: tyres() });
    expect(res.status).toBe(200);
    const byPos = Object.fromEntries(res.body.tyres.readings.map((r: { reading: { position: string } }) => [r.reading.position, r]));
    const fl = byPos.front_left.assessment;
    // 235/60 R18 103V: load index 103 → 875 kg, V → 240 km/h, diameter 739.2 mm (../shared/TRADE.md §2.1–2.3, S2 [S16]).
    expect(fl.size).toMatchObject({ widthMm: 235, aspectRatio: 60, rimInches: 18, loadKg: 875, speedKmh: 240 });
    expect(fl.size.overallDiameterMm).toBeCloseTo(739.2, 1);
    // DOT 2319 inspected on 2025-06-20 → 6 years (TRADE.md §2.4, S [S5]); 6 years → advise (§2.6, CP).
    expect(fl.ageYears).toBe(6);
    expect(fl.ageAdvisory).toBe("advise");
    expect(fl.tread).toMatchObject({ verdict: "pass", leastMm: 4.9 });
    // The demo market is AU: 1.5 mm (WA Road Traffic (Vehicles) Regulations 2014 r 270(2), TRADE.md §2.5, S [S9]); the least of 1.4 fails.
    expect(byPos.rear_left.assessment.tread).toMatchObject({ verdict: "fail", leastMm: 1.4 });
    // DOT 0414 → 2014; measured 2025-06-20 → 11 years → strong advisory (CP).
    expect(byPos.rear_left.assessment.ageAdvisory).toBe("strong");
    const codes = res.body.cautions.map((c: { code: string }) => c.code);
    expect(codes).toContain("tyre_below_minimum_rear_left");
    expect(res.body.cautions.find((c: { code: string }) => c.code === "tyre_below_minimum_rear_left").text).toMatch(/legal minimum/);
    const stale = await w.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: "2025-06-20", readings: tyres() });
    expect(stale.status).toBe(409);
  });

  it("when a safety check fails, then a blocking caution says it must be repaired and defers to a licensed inspector", async () => {
    const { v, w } = await vehicleWithPhoto();
    const res = await w.put(`/api/vehicles/${v.id}/checks`).send({ version: 0, results: [{ item: "brakes", result: "fail", note: "Rear pads worn to the backing plate" }, { item: "climate", result: "advise", note: "Slow to cool" }] });
    expect(res.status).toBe(200);
    const caution = res.body.cautions.find((c: { code: string }) => c.code === "check_failed_brakes");
    expect(caution.level).toBe("block");
    expect(caution.text).toMatch(/repaired before it is sold/);
    expect(caution.text).toMatch(/licensed inspector/);
  });

  it("when readings are bad, then 400 names them", async () => {
    const { v, w } = await vehicleWithPhoto();
    const res = await w.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: "2999-01-01", readings: [{ position: "middle", treadInnerMm: -1, dotCode: "23/19" }] });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["measuredOn", "readings.0.dotCode", "readings.0.position", "readings.0.treadInnerMm"]);
    const checks = await w.put(`/api/vehicles/${v.id}/checks`).send({ version: 0, results: [{ item: "brakes", result: "ok" }] });
    expect(checks.status).toBe(400);
  });

  it("when marketing records tyres, then 403", async () => {
    const { v } = await vehicleWithPhoto();
    const m = await t.signIn("marketing");
    expect((await m.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: "2025-06-20", readings: [] })).status).toBe(403);
  });

  it("when the vehicle's evidence is read, then its condition index comes with it, and adding a defect never raises the index", async () => {
    const { v, w, photo } = await vehicleWithPhoto();
    await w.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: "2025-06-20", readings: tyres().slice(0, 2) });
    await w.put(`/api/vehicles/${v.id}/checks`).send({ version: 0, results: [{ item: "brakes", result: "pass" }] });
    const before = (await w.get(`/api/vehicles/${v.id}/evidence`)).body.evidence;
    expect(before.photos).toHaveLength(1);
    expect(before.condition.index).toBeGreaterThan(0);
    expect(before.condition.explanation.length).toBeGreaterThan(2);
    await w.post(`/api/vehicles/${v.id}/defects`).send(defect({ pin: { photoId: photo.id, x: 0.5, y: 0.5 } }));
    const after = (await w.get(`/api/vehicles/${v.id}/evidence`)).body.evidence;
    expect(after.condition.index).toBeLessThan(before.condition.index);
    expect(after.condition.summary.sentence).toBe("1 item noted, none affecting safety.");
  });
});
