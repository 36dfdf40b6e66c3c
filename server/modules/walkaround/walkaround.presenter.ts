import type { Defect } from "../../db/schema/index.ts";
import { mediaUrl } from "../photos/photos.presenter.ts";

/** A defect for staff: everything, the internal repair cost included. */
export function presentDefect(d: Defect) {
  return {
    id: d.id,
    number: d.number,
    zone: d.zone,
    kind: d.kind,
    severity: d.severity,
    sizeMm: d.sizeMm,
    note: d.note,
    repairPlan: d.repairPlan,
    repairCostCents: d.repairCostCents,
    safetyRelevant: d.safetyRelevant,
    pin: d.photoId != null && d.pinX != null && d.pinY != null ? { photoId: d.photoId, x: d.pinX, y: d.pinY } : null,
    closeup: d.closeupKey ? mediaUrl(d.closeupKey) : null,
    version: d.version,
    createdAt: d.createdAt.toISOString(),
    updatedAt: d.updatedAt.toISOString(),
  };
}
export type DefectView = ReturnType<typeof presentDefect>;
