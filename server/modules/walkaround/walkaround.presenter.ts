import type { Defect } from "../../db/schema/index.ts";
import { mediaUrl } from "../photos/photos.presenter.ts";
import { ZONES, type Zone } from "../../../shared/constants/evidence.ts";

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

/** Each zone: checked with nothing found, checked with defects, or still to check. */
export function zoneStates(defectRows: Pick<Defect, "zone">[], marks: Array<{ zone: Zone; checkedBy: string | null; checkedAt: Date }>) {
  return ZONES.map((zone) => {
    const count = defectRows.filter((d) => d.zone === zone).length;
    const mark = marks.find((m) => m.zone === zone);
    return {
      zone,
      state: count > 0 ? ("defects" as const) : mark ? ("nothing_found" as const) : ("unchecked" as const),
      defects: count,
      checkedBy: mark?.checkedBy ?? null,
      checkedAt: mark?.checkedAt.toISOString() ?? null,
    };
  });
}
export type ZoneState = ReturnType<typeof zoneStates>[number];

/** GET /api/vehicles/:id/walkaround: the defects and the state of every zone. */
export const presentWalkaround = (rows: Defect[], marks: Parameters<typeof zoneStates>[1]) => ({
  defects: rows.map(presentDefect),
  zones: zoneStates(rows, marks),
});
export type WalkaroundView = ReturnType<typeof presentWalkaround>;
