import type { DbOrTx } from "../../db/client.ts";
import type { Dealership } from "../../db/schema/index.ts";
import { photoViewsOf } from "../photos/photos.service.ts";
import { walkaroundRecordsOf } from "../walkaround/walkaround.service.ts";
import { checksFor } from "../checks/checks.service.ts";
import { presentEvidence, type Evidence } from "./condition.presenter.ts";

// The client still imports this type from here; it lives in condition.presenter.ts.
export type { Evidence };

/** Gathers everything recorded about a vehicle's condition, through each evidence module's front door. */
export async function evidenceOf(db: DbOrTx, d: Dealership, v: { id: number; tyresVersion: number; checksVersion: number }): Promise<Evidence> {
  const [photos, walkaround, checkSet] = await Promise.all([photoViewsOf(db, v.id), walkaroundRecordsOf(db, v.id), checksFor(db, d, v)]);
  return presentEvidence(photos, walkaround.defects, walkaround.marks, checkSet);
}
