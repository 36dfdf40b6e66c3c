// The usual cautions where the work can hurt someone (brief: tyres under the legal minimum, failed brakes, warning
// lamps). Each says what to do, and defers to local law and licensed inspectors. Common practice, no source.
import { isSafetyCheckItem } from "./condition-rules.ts";
import type { TyreAssessment } from "./tyre-assessment.ts";
import { formatTreadDepth } from "./display.ts";

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
