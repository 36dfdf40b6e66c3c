import type { AuditEntry, Vehicle, vehicleEvents } from "../../db/schema/index.ts";
import type { Derived } from "../../../shared/domain/derived.ts";
import { STORED_FIELD_NAMES } from "../../../shared/constants/vehicle-fields.ts";
import { wholeDaysBetween } from "../../lib/clock.ts";

/** Every catalogued input field under its own name (shared/constants/vehicle-field-catalogue.ts). */
const fieldsOf = (v: Vehicle) =>
  Object.fromEntries(STORED_FIELD_NAMES.map((f) => [f, v[f]])) as { [K in (typeof STORED_FIELD_NAMES)[number]]: Vehicle[K] };

/**
 * The staff view of a vehicle's record, as every write returns it: every input field by name, the derived block, and
 * bookkeeping (GET /api/vehicles/:id adds readiness and publishing: publishing.presenter.ts VehicleDetail).
 */
export function presentVehicle(v: Vehicle, derived: Derived, now: Date) {
  return {
    id: v.id,
    stockNumber: v.stockNumber,
    status: v.status,
    ...fieldsOf(v),
    odometerKm: v.odometerKmIndex,
    derived,
    daysInStock: wholeDaysBetween(v.stockedAt, now),
    stockedAt: v.stockedAt.toISOString(),
    createdAt: v.createdAt.toISOString(),
    updatedAt: v.updatedAt.toISOString(),
    version: v.version,
  };
}
export type VehicleRecord = ReturnType<typeof presentVehicle>;

/** One row of the stock table. */
export function presentVehicleRow(v: Vehicle, now: Date) {
  return {
    id: v.id,
    stockNumber: v.stockNumber,
    status: v.status,
    vin: v.vin,
    registrationPlate: v.registrationPlate,
    make: v.make,
    model: v.model,
    variant: v.variant,
    buildYear: v.buildYear,
    fuelType: v.fuelType,
    bodyType: v.bodyType,
    colour: v.colour,
    odometerReading: v.odometerReading,
    odometerUnit: v.odometerUnit,
    odometerKm: v.odometerKmIndex,
    priceCents: v.priceCents,
    rangeKm: v.derived.rangeKm,
    vinCheck: v.derived.vinCheck,
    daysInStock: wholeDaysBetween(v.stockedAt, now),
    updatedAt: v.updatedAt.toISOString(),
    version: v.version,
  };
}
export type VehicleRow = ReturnType<typeof presentVehicleRow>;

/** GET /api/vehicles: one page of the stock table. */
export function presentVehicleList(page: { rows: Vehicle[]; total: number; page: number; pageSize: number }, now: Date) {
  return {
    vehicles: page.rows.map((r) => presentVehicleRow(r, now)),
    total: page.total,
    page: page.page,
    pageSize: page.pageSize,
    pageCount: Math.max(1, Math.ceil(page.total / page.pageSize)),
  };
}
export type VehicleList = ReturnType<typeof presentVehicleList>;

/** GET /api/vehicles/:id/history: status moves and the audit trail, newest first. */
export function presentVehicleHistory(events: Array<typeof vehicleEvents.$inferSelect>, audit: AuditEntry[]) {
  return {
    statusHistory: events.map((e) => ({ from: e.fromStatus, to: e.toStatus, note: e.note, by: e.userName, at: e.at.toISOString() })),
    audit: audit.map((a) => ({ action: a.action, by: a.userEmail, at: a.at.toISOString(), before: a.before, after: a.after })),
  };
}
export type VehicleHistory = ReturnType<typeof presentVehicleHistory>;

/** GET /api/vehicles/suggestions: feature tags used before and the makes in stock, for the editor. */
export const presentSuggestions = (features: string[], makes: Array<{ make: string }>) => ({ features, makes: makes.map((m) => m.make) });
export type VehicleSuggestions = ReturnType<typeof presentSuggestions>;
