// Tread depth against a legal minimum (TRADE.md §2.5) and tyre-age advice
// (TRADE.md §2.6). The shallowest reading decides, and "at the minimum" passes
// because every cited rule refuses only depths *less than* the minimum.
import { isNonNegative, isPositive } from "./guards.ts";

export type TreadPosition = "inner" | "centre" | "outer";
export interface TreadDepths {
  inner?: number | null;
  centre?: number | null;
  outer?: number | null;
}

export interface TreadVerdict {
  verdict: "pass" | "fail";
  leastMm: number;
  /** Where the least depth was measured (the first such position on a tie). */
  leastPosition: TreadPosition;
  /** leastMm − legal minimum; negative on a fail. */
  marginMm: number;
  /** Positions without a usable reading; the verdict rests on the others. */
  missing: TreadPosition[];
}

const POSITIONS: readonly TreadPosition[] = ["inner", "centre", "outer"];

/** Null when no position has a reading (≥ 0 mm) or the minimum is not above zero. */
export function treadVerdict(depthsMm: TreadDepths | null | undefined, legalMinimumMm: number | null | undefined): TreadVerdict | null {
  if (!depthsMm || !isPositive(legalMinimumMm)) return null;
  const readings = POSITIONS.flatMap((position) => {
    const value = depthsMm[position];
    return isNonNegative(value) ? [{ position, value }] : [];
  });
  if (readings.length === 0) return null;
  const least = readings.reduce((a, b) => (b.value < a.value ? b : a));
  return {
    verdict: least.value >= legalMinimumMm ? "pass" : "fail",
    leastMm: least.value,
    leastPosition: least.position,
    marginMm: least.value - legalMinimumMm,
    missing: POSITIONS.filter((p) => !readings.some((r) => r.position === p)),
  };
}

/**
 * Usable tread left, as a share of the usable tread when new:
 * (least − minimum) ÷ (new − minimum) × 100, clamped to 0..100 (a worn-out tyre
 * is 0 %, a reading above the stated new depth is 100 %). Null when the new
 * depth is not above the minimum, or an input is missing.
 */
export function remainingTreadPercent(
  leastMm: number | null | undefined,
  legalMinimumMm: number | null | undefined,
  newDepthMm: number | null | undefined,
): number | null {
  if (!isNonNegative(leastMm) || !isPositive(legalMinimumMm) || !isPositive(newDepthMm)) return null;
  if (newDepthMm <= legalMinimumMm) return null;
  const share = ((leastMm - legalMinimumMm) / (newDepthMm - legalMinimumMm)) * 100;
  return Math.min(100, Math.max(0, share));
}

/** Suggested app rule (TRADE.md §2.6, CP): advise from 6 years (makers' manuals, S2), strongly from 10 (Ontario handbook, UK DVSA ban, S2). */
export const TYRE_AGE_ADVISE_YEARS = 6;
export const TYRE_AGE_STRONG_YEARS = 10;

export type TyreAgeAdvisory = "none" | "advise" | "strong";

/** Null when the age is unknown: an unknown age is not "none". Never a claim of "unsafe". */
export function ageAdvisory(years: number | null | undefined): TyreAgeAdvisory | null {
  if (!isNonNegative(years)) return null;
  if (years >= TYRE_AGE_STRONG_YEARS) return "strong";
  if (years >= TYRE_AGE_ADVISE_YEARS) return "advise";
  return "none";
}
