import type { Dealership, Vehicle } from "../../db/schema/index.ts";
import type { Derived } from "../../../shared/domain/derived.ts";
import type { PublicSnapshot } from "../../../shared/schemas/public.ts";
import { renderMarkdown } from "../../../shared/markdown.ts";
import { presentPublicDealership } from "../dealerships/dealerships.presenter.ts";
import type { Evidence } from "../condition/condition.presenter.ts";
import { shownPublicly } from "../photos/photos.presenter.ts";

/**
 * Media keys behind the /media/ URLs a snapshot shows, read back out of them. A publish records its keys from the rows
 * instead (condition.service.ts evidenceWithMediaOf); this independent reading is what the crash test checks them by.
 */
export function mediaKeysOf(snapshot: PublicSnapshot): string[] {
  const urls = [
    ...snapshot.photos.flatMap((p) => [p.src, ...[p.srcsetAvif, p.srcsetWebp, p.srcsetJpeg].flatMap((s) => (s ? s.split(", ").map((x) => x.split(" ")[0]) : []))]),
    ...snapshot.defects.flatMap((d) => (d.closeup ? [d.closeup] : [])),
  ];
  return [...new Set(urls.filter((u) => u.startsWith("/media/")).map((u) => u.slice("/media/".length)))];
}

const latest = (dates: Array<string | null | undefined>) => dates.filter((d): d is string => Boolean(d)).sort().at(-1) ?? null;

/**
 * Everything the public page shows, and nothing internal: no repair costs, no staff notes beyond what a defect
 * says to buyers, no audit, no plate.
 */
export function buildSnapshot(v: Vehicle, derived: Derived, evidence: Evidence, d: Dealership): PublicSnapshot {
  const photos = evidence.photos.filter(shownPublicly);
  const indexOf = new Map(photos.map((p, i) => [p.id, i]));
  const tyreDates = evidence.tyres.readings.map((r) => r.measuredOn);
  const checkDates = evidence.checks.results.map((c) => c.checkedOn);
  const zoneDates = evidence.zones.map((z) => z.checkedAt?.slice(0, 10));
  const inspector =
    evidence.tyres.readings[0]?.measuredBy ?? evidence.checks.results[0]?.checkedBy ?? evidence.zones.find((z) => z.checkedBy)?.checkedBy ?? null;
  return {
    title: [v.buildYear, v.make, v.model].filter(Boolean).join(" "),
    stockNumber: v.stockNumber,
    make: v.make,
    model: v.model,
    variant: v.variant,
    buildYear: v.buildYear,
    firstRegistrationDate: v.firstRegistrationDate,
    vin: v.vin,
    bodyType: v.bodyType,
    colour: v.colour,
    doors: v.doors,
    seats: v.seats,
    driveType: v.driveType,
    fuelType: v.fuelType,
    engineCapacityCc: v.engineCapacityCc,
    cylinders: v.cylinders,
    aspiration: v.aspiration,
    powerKw: v.powerKw,
    torqueNm: v.torqueNm,
    transmission: v.transmission,
    gears: v.gears,
    kerbWeightKg: v.kerbWeightKg,
    fuelTankLitres: v.fuelTankLitres,
    fuelConsumptionL100km: v.fuelConsumptionL100km,
    consumptionTestCycle: v.consumptionTestCycle,
    batteryKwh: v.batteryKwh,
    energyKwh100km: v.energyKwh100km,
    odometer: { reading: v.odometerReading, unit: v.odometerUnit, km: v.odometerKmIndex },
    keysCount: v.keysCount,
    previousOwners: v.previousOwners,
    features: v.features,
    descriptionHtml: renderMarkdown(v.description),
    priceCents: v.priceCents,
    currency: d.currency,
    derived,
    serviceHistory: v.serviceHistory.map((e) => ({ date: e.date, odometerKm: e.odometerKm, kind: e.kind, workshop: e.workshop ?? "", notes: e.notes ?? "" })),
    photos: photos.map((p) => ({
      src: p.src, srcsetAvif: p.srcsetAvif, srcsetWebp: p.srcsetWebp, srcsetJpeg: p.srcsetJpeg, width: p.width, height: p.height,
      placeholder: p.placeholder, caption: p.caption, zone: p.zone, isCover: p.isCover,
    })),
    defects: evidence.defects.map((x) => ({
      number: x.number, zone: x.zone, kind: x.kind, severity: x.severity, sizeMm: x.sizeMm, note: x.note,
      repairPlan: x.repairPlan, safetyRelevant: x.safetyRelevant,
      pin: x.pin && indexOf.has(x.pin.photoId) ? { photoIndex: indexOf.get(x.pin.photoId)!, x: x.pin.x, y: x.pin.y } : null,
      closeup: x.closeup,
    })),
    zones: evidence.zones.map((z) => ({ zone: z.zone, state: z.state })),
    tyres: {
      measuredOn: evidence.tyres.measuredOn,
      legalMinTreadMm: evidence.tyres.legalMinTreadMm,
      readings: evidence.tyres.readings.map((r) => ({
        position: r.reading.position,
        leastTreadMm: r.assessment.tread?.leastMm ?? null,
        treadVerdict: r.assessment.tread?.verdict ?? null,
        remainingPercent: r.assessment.remainingPercent,
        size: r.assessment.size?.designation ?? r.reading.sizeDesignation ?? null,
        loadKg: r.assessment.size?.loadKg ?? null,
        speedKmh: r.assessment.size?.speedKmh ?? null,
        ageYears: r.assessment.ageYears,
        ageAdvisory: r.assessment.ageAdvisory,
      })),
    },
    checks: evidence.checks.results.map((c) => ({ item: c.item, label: c.label, result: c.result, note: c.note, checkedOn: c.checkedOn })),
    cautions: evidence.cautions,
    condition: {
      index: evidence.condition.index,
      sentence: evidence.condition.summary.sentence,
      bySeverity: evidence.condition.summary.bySeverity,
      byZone: evidence.condition.summary.byZone,
      explanation: evidence.condition.explanation,
    },
    inspectedOn: latest([...tyreDates, ...checkDates, ...zoneDates]),
    inspectedBy: inspector,
    disclaimerHtml: renderMarkdown(d.disclaimerMarkdown),
    dealership: presentPublicDealership(d),
  };
}
