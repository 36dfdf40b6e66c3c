/**
 * Condition evidence for the demo stock: photos drawn by the project (./art), defects pinned on them, zones
 * checked, tyres measured and checks run, so the yard looks real. Deterministic for a given vehicle list. Variants
 * are left to the photo worker, as for any upload.
 */
import { eq } from "drizzle-orm";
import sharp from "sharp";
import type { Db } from "../db/client.ts";
import { checkResults, defects, photos, tyreReadings, vehicles, zoneMarks } from "../db/schema/index.ts";
import type { Storage } from "../lib/storage.ts";
import { prepareMaster, makeCloseup } from "../modules/photos/photos.service.ts";
import { renderDemoPhoto, ANGLE_ZONE, type Angle } from "./art/index.ts";
import { CHECK_ITEMS, ZONES, type DefectKind, type RepairPlanCode, type Zone } from "../../shared/constants/evidence.ts";
import { dayIn } from "../lib/clock.ts";

/** A small deterministic generator, so the demo is the same on every machine. */
function rng(seed: number) {
  let s = seed >>> 0 || 1;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

const ANGLES_BY_STATUS: Record<string, Angle[]> = {
  intake: ["front_left"],
  preparing: ["front_left", "side_left", "rear_right", "dashboard"],
  default: ["front_left", "side_left", "rear_right", "interior_front", "dashboard", "wheel"],
};

type DefectSeed = {
  zone: Zone; angle: Angle; kind: DefectKind; severity: "minor" | "moderate" | "major"; sizeMm: number; note: string; repairPlan: RepairPlanCode;
  x: number; y: number; cost: number;
};

const DEFECT_POOL: DefectSeed[] = [
  { zone: "front", angle: "front_left", kind: "stone_chip", severity: "minor", sizeMm: 2, note: "Leading edge of the bonnet, above the grille", repairPlan: "disclosed_as_is", x: 0.42, y: 0.45, cost: 6000 },
  { zone: "left_side", angle: "side_left", kind: "scratch", severity: "minor", sizeMm: 30, note: "Rear door, below the handle; does not catch a fingernail", repairPlan: "disclosed_as_is", x: 0.55, y: 0.55, cost: 15000 },
  { zone: "left_side", angle: "side_left", kind: "dent", severity: "moderate", sizeMm: 18, note: "Front door, paint unbroken", repairPlan: "to_be_repaired", x: 0.38, y: 0.58, cost: 22000 },
  { zone: "rear", angle: "rear_right", kind: "scuff", severity: "minor", sizeMm: 45, note: "Rear bumper corner, right", repairPlan: "repaired_before_sale", x: 0.7, y: 0.68, cost: 18000 },
  { zone: "wheels_tyres", angle: "wheel", kind: "kerb_rash", severity: "minor", sizeMm: 60, note: "Rim edge, front left wheel", repairPlan: "disclosed_as_is", x: 0.5, y: 0.22, cost: 12000 },
  { zone: "interior_front", angle: "interior_front", kind: "interior_wear", severity: "minor", sizeMm: 40, note: "Driver's seat bolster, outer side", repairPlan: "disclosed_as_is", x: 0.35, y: 0.6, cost: 0 },
  { zone: "front", angle: "front", kind: "glass_chip", severity: "moderate", sizeMm: 4, note: "Windscreen, passenger side, outside the driver's view", repairPlan: "to_be_repaired", x: 0.62, y: 0.3, cost: 9000 },
];

export async function seedDemoEvidence(db: Db, storage: Storage, dealershipId: number, now = new Date()): Promise<void> {
  const list = await db.select().from(vehicles).where(eq(vehicles.dealershipId, dealershipId));
  for (const v of list) {
    const rnd = rng(v.id * 7919);
    const angles = ANGLES_BY_STATUS[v.status] ?? ANGLES_BY_STATUS.default;
    const bodyType = v.bodyType ?? "sedan";
    const odometerText = v.odometerReading != null ? `${v.odometerReading.toLocaleString("en-AU").replace(/,/g, " ")} ${v.odometerUnit}` : undefined;
    const stored: Array<{ id: number; angle: Angle; width: number; height: number; masterKey: string }> = [];
    // Drawing is the slow part; the two cores draw a vehicle's photos side by side.
    // Drawn at 1600 px and kept at 1280 px: plenty for a demo, and a third less work for every size made from it.
    const masters = await Promise.all(
      angles.map(async (angle) => prepareMaster(await sharp(await renderDemoPhoto({ bodyType, colour: v.colour ?? "White", angle, seed: v.id, odometerText })).resize(1280).jpeg({ quality: 84 }).toBuffer())),
    );
    for (const [i, angle] of angles.entries()) {
      const master = masters[i];
      await storage.put(master.key, master.buffer);
      const [res] = await db.insert(photos).values({
        vehicleId: v.id, position: i + 1, isCover: i === 0, caption: "", zone: ANGLE_ZONE[angle] as Zone, hash: master.hash, masterKey: master.key,
        width: master.width, height: master.height, placeholder: master.placeholder, variants: [], status: "processing",
      });
      stored.push({ id: res.insertId, angle, width: master.width, height: master.height, masterKey: master.key });
    }
    if (v.status === "intake") continue;

    // Defects: a few from the pool whose photo exists, pinned where the illustration shows that part.
    const chosen = DEFECT_POOL.filter((d) => stored.some((p) => p.angle === d.angle) && rnd() < 0.55);
    let number = 0;
    for (const d of chosen) {
      const p = stored.find((s) => s.angle === d.angle)!;
      const closeupKey = await makeCloseup(storage, await storage.read(p.masterKey), p.width, p.height, d.x, d.y);
      number += 1;
      await db.insert(defects).values({
        vehicleId: v.id, number, zone: d.zone, kind: d.kind, severity: d.severity, sizeMm: d.sizeMm, note: d.note, repairPlan: d.repairPlan,
        repairCostCents: d.cost, safetyRelevant: false, photoId: p.id, pinX: d.x, pinY: d.y, closeupKey,
      });
    }
    await db.update(vehicles).set({ lastDefectNumber: number }).where(eq(vehicles.id, v.id));

    // Zones: every zone checked on vehicles past preparation; preparing ones are part-way round.
    const withDefects = new Set(chosen.map((d) => d.zone));
    const done = v.status === "preparing" ? ZONES.slice(0, 7) : ZONES;
    const checkedAt = new Date(v.stockedAt.getTime() + 86_400_000);
    const marks = done.filter((z) => !withDefects.has(z)).map((zone) => ({ vehicleId: v.id, zone, checkedBy: "Wren Tallis", checkedAt }));
    if (marks.length) await db.insert(zoneMarks).values(marks);

    // Tyres and checks on the day after stocking. One preparing vehicle has a worn rear tyre and one failed brakes,
    // so readiness has something to refuse.
    const measuredOn = dayIn("Australia/Brisbane", checkedAt > now ? now : checkedAt);
    const wornRear = v.status === "preparing" && v.id % 3 === 0;
    const base = 3.5 + rnd() * 4;
    const dot = `${String(10 + Math.floor(rnd() * 40)).padStart(2, "0")}${String((v.buildYear ?? 2019) % 100).padStart(2, "0")}`;
    const size = bodyType === "ute" || bodyType === "cab_chassis" ? "265/65 R17 112S" : bodyType === "suv" ? "235/60 R18 103V" : bodyType === "van" ? "215/65 R16C 109/107T" : "205/55 R16 91H";
    await db.insert(tyreReadings).values(
      (["front_left", "front_right", "rear_left", "rear_right"] as const).map((position, i) => {
        const depth = wornRear && position === "rear_left" ? 1.3 : Math.round((base + (i < 2 ? 0.4 : 0) - rnd() * 0.6) * 10) / 10;
        return { vehicleId: v.id, position, treadInnerMm: Math.max(0.5, depth - 0.2), treadCentreMm: depth + 0.1, treadOuterMm: depth, sizeDesignation: size, dotCode: dot, pressureKpa: 240, measuredOn, measuredBy: "Wren Tallis" };
      }),
    );
    const failedBrakes = v.status === "preparing" && v.id % 3 === 1;
    await db.insert(checkResults).values(
      CHECK_ITEMS.map((item): typeof checkResults.$inferInsert => ({
        vehicleId: v.id,
        item,
        result: item === "brakes" && failedBrakes ? "fail" : item === "climate" && rnd() < 0.2 ? "advise" : item === "keys" && (v.keysCount ?? 2) < 2 ? "advise" : "pass",
        note: item === "brakes" && failedBrakes ? "Rear pads below 2 mm; discs scored. Replace pads and discs before sale." : item === "keys" && (v.keysCount ?? 2) < 2 ? "One key only; a spare can be cut and coded." : "",
        checkedOn: measuredOn,
        checkedBy: "Wren Tallis",
      })),
    );
    await db.update(vehicles).set({ tyresVersion: 1, checksVersion: 1 }).where(eq(vehicles.id, v.id));
  }
}
