// A 0–100 condition index of our own (PRODUCT.md). Deductions only: every
// item can only take points off, which is what makes the index monotonic.
import {
  CHECK_POINTS,
  REPAIR_PLAN_FACTOR,
  SAFETY_DEFECT_FACTOR,
  SEVERITY_POINTS,
  STARTING_POINTS,
  TYRE_POINTS,
  isSafetyCheckItem,
  sizeFactor,
  type CheckResult,
  type DefectSeverity,
  type RepairPlan,
} from "./condition-rules.ts";
import { ageAdvisory } from "./tyre-tread.ts";

export * from "./condition-rules.ts";
export { conditionIndexExplanation } from "./condition-explanation.ts";
export { summariseDefects, type DefectSummary } from "./defect-summary.ts";

export interface ConditionDefect {
  zone: string;
  kind: string;
  severity: DefectSeverity;
  sizeMm?: number | null;
  repairPlan: RepairPlan;
  /** Set by staff; null/undefined means not assessed. */
  safetyRelevant?: boolean | null;
}

export interface ConditionTyre {
  position: string;
  treadVerdict?: "pass" | "fail" | null;
  ageYears?: number | null;
}

export interface ConditionCheck {
  item: string;
  result: CheckResult;
}

export interface ConditionInput {
  defects?: readonly ConditionDefect[] | null;
  tyres?: readonly ConditionTyre[] | null;
  checks?: readonly ConditionCheck[] | null;
}

export interface Deduction {
  source: "defect" | "check" | "tyre";
  /** Index into the matching input array. */
  index: number;
  points: number;
  reason: string;
}

export interface ConditionIndexResult {
  /** Unrounded, 0..100; round only at display. */
  index: number;
  totalDeducted: number;
  deductions: Deduction[];
}

export function defectPoints(defect: ConditionDefect): number {
  const severity = SEVERITY_POINTS[defect.severity] ?? SEVERITY_POINTS.major;
  const plan = REPAIR_PLAN_FACTOR[defect.repairPlan] ?? 1;
  const safety = defect.safetyRelevant === true ? SAFETY_DEFECT_FACTOR : 1;
  return severity * sizeFactor(defect.sizeMm) * plan * safety;
}

function checkPoints(check: ConditionCheck): number {
  if (check.result !== "advise" && check.result !== "fail") return 0;
  return CHECK_POINTS[isSafetyCheckItem(check.item) ? "safety" : "other"][check.result];
}

function tyrePoints(tyre: ConditionTyre): number {
  const age = ageAdvisory(tyre.ageYears);
  const agePoints = age === "strong" ? TYRE_POINTS.ageStrong : age === "advise" ? TYRE_POINTS.ageAdvise : 0;
  return (tyre.treadVerdict === "fail" ? TYRE_POINTS.treadFail : 0) + agePoints;
}

/**
 * Null when no tyre and no check has been recorded: without any measurement an
 * index of 100 would claim an inspection that did not happen. Unknown severities
 * count as major and unknown repair plans as unrepaired, so bad data never flatters.
 */
export function conditionIndex(input: ConditionInput): ConditionIndexResult | null {
  const defects = input.defects ?? [];
  const tyres = input.tyres ?? [];
  const checks = input.checks ?? [];
  if (tyres.length === 0 && checks.length === 0) return null;

  const deductions: Deduction[] = [
    ...defects.map((d, index) => ({ source: "defect" as const, index, points: defectPoints(d), reason: `${d.severity} ${d.kind} (${d.zone})` })),
    ...checks.map((c, index) => ({ source: "check" as const, index, points: checkPoints(c), reason: `${c.item}: ${c.result}` })),
    ...tyres.map((t, index) => ({ source: "tyre" as const, index, points: tyrePoints(t), reason: `tyre ${t.position}` })),
  ].filter((d) => d.points > 0);

  const totalDeducted = deductions.reduce((sum, d) => sum + d.points, 0);
  return { index: Math.min(STARTING_POINTS, Math.max(0, STARTING_POINTS - totalDeducted)), totalDeducted, deductions };
}
