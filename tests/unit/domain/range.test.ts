import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { RANGE_BASIS, electricRangeKm, rangeKm } from "../../../shared/domain/range.ts";
import { kmToMiles } from "../../../shared/domain/units.ts";

const positive = fc.double({ min: 0.1, max: 500, noNaN: true });

describe("rangeKm", () => {
  it("when 68 L at 8.8 L/100 km, then 772.727… km, 772.7 to 1 dp and 480.2 mi", () => {
    // TRADE.md §4 worked example (CP, common practice, no source; numbers computed)
    expect(rangeKm(68, 8.8)).toBeCloseTo(772.7272727, 6);
    expect(rangeKm(68, 8.8)).toBeCloseTo(772.7, 1);
    expect(kmToMiles(rangeKm(68, 8.8))).toBeCloseTo(480.2, 1);
  });

  it("when consumption or tank is zero, negative or missing, then there is no range (TRADE.md §4 guard, CP)", () => {
    for (const bad of [0, -1, null, undefined, Number.NaN]) {
      expect(rangeKm(68, bad)).toBeNull();
      expect(rangeKm(bad, 8.8)).toBeNull();
    }
  });

  it("when the range is computed, then its basis is labelled theoretical (TRADE.md §4 caution 1, CP)", () => {
    expect(RANGE_BASIS).toBe("theoretical");
  });

  it("when the tank grows, then range never falls; when consumption grows, then range never rises", () => {
    fc.assert(
      fc.property(positive, positive, positive, (tank, extra, l100) => {
        expect(rangeKm(tank + extra, l100)!).toBeGreaterThanOrEqual(rangeKm(tank, l100)!);
        expect(rangeKm(tank, l100 + extra)!).toBeLessThanOrEqual(rangeKm(tank, l100)!);
      }),
    );
  });
});

describe("electricRangeKm", () => {
  it("when a 77 kWh battery uses 17.5 kWh/100 km (our own example), then 440 km", () => {
    expect(electricRangeKm(77, 17.5)).toBeCloseTo(440, 10); // computed by us: 77 / 17.5 × 100
  });

  it("when battery or energy use is missing or zero, then null", () => {
    expect(electricRangeKm(77, 0)).toBeNull();
    expect(electricRangeKm(null, 17.5)).toBeNull();
  });

  it("when any positive inputs are given, then the range is finite and positive, never NaN", () => {
    fc.assert(
      fc.property(positive, positive, (kwh, per100) => {
        const r = electricRangeKm(kwh, per100)!;
        expect(Number.isFinite(r) && r > 0).toBe(true);
      }),
    );
  });
});
