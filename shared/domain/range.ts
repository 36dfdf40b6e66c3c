// Range per tank or per battery charge (TRADE.md §4, CP). The figure uses the
// maker's nominal capacity and a test-cycle consumption, so it is always a
// theoretical range; callers must label it so (RANGE_BASIS).
import { isPositive } from "./guards.ts";

export const RANGE_BASIS = "theoretical" as const;
export type RangeBasis = typeof RANGE_BASIS;

type Input = number | null | undefined;

/** tank L ÷ (L/100 km) × 100; null when either input is missing or ≤ 0. */
export function rangeKm(tankLitres: Input, l100km: Input): number | null {
  if (!isPositive(tankLitres) || !isPositive(l100km)) return null;
  return (tankLitres / l100km) * 100;
}

/** battery kWh ÷ (kWh/100 km) × 100; null when either input is missing or ≤ 0. */
export function electricRangeKm(batteryKwh: Input, kwhPer100km: Input): number | null {
  if (!isPositive(batteryKwh) || !isPositive(kwhPer100km)) return null;
  return (batteryKwh / kwhPer100km) * 100;
}
