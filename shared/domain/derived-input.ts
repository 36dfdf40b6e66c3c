// The derived figures' input from a vehicle as stored or presented, with the odometer as read. The server (on every
// save and read) and the live editor (as the person types) both go through here, so the figures beside the form are
// the ones the save will store. Values that are not (yet) what the field holds count as missing, as computeDerived
// expects: the editor passes what is typed, which may still be half a number.
import type { DerivedInput } from "./derived.ts";
import type { FuelType } from "./fuel.ts";
import type { ServiceEntry } from "./service.ts";
import { milesToKm } from "./units.ts";

/** The odometer in km from the reading in its own unit (the stored reading is never converted). */
export const odometerKmOf = (reading: number | null | undefined, unit: "km" | "mi" | null | undefined) =>
  reading == null ? null : unit === "mi" ? milesToKm(reading) : reading;

/** The fields of a vehicle that feed its derived figures. */
export type DerivedSource = Partial<
  Record<
    | "vin" | "buildYear" | "firstRegistrationDate" | "odometerReading" | "odometerUnit" | "fuelType" | "powerKw" | "torqueNm"
    | "fuelTankLitres" | "fuelConsumptionL100km" | "consumptionTestCycle" | "batteryKwh" | "energyKwh100km" | "kerbWeightKg" | "serviceHistory",
    unknown
  >
>;

const num = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);
const str = (v: unknown) => (typeof v === "string" ? v : null);

export function derivedInputOf(v: DerivedSource): DerivedInput {
  return {
    vin: str(v.vin),
    buildYear: num(v.buildYear),
    firstRegistrationDate: str(v.firstRegistrationDate),
    odometerKm: odometerKmOf(num(v.odometerReading), v.odometerUnit === "mi" ? "mi" : "km"),
    fuelType: str(v.fuelType) as FuelType | null,
    powerKw: num(v.powerKw),
    torqueNm: num(v.torqueNm),
    fuelTankLitres: num(v.fuelTankLitres),
    fuelConsumptionL100km: num(v.fuelConsumptionL100km),
    consumptionTestCycle: str(v.consumptionTestCycle),
    batteryKwh: num(v.batteryKwh),
    energyKwh100km: num(v.energyKwh100km),
    kerbWeightKg: num(v.kerbWeightKg),
    serviceHistory: Array.isArray(v.serviceHistory)
      ? (v.serviceHistory as ServiceEntry[]).map((e) => ({ ...e, odometerKm: num(e.odometerKm) }))
      : null,
  };
}
