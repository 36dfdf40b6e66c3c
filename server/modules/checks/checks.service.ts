import { eq } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import { checkResults, tyreReadings, vehicles } from "../../db/schema/index.ts";
import { conflict } from "../../lib/errors.ts";
import { actorOf, recordAudit } from "../audit/audit.service.ts";
import { lockVehicle, requireVehicle } from "../vehicles/vehicles.service.ts";
import { getDealership, todayFor } from "../dealerships/dealerships.service.ts";
import type { ChecksInput, TyresInput } from "../../../shared/schemas/evidence.ts";
import type { Dealership } from "../../db/schema/index.ts";
import { checksOf, tyresOf } from "./checks.queries.ts";
import { presentChecks, type ChecksView } from "./checks.presenter.ts";
import type { DealershipDay } from "../../lib/clock.ts";

/** The front door for other modules: a vehicle's tyres and checks as presented, read with the caller's db or tx. */
export async function checksFor(db: DbOrTx, d: Pick<Dealership, "legalMinTreadMm" | "newTyreTreadMm">, v: { id: number; tyresVersion: number; checksVersion: number }): Promise<ChecksView> {
  const [tyres, checks] = await Promise.all([tyresOf(db, v.id), checksOf(db, v.id)]);
  return presentChecks(d, v, tyres, checks);
}

export async function get(ctx: AppContext, actor: User, vehicleId: number) {
  const { db } = ctx.database;
  const v = await requireVehicle(db, actor.dealershipId, vehicleId);
  return checksFor(db, await getDealership(db, actor.dealershipId), v);
}

const stale = (what: string, current: unknown) =>
  conflict(`Someone saved the ${what} after you opened them. Reload to see theirs; your readings are still in the form.`, { current }, "stale_version");

const sameReading = (a: Record<string, unknown>, b: Record<string, unknown>) =>
  ["treadInnerMm", "treadCentreMm", "treadOuterMm", "sizeDesignation", "dotCode", "pressureKpa"].every((k) => (a[k] ?? null) === (b[k] ?? null));

/** Replaces the tyre readings as a set, so the record always shows one measuring session. */
export async function putTyres(ctx: AppContext, actor: User, vehicleId: number, input: TyresInput, day?: DealershipDay) {
  return ctx.database.db.transaction(async (tx) => {
    const v = await lockVehicle(tx, actor.dealershipId, vehicleId);
    // The route already read the dealership for the schema's "today"; read it here only when called without it.
    const d = day?.dealership ?? (await getDealership(tx, actor.dealershipId));
    const before = await tyresOf(tx, vehicleId);
    if (v.tyresVersion !== input.version) throw stale("tyre readings", presentChecks(d, v, before, await checksOf(tx, vehicleId)));
    await tx.delete(tyreReadings).where(eq(tyreReadings.vehicleId, vehicleId));
    if (input.readings.length) {
      // A reading carried over unchanged keeps the name of whoever measured it.
      await tx.insert(tyreReadings).values(
        input.readings.map((r) => {
          const old = before.find((b) => b.position === r.position);
          const kept = old && old.measuredOn === input.measuredOn && sameReading(old, r);
          return { ...r, vehicleId, measuredOn: input.measuredOn, measuredBy: kept ? old.measuredBy : actor.name };
        }),
      );
    }
    await tx.update(vehicles).set({ tyresVersion: v.tyresVersion + 1 }).where(eq(vehicles.id, vehicleId));
    await recordAudit(tx, actorOf(actor), { action: "tyres_recorded", entityType: "vehicle", entityId: vehicleId, before: { readings: before }, after: { measuredOn: input.measuredOn, readings: input.readings } });
    return presentChecks(d, { ...v, tyresVersion: v.tyresVersion + 1 }, await tyresOf(tx, vehicleId), await checksOf(tx, vehicleId));
  });
}

export async function putChecks(ctx: AppContext, actor: User, vehicleId: number, input: ChecksInput) {
  return ctx.database.db.transaction(async (tx) => {
    const v = await lockVehicle(tx, actor.dealershipId, vehicleId);
    const d = await getDealership(tx, actor.dealershipId);
    const before = await checksOf(tx, vehicleId);
    if (v.checksVersion !== input.version) throw stale("checks", presentChecks(d, v, await tyresOf(tx, vehicleId), before));
    await tx.delete(checkResults).where(eq(checkResults.vehicleId, vehicleId));
    if (input.results.length) {
      // An answer carried over unchanged keeps the day and the name of whoever checked it.
      await tx.insert(checkResults).values(
        input.results.map((r) => {
          const old = before.find((b) => b.item === r.item);
          const kept = old && old.result === r.result && old.note === r.note;
          return { ...r, vehicleId, checkedOn: kept ? old.checkedOn : todayFor(ctx, d), checkedBy: kept ? old.checkedBy : actor.name };
        }),
      );
    }
    await tx.update(vehicles).set({ checksVersion: v.checksVersion + 1 }).where(eq(vehicles.id, vehicleId));
    await recordAudit(tx, actorOf(actor), { action: "checks_recorded", entityType: "vehicle", entityId: vehicleId, before: { results: before }, after: { results: input.results } });
    return presentChecks(d, { ...v, checksVersion: v.checksVersion + 1 }, await tyresOf(tx, vehicleId), await checksOf(tx, vehicleId));
  });
}
