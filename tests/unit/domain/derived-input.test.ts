import { describe, expect, it } from "vitest";
import { derivedInputOf, odometerKmOf } from "../../../shared/domain/derived-input.ts";
import { computeDerived, type DerivedInput } from "../../../shared/domain/derived.ts";

const stored = {
  vin: "1G4AH59H45G118341", buildYear: 2019, firstRegistrationDate: "2019-05-02", odometerReading: 52_000, odometerUnit: "mi" as const, fuelType: "diesel",
  powerKw: 147, torqueNm: 440, fuelTankLitres: 68, fuelConsumptionL100km: 8.8, consumptionTestCycle: "wltp", batteryKwh: null, energyKwh100km: null,
  kerbWeightKg: 1890, serviceHistory: [{ date: "2024-03-01", odometerKm: 45_000, kind: "scheduled", workshop: "Quarry Lane Workshop", notes: "" }],
  // Fields that do not feed a figure are ignored.
  registrationPlate: "QX 4471", priceCents: 3_499_000,
};

describe("derivedInputOf", () => {
  it("when the odometer was read in miles, then the figures get km at 1.609344 km a mile", () => {
    // International mile, exact: TRADE.md §3, S2 [S19a].
    expect(derivedInputOf(stored).odometerKm).toBeCloseTo(52_000 * 1.609344, 9);
    expect(odometerKmOf(52_000, "mi")).toBe(52_000 * 1.609344);
    expect(odometerKmOf(52_000, "km")).toBe(52_000);
    expect(odometerKmOf(null, "mi")).toBeNull();
  });

  it("when a stored vehicle is mapped, then it is the input the server always built field by field", () => {
    const expected: DerivedInput = {
      vin: stored.vin, buildYear: 2019, firstRegistrationDate: "2019-05-02", odometerKm: 52_000 * 1.609344, fuelType: "diesel", powerKw: 147, torqueNm: 440,
      fuelTankLitres: 68, fuelConsumptionL100km: 8.8, consumptionTestCycle: "wltp", batteryKwh: null, energyKwh100km: null, kerbWeightKg: 1890,
      serviceHistory: stored.serviceHistory,
    };
    expect(derivedInputOf(stored)).toEqual(expected);
    const context = { today: "2025-06-20", checkDigitMandatory: true, serviceIntervalKm: 15_000, serviceIntervalMonths: 12 };
    expect(computeDerived(derivedInputOf(stored), context)).toEqual(computeDerived(expected, context));
  });

  it("when the editor passes half-typed values, then what is not yet a number or text counts as missing", () => {
    const typing = { vin: null, buildYear: "20x9", odometerReading: "12,0", odometerUnit: "km", powerKw: Number.NaN, fuelType: "", serviceHistory: [{ date: "2024-03-01", odometerKm: "4", kind: "scheduled" }] };
    const input = derivedInputOf(typing);
    expect(input).toMatchObject({ vin: null, buildYear: null, odometerKm: null, powerKw: null, fuelType: "" });
    expect(input.serviceHistory).toEqual([{ date: "2024-03-01", odometerKm: null, kind: "scheduled" }]);
    expect(derivedInputOf({}).serviceHistory).toBeNull();
  });
});
