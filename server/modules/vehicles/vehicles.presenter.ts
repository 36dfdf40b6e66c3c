import type { Vehicle } from "../../db/schema/index.ts";
import type { Derived } from "../../../shared/domain/derived.ts";
import { wholeDaysBetween } from "../../lib/clock.ts";

/** The staff view of a vehicle: every input field by name, the derived block, and bookkeeping. */
export function presentVehicle(v: Vehicle, derived: Derived, now: Date) {
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
    firstRegistrationDate: v.firstRegistrationDate,
    bodyType: v.bodyType,
    colour: v.colour,
    doors: v.doors,
    seats: v.seats,
    odometerReading: v.odometerReading,
    odometerUnit: v.odometerUnit,
    odometerKm: v.odometerKmIndex,
    driveType: v.driveType,
    fuelType: v.fuelType,
    engineCapacityCc: v.engineCapacityCc,
    cylinders: v.cylinders,
    aspiration: v.aspiration,
    powerKw: v.powerKw,
    torqueNm: v.torqueNm,
    transmission: v.transmission,
    gears: v.gears,
    fuelTankLitres: v.fuelTankLitres,
    fuelConsumptionL100km: v.fuelConsumptionL100km,
    consumptionTestCycle: v.consumptionTestCycle,
    batteryKwh: v.batteryKwh,
    energyKwh100km: v.energyKwh100km,
    kerbWeightKg: v.kerbWeightKg,
    keysCount: v.keysCount,
    previousOwners: v.previousOwners,
    features: v.features,
    priceCents: v.priceCents,
    description: v.description,
    serviceHistory: v.serviceHistory,
    derived,
    daysInStock: wholeDaysBetween(v.stockedAt, now),
    stockedAt: v.stockedAt.toISOString(),
    createdAt: v.createdAt.toISOString(),
    updatedAt: v.updatedAt.toISOString(),
    version: v.version,
  };
}
export type VehicleView = ReturnType<typeof presentVehicle>;

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
