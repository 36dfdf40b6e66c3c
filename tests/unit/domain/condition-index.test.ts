import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  CHECK_POINTS,
  LARGER_SIZE_FACTOR,
  REPAIR_PLAN_FACTOR,
  SEVERITY_POINTS,
  SIZE_BANDS,
  TYRE_POINTS,
  conditionIndex,
  conditionIndexExplanation,
  defectPoints,
  sizeFactor,
  type ConditionDefect,
  type ConditionInput,
  type DefectSeverity,
} from "../../../shared/domain/condition-index.ts";

const passChecks = [{ item: "brakes", result: "pass" as const }];
const defect = (over: Partial<ConditionDefect> = {}): ConditionDefect => ({
  zone: "front",
  kind: "stone chip",
  severity: "minor",
  sizeMm: 2,
  repairPlan: "disclosed_as_is",
  ...over,
});
const index = (input: ConditionInput) => conditionIndex(input)!.index;

const severityArb = fc.constantFrom<DefectSeverity>("minor", "moderate", "major");
const defectArb: fc.Arbitrary<ConditionDefect> = fc.record({
  zone: fc.constantFrom("front", "roof", "left side", "glass", "interior front"),
  kind: fc.constantFrom("stone chip", "scratch", "dent", "scuff"),
  severity: severityArb,
  sizeMm: fc.option(fc.integer({ min: 0, max: 300 }), { nil: null }),
  repairPlan: fc.constantFrom("repaired_before_sale", "disclosed_as_is", "to_be_repaired"),
  safetyRelevant: fc.option(fc.boolean(), { nil: undefined }),
});
const inputArb: fc.Arbitrary<ConditionInput> = fc.record({
  defects: fc.array(defectArb, { maxLength: 30 }),
  tyres: fc.array(
    fc.record({
      position: fc.constantFrom("front_left", "front_right", "rear_left", "rear_right", "spare"),
      treadVerdict: fc.constantFrom("pass" as const, "fail" as const, null),
      ageYears: fc.option(fc.integer({ min: 0, max: 20 }), { nil: null }),
    }),
    { minLength: 1, maxLength: 5 },
  ),
  checks: fc.array(
    fc.record({
      item: fc.constantFrom("brakes", "lights", "glass", "seat_belts", "climate", "windows", "keys"),
      result: fc.constantFrom("pass" as const, "advise" as const, "fail" as const),
    }),
    { maxLength: 12 },
  ),
});

describe("conditionIndex (a formula of our own)", () => {
  it("when nothing is wrong, then 100", () => {
    expect(index({ defects: [], checks: passChecks, tyres: [{ position: "front_left", treadVerdict: "pass", ageYears: 2 }] })).toBe(100);
  });

  it("when no tyre and no check has been recorded, then null rather than an unearned 100", () => {
    expect(conditionIndex({ defects: [] })).toBeNull();
    expect(conditionIndex({ defects: [defect()] })).toBeNull();
  });

  it("when a moderate 20 mm scratch is disclosed as is, then 5 points × 1 come off (our own constants)", () => {
    expect(index({ defects: [defect({ severity: "moderate", sizeMm: 20 })], checks: passChecks })).toBe(95);
  });

  it("when the same defect was repaired before sale, then it costs less but not nothing", () => {
    const asIs = index({ defects: [defect({ severity: "major", sizeMm: 40 })], checks: passChecks });
    const repaired = index({ defects: [defect({ severity: "major", sizeMm: 40, repairPlan: "repaired_before_sale" })], checks: passChecks });
    expect(repaired).toBeGreaterThan(asIs);
    expect(repaired).toBeLessThan(100);
    expect(100 - repaired).toBeCloseTo(SEVERITY_POINTS.major * 1.25 * REPAIR_PLAN_FACTOR.repaired_before_sale, 10);
  });

  it("when sizes fall in the BVRLA bands ≤3, ≤15, ≤25, ≤50 mm, then the factors rise with size", () => {
    // Bands from TRADE.md §9.1, S2 [S28]; factors are ours
    expect(SIZE_BANDS.map((b) => b.maxMm)).toEqual([3, 15, 25, 50]);
    expect([3, 4, 15, 16, 25, 26, 50, 51].map(sizeFactor)).toEqual([0.5, 0.75, 0.75, 1, 1, 1.25, 1.25, LARGER_SIZE_FACTOR]);
  });

  it("when the size is unknown, then it counts as the largest band, so omitting it never helps", () => {
    expect(sizeFactor(null)).toBe(LARGER_SIZE_FACTOR);
    expect(defectPoints(defect({ sizeMm: null }))).toBeGreaterThanOrEqual(defectPoints(defect({ sizeMm: 500 })));
  });

  it("when safety checks are advised or failed, then they cost more than function checks", () => {
    expect(index({ checks: [{ item: "brakes", result: "fail" }] })).toBe(100 - CHECK_POINTS.safety.fail);
    expect(index({ checks: [{ item: "climate", result: "fail" }] })).toBe(100 - CHECK_POINTS.other.fail);
    expect(index({ checks: [{ item: "wipers_washers", result: "advise" }] })).toBe(100 - CHECK_POINTS.safety.advise);
  });

  it("when a tyre fails on tread and is 10 years old, then both deductions apply", () => {
    expect(index({ tyres: [{ position: "spare", treadVerdict: "fail", ageYears: 10 }] })).toBe(100 - TYRE_POINTS.treadFail - TYRE_POINTS.ageStrong);
    expect(index({ tyres: [{ position: "spare", treadVerdict: "pass", ageYears: 6 }] })).toBe(100 - TYRE_POINTS.ageAdvise);
  });

  it("when many major defects are recorded, then the index stops at 0", () => {
    expect(index({ defects: Array.from({ length: 50 }, () => defect({ severity: "major", sizeMm: 200 })), checks: passChecks })).toBe(0);
  });

  it("when deductions are listed, then they add up to the difference from 100", () => {
    const result = conditionIndex({ defects: [defect(), defect({ severity: "major" })], checks: [{ item: "lights", result: "advise" }] })!;
    expect(result.deductions).toHaveLength(3);
    expect(100 - result.index).toBeCloseTo(result.totalDeducted, 10);
  });
});

describe("conditionIndex properties", () => {
  it("when any input is scored, then the index stays within 0..100", () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const value = index(input);
        expect(value).toBeGreaterThanOrEqual(0);
        expect(value).toBeLessThanOrEqual(100);
      }),
    );
  });

  it("when a defect is added, then the index never rises", () => {
    fc.assert(
      fc.property(inputArb, defectArb, fc.nat(), (input, extra, at) => {
        const defects = [...(input.defects ?? [])];
        defects.splice(at % (defects.length + 1), 0, extra);
        expect(index({ ...input, defects })).toBeLessThanOrEqual(index(input));
      }),
    );
  });

  it("when a defect's severity is worsened, then the index never rises", () => {
    const order: DefectSeverity[] = ["minor", "moderate", "major"];
    fc.assert(
      fc.property(inputArb, defectArb, fc.nat(2), fc.nat(2), (input, d, a, b) => {
        const [lo, hi] = [Math.min(a, b), Math.max(a, b)];
        const withLo = { ...input, defects: [...(input.defects ?? []), { ...d, severity: order[lo] }] };
        const withHi = { ...input, defects: [...(input.defects ?? []), { ...d, severity: order[hi] }] };
        expect(index(withHi)).toBeLessThanOrEqual(index(withLo));
      }),
    );
  });

  it("when a defect grows in size, then the index never rises", () => {
    fc.assert(
      fc.property(inputArb, defectArb, fc.integer({ min: 0, max: 200 }), fc.integer({ min: 0, max: 200 }), (input, d, s1, s2) => {
        const small = { ...input, defects: [...(input.defects ?? []), { ...d, sizeMm: Math.min(s1, s2) }] };
        const large = { ...input, defects: [...(input.defects ?? []), { ...d, sizeMm: Math.max(s1, s2) }] };
        expect(index(large)).toBeLessThanOrEqual(index(small));
      }),
    );
  });
});

describe("conditionIndexExplanation", () => {
  const text = conditionIndexExplanation().join(" ");

  it("when generated, then it states the constants the formula uses", () => {
    for (const n of [SEVERITY_POINTS.minor, SEVERITY_POINTS.moderate, SEVERITY_POINTS.major, CHECK_POINTS.safety.fail, TYRE_POINTS.treadFail]) {
      expect(text).toContain(`${n} point`);
    }
    for (const band of SIZE_BANDS) expect(text).toContain(`up to ${band.maxMm} mm ×${band.factor}`);
    expect(text).toContain(`×${REPAIR_PLAN_FACTOR.repaired_before_sale}`);
  });

  it("when generated, then it uses no grade words, scales or stars", () => {
    expect(text).not.toMatch(/\b(good|fair|poor|excellent|grade|stars?|out of 5)\b/i);
  });

  it("when generated, then it says the index is not a roadworthiness certificate", () => {
    expect(text).toContain("not a roadworthiness or safety certificate");
  });
});
