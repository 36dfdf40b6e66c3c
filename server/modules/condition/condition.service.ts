import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import type { DealershipDay } from "../../lib/clock.ts";
import type { Dealership } from "../../db/schema/index.ts";
import { photoViewsOf } from "../photos/photos.service.ts";
import { walkaroundRecordsOf } from "../walkaround/walkaround.service.ts";
import { checksFor } from "../checks/checks.service.ts";
import { requireVehicle } from "../vehicles/vehicles.service.ts";
import { presentEvidence, type Evidence } from "./condition.presenter.ts";

type EvidenceOwner = { id: number; tyresVersion: number; checksVersion: number };

/**
 * Everything recorded about a vehicle's condition, through each evidence module's front door, and the storage keys
 * of the files a revision made from it shows (finished photos' served sizes, defects' close-ups), taken from the same
 * rows: a publish records those keys, so the clean-up keeps the files, without reading them back out of URLs.
 */
export async function evidenceWithMediaOf(db: DbOrTx, d: Dealership, v: EvidenceOwner): Promise<{ evidence: Evidence; mediaKeys: string[] }> {
  const [photos, walkaround, checkSet] = await Promise.all([photoViewsOf(db, v.id), walkaroundRecordsOf(db, v.id), checksFor(db, d, v)]);
  const closeups = walkaround.defects.flatMap((x) => (x.closeupKey ? [x.closeupKey] : []));
  return {
    evidence: presentEvidence(photos.views, walkaround.defects, walkaround.marks, checkSet),
    mediaKeys: [...new Set([...photos.publicKeys, ...closeups])],
  };
}

/** Everything recorded about a vehicle's condition, with the condition index computed from it. */
export const evidenceOf = async (db: DbOrTx, d: Dealership, v: EvidenceOwner): Promise<Evidence> => (await evidenceWithMediaOf(db, d, v)).evidence;

/** GET /api/vehicles/:id/evidence. The vehicle and the dealership (its tyre rules) are read side by side. */
export async function evidence(ctx: AppContext, actor: User, id: number, day: () => Promise<DealershipDay>): Promise<Evidence> {
  const { db } = ctx.database;
  const [v, { dealership }] = await Promise.all([requireVehicle(db, actor.dealershipId, id), day()]);
  return evidenceOf(db, dealership, v);
}
