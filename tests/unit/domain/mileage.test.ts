import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { averageKmPerYear } from "../../../shared/domain/service.ts";

describe("averageKmPerYear", () => {
  it("when 45,000 km on a 2020 build checked on 2025-07-01, then 9,000 km/year (age from 1 July 2020, our own example)", () => {
    expect(averageKmPerYear(45_000, 2020, "2025-07-01")).toBe(9000);
  });

  it("when a first-registration date is given, then the age runs from that date", () => {
    expect(averageKmPerYear(30_000, "2022-03-15", "2025-03-15")).toBe(10_000);
  });

  it("when the car was built this year and 1 July has not come, then the age is taken as one month, not zero", () => {
    expect(averageKmPerYear(500, 2025, "2025-03-01")).toBe(6000); // 500 km over a 1-month minimum age
  });

  it("when the build year or registration is after today, or an input is missing, then null", () => {
    expect(averageKmPerYear(500, 2026, "2025-03-01")).toBeNull();
    expect(averageKmPerYear(500, "2025-04-01", "2025-03-01")).toBeNull();
    expect(averageKmPerYear(null, 2020, "2025-03-01")).toBeNull();
    expect(averageKmPerYear(-1, 2020, "2025-03-01")).toBeNull();
    expect(averageKmPerYear(500, null, "2025-03-01")).toBeNull();
    expect(averageKmPerYear(500, 2020, "bad")).toBeNull();
  });

  it("when the odometer reads 0, then 0 km/year (a real reading, not a missing one)", () => {
    expect(averageKmPerYear(0, 2020, "2025-07-01")).toBe(0);
  });

  it("when any build year up to today is given, then the result is finite and never NaN", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 500_000 }), fc.integer({ min: 1950, max: 2025 }), (km, year) => {
        const value = averageKmPerYear(km, year, "2025-03-01")!;
        expect(Number.isFinite(value) && value >= 0).toBe(true);
      }),
    );
  });
});
