// The API.md "derived" block, computed from the vehicle's stored fields on
// every save. Each figure is null when its inputs are missing, never 0.
import { co2GramsPerKmEstimate } from "./co2.ts";
import type { FuelType } from "./fuel.ts";
import { averageKmPerYear } from "./mileage.ts";
import { powerToWeightKwPerTonne } from "./power.ts";
import { electricRangeKm, rangeKm, RANGE_BASIS, type RangeBasis } from "./range.ts";
import { analyseServiceHistory, nextService, type OdometerFlag, type ServiceEntry } from "./service.ts";
import { kwToHp, kwToPs, l100kmToKmPerL, l100kmToMpgImperial, l100kmToMpgUs, nmToLbft } from "./units.ts";
import { modelYearFromVin, vinCheck, type VinIssue, type VinStatus } from "./vin.ts";

export interface DerivedInput {
  vin?: string | null;
  buildYear?: number | null;
  /** "YYYY-MM-DD"; preferred over buildYear for the average distance per year. */
  firstRegistrationDate?: string | null;
  odometerKm?: number | null;
  fuelType?: FuelType | null;
  powerKw?: number | null;
  torqueNm?: number | null;
  fuelTankLitres?: number | null;
  fuelConsumptionL100km?: number | null;
  consumptionTestCycle?: string | null;
  batteryKwh?: number | null;
  energyKwh100km?: number | null;
  kerbWeightKg?: number | null;
  serviceHistory?: readonly ServiceEntry[] | null;
}

export interface DerivedContext {
  today: string;
  checkDigitMandatory: boolean;
  serviceIntervalKm?: number | null;
  serviceIntervalMonths?: number | null;
}

export interface Derived {
  // API.md names
  rangeKm: number | null;
  mpgUs: number | null;
  mpgImperial: number | null;
  powerHp: number | null;
  powerPs: number | null;
  torqueLbft: number | null;
  powerToWeightKwPerTonne: number | null;
  co2GramsPerKmEstimate: number | null;
  vinCheck: VinStatus;
  modelYearFromVin: number | null;
  averageKmPerYear: number | null;
  nextService: { dueByDate: string | null; dueByKm: number | null; overdue: boolean } | null;
  // detail
  electricRangeKm: number | null;
  rangeBasis: RangeBasis | null;
  consumptionTestCycle: string | null;
  kmPerLitre: number | null;
  powerToWeightMassBasis: "kerb" | null;
  co2Factor: { gramsPerLitre: number; source: string } | null;
  vinIssues: VinIssue[];
  vinBlocking: boolean;
  modelYearCandidates: number[];
  modelYearAmbiguous: boolean;
  odometerFlags: OdometerFlag[];
  lastServiceDate: string | null;
  lastServiceKm: number | null;
}

// Which figures apply to which drivetrain: an electric car has no fuel economy
// and no tailpipe CO2 from fuel, a combustion car no battery range.
const BURNS_FUEL = (fuel: FuelType | null | undefined) => fuel !== "electric";
const HAS_BATTERY_RANGE = (fuel: FuelType | null | undefined) => fuel === "electric" || fuel === "plug_in_hybrid";

export function computeDerived(input: DerivedInput, context: DerivedContext): Derived {
  const fuel = input.fuelType ?? null;
  const l100km = BURNS_FUEL(fuel) ? input.fuelConsumptionL100km : null;
  const fuelRange = BURNS_FUEL(fuel) ? rangeKm(input.fuelTankLitres, l100km) : null;
  const batteryRange = HAS_BATTERY_RANGE(fuel) ? electricRangeKm(input.batteryKwh, input.energyKwh100km) : null;
  const range = fuel === "electric" ? batteryRange : fuelRange;

  const co2 = co2GramsPerKmEstimate(l100km, fuel);
  const vin = vinCheck(input.vin, { checkDigitMandatory: context.checkDigitMandatory });
  const year = modelYearFromVin(input.vin, { today: context.today });
  const pmr = powerToWeightKwPerTonne(input.powerKw, input.kerbWeightKg);
  const service = nextService(
    input.serviceHistory,
    input.odometerKm,
    context.serviceIntervalKm,
    context.serviceIntervalMonths,
    context.today,
  );

  return {
    rangeKm: range,
    mpgUs: l100kmToMpgUs(l100km),
    mpgImperial: l100kmToMpgImperial(l100km),
    powerHp: kwToHp(input.powerKw),
    powerPs: kwToPs(input.powerKw),
    torqueLbft: nmToLbft(input.torqueNm),
    powerToWeightKwPerTonne: pmr,
    co2GramsPerKmEstimate: co2?.gramsPerKm ?? null,
    vinCheck: vin.status,
    modelYearFromVin: year?.year ?? null,
    averageKmPerYear: averageKmPerYear(input.odometerKm, input.firstRegistrationDate ?? input.buildYear, context.today),
    nextService: service ? { dueByDate: service.dueByDate, dueByKm: service.dueByKm, overdue: service.overdue } : null,

    electricRangeKm: batteryRange,
    rangeBasis: range !== null || batteryRange !== null ? RANGE_BASIS : null,
    consumptionTestCycle: input.consumptionTestCycle ?? null,
    kmPerLitre: l100kmToKmPerL(l100km),
    powerToWeightMassBasis: pmr !== null ? "kerb" : null,
    co2Factor: co2 ? { gramsPerLitre: co2.factorGramsPerLitre, source: co2.source } : null,
    vinIssues: vin.issues,
    vinBlocking: vin.blocking,
    modelYearCandidates: year?.candidates ?? [],
    modelYearAmbiguous: year?.ambiguous ?? false,
    odometerFlags: analyseServiceHistory(input.serviceHistory).odometerFlags,
    lastServiceDate: service?.lastServiceDate ?? null,
    lastServiceKm: service?.lastServiceKm ?? null,
  };
}
