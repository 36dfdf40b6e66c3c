// Words and figures for the public pages. Every number goes through shared/domain/display.ts, the one place
// numbers are rounded; this file only picks labels and joins them.
import { formatDistance, formatMoney, formatNumber, THIN_SPACE } from "../../../shared/domain/display.ts";
import { LABELS } from "../../../shared/constants/vehicle.ts";
import type { PublicDealership } from "../../../shared/schemas/dealership.ts";
import {
  CHECK_RESULT_LABELS,
  DEFECT_KIND_LABELS,
  REPAIR_PLAN_LABELS,
  SEVERITY_LABELS,
  TYRE_POSITION_LABELS,
  ZONE_LABELS,
} from "../../../shared/constants/evidence.ts";

export const DASH = "—";

export const label = <K extends keyof typeof LABELS>(group: K, value: string | null | undefined): string | null =>
  value ? ((LABELS[group] as Record<string, string>)[value] ?? humanise(value)) : null;

const pick = (table: Record<string, string>, value: string) => table[value] ?? humanise(value);
export const zoneLabel = (zone: string) => pick(ZONE_LABELS, zone);
export const kindLabel = (kind: string) => pick(DEFECT_KIND_LABELS, kind);
export const severityLabel = (severity: string) => pick(SEVERITY_LABELS, severity);
export const repairPlanLabel = (plan: string) => pick(REPAIR_PLAN_LABELS, plan);
export const tyrePositionLabel = (position: string) => pick(TYRE_POSITION_LABELS, position);
export const checkResultLabel = (result: string) => pick(CHECK_RESULT_LABELS, result);

function humanise(code: string): string {
  const s = code.replace(/_/g, " ");
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export const plural = (n: number, one: string, many = `${one}s`) => (n === 1 ? one : many);

/** "1 item", "14 items", with the locale's digit grouping. */
export const count = (n: number, one: string, many?: string, locale?: string) => `${formatNumber(n, { locale })} ${plural(n, one, many)}`;

export const priceText = (cents: number | null, currency: string, locale?: string) =>
  cents === null ? null : formatMoney(cents, currency, locale);

/** The odometer as read, in its own unit, never converted. */
export const odometerText = (reading: number | null, unit: "km" | "mi", locale?: string) => {
  const n = formatNumber(reading, { locale });
  return n === null ? null : `${n}${THIN_SPACE}${unit}`;
};

/** A theoretical range, always with "≈". */
export const rangeText = (km: number | null, unit: "km" | "mi", locale?: string) => formatDistance(km, unit, { locale, approximate: true });

export const yearText = (year: number | null) => (year === null ? null : String(year));

/**
 * "2 December 2025". A date-only value ("2025-12-02") is a calendar day and is shown as that day everywhere; a
 * timestamp is shown on the reader's own calendar.
 */
export function dateText(value: string | null | undefined, locale = "en", style: "long" | "medium" = "long", timeZone?: string): string | null {
  if (!value) return null;
  const dateOnly = /^\d{4}-\d{2}-\d{2}$/.test(value);
  const date = new Date(dateOnly ? `${value}T00:00:00Z` : value);
  if (Number.isNaN(date.getTime())) return value;
  const zone = dateOnly ? { timeZone: "UTC" } : timeZone ? { timeZone } : {};
  try {
    return new Intl.DateTimeFormat(locale, { dateStyle: style, ...zone }).format(date);
  } catch {
    return new Intl.DateTimeFormat("en", { dateStyle: style, ...(dateOnly ? { timeZone: "UTC" } : {}) }).format(date);
  }
}

/**
 * The day a revision was published, on the dealership's calendar when the server says which it is (so it matches the
 * inspection day, which is a calendar day there), else on the reader's own.
 */
export function publishedText(iso: string, dealership: PublicDealership, style: "long" | "medium" = "long"): string {
  const zone = (dealership as PublicDealership & { timeZone?: unknown }).timeZone;
  return dateText(iso, dealership.locale || "en", style, typeof zone === "string" && zone ? zone : undefined) ?? iso;
}

/** The address on one line. */
export const addressLine = (d: { addressLine: string; town: string; region: string; postcode: string }) =>
  [d.addressLine, d.town, [d.region, d.postcode].filter(Boolean).join(" ")].filter(Boolean).join(", ");

/** "fernhollow.example/vehicles/2019-ambrel-loam", for print and the window card. */
export const shortUrl = (url: string) => url.replace(/^https?:\/\//, "").replace(/^www\./, "").replace(/\/$/, "");

export const telHref = (phone: string) => `tel:${phone.replace(/[^\d+]/g, "")}`;
