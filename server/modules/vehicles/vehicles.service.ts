import { eq, sql } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import type { DbOrTx } from "../../db/client.ts";
import type { DealershipDay } from "../../lib/clock.ts";
import { dealerships, vehicleEvents, vehicles, type Dealership, type Vehicle } from "../../db/schema/index.ts";
import { AppError, badRequest, conflict, forbidden, notFound, staleVersion } from "../../lib/errors.ts";
import { actorOf, auditFor, diffFields, recordAudit } from "../audit/audit.service.ts";
import { getDealership, todayFor } from "../dealerships/dealerships.service.ts";
import { vinCheck } from "../../../shared/domain/vin.ts";
import { checkStatusMove } from "../../../shared/domain/status.ts";
import { forbiddenFields } from "../../../shared/constants/vehicle-fields.ts";
import type { CreateVehicleInput, StatusMoveInput, UpdateVehicleInput, VehicleListQuery } from "../../../shared/schemas/vehicles.ts";
import { eventsFor, featureSuggestions, findVehicle, listVehicles, makesInStock } from "./vehicles.queries.ts";
import { presentSuggestions, presentVehicle, presentVehicleHistory, presentVehicleList } from "./vehicles.presenter.ts";
import { deriveFor, odometerKmOf, type Stored } from "./derive.ts";

// Other modules reach the vehicle through these, never through vehicles.queries.ts.
export { deriveFor };

/** The vehicle of this dealership, or 404: other dealerships' vehicles do not exist for this user. */
export async function requireVehicle(db: DbOrTx, dealershipId: number, id: number): Promise<Vehicle> {
  const v = await findVehicle(db, dealershipId, id);
  if (!v) throw notFound("That vehicle");
  return v;
}

/**
 * The vehicle locked for the rest of the transaction (SELECT … FOR UPDATE), or 404. Every write that counts, numbers or
 * versions something on a vehicle takes this lock first, so concurrent writes to one vehicle queue up.
 */
export async function lockVehicle(tx: DbOrTx, dealershipId: number, id: number): Promise<Vehicle> {
  const v = await findVehicle(tx, dealershipId, id, true);
  if (!v) throw notFound("That vehicle");
  return v;
}

/** Maps validated input to columns. The odometer keeps the unit it was read in; a km figure is kept beside it for sorting. */
function toColumns(input: Partial<CreateVehicleInput>, defaultUnit: "km" | "mi"): Partial<Stored> {
  const { odometerKm, odometerReading, odometerUnit, ...rest } = input;
  // make and model are never null here: both schemas refuse an empty make or model.
  const out = { ...rest } as Partial<Stored>;
  if (odometerKm !== undefined) {
    out.odometerReading = odometerKm;
    out.odometerUnit = "km";
  } else if (odometerReading !== undefined) {
    out.odometerReading = odometerReading;
    out.odometerUnit = odometerUnit ?? defaultUnit;
  } else if (odometerUnit !== undefined) {
    out.odometerUnit = odometerUnit;
  }
  return out;
}

/** Where the market makes the check digit mandatory, a wrong one is refused; elsewhere it is only a warning. */
function enforceVin(vin: string | null | undefined, d: Dealership) {
  if (!vin) return;
  const check = vinCheck(vin, { checkDigitMandatory: d.vinCheckDigitMandatory });
  const blocking = check.issues.filter((i) => i.severity === "error");
  if (blocking.length) throw badRequest("The VIN does not pass its checks.", { vin: blocking.map((i) => i.message).join(" ") });
}

async function nextStockNumber(tx: DbOrTx, dealershipId: number): Promise<string> {
  await tx.update(dealerships).set({ lastStockNumber: sql`${dealerships.lastStockNumber} + 1` }).where(eq(dealerships.id, dealershipId));
  const [row] = await tx.select({ n: dealerships.lastStockNumber }).from(dealerships).where(eq(dealerships.id, dealershipId));
  return String(row.n);
}

export async function list(ctx: AppContext, actor: User, query: VehicleListQuery) {
  return presentVehicleList(await listVehicles(ctx.database.db, actor.dealershipId, query), ctx.now());
}

/**
 * The staff view of a vehicle row with its derived figures as of the dealership's today: recomputed on every read,
 * since "overdue" depends on today, not on the day of the last save. GET /api/vehicles/:id (the record with readiness
 * and revisions) is served by the publishing module, which depends on this one (publishing.service.ts vehicleDetail),
 * and the evidence by the condition module; this module calls neither.
 */
export const recordView = (ctx: AppContext, v: Vehicle, d: Dealership) => presentVehicle(v, deriveFor(v, d, todayFor(ctx, d)), ctx.now());

export async function history(ctx: AppContext, actor: User, id: number) {
  const { db } = ctx.database;
  await requireVehicle(db, actor.dealershipId, id);
  const [events, audit] = await Promise.all([eventsFor(db, id), auditFor(db, actor.dealershipId, "vehicle", String(id))]);
  return presentVehicleHistory(events, audit);
}

export async function create(ctx: AppContext, actor: User, input: CreateVehicleInput, day: DealershipDay) {
  return ctx.database.db.transaction(async (tx) => {
    // Locks the dealership row: the stock number is counted on it.
    const d = await getDealership(tx, actor.dealershipId, true);
    enforceVin(input.vin, d);
    const columns = toColumns(input, d.distanceUnit);
    const stockNumber = await nextStockNumber(tx, d.id);
    const base = {
      odometerUnit: d.distanceUnit,
      features: [],
      serviceHistory: [],
      ...columns,
      make: input.make!,
      model: input.model!,
    } as Stored & { make: string; model: string };
    const derived = deriveFor(base, d, day.today);
    const [result] = await tx.insert(vehicles).values({
      ...base,
      dealershipId: d.id,
      stockNumber,
      // The salesperson who takes the vehicle in answers its enquiries; an admin's vehicles go to the dealership inbox.
      salespersonId: actor.role === "sales" ? actor.id : null,
      odometerKmIndex: odometerKmOf(base.odometerReading, base.odometerUnit ?? "km"),
      derived,
      stockedAt: ctx.now(),
    });
    const id = result.insertId;
    await tx.insert(vehicleEvents).values({ vehicleId: id, fromStatus: null, toStatus: "intake", note: "Taken into stock", userId: actor.id, userName: actor.name });
    await recordAudit(tx, actorOf(actor), { action: "vehicle_created", entityType: "vehicle", entityId: id, after: { stockNumber, ...columns } });
    const row = await findVehicle(tx, d.id, id);
    return presentVehicle(row, derived, ctx.now());
  });
}

export async function update(ctx: AppContext, actor: User, id: number, input: UpdateVehicleInput, { dealership: d, today }: DealershipDay) {
  const { version, ...changes } = input;
  const fields = Object.keys(changes);
  const refused = forbiddenFields(actor.role, fields);
  if (refused.length) {
    throw new AppError(403, "forbidden_fields", `Your role cannot change: ${refused.join(", ")}.`, Object.fromEntries(refused.map((f) => [f, "Your role cannot change this field."])));
  }
  return ctx.database.db.transaction(async (tx) => {
    const current = await lockVehicle(tx, actor.dealershipId, id);
    if (current.version !== version) throw staleVersion(presentVehicle(current, deriveFor(current, d, today), ctx.now()));
    if ("vin" in changes) enforceVin(changes.vin, d);
    const columns = toColumns(changes, current.odometerUnit);
    const next = { ...current, ...columns };
    const derived = deriveFor(next, d, today);
    await tx
      .update(vehicles)
      .set({ ...columns, odometerKmIndex: odometerKmOf(next.odometerReading, next.odometerUnit), derived, version: current.version + 1 })
      .where(eq(vehicles.id, id));
    const diff = diffFields(current as unknown as Record<string, unknown>, columns as Record<string, unknown>);
    if (diff) await recordAudit(tx, actorOf(actor), { action: "vehicle_updated", entityType: "vehicle", entityId: id, ...diff });
    const row = await findVehicle(tx, d.id, id);
    return presentVehicle(row, derived, ctx.now());
  });
}

export async function moveStatus(ctx: AppContext, actor: User, id: number, input: StatusMoveInput) {
  return ctx.database.db.transaction(async (tx) => {
    const current = await lockVehicle(tx, actor.dealershipId, id);
    const d = await getDealership(tx, actor.dealershipId);
    if (current.version !== input.version) throw staleVersion(recordView(ctx, current, d));
    const verdict = checkStatusMove(current.status, input.to, actor.role);
    if (!verdict.ok) {
      if (verdict.code === "role") throw forbidden(verdict.reason);
      throw conflict(verdict.reason, { from: current.status, to: input.to }, "illegal_move");
    }
    await tx.update(vehicles).set({ status: input.to, version: current.version + 1 }).where(eq(vehicles.id, id));
    await tx.insert(vehicleEvents).values({ vehicleId: id, fromStatus: current.status, toStatus: input.to, note: input.note ?? "", userId: actor.id, userName: actor.name });
    await recordAudit(tx, actorOf(actor), { action: "status_moved", entityType: "vehicle", entityId: id, before: { status: current.status }, after: { status: input.to, note: input.note ?? null } });
    return recordView(ctx, await findVehicle(tx, d.id, id), d);
  });
}

export async function suggestions(ctx: AppContext, actor: User, prefix: string) {
  const [features, makes] = await Promise.all([
    featureSuggestions(ctx.database.db, actor.dealershipId, prefix),
    makesInStock(ctx.database.db, actor.dealershipId),
  ]);
  return presentSuggestions(features, makes);
}
