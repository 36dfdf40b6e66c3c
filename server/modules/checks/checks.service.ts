import { eq } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import { checkResults, tyreReadings, vehicles } from "../../db/schema/index.ts";
import { conflict, notFound } from "../../lib/errors.ts";
import { recordAudit } from "../audit/audit.service.ts";
import { findVehicle } from "../vehicles/vehicles.queries.ts";
import { getDealership, todayFor } from "../dealerships/dealerships.service.ts";
import { assessTyre } from "../../../shared/domain/tyre-assessment.ts";
import { safetyCautions } from "../../../shared/domain/cautions.ts";
import { CHECK_LABELS, TYRE_POSITION_LABELS, TYRE_POSITIONS, type CheckItem, type TyrePosition } from "../../../shared/constants/evidence.ts";
import type { ChecksInput, TyresInput } from "../../../shared/schemas/evidence.ts";
import type { Dealership } from "../../db/schema/index.ts";
import type { DealershipDay } from "../../lib/clock.ts";

const actorOf = (u: User) => ({ id: u.id, email: u.email, dealershipId: u.dealershipId });

export const tyresOf = (db: DbOrTx, vehicleId: number) => db.select().from(tyreReadings).where(eq(tyreReadings.vehicleId, vehicleId));
export const checksOf = (db: DbOrTx, vehicleId: number) => db.select().from(checkResults).where(eq(checkResults.vehicleId, vehicleId));

/** Tyres and checks with every computed figure and the cautions they call for. */
export function presentChecks(
  d: Pick<Dealership, "legalMinTreadMm" | "newTyreTreadMm">,
  v: { tyresVersion: number; checksVersion: number },
  tyres: Awaited<ReturnType<typeof tyresOf>>,
  checks: Awaited<ReturnType<typeof checksOf>>,
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
  const results = checks.map((c) => ({ item: c.item, label: CHECK_LABELS[c.item as CheckItem], result: c.result, note: c.note, checkedOn: c.checkedOn, checkedBy: c.checkedBy }));
  return {
    tyres: { version: v.tyresVersion, measuredOn: tyres[0]?.measuredOn ?? null, legalMinTreadMm: d.legalMinTreadMm, readings },
    checks: { version: v.checksVersion, results },
    cautions: safetyCautions(results, readings.map((r) => r.assessment), (p) => TYRE_POSITION_LABELS[p as TyrePosition] ?? p),
  };
}

export async function get(ctx: AppContext, actor: User, vehicleId: number) {
  const { db } = ctx.database;
  const v = await findVehicle(db, actor.dealershipId, vehicleId);
  if (!v) throw notFound("That vehicle");
  const [d, tyres, checks] = await Promise.all([getDealership(db, actor.dealershipId), tyresOf(db, vehicleId), checksOf(db, vehicleId)]);
  return presentChecks(d, v, tyres, checks);
}

const stale = (what: string, current: unknown) =>
  conflict(`Someone saved the ${what} after you opened them. Reload to see theirs; your readings are still in the form.`, { current }, "stale_version");

const sameReading = (a: Record<string, unknown>, b: Record<string, unknown>) =>
  ["treadInnerMm", "treadCentreMm", "treadOuterMm", "sizeDesignation", "dotCode", "pressureKpa"].every((k) => (a[k] ?? null) === (b[k] ?? null));

/** Replaces the tyre readings as a set, so the record always shows one measuring session. */
export async function putTyres(ctx: AppContext, actor: User, vehicleId: number, input: TyresInput, day?: DealershipDay) {
  return ctx.database.db.transaction(async (tx) => {
    const v = await findVehicle(tx, actor.dealershipId, vehicleId, true);
    if (!v) throw notFound("That vehicle");
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
    const v = await findVehicle(tx, actor.dealershipId, vehicleId, true);
    if (!v) throw notFound("That vehicle");
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
