// The usual cautions where the work can hurt someone (brief: tyres under the legal minimum, failed brakes, warning
// lamps). Each says what to do, and defers to local law and licensed inspectors. Common practice, no source.
import { isSafetyCheckItem } from "./condition-rules.ts";
import type { TyreAssessment } from "./tyre-assessment.ts";
import { formatTreadDepth } from "./display.ts";
import { DEFECT_KIND_LABELS, SEVERITY_LABELS, ZONE_LABELS } from "../constants/evidence.ts";

export interface Caution {
  level: "block" | "advise";
  code: string;
  text: string;
}

export const NOT_A_CERTIFICATE =
  "This report records what staff observed and measured on the date shown. It is not a roadworthiness or safety certificate and not a mechanical warranty; local law and a licensed inspector decide whether a vehicle is fit for the road.";

export function safetyCautions(
  checks: ReadonlyArray<{ item: string; result: string; label?: string }>,
  tyres: readonly TyreAssessment[],
  positionLabel: (p: string) => string = (p) => p,
): Caution[] {
  const out: Caution[] = [];
  for (const c of checks) {
    if (c.result === "fail" && isSafetyCheckItem(c.item)) {
      out.push({
        level: "block",
        code: `check_failed_${c.item}`,
        text: `${c.label ?? c.item} failed. The vehicle must be repaired before it is sold for road use. A licensed inspector decides when it is fit for the road.`,
      });
    } else if (c.result === "advise" && isSafetyCheckItem(c.item)) {
      // Advice, not a verdict: the inspection noticed something on a safety item and says who decides.
      out.push({
        level: "advise",
        code: `check_advised_${c.item}`,
        text: `${c.label ?? c.item}: advised. Our inspection noted something that may need attention soon. Have it checked by a licensed inspector or mechanic; this report is not a safety certificate.`,
      });
    }
  }
  for (const t of tyres) {
    if (t.tread?.verdict === "fail") {
      out.push({
        level: "block",
        code: `tyre_below_minimum_${t.position}`,
        text: `${positionLabel(t.position)} tyre: ${formatTreadDepth(t.tread.leastMm, { fractionDigits: 1 })} at its shallowest, below the legal minimum. Replace it before the vehicle is driven on the road; local law sets the minimum and how it is measured.`,
      });
    }
    if (t.ageAdvisory === "strong") {
      out.push({ level: "advise", code: `tyre_age_strong_${t.position}`, text: `${positionLabel(t.position)} tyre is ${t.ageYears} years old. Ten years is where some road authorities draw the line for tyre age whatever the tread; have it replaced or inspected by a tyre specialist.` });
    } else if (t.ageAdvisory === "advise") {
      out.push({ level: "advise", code: `tyre_age_${t.position}`, text: `${positionLabel(t.position)} tyre is ${t.ageYears} years old. Vehicle makers commonly advise replacing tyres from 6 years; have it checked.` });
    }
  }
  return out;
}

/** A defect as the caution rules read it: the staff row and the published snapshot both fit. */
export interface CautionDefect {
  number: number;
  zone: string;
  kind: string;
  severity: string;
  repairPlan: string;
  safetyRelevant?: boolean | null;
}

const DEFECT_CAUTION_PREFIX = "defect_safety_";

/** Own properties only, so a code named like an object built-in never reads as a label. */
const labelOf = (labels: Record<string, string>, code: string) => (Object.hasOwn(labels, code) ? labels[code] : code.replaceAll("_", " "));

/** Marked as affecting safety and not repaired before sale: what blocks publishing and raises a caution. */
export function unrepairedSafetyDefects<D extends CautionDefect>(defects: readonly D[]): D[] {
  return defects.filter((d) => d.safetyRelevant === true && d.repairPlan !== "repaired_before_sale");
}

/**
 * One caution per defect that affects safety and was not repaired before sale, worded for buyers: a condition report
 * cannot say a car is safe, so it sends them to a licensed inspector.
 */
export function defectCautions(defects: readonly CautionDefect[]): Caution[] {
  return unrepairedSafetyDefects(defects).map((d) => {
    const what = `${labelOf(SEVERITY_LABELS, d.severity).toLowerCase()} ${labelOf(DEFECT_KIND_LABELS, d.kind).toLowerCase()}, ${labelOf(ZONE_LABELS, d.zone).toLowerCase()}`;
    const state = d.repairPlan === "to_be_repaired" ? "is still to be repaired" : "has not been repaired";
    return {
      level: "block" as const,
      code: `${DEFECT_CAUTION_PREFIX}${d.number}`,
      text: `Item ${d.number} (${what}) affects safety and ${state}. Have it inspected by a licensed inspector before driving; this condition report is not a safety certificate.`,
    };
  });
}

/** The cautions a defect raised (the checks screen computes only the tyre and check ones as the form is typed). */
export const isDefectCaution = (c: Pick<Caution, "code">) => c.code.startsWith(DEFECT_CAUTION_PREFIX);

/**
 * The cautions as one line of text for feeds and portals that show no list: the counts in words, then each caution's
 * sentence, safety first. "No cautions." when there are none.
 */
export function cautionsInWords(cautions: readonly Caution[]): string {
  if (cautions.length === 0) return "No cautions.";
  const blocks = cautions.filter((c) => c.level === "block");
  const advises = cautions.filter((c) => c.level !== "block");
  const counts = [
    blocks.length ? `${blocks.length} safety caution${blocks.length === 1 ? "" : "s"}` : "",
    advises.length ? `${advises.length} advisor${advises.length === 1 ? "y" : "ies"}` : "",
  ].filter(Boolean);
  return [`${counts.join(" and ")}.`, ...blocks.map((c) => `Safety: ${c.text}`), ...advises.map((c) => `Advisory: ${c.text}`)].join(" ");
}
