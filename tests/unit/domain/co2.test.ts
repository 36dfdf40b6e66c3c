import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CO2_FACTORS, co2FactorFor, co2GramsPerKmEstimate } from "../../../shared/domain/co2.ts";

describe("CO2 factors", () => {
  it("when the EPA factors are converted per litre, then 2,347.7 g/L petrol and 2,689.3 g/L diesel", () => {
    // TRADE.md §5, S [S17] EPA-420-F-11-041: 8,887 and 10,180 g/gal; per litre computed (1 dp)
    expect(CO2_FACTORS.petrol.value).toBe(8887);
    expect(CO2_FACTORS.diesel.value).toBe(10180);
    expect(CO2_FACTORS.petrol.gramsPerLitre).toBeCloseTo(2347.7, 1);
    expect(CO2_FACTORS.diesel.gramsPerLitre).toBeCloseTo(2689.3, 1);
  });

  it("when a factor is listed, then it carries its unit and its source text", () => {
    for (const f of Object.values(CO2_FACTORS)) {
      expect(f.unit).toBe("g CO2/US gal");
      expect(f.source).toContain("US EPA EPA-420-F-11-041 (2011)");
    }
  });
});

describe("co2GramsPerKmEstimate", () => {
  it("when 8.8 L/100 km diesel with the EPA factor, then 236.7 g/km", () => {
    // TRADE.md §5 worked example, S [S17]: 0.088 × 2,689.27 = 236.7 (1 dp)
    const result = co2GramsPerKmEstimate(8.8, "diesel")!;
    expect(result.gramsPerKm).toBeCloseTo(236.7, 1);
    expect(result.factorGramsPerLitre).toBeCloseTo(2689.27, 2);
    expect(result.source).toContain("EPA-420-F-11-041");
  });

  it("when 6.0 L/100 km petrol (our own example), then 140.86 g/km", () => {
    expect(co2GramsPerKmEstimate(6, "petrol")!.gramsPerKm).toBeCloseTo(140.862, 3); // computed by us: 0.06 × 8887 / 3.785411784
  });

  it("when the vehicle is a hybrid or plug-in hybrid, then the petrol factor is used", () => {
    expect(co2FactorFor("hybrid")).toBe(CO2_FACTORS.petrol);
    expect(co2FactorFor("plug_in_hybrid")).toBe(CO2_FACTORS.petrol);
  });

  it("when the vehicle is electric, LPG or of unknown fuel, then null (no sourced factor)", () => {
    expect(co2GramsPerKmEstimate(8.8, "electric")).toBeNull();
    expect(co2GramsPerKmEstimate(8.8, "lpg")).toBeNull();
    expect(co2GramsPerKmEstimate(8.8, null)).toBeNull();
    expect(co2GramsPerKmEstimate(8.8, "hydrogen")).toBeNull();
  });

  it("when consumption is missing, zero or NaN, then null, never 0", () => {
    for (const bad of [null, undefined, 0, -2, Number.NaN]) expect(co2GramsPerKmEstimate(bad, "petrol")).toBeNull();
  });

  it("when consumption rises, then the estimate rises in proportion", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 30, noNaN: true }), (l) => {
        const one = co2GramsPerKmEstimate(l, "diesel")!.gramsPerKm;
        const two = co2GramsPerKmEstimate(2 * l, "diesel")!.gramsPerKm;
        expect(two).toBeCloseTo(2 * one, 8);
      }),
    );
  });
});
