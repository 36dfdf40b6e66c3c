// "How this is scored", in sentences a buyer can read, generated from the
// same constants as the formula so the two cannot disagree.
import {
  CHECK_POINTS,
  LARGER_SIZE_FACTOR,
  REPAIR_PLAN_FACTOR,
  SAFETY_CHECK_ITEMS,
  SAFETY_DEFECT_FACTOR,
  SEVERITY_POINTS,
  SIZE_BANDS,
  STARTING_POINTS,
  TYRE_POINTS,
} from "./condition-rules.ts";
import { TYRE_AGE_ADVISE_YEARS, TYRE_AGE_STRONG_YEARS } from "./tyre-tread.ts";

const points = (n: number) => `${n} ${n === 1 ? "point" : "points"}`;
const humanise = (item: string) => item.replace(/_/g, " ");

function list(items: readonly string[]): string {
  return items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items.at(-1)}`;
}

export function conditionIndexExplanation(): string[] {
  const bands = SIZE_BANDS.map((b) => `up to ${b.maxMm} mm ×${b.factor}`);
  const lastBand = SIZE_BANDS.at(-1)!.maxMm;
  return [
    `The condition index is a formula of our own. It starts at ${STARTING_POINTS} and takes points off for each item recorded at the inspection; it never goes below 0 and no item can add points.`,
    `Each noted item (a chip, scratch, dent, scuff or wear mark) takes off ${points(SEVERITY_POINTS.minor)} if minor, ${points(SEVERITY_POINTS.moderate)} if moderate and ${points(SEVERITY_POINTS.major)} if major.`,
    `Its size scales that: ${list([...bands, `larger ×${LARGER_SIZE_FACTOR}`])}. An item recorded without a size counts as larger than ${lastBand} mm. The size bands follow the BVRLA wear-and-tear guide for cars.`,
    `An item repaired before sale still counts, at ×${REPAIR_PLAN_FACTOR.repaired_before_sale}. An item that affects safety counts ×${SAFETY_DEFECT_FACTOR}.`,
    `Safety checks (${list(SAFETY_CHECK_ITEMS.map(humanise))}) take off ${points(CHECK_POINTS.safety.advise)} when the inspector advises attention and ${points(CHECK_POINTS.safety.fail)} when one fails; other checks take off ${points(CHECK_POINTS.other.advise)} and ${points(CHECK_POINTS.other.fail)}.`,
    `Each tyre below the legal minimum tread depth takes off ${points(TYRE_POINTS.treadFail)}. Each tyre ${TYRE_AGE_ADVISE_YEARS} years old or more takes off ${points(TYRE_POINTS.ageAdvise)}, or ${points(TYRE_POINTS.ageStrong)} from ${TYRE_AGE_STRONG_YEARS} years.`,
    "The index records what staff observed on the inspection date. It is not a roadworthiness or safety certificate; have the vehicle inspected independently.",
  ];
}
