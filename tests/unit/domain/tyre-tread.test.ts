import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MARKETS } from "../../../shared/domain/markets.ts";
import { ageAdvisory, remainingTreadPercent, treadVerdict } from "../../../shared/domain/tyres.ts";

const even = (mm: number) => ({ inner: mm, centre: mm, outer: mm });

describe("treadVerdict against the TRADE.md §2.5 test matrix", () => {
  it("when 1.5 mm is measured, then fail in EU/UK and US, pass in AU/NZ and Ontario", () => {
    // TRADE.md §2.5 test matrix: EU S [S7], UK S2 [S8], AU S [S9], NZ S2 [S10], US S [S12], Ontario S [S11]
    expect(treadVerdict(even(1.5), MARKETS.EU.legalMinimumTreadMm)!.verdict).toBe("fail");
    expect(treadVerdict(even(1.5), MARKETS.UK.legalMinimumTreadMm)!.verdict).toBe("fail");
    expect(treadVerdict(even(1.5), MARKETS.AU.legalMinimumTreadMm)!.verdict).toBe("pass");
    expect(treadVerdict(even(1.5), MARKETS.NZ.legalMinimumTreadMm)!.verdict).toBe("pass");
    expect(treadVerdict(even(1.5), MARKETS.US.legalMinimumTreadMm)!.verdict).toBe("fail");
    expect(treadVerdict(even(1.5), MARKETS.CA_ON.legalMinimumTreadMm)!.verdict).toBe("pass");
  });

  it("when 1.6 mm is measured, then pass everywhere (US: 1.6 ≥ 1.5875)", () => {
    for (const market of Object.values(MARKETS)) expect(treadVerdict(even(1.6), market.legalMinimumTreadMm)!.verdict).toBe("pass");
  });

  it("when one groove is lower than the others, then the least depth decides", () => {
    const v = treadVerdict({ inner: 1.4, centre: 4.0, outer: 3.8 }, 1.6)!;
    expect(v).toMatchObject({ verdict: "fail", leastMm: 1.4, leastPosition: "inner", missing: [] });
    expect(v.marginMm).toBeCloseTo(-0.2, 10);
  });

  it("when a reading is missing, then the verdict rests on the others and names the missing position", () => {
    expect(treadVerdict({ inner: 3, centre: null, outer: 2.5 }, 1.6)).toMatchObject({ verdict: "pass", leastMm: 2.5, missing: ["centre"] });
  });

  it("when there are no readings or no minimum, then null", () => {
    expect(treadVerdict({}, 1.6)).toBeNull();
    expect(treadVerdict(even(3), 0)).toBeNull();
    expect(treadVerdict(null, 1.6)).toBeNull();
  });

  it("when any depths are given, then pass exactly when the least is ≥ the minimum", () => {
    const depth = fc.double({ min: 0, max: 12, noNaN: true });
    fc.assert(
      fc.property(depth, depth, depth, fc.constantFrom(1.5, 1.6, 1.5875), (inner, centre, outer, min) => {
        const v = treadVerdict({ inner, centre, outer }, min)!;
        expect(v.leastMm).toBe(Math.min(inner, centre, outer));
        expect(v.verdict === "pass").toBe(Math.min(inner, centre, outer) >= min);
      }),
    );
  });
});

describe("remainingTreadPercent", () => {
  it("when 4.8 mm is left on an 8 mm tyre with a 1.6 mm minimum (our own example), then 50 %", () => {
    expect(remainingTreadPercent(4.8, 1.6, 8)).toBeCloseTo(50, 10); // computed by us: 3.2 / 6.4
  });

  it("when below the minimum or above new, then clamped to 0 and 100", () => {
    expect(remainingTreadPercent(1.0, 1.6, 8)).toBe(0);
    expect(remainingTreadPercent(9, 1.6, 8)).toBe(100);
  });

  it("when the new depth is not above the minimum or an input is missing, then null", () => {
    expect(remainingTreadPercent(4, 1.6, 1.6)).toBeNull();
    expect(remainingTreadPercent(null, 1.6, 8)).toBeNull();
    expect(remainingTreadPercent(4, 1.6, Number.NaN)).toBeNull();
  });

  it("when any inputs are valid, then the share stays within 0..100", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 15, noNaN: true }), fc.double({ min: 1.7, max: 15, noNaN: true }), (least, newDepth) => {
        const p = remainingTreadPercent(least, 1.6, newDepth)!;
        expect(p).toBeGreaterThanOrEqual(0);
        expect(p).toBeLessThanOrEqual(100);
      }),
    );
  });
});

describe("ageAdvisory (TRADE.md §2.6, CP suggested app rule)", () => {
  it("when under 6 years, then none; from 6, advise; from 10, strong", () => {
    expect(ageAdvisory(5)).toBe("none");
    expect(ageAdvisory(6)).toBe("advise"); // 6 years: makers' manuals, S2 [S15]
    expect(ageAdvisory(9)).toBe("advise");
    expect(ageAdvisory(10)).toBe("strong"); // 10 years: Ontario handbook S2 [S13], DVSA S2 [S14]
  });

  it("when the age is unknown, then null rather than none", () => {
    expect(ageAdvisory(null)).toBeNull();
    expect(ageAdvisory(Number.NaN)).toBeNull();
  });
});
