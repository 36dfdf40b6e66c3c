// What changed between two published revisions, in sentences a buyer can read. Pure.
import type { PublicDefect, PublicSnapshot } from "../schemas/public.ts";
import { DEFECT_KIND_LABELS, SEVERITY_LABELS, ZONE_LABELS, CHECK_LABELS, type DefectKind, type Zone, type CheckItem } from "../constants/evidence.ts";
import { CHANGE_WORDS, type VehicleFieldName } from "../constants/vehicle-fields.ts";
import { formatMoney, formatNumber, THIN_SPACE } from "./display.ts";

const describe = (d: PublicDefect) =>
  `${SEVERITY_LABELS[d.severity].toLowerCase()} ${DEFECT_KIND_LABELS[d.kind as DefectKind].toLowerCase()} (${ZONE_LABELS[d.zone as Zone]?.toLowerCase() ?? d.zone})`;

// The words for each field come from the field catalogue, in its order.
const SPEC_FIELDS = CHANGE_WORDS as ReadonlyArray<readonly [keyof PublicSnapshot & VehicleFieldName, string]>;

export function describeChanges(prev: PublicSnapshot | null, next: PublicSnapshot, locale = "en"): string[] {
  if (!prev) return ["First published."];
  const out: string[] = [];
  const money = (c: number | null) => (c == null ? "no price" : formatMoney(c, next.currency, locale));
  if (prev.priceCents !== next.priceCents) out.push(`Price changed from ${money(prev.priceCents)} to ${money(next.priceCents)}.`);
  if (prev.odometer.reading !== next.odometer.reading || prev.odometer.unit !== next.odometer.unit) {
    const odo = (o: PublicSnapshot["odometer"]) => (o.reading == null ? "not recorded" : `${formatNumber(o.reading, { locale })}${THIN_SPACE}${o.unit}`);
    out.push(`Odometer reading updated from ${odo(prev.odometer)} to ${odo(next.odometer)}.`);
  }
  const before = new Map(prev.defects.map((d) => [d.number, d]));
  const after = new Map(next.defects.map((d) => [d.number, d]));
  for (const d of next.defects) {
    const old = before.get(d.number);
    if (!old) out.push(`Added item ${d.number}: ${describe(d)}.`);
    else if (old.repairPlan !== "repaired_before_sale" && d.repairPlan === "repaired_before_sale") out.push(`Item ${d.number} (${describe(old)}) repaired.`);
    else if (old.severity !== d.severity || old.sizeMm !== d.sizeMm || old.kind !== d.kind || old.zone !== d.zone) out.push(`Item ${d.number} now recorded as ${describe(d)}${d.sizeMm ? `, ${d.sizeMm} mm` : ""}.`);
  }
  for (const d of prev.defects) if (!after.has(d.number)) out.push(`Item ${d.number} (${describe(d)}) removed from the report.`);
  const spec = SPEC_FIELDS.filter(([k]) => JSON.stringify(prev[k]) !== JSON.stringify(next[k])).map(([, label]) => label);
  if (spec.length) out.push(`Specification updated: ${spec.join(", ")}.`);
  if (JSON.stringify(prev.features) !== JSON.stringify(next.features)) out.push("Feature list updated.");
  if (prev.photos.length !== next.photos.length) out.push(`Photos: ${prev.photos.length} before, ${next.photos.length} now.`);
  else if (JSON.stringify(prev.photos.map((p) => p.src)) !== JSON.stringify(next.photos.map((p) => p.src))) out.push("Photos changed.");
  if (prev.tyres.measuredOn !== next.tyres.measuredOn && next.tyres.measuredOn) out.push(`Tyres measured again on ${next.tyres.measuredOn}.`);
  const checks = next.checks.filter((c) => prev.checks.find((p) => p.item === c.item)?.result !== c.result).map((c) => `${CHECK_LABELS[c.item as CheckItem]?.toLowerCase() ?? c.item} now ${c.result}`);
  if (checks.length) out.push(`Checks: ${checks.join("; ")}.`);
  if (JSON.stringify(prev.serviceHistory) !== JSON.stringify(next.serviceHistory)) out.push("Service history updated.");
  if (prev.descriptionHtml !== next.descriptionHtml) out.push("Listing copy revised.");
  return out.length ? out : ["Published again with no change to what buyers see."];
}
