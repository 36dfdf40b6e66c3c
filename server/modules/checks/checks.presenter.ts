import type { checkResults, Dealership, tyreReadings } from "../../db/schema/index.ts";
import { assessTyre } from "../../../shared/domain/tyre-assessment.ts";
import { safetyCautions } from "../../../shared/domain/cautions.ts";
import { CHECK_LABELS, TYRE_POSITION_LABELS, TYRE_POSITIONS, type TyrePosition } from "../../../shared/constants/evidence.ts";

/** Tyres and checks with every computed figure and the cautions they call for. */
export function presentChecks(
  d: Pick<Dealership, "legalMinTreadMm" | "newTyreTreadMm">,
  v: { tyresVersion: number; checksVersion: number },
  tyres: Array<typeof tyreReadings.$inferSelect>,
  checks: Array<typeof checkResults.$inferSelect>,
) {
  const order = (p: string) => TYRE_POSITIONS.indexOf(p as TyrePosition);
  const readings = [...tyres].sort((a, b) => order(a.position) - order(b.position)).map((t) => ({
    reading: {
      position: t.position,
      treadInnerMm: t.treadInnerMm,
      treadCentreMm: t.treadCentreMm,
      treadOuterMm: t.treadOuterMm,
      sizeDesignation: t.sizeDesignation,
      dotCode: t.dotCode,
      pressureKpa: t.pressureKpa,
    },
    assessment: assessTyre(t, { legalMinTreadMm: d.legalMinTreadMm, newTyreTreadMm: d.newTyreTreadMm, measuredOn: t.measuredOn }),
    measuredOn: t.measuredOn,
    measuredBy: t.measuredBy,
  }));
  const results = checks.map((c) => ({
    item: c.item, label: CHECK_LABELS[c.item], result: c.result, note: c.note, checkedOn: c.checkedOn, checkedBy: c.checkedBy,
  }));
  return {
    tyres: { version: v.tyresVersion, measuredOn: tyres[0]?.measuredOn ?? null, legalMinTreadMm: d.legalMinTreadMm, readings },
    checks: { version: v.checksVersion, results },
    cautions: safetyCautions(results, readings.map((r) => r.assessment), (p) => TYRE_POSITION_LABELS[p as TyrePosition] ?? p),
  };
}
/** GET /api/vehicles/:id/checks, and the answer of both PUTs. */
export type ChecksView = ReturnType<typeof presentChecks>;
export type TyresView = ChecksView["tyres"];
export type ChecksSetView = ChecksView["checks"];
