import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeDerived, type DerivedContext, type DerivedInput } from "../../../shared/domain/derived.ts";

const context: DerivedContext = { today: "2025-06-20", checkDigitMandatory: true, serviceIntervalKm: 15_000, serviceIntervalMonths: 12 };

const API_NAMES = [
  "rangeKm",
  "mpgUs",
  "mpgImperial",
  "powerHp",
  "powerPs",
  "torqueLbft",
  "powerToWeightKwPerTonne",
  "co2GramsPerKmEstimate",
  "vinCheck",
  "modelYearFromVin",
  "averageKmPerYear",
  "nextService",
];

const diesel: DerivedInput = {
  vin: "1G4AH59H45G118341",
  buildYear: 2005,
  odometerKm: 123_456,
  fuelType: "diesel",
  powerKw: 150,
  torqueNm: 400,
  fuelTankLitres: 68,
  fuelConsumptionL100km: 8.8,
  consumptionTestCycle: "WLTP combined",
  kerbWeightKg: 1234,
  serviceHistory: [
    { date: "2024-03-01", odometerKm: 45_000, kind: "scheduled", workshop: "A", notes: null },
    { date: "2024-09-01", odometerKm: 44_000, kind: "repair", workshop: "B", notes: null },
  ],
};

describe("computeDerived", () => {
  it("when computed, then every API.md derived name is present", () => {
    const derived = computeDerived({}, context);
    for (const name of API_NAMES) expect(derived).toHaveProperty(name);
  });

  it("when a diesel with the TRADE.md inputs is computed, then each figure matches its worked example", () => {
    const d = computeDerived(diesel, context);
    expect(d.rangeKm).toBeCloseTo(772.7272727, 6); // TRADE.md §4 (CP)
    expect(d.rangeBasis).toBe("theoretical");
    expect(d.mpgUs).toBeCloseTo(26.73, 2); // TRADE.md §3
    expect(d.mpgImperial).toBeCloseTo(32.1, 2); // TRADE.md §3
    expect(d.kmPerLitre).toBeCloseTo(11.36, 2); // TRADE.md §3
    expect(d.torqueLbft).toBeCloseTo(295.02, 2); // TRADE.md §3
    expect(d.powerToWeightKwPerTonne).toBeCloseTo(121.56, 2); // TRADE.md §6.1, S [S20]
    expect(d.powerToWeightMassBasis).toBe("kerb");
    expect(d.co2GramsPerKmEstimate).toBeCloseTo(236.7, 1); // TRADE.md §5, S [S17]
    expect(d.co2Factor?.source).toContain("EPA-420-F-11-041");
    expect(d.vinCheck).toBe("valid"); // TRADE.md §1.2, S [S1]
    expect(d.modelYearFromVin).toBe(2005); // TRADE.md §1.3
    expect(d.modelYearCandidates).toEqual([2005]);
    expect(d.consumptionTestCycle).toBe("WLTP combined");
    expect(d.electricRangeKm).toBeNull();
  });

  it("when the service history has a decrease, then the derived block carries the odometer flag and the next service", () => {
    const d = computeDerived(diesel, context);
    expect(d.odometerFlags).toMatchObject([{ earlierIndex: 0, laterIndex: 1 }]); // TRADE.md §10 (CP)
    expect(d.nextService).toEqual({ dueByDate: "2025-03-01", dueByKm: 60_000, overdue: true }); // TRADE.md §10 (CP); today is past 2025-03-01
    expect(d.lastServiceDate).toBe("2024-03-01");
  });

  it("when the vehicle is electric, then range comes from the battery and fuel figures are null", () => {
    const d = computeDerived({ fuelType: "electric", batteryKwh: 77, energyKwh100km: 17.5, fuelTankLitres: 50, fuelConsumptionL100km: 5 }, context);
    expect(d.rangeKm).toBeCloseTo(440, 10);
    expect(d.electricRangeKm).toBeCloseTo(440, 10);
    expect(d.mpgUs).toBeNull();
    expect(d.co2GramsPerKmEstimate).toBeNull();
  });

  it("when the vehicle is a plug-in hybrid, then both the fuel range and the electric range are given", () => {
    const d = computeDerived({ fuelType: "plug_in_hybrid", fuelTankLitres: 40, fuelConsumptionL100km: 2, batteryKwh: 13, energyKwh100km: 20 }, context);
    expect(d.rangeKm).toBeCloseTo(2000, 10);
    expect(d.electricRangeKm).toBeCloseTo(65, 10);
    expect(d.co2Factor?.gramsPerLitre).toBeCloseTo(2347.7, 1); // petrol factor, TRADE.md §5, S [S17]
  });

  it("when a non-mandatory market sees a failed check digit, then vinCheck is invalid but not blocking", () => {
    const d = computeDerived({ vin: "1G4AH59H55G118341" }, { ...context, checkDigitMandatory: false });
    expect(d.vinCheck).toBe("invalid");
    expect(d.vinBlocking).toBe(false);
    expect(d.vinIssues[0]?.severity).toBe("warning");
  });

  it("when nothing is known, then every figure is null (vinCheck not_applicable), never 0", () => {
    const d = computeDerived({}, context);
    for (const name of API_NAMES.filter((n) => n !== "vinCheck")) expect(d[name as keyof typeof d]).toBeNull();
    expect(d.vinCheck).toBe("not_applicable");
  });

  it("when any inputs are missing, zero or NaN, then every derived figure is null or a positive finite number, never 0 or NaN", () => {
    const maybe = fc.option(fc.constantFrom(0, -1, Number.NaN, 5, 68, 150), { nil: null });
    fc.assert(
      fc.property(maybe, maybe, maybe, maybe, maybe, (tank, l100, kw, nm, kg) => {
        const d = computeDerived(
          { fuelTankLitres: tank, fuelConsumptionL100km: l100, powerKw: kw, torqueNm: nm, kerbWeightKg: kg, fuelType: "petrol" },
          context,
        );
        for (const value of [d.rangeKm, d.mpgUs, d.mpgImperial, d.powerHp, d.powerPs, d.torqueLbft, d.powerToWeightKwPerTonne, d.co2GramsPerKmEstimate]) {
          if (value !== null) expect(Number.isFinite(value) && value > 0).toBe(true);
        }
      }),
    );
  });
});
