import { FEED_FORMAT_LABELS, type FeedFilter } from "../../../../shared/schemas/feeds.ts";
import { LABELS } from "../../../../shared/constants/vehicle.ts";
import type { FeedView } from "../api/feeds.ts";

export const formatLabel = (f: FeedView["format"]) => FEED_FORMAT_LABELS[f];

const money = (cents: number) => (cents / 100).toLocaleString(undefined, { maximumFractionDigits: 0 });

/** The filter in a line of words, for the list. */
export function filterSummary(f: FeedFilter): string {
  const bits: string[] = [];
  bits.push((f.statuses ?? ["live", "reserved"]).map((s) => LABELS.status[s].toLowerCase()).join(" or "));
  if (f.makes?.length) bits.push(f.makes.join(", "));
  if (f.bodyTypes?.length) bits.push(f.bodyTypes.map((b) => LABELS.bodyType[b].toLowerCase()).join(", "));
  if (f.fuelTypes?.length) bits.push(f.fuelTypes.map((x) => LABELS.fuelType[x].toLowerCase()).join(", "));
  if (f.priceMinCents !== undefined || f.priceMaxCents !== undefined)
    bits.push(f.priceMaxCents === undefined ? `from ${money(f.priceMinCents!)}` : f.priceMinCents === undefined ? `up to ${money(f.priceMaxCents)}` : `${money(f.priceMinCents)} to ${money(f.priceMaxCents)}`);
  if (f.daysInStockMin !== undefined) bits.push(`at least ${f.daysInStockMin} days in stock`);
  if (f.daysInStockMax !== undefined) bits.push(`at most ${f.daysInStockMax} days in stock`);
  return bits.join(" · ");
}

export function ago(iso: string, now = Date.now()): string {
  const s = Math.max(0, Math.round((now - Date.parse(iso)) / 1000));
  if (s < 60) return "just now";
  const m = Math.round(s / 60);
  if (m < 60) return `${m} minute${m === 1 ? "" : "s"} ago`;
  const h = Math.round(m / 60);
  if (h < 48) return `${h} hour${h === 1 ? "" : "s"} ago`;
  const d = Math.round(h / 24);
  return `${d} days ago`;
}

export const bytes = (n: number) => (n < 1024 ? `${n} B` : n < 1024 * 1024 ? `${(n / 1024).toFixed(1)} kB` : `${(n / 1024 / 1024).toFixed(1)} MB`);
