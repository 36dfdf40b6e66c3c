import { and, eq, sql } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import { defects, vehicles, zoneMarks } from "../../db/schema/index.ts";
import { badRequest, conflict, notFound, staleVersion } from "../../lib/errors.ts";
import { actorOf, diffFields, recordAudit } from "../audit/audit.service.ts";
import type { Zone } from "../../../shared/constants/evidence.ts";
import type { CreateDefectInput, UpdateDefectInput } from "../../../shared/schemas/evidence.ts";
import { lockVehicle, requireVehicle } from "../vehicles/vehicles.service.ts";
import { closeupOn } from "../photos/photos.service.ts";
import { defectsOf, marksOf } from "./walkaround.queries.ts";
import { presentDefect, presentWalkaround, zoneStates } from "./walkaround.presenter.ts";

/** The front door for other modules: a vehicle's defects (by number) and zone marks, read with the caller's db or tx. */
export async function walkaroundRecordsOf(db: DbOrTx, vehicleId: number) {
  const [rows, marks] = await Promise.all([defectsOf(db, vehicleId), marksOf(db, vehicleId)]);
  return { defects: rows, marks };
}

/** Validates a pin against the vehicle's photos and cuts the close-up; null clears it. */
async function pinColumns(ctx: AppContext, tx: DbOrTx, vehicleId: number, pin: CreateDefectInput["pin"]) {
  if (pin === undefined) return {};
  if (pin === null) return { photoId: null, pinX: null, pinY: null, closeupKey: null };
  const cut = await closeupOn(ctx.storage, tx, vehicleId, pin);
  if (!cut) throw badRequest("The pin must be on one of this vehicle's photos.", { "pin.photoId": "That photo is not on this vehicle." });
  return { photoId: cut.photoId, pinX: pin.x, pinY: pin.y, closeupKey: cut.closeupKey };
}

/** Takes away a zone's "nothing found" mark, if it has one. */
const clearMark = (tx: DbOrTx, vehicleId: number, zone: Zone) => tx.delete(zoneMarks).where(and(eq(zoneMarks.vehicleId, vehicleId), eq(zoneMarks.zone, zone)));

/** Locks the vehicle, then the defect about to change: not found unless it is this vehicle's, stale unless `version` is its own. */
async function lockDefect(tx: DbOrTx, actor: User, vehicleId: number, defectId: number, version: number) {
  await lockVehicle(tx, actor.dealershipId, vehicleId);
  const [current] = await tx.select().from(defects).where(and(eq(defects.vehicleId, vehicleId), eq(defects.id, defectId))).for("update");
  if (!current) throw notFound("That defect");
  if (current.version !== version) throw staleVersion(presentDefect(current));
  return current;
}

export async function walkaround(ctx: AppContext, actor: User, vehicleId: number) {
  const { db } = ctx.database;
  await requireVehicle(db, actor.dealershipId, vehicleId);
  const { defects: rows, marks } = await walkaroundRecordsOf(db, vehicleId);
  return presentWalkaround(rows, marks);
}

export async function createDefect(ctx: AppContext, actor: User, vehicleId: number, input: CreateDefectInput) {
  return ctx.database.db.transaction(async (tx) => {
    const v = await lockVehicle(tx, actor.dealershipId, vehicleId);
    const pin = await pinColumns(ctx, tx, vehicleId, input.pin);
    const number = v.lastDefectNumber + 1;
    await tx.update(vehicles).set({ lastDefectNumber: number }).where(eq(vehicles.id, vehicleId));
    const { pin: _pin, ...fields } = input;
    const [res] = await tx.insert(defects).values({ ...fields, ...pin, vehicleId, number, recordedBy: actor.id });
    // A defect in a zone marked "nothing found" replaces the mark: the zone is now checked with defects.
    await clearMark(tx, vehicleId, input.zone);
    await recordAudit(tx, actorOf(actor), { action: "defect_added", entityType: "vehicle", entityId: vehicleId, after: { number, ...fields, pinned: Boolean(input.pin) } });
    const [row] = await tx.select().from(defects).where(eq(defects.id, res.insertId));
    return presentDefect(row);
  });
}

export async function updateDefect(ctx: AppContext, actor: User, vehicleId: number, defectId: number, input: UpdateDefectInput) {
  return ctx.database.db.transaction(async (tx) => {
    const current = await lockDefect(tx, actor, vehicleId, defectId, input.version);
    const { version, pin, ...fields } = input;
    const pinCols = await pinColumns(ctx, tx, vehicleId, pin);
    await tx.update(defects).set({ ...fields, ...pinCols, version: version + 1 }).where(eq(defects.id, defectId));
    if (fields.zone) await clearMark(tx, vehicleId, fields.zone);
    const diff = diffFields(current as unknown as Record<string, unknown>, { ...fields, ...pinCols });
    if (diff) await recordAudit(tx, actorOf(actor), { action: "defect_updated", entityType: "vehicle", entityId: vehicleId, before: { number: current.number, ...diff.before }, after: { number: current.number, ...diff.after } });
    const [row] = await tx.select().from(defects).where(eq(defects.id, defectId));
    return presentDefect(row);
  });
}

export async function deleteDefect(ctx: AppContext, actor: User, vehicleId: number, defectId: number, version: number) {
  await ctx.database.db.transaction(async (tx) => {
    const current = await lockDefect(tx, actor, vehicleId, defectId, version);
    await tx.delete(defects).where(eq(defects.id, defectId));
    await recordAudit(tx, actorOf(actor), { action: "defect_removed", entityType: "vehicle", entityId: vehicleId, before: presentDefect(current), after: null });
  });
}

/** Marks a zone "checked, nothing found", or clears the mark. A zone with defects cannot be marked clear. */
export async function markZone(ctx: AppContext, actor: User, vehicleId: number, zone: Zone, nothingFound: boolean) {
  return ctx.database.db.transaction(async (tx) => {
    await lockVehicle(tx, actor.dealershipId, vehicleId);
    const [{ n }] = (await tx.select({ n: sql<number>`count(*)` }).from(defects).where(and(eq(defects.vehicleId, vehicleId), eq(defects.zone, zone)))) as [{ n: number }];
    if (nothingFound && Number(n) > 0) throw conflict("This zone has defects recorded, so it cannot be marked as nothing found.", undefined, "zone_has_defects");
    await clearMark(tx, vehicleId, zone);
    if (nothingFound) await tx.insert(zoneMarks).values({ vehicleId, zone, checkedBy: actor.name, checkedAt: ctx.now() });
    await recordAudit(tx, actorOf(actor), { action: nothingFound ? "zone_checked_clear" : "zone_unchecked", entityType: "vehicle", entityId: vehicleId, after: { zone } });
    const { defects: rows, marks } = await walkaroundRecordsOf(tx, vehicleId);
    return zoneStates(rows, marks);
  });
}
