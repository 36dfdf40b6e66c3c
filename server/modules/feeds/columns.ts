// The value of each catalogue column (shared/schemas/feeds.ts) for one published revision. Feeds read only the
// revision's snapshot, never the working record, so a feed shows exactly what the public page shows.
import type { PublicPhoto, PublicSnapshot, PublicStatus } from "../../../shared/schemas/public.ts";
import type { FeedColumn, FeedColumnKey, FeedUnits } from "../../../shared/schemas/feeds.ts";
import { DEFAULT_PHOTO_WIDTH, FEED_COLUMNS } from "../../../shared/schemas/feeds.ts";
import { kmToMiles, l100kmToMpgImperial, l100kmToMpgUs } from "../../../shared/domain/units.ts";
import { DAY_MS } from "../../lib/clock.ts";
import { cautionsInWords } from "../../../shared/domain/cautions.ts";

export type Cell = string | number | null | string[];

/** One live row as the feed query streams it. */
export interface FeedRow {
  vehicleId: number;
  status: PublicStatus;
  stockNumber: string;
  stockedAt: Date;
  revisionId: number;
  number: number;
  slug: string;
  snapshot: PublicSnapshot;
  publishedAt: Date;
  changedAt: Date;
}

/** A vehicle that left the feed (sold, withdrawn, archived or out of the filter) since the portal last asked. */
export interface RemovedRow {
  stockNumber: string;
  slug: string;
  removedAt: Date;
}

export type ConsumptionUnit = "l100km" | "mpg_us" | "mpg_imperial";

export interface UnitsInEffect {
  distance: "km" | "mi";
  consumption: ConsumptionUnit;
}

export interface CellContext {
  publicUrl: string;
  units: UnitsInEffect;
  now: Date;
}

/** The market's units are the dealership's distance unit, with mpg where the market quotes it (US gallons, imperial in the UK). */
export function unitsFor(units: FeedUnits, dealership: { distanceUnit: "km" | "mi"; market: string }): UnitsInEffect {
  if (units === "metric") return { distance: "km", consumption: "l100km" };
  return { distance: dealership.distanceUnit, consumption: dealership.market === "US" ? "mpg_us" : dealership.market === "UK" ? "mpg_imperial" : "l100km" };
}

const CONSUMPTION_UNIT_TEXT: Record<ConsumptionUnit, string> = { l100km: "L/100 km", mpg_us: "mpg (US)", mpg_imperial: "mpg (UK)" };

export const absoluteUrl = (base: string, path: string) => (/^https?:\/\//.test(path) ? path : `${base}${path.startsWith("/") ? "" : "/"}${path}`);
export const pageUrl = (base: string, slug: string) => `${base}/vehicles/${slug}`;

const round = (n: number | null | undefined, digits = 0) => (n == null || !Number.isFinite(n) ? null : Number(n.toFixed(digits)));

function distance(km: number | null | undefined, unit: "km" | "mi", digits = 0) {
  if (km == null) return null;
  return round(unit === "mi" ? kmToMiles(km) : km, digits);
}

/** The odometer in the feed's unit: as read when the units agree (never converted there and back), otherwise converted. */
function odometer(s: PublicSnapshot, unit: "km" | "mi") {
  if (s.odometer.reading != null && s.odometer.unit === unit) return s.odometer.reading;
  return distance(s.odometer.km, unit);
}

function consumption(l100km: number | null, unit: ConsumptionUnit) {
  if (l100km == null) return null;
  if (unit === "mpg_us") return round(l100kmToMpgUs(l100km), 2);
  if (unit === "mpg_imperial") return round(l100kmToMpgImperial(l100km), 2);
  return l100km;
}

/** The photo's JPEG at the chosen width: that width, else the largest below it, else the smallest there is. */
export function photoAt(p: PublicPhoto, width: number, base: string): string {
  const sizes = (p.srcsetJpeg ?? "")
    .split(", ")
    .map((entry) => {
      const [url, w] = entry.trim().split(" ");
      return { url: url ?? "", w: Number((w ?? "").replace(/w$/, "")) };
    })
    .filter((s) => s.url && Number.isFinite(s.w))
    .sort((a, b) => a.w - b.w);
  const chosen = sizes.filter((s) => s.w <= width).pop() ?? sizes[0];
  return absoluteUrl(base, chosen?.url ?? p.src);
}

const cover = (s: PublicSnapshot) => s.photos.find((p) => p.isCover) ?? s.photos[0] ?? null;

type Getter = (r: FeedRow, c: CellContext, col: FeedColumn) => Cell;
const snap = (k: keyof PublicSnapshot): Getter => (r) => (r.snapshot[k] as string | number | null) ?? null;

const GETTERS: Record<FeedColumnKey, Getter> = {
  stockNumber: (r) => r.stockNumber,
  status: (r) => r.status,
  title: snap("title"),
  make: snap("make"),
  model: snap("model"),
  variant: snap("variant"),
  buildYear: snap("buildYear"),
  firstRegistrationDate: snap("firstRegistrationDate"),
  vin: snap("vin"),
  bodyType: snap("bodyType"),
  colour: snap("colour"),
  doors: snap("doors"),
  seats: snap("seats"),
  driveType: snap("driveType"),
  fuelType: snap("fuelType"),
  transmission: snap("transmission"),
  gears: snap("gears"),
  engineCapacityCc: snap("engineCapacityCc"),
  cylinders: snap("cylinders"),
  aspiration: snap("aspiration"),
  powerKw: snap("powerKw"),
  torqueNm: snap("torqueNm"),
  kerbWeightKg: snap("kerbWeightKg"),
  fuelTankLitres: snap("fuelTankLitres"),
  fuelConsumption: (r, c) => consumption(r.snapshot.fuelConsumptionL100km, c.units.consumption),
  fuelConsumptionUnit: (r, c) => (r.snapshot.fuelConsumptionL100km == null ? null : CONSUMPTION_UNIT_TEXT[c.units.consumption]),
  batteryKwh: snap("batteryKwh"),
  energyKwh100km: snap("energyKwh100km"),
  odometer: (r, c) => odometer(r.snapshot, c.units.distance),
  distanceUnit: (_r, c) => c.units.distance,
  keysCount: snap("keysCount"),
  previousOwners: snap("previousOwners"),
  features: (r) => r.snapshot.features ?? [],
  descriptionHtml: snap("descriptionHtml"),
  price: (r) => (r.snapshot.priceCents == null ? null : (r.snapshot.priceCents / 100).toFixed(2)),
  priceCents: snap("priceCents"),
  currency: snap("currency"),
  daysInStock: (r, c) => Math.max(0, Math.floor((c.now.getTime() - r.stockedAt.getTime()) / DAY_MS)),
  publishedAt: (r) => r.publishedAt.toISOString(),
  revision: (r) => r.number,
  range: (r, c) => distance(r.snapshot.derived.rangeKm, c.units.distance),
  averagePerYear: (r, c) => distance(r.snapshot.derived.averageKmPerYear, c.units.distance),
  powerHp: (r) => round(r.snapshot.derived.powerHp, 1),
  powerPs: (r) => round(r.snapshot.derived.powerPs, 1),
  torqueLbft: (r) => round(r.snapshot.derived.torqueLbft, 1),
  powerToWeightKwPerTonne: (r) => round(r.snapshot.derived.powerToWeightKwPerTonne, 1),
  co2GramsPerKmEstimate: (r) => round(r.snapshot.derived.co2GramsPerKmEstimate, 0),
  vinCheck: (r) => r.snapshot.derived.vinCheck ?? null,
  modelYearFromVin: (r) => r.snapshot.derived.modelYearFromVin ?? null,
  nextServiceDueByDate: (r) => r.snapshot.derived.nextService?.dueByDate ?? null,
  nextServiceDueByKm: (r) => r.snapshot.derived.nextService?.dueByKm ?? null,
  conditionIndex: (r) => round(r.snapshot.condition.index, 1),
  conditionSentence: (r) => r.snapshot.condition.sentence,
  defectCount: (r) => r.snapshot.defects.length,
  defectsMinor: (r) => r.snapshot.condition.bySeverity.minor ?? 0,
  defectsModerate: (r) => r.snapshot.condition.bySeverity.moderate ?? 0,
  defectsMajor: (r) => r.snapshot.condition.bySeverity.major ?? 0,
  cautionCount: (r) => r.snapshot.cautions.length,
  safetyCautionCount: (r) => r.snapshot.cautions.filter((c) => c.level === "block").length,
  cautionsText: (r) => cautionsInWords(r.snapshot.cautions),
  photoCount: (r) => r.snapshot.photos.length,
  url: (r, c) => pageUrl(c.publicUrl, r.slug),
  coverPhotoUrl: (r, c, col) => {
    const p = cover(r.snapshot);
    return p ? photoAt(p, col.photoWidth ?? DEFAULT_PHOTO_WIDTH, c.publicUrl) : null;
  },
  photoUrls: (r, c, col) => r.snapshot.photos.map((p) => photoAt(p, col.photoWidth ?? DEFAULT_PHOTO_WIDTH, c.publicUrl)),
};

export const cellOf = (r: FeedRow, c: CellContext, col: FeedColumn): Cell => GETTERS[col.key](r, c, col);

/** What a removed vehicle still tells a portal: which one it was, and where its page was. */
export function removedCell(r: RemovedRow, c: CellContext, col: FeedColumn): Cell {
  if (col.key === "stockNumber") return r.stockNumber;
  if (col.key === "status") return "removed";
  if (col.key === "url") return pageUrl(c.publicUrl, r.slug);
  return null;
}

/** Every catalogue column under its own key, for the JSON feed. */
export const ALL_COLUMNS: FeedColumn[] = FEED_COLUMNS.map((c) => ({ key: c.key, header: c.key, ...("width" in c && c.width ? { photoWidth: DEFAULT_PHOTO_WIDTH } : {}) }));

/** Columns whose value depends on today, so the validator (ETag) must change with the day. */
export const dependsOnToday = (columns: FeedColumn[]) => columns.some((c) => c.key === "daysInStock");

/** XML 1.0 forbids most control characters even escaped; they cannot be in a well-formed document at all. */
// eslint-disable-next-line no-control-regex
const XML_INVALID = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;
export const xmlSafe = (s: string) => s.replace(XML_INVALID, "");
