import type { Dealership, Vehicle } from "../../db/schema/index.ts";
import { vehicles } from "../../db/schema/index.ts";
import { computeDerived, type Derived } from "../../../shared/domain/derived.ts";
import { milesToKm } from "../../../shared/domain/units.ts";

export type Stored = Omit<typeof vehicles.$inferInsert, "id" | "dealershipId" | "stockNumber" | "stockedAt" | "derived">;

export const odometerKmOf = (reading: number | null | undefined, unit: "km" | "mi") =>
  reading == null ? null : unit === "mi" ? milesToKm(reading) : reading;

export function deriveFor(v: Pick<Vehicle, keyof Stored> & { odometerKmIndex?: number | null }, d: Dealership, today: string): Derived {
  return computeDerived(
    {
      vin: v.vin,
      buildYear: v.buildYear,
      firstRegistrationDate: v.firstRegistrationDate,
      odometerKm: odometerKmOf(v.odometerReading, v.odometerUnit ?? "km"),
      fuelType: v.fuelType,
      powerKw: v.powerKw,
      torqueNm: v.torqueNm,
      fuelTankLitres: v.fuelTankLitres,
      fuelConsumptionL100km: v.fuelConsumptionL100km,
      consumptionTestCycle: v.consumptionTestCycle,
      batteryKwh: v.batteryKwh,
      energyKwh100km: v.energyKwh100km,
      kerbWeightKg: v.kerbWeightKg,
      serviceHistory: v.serviceHistory,
    },
    { today, checkDigitMandatory: d.vinCheckDigitMandatory, serviceIntervalKm: d.serviceIntervalKm, serviceIntervalMonths: d.serviceIntervalMonths },
  );
}

