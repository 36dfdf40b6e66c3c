// What buyers see: the snapshot frozen into each published revision, and the public API's answers. Written once here;
// the server builds it at publish time (server/modules/publishing/snapshot.ts), the public pages render it.
import type { Derived } from "../domain/derived.ts";
import type { Caution } from "../domain/cautions.ts";
import type { PublicDealership } from "./dealership.ts";

export interface PublicPhoto {
  src: string;
  srcsetAvif: string;
  srcsetWebp: string;
  srcsetJpeg: string;
  width: number;
  height: number;
  placeholder: string;
  caption: string;
  zone: string | null;
  isCover: boolean;
}

export interface PublicDefect {
  number: number;
  zone: string;
  kind: string;
  severity: "minor" | "moderate" | "major";
  sizeMm: number | null;
  note: string;
  repairPlan: "repaired_before_sale" | "disclosed_as_is" | "to_be_repaired";
  safetyRelevant: boolean;
  /** Index into `photos`, with the pin as fractions of the photo. */
  pin: { photoIndex: number; x: number; y: number } | null;
  closeup: string | null;
}

export interface PublicTyre {
  position: string;
  leastTreadMm: number | null;
  treadVerdict: "pass" | "fail" | null;
  remainingPercent: number | null;
  size: string | null;
  loadKg: number | null;
  speedKmh: number | null;
  ageYears: number | null;
  ageAdvisory: "none" | "advise" | "strong" | null;
}

export interface PublicSnapshot {
  title: string;
  stockNumber: string;
  make: string;
  model: string;
  variant: string | null;
  buildYear: number | null;
  firstRegistrationDate: string | null;
  vin: string | null;
  bodyType: string | null;
  colour: string | null;
  doors: number | null;
  seats: number | null;
  driveType: string | null;
  fuelType: string | null;
  engineCapacityCc: number | null;
  cylinders: number | null;
  aspiration: string | null;
  powerKw: number | null;
  torqueNm: number | null;
  transmission: string | null;
  gears: number | null;
  kerbWeightKg: number | null;
  fuelTankLitres: number | null;
  fuelConsumptionL100km: number | null;
  consumptionTestCycle: string | null;
  batteryKwh: number | null;
  energyKwh100km: number | null;
  odometer: { reading: number | null; unit: "km" | "mi"; km: number | null };
  keysCount: number | null;
  previousOwners: number | null;
  features: string[];
  /** Listing copy rendered from Markdown at publish time and sanitised (shared/markdown.ts). */
  descriptionHtml: string;
  priceCents: number | null;
  currency: string;
  derived: Derived;
  serviceHistory: Array<{ date: string; odometerKm: number; kind: string; workshop: string; notes: string }>;
  photos: PublicPhoto[];
  defects: PublicDefect[];
  zones: Array<{ zone: string; state: "unchecked" | "nothing_found" | "defects" }>;
  tyres: { measuredOn: string | null; legalMinTreadMm: number; readings: PublicTyre[] };
  checks: Array<{ item: string; label: string; result: "pass" | "advise" | "fail"; note: string; checkedOn: string }>;
  cautions: Caution[];
  condition: {
    index: number | null;
    sentence: string;
    bySeverity: Record<"minor" | "moderate" | "major", number>;
    byZone: Record<string, number>;
    explanation: string[];
  };
  /** The day of the inspection the report records, and who made it. */
  inspectedOn: string | null;
  inspectedBy: string | null;
  disclaimerHtml: string;
  dealership: PublicDealership;
}

export interface RevisionSummary {
  number: number;
  publishedAt: string;
  changes: string[];
}

export type PublicStatus = "live" | "reserved" | "sold";

export interface PublicVehicle {
  slug: string;
  url: string;
  status: PublicStatus;
  revision: RevisionSummary;
  snapshot: PublicSnapshot;
  revisions: RevisionSummary[];
}

/** One card on the storefront. */
export interface PublicVehicleCard {
  slug: string;
  url: string;
  status: PublicStatus;
  title: string;
  variant: string | null;
  priceCents: number | null;
  currency: string;
  odometer: { reading: number | null; unit: "km" | "mi" };
  buildYear: number | null;
  bodyType: string | null;
  fuelType: string | null;
  transmission: string | null;
  rangeKm: number | null;
  conditionIndex: number | null;
  defectCount: number;
  cover: PublicPhoto | null;
  publishedAt: string;
}
