// The one place where numbers are rounded, for people to read. Computations
// elsewhere keep full precision; rounding is half-up (half away from zero,
// Intl "halfExpand") on the shortest decimal form of the number, so 26.725 → 26.73.
// Every formatter returns null for a missing value; the caller picks the placeholder.
import { isNonNegative } from "./guards.ts";
import { kgToLb, kmToMiles, kwToHp, kwToPs, l100kmToKmPerL, l100kmToMpgImperial, l100kmToMpgUs, nmToLbft } from "./units.ts";
import type { DistanceUnit } from "./markets.ts";

/** Between a number and its unit (STYLE: "773 km"). */
export const THIN_SPACE = "\u2009";
export const DEFAULT_LOCALE = "en";

type Value = number | null | undefined;

export interface NumberOptions {
  locale?: string;
  /** Exact number of decimals shown (default 0). */
  fractionDigits?: number;
}

export function formatNumber(value: Value, options: NumberOptions = {}): string | null {
  if (typeof value !== "number" || !Number.isFinite(value)) return null;
  const digits = options.fractionDigits ?? 0;
  return new Intl.NumberFormat(options.locale ?? DEFAULT_LOCALE, {
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
    roundingMode: "halfExpand",
  }).format(value);
}

export function withUnit(value: Value, unit: string, options: NumberOptions & { approximate?: boolean } = {}): string | null {
  const number = formatNumber(value, options);
  if (number === null) return null;
  return `${options.approximate ? `≈${THIN_SPACE}` : ""}${number}${THIN_SPACE}${unit}`;
}

/** Whole km or mi by default: 772.727… km → "773 km" (common practice, no source). */
export function formatDistance(km: Value, unit: DistanceUnit, options: NumberOptions & { approximate?: boolean } = {}): string | null {
  const value = unit === "mi" ? kmToMiles(km) : isNonNegative(km) ? km : null;
  return withUnit(value, unit, options);
}

export type ConsumptionUnit = "l100km" | "mpg_us" | "mpg_imperial" | "km_per_l";

const CONSUMPTION: Record<ConsumptionUnit, { convert: (l: Value) => number | null; unit: string; digits: number }> = {
  l100km: { convert: (l) => (typeof l === "number" && l > 0 ? l : null), unit: "L/100\u00a0km", digits: 1 },
  // mpg to 2 dp as TRADE.md §3's worked examples state them.
  mpg_us: { convert: l100kmToMpgUs, unit: "mpg US", digits: 2 },
  mpg_imperial: { convert: l100kmToMpgImperial, unit: "mpg UK", digits: 2 },
  km_per_l: { convert: l100kmToKmPerL, unit: "km/L", digits: 2 },
};

export function formatConsumption(l100km: Value, unit: ConsumptionUnit = "l100km", options: NumberOptions = {}): string | null {
  const spec = CONSUMPTION[unit];
  return withUnit(spec.convert(l100km), spec.unit, { fractionDigits: spec.digits, ...options });
}

export type PowerUnit = "kW" | "hp" | "PS";

export function formatPower(kw: Value, unit: PowerUnit = "kW", options: NumberOptions = {}): string | null {
  const value = unit === "hp" ? kwToHp(kw) : unit === "PS" ? kwToPs(kw) : typeof kw === "number" && kw > 0 ? kw : null;
  return withUnit(value, unit, options);
}

export function formatTorque(nm: Value, unit: "N·m" | "lbf·ft" = "N·m", options: NumberOptions = {}): string | null {
  const value = unit === "lbf·ft" ? nmToLbft(nm) : typeof nm === "number" && nm > 0 ? nm : null;
  return withUnit(value, unit, options);
}

export function formatMass(kg: Value, unit: "kg" | "lb" = "kg", options: NumberOptions = {}): string | null {
  const value = unit === "lb" ? kgToLb(kg) : typeof kg === "number" && kg > 0 ? kg : null;
  return withUnit(value, unit, options);
}

export function formatPowerToWeight(kwPerTonne: Value, options: NumberOptions = {}): string | null {
  return withUnit(kwPerTonne, "kW/t", { fractionDigits: 1, ...options });
}

/** An estimate, so it is shown with "≈". */
export function formatCo2(gramsPerKm: Value, options: NumberOptions = {}): string | null {
  return withUnit(gramsPerKm, "g/km", { approximate: true, ...options });
}

/** Stored and shown to 1 dp (TRADE.md §2.5). */
export function formatTreadDepth(mm: Value, options: NumberOptions = {}): string | null {
  return withUnit(mm, "mm", { fractionDigits: 1, ...options });
}

export function formatPercent(percent: Value, options: NumberOptions = {}): string | null {
  return withUnit(percent, "%", options);
}

/** The condition index is shown as a whole number out of 100, never as a grade. */
export function formatConditionIndex(index: Value, options: NumberOptions = {}): string | null {
  return formatNumber(index, { ...options, fractionDigits: 0 });
}

/**
 * Money from integer minor units (API.md priceCents) with the currency's own
 * number of decimals (JPY has none), so 2499000 AUD → "A$24,990.00" in en.
 */
export function formatMoney(cents: Value, currency: string, locale: string = DEFAULT_LOCALE): string | null {
  if (typeof cents !== "number" || !Number.isInteger(cents)) return null;
  let format: Intl.NumberFormat;
  try {
    format = new Intl.NumberFormat(locale, { style: "currency", currency });
  } catch {
    return null;
  }
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(cents / 10 ** digits);
}
