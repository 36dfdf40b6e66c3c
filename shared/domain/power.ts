// Power-to-mass ratio (TRADE.md §6.1). The caller states which mass it used
// (kerb, tare, gross) because the published thresholds name one.
import { isPositive } from "./guards.ts";

type Input = number | null | undefined;

/** kW ÷ (kg ÷ 1000), unrounded. */
export function powerToWeightKwPerTonne(powerKw: Input, massKg: Input): number | null {
  if (!isPositive(powerKw) || !isPositive(massKg)) return null;
  return powerKw / (massKg / 1000);
}

/**
 * NSW provisional-licence "high performance vehicle" threshold (TRADE.md §6.1,
 * S [S20]): strictly more than 130 kW/t on tare mass, the ratio not rounded.
 */
export const NSW_HIGH_PERFORMANCE_KW_PER_TONNE = 130;

export function exceedsNswHighPerformance(kwPerTonne: Input): boolean | null {
  if (!isPositive(kwPerTonne)) return null;
  return kwPerTonne > NSW_HIGH_PERFORMANCE_KW_PER_TONNE;
}
