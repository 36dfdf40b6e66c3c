import type { DbOrTx } from "../../db/client.ts";
import type { Dealership } from "../../db/schema/index.ts";
import { conditionIndex, conditionIndexExplanation, summariseDefects } from "../../../shared/domain/condition-index.ts";
import { photosOf } from "../photos/photos.queries.ts";
import { presentPhoto } from "../photos/photos.presenter.ts";
import { defectsOf, marksOf, zoneStates } from "../walkaround/walkaround.service.ts";
import { presentDefect } from "../walkaround/walkaround.presenter.ts";
import { checksOf, presentChecks, tyresOf } from "../checks/checks.service.ts";

/**
 * Everything recorded about a vehicle's condition, with the figures computed from it: photos, defects and zones,
 * tyres and checks with their cautions, and the condition index with its explanation and counts.
 */
export async function evidenceOf(db: DbOrTx, d: Dealership, v: { id: number; tyresVersion: number; checksVersion: number }) {
  const [photoRows, defectRows, marks, tyres, checks] = await Promise.all([photosOf(db, v.id), defectsOf(db, v.id), marksOf(db, v.id), tyresOf(db, v.id), checksOf(db, v.id)]);
  const checkSet = presentChecks(d, v, tyres, checks);
  const index = conditionIndex({
    defects: defectRows,
    tyres: checkSet.tyres.readings.map((r) => ({ position: r.reading.position, treadVerdict: r.assessment.tread?.verdict ?? null, ageYears: r.assessment.ageYears })),
    checks: checkSet.checks.results,
  });
  return {
    photos: photoRows.map(presentPhoto),
    defects: defectRows.map(presentDefect),
    zones: zoneStates(defectRows, marks),
    ...checkSet,
    condition: {
      index: index?.index ?? null,
      deductions: index?.deductions ?? [],
      summary: summariseDefects(defectRows),
      explanation: conditionIndexExplanation(),
    },
  };
}
export type Evidence = Awaited<ReturnType<typeof evidenceOf>>;
