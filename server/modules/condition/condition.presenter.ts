import type { Defect } from "../../db/schema/index.ts";
import { conditionIndex, conditionIndexExplanation, summariseDefects } from "../../../shared/domain/condition-index.ts";
import type { PhotoView } from "../photos/photos.presenter.ts";
import { presentDefect, zoneStates } from "../walkaround/walkaround.presenter.ts";
import type { ChecksView } from "../checks/checks.presenter.ts";
import { defectCautions } from "../../../shared/domain/cautions.ts";

/**
 * Everything recorded about a vehicle's condition, with the figures computed from it: photos, defects and zones,
 * tyres and checks with their cautions, and the condition index with its explanation and counts.
 */
export function presentEvidence(photos: PhotoView[], defectRows: Defect[], marks: Parameters<typeof zoneStates>[1], checkSet: ChecksView) {
  const index = conditionIndex({
    defects: defectRows,
    tyres: checkSet.tyres.readings.map((r) => ({
      position: r.reading.position,
      treadVerdict: r.assessment.tread?.verdict ?? null,
      ageYears: r.assessment.ageYears,
    })),
    checks: checkSet.checks.results,
  });
  return {
    photos,
    defects: defectRows.map(presentDefect),
    zones: zoneStates(defectRows, marks),
    ...checkSet,
    // The one caution list: staff record, readiness and the snapshot (public page, print, window card) all read it.
    cautions: [...checkSet.cautions, ...defectCautions(defectRows)],
    condition: {
      index: index?.index ?? null,
      deductions: index?.deductions ?? [],
      summary: summariseDefects(defectRows),
      explanation: conditionIndexExplanation(),
    },
  };
}
/** The condition evidence of a vehicle, as the detail page and the publishing snapshot read it. */
export type Evidence = ReturnType<typeof presentEvidence>;
