// The constants of our own condition index. The formula in condition-index.ts
// and the buyer-facing explanation are both generated from these, so the text
// a buyer reads cannot drift from the arithmetic.

export type DefectSeverity = "minor" | "moderate" | "major";
export type RepairPlan = "repaired_before_sale" | "disclosed_as_is" | "to_be_repaired";
export type CheckResult = "pass" | "advise" | "fail";

export const STARTING_POINTS = 100;

/** Rising with severity, which is what keeps "worse severity never raises the index" true. */
export const SEVERITY_POINTS: Readonly<Record<DefectSeverity, number>> = { minor: 2, moderate: 5, major: 12 };

/**
 * Size bands are the BVRLA wear-and-tear thresholds (≤3 mm chips, ≤15 mm dents,
 * ≤25 mm scratches, ≤50 mm wheel scuffs; TRADE.md §9.1, S2 [S28]) used as bands
 * only; the factors are ours. Factors rise with size.
 */
export const SIZE_BANDS: ReadonlyArray<{ maxMm: number; factor: number }> = [
  { maxMm: 3, factor: 0.5 },
  { maxMm: 15, factor: 0.75 },
  { maxMm: 25, factor: 1 },
  { maxMm: 50, factor: 1.25 },
];
export const LARGER_SIZE_FACTOR = 1.5;
/** A defect without a size counts as the largest band, so leaving the size out never helps. */
export const UNKNOWN_SIZE_FACTOR = LARGER_SIZE_FACTOR;

/** Repaired before sale counts less but not zero: the repair itself is part of the car's history. */
export const REPAIR_PLAN_FACTOR: Readonly<Record<RepairPlan, number>> = {
  repaired_before_sale: 0.25,
  to_be_repaired: 1,
  disclosed_as_is: 1,
};

/** A defect marked as affecting safety weighs double. */
export const SAFETY_DEFECT_FACTOR = 2;

/** The checks that bear on safety (PRODUCT.md checks); the rest are function checks. */
export const SAFETY_CHECK_ITEMS = ["brakes", "lights", "glass", "wipers_washers", "warning_lamps", "seat_belts", "tyres"] as const;

export const CHECK_POINTS: Readonly<Record<"safety" | "other", Record<Exclude<CheckResult, "pass">, number>>> = {
  safety: { advise: 4, fail: 15 },
  other: { advise: 1.5, fail: 5 },
};

export const TYRE_POINTS = {
  /** Per tyre below the market's legal minimum tread depth. */
  treadFail: 10,
  /** Per tyre at or above the advisory ages of tyre-tread.ts (6 and 10 years). */
  ageAdvise: 2,
  ageStrong: 5,
} as const;

export function isSafetyCheckItem(item: string): boolean {
  return (SAFETY_CHECK_ITEMS as readonly string[]).includes(item);
}

export function sizeFactor(sizeMm: number | null | undefined): number {
  if (typeof sizeMm !== "number" || !Number.isFinite(sizeMm) || sizeMm < 0) return UNKNOWN_SIZE_FACTOR;
  return SIZE_BANDS.find((band) => sizeMm <= band.maxMm)?.factor ?? LARGER_SIZE_FACTOR;
}
