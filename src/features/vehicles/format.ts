import { formatMoney, formatNumber, THIN_SPACE } from "../../../shared/domain/display.ts";
import { LABELS } from "../../../shared/constants/vehicle.ts";

export const DASH = "—";

export const vehicleTitle = (v: { buildYear: number | null; make: string; model: string; variant?: string | null }) =>
  [v.buildYear, v.make, v.model].filter(Boolean).join(" ");

/** The odometer as read, in its own unit. */
export const odometerText = (v: { odometerReading: number | null; odometerUnit: "km" | "mi" }, locale?: string) =>
  v.odometerReading == null ? DASH : `${formatNumber(v.odometerReading, { locale })}${THIN_SPACE}${v.odometerUnit}`;

export const priceText = (cents: number | null, currency: string, locale?: string) =>
  cents == null ? DASH : (formatMoney(cents, currency, locale) ?? DASH);

export const label = <K extends keyof typeof LABELS>(group: K, value: string | null | undefined): string =>
  value ? ((LABELS[group] as Record<string, string>)[value] ?? value) : DASH;
