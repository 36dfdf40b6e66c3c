import sharp from "sharp";
import type { TestApp } from "./app.ts";
import { dieselSuv } from "./vehicles.ts";
import { renderDemoPhoto, type Angle } from "../../server/demo/art/index.ts";
import { ZONES } from "../../shared/constants/evidence.ts";

export const READY_TYRES = (["front_left", "front_right", "rear_left", "rear_right"] as const).map((position) => ({
  position, treadInnerMm: 5.1, treadCentreMm: 5.4, treadOuterMm: 5.2, sizeDesignation: "235/60 R18 103V", dotCode: "2322",
}));

/**
 * A vehicle taken all the way to ready (valid VIN, price, copy, photos, every zone checked with one pinned defect,
 * four tyres, checks passed) and, unless told otherwise, published by sales. The 68 L / 8.8 L/100 km diesel SUV.
 */
export async function prepareReadyVehicle(t: TestApp, over: Record<string, unknown> = {}) {
  const sales = await t.signIn("sales");
  const v = (await sales.post("/api/vehicles").send(dieselSuv({ vin: "1G4AH59H45G118341", registrationPlate: "FHM 204", ...over }))).body.vehicle;
  await sales.post(`/api/vehicles/${v.id}/status`).send({ version: v.version, to: "preparing" });
  const w = await t.signIn("workshop");
  const angles: Angle[] = ["front_left", "side_left", "rear_right", "interior_front"];
  const upload = w.post(`/api/vehicles/${v.id}/photos`);
  // Drawn at 1600 px, sent at 800 px: the variants (AVIF above all) are what makes a test slow.
  for (const [i, angle] of angles.entries()) {
    const photo = await sharp(await renderDemoPhoto({ bodyType: "suv", colour: "Slate grey", angle, seed: v.id * 10 + i })).resize(800).jpeg({ quality: 80 }).toBuffer();
    upload.attach("photos", photo, `${angle}.jpg`);
  }
  const photos = (await upload).body.photos;
  await t.ctx.photoWorker.settled();
  await w.post(`/api/vehicles/${v.id}/defects`).send({
    zone: "left_side", kind: "scratch", severity: "minor", sizeMm: 30, note: "Rear door, below the handle", repairPlan: "disclosed_as_is",
    repairCostCents: 15_000, pin: { photoId: photos[1].id, x: 0.55, y: 0.55 },
  });
  for (const zone of ZONES.filter((z) => z !== "left_side")) await w.put(`/api/vehicles/${v.id}/walkaround/zones`).send({ zone, nothingFound: true });
  const today = new Date().toISOString().slice(0, 10);
  await w.put(`/api/vehicles/${v.id}/tyres`).send({ version: 0, measuredOn: today, readings: READY_TYRES });
  await w.put(`/api/vehicles/${v.id}/checks`).send({ version: 0, results: [{ item: "brakes", result: "pass" }, { item: "lights", result: "pass" }, { item: "warning_lamps", result: "pass" }] });
  return { vehicleId: v.id as number, sales, workshop: w };
}

export async function publishReadyVehicle(t: TestApp, over: Record<string, unknown> = {}) {
  const { vehicleId, sales } = await prepareReadyVehicle(t, over);
  const res = await sales.post(`/api/vehicles/${vehicleId}/publish`).send({});
  if (res.status !== 201) throw new Error(`publish failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { vehicleId, slug: res.body.slug as string, url: res.body.url as string, sales };
}
