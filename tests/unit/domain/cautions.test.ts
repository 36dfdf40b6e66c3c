import { describe, expect, it } from "vitest";
import { cautionsInWords, defectCautions, isDefectCaution, safetyCautions, unrepairedSafetyDefects } from "../../../shared/domain/cautions.ts";

const defect = (over: Partial<Parameters<typeof defectCautions>[0][number]> = {}) => ({
  number: 3, zone: "underbody", kind: "corrosion", severity: "major", repairPlan: "disclosed_as_is", safetyRelevant: true, ...over,
});

describe("defect cautions", () => {
  it("when a defect affects safety and is not repaired before sale, then it raises a safety caution that defers to a licensed inspector", () => {
    const [c, ...rest] = defectCautions([defect()]);
    expect(rest).toEqual([]);
    expect(c.level).toBe("block");
    expect(c.code).toBe("defect_safety_3");
    expect(isDefectCaution(c)).toBe(true);
    expect(c.text).toMatch(/^Item 3 \(major corrosion, underbody\) affects safety/);
    expect(c.text).toMatch(/have it inspected by a licensed inspector before driving/i);
    expect(c.text).toMatch(/not a safety certificate/);
  });

  it("when the defect is still to be repaired, then the caution says so; when it was repaired before sale or does not affect safety, then none", () => {
    expect(defectCautions([defect({ repairPlan: "to_be_repaired" })])[0].text).toMatch(/still to be repaired/);
    expect(defectCautions([defect({ repairPlan: "repaired_before_sale" }), defect({ number: 4, safetyRelevant: false }), defect({ number: 5, safetyRelevant: null })])).toEqual([]);
    expect(unrepairedSafetyDefects([defect({ repairPlan: "repaired_before_sale" }), defect({ number: 7, severity: "minor" })]).map((d) => d.number)).toEqual([7]);
  });
});

describe("check cautions", () => {
  it("when a safety item is recorded as advise, then it gets an advisory caution; a function item on advise does not", () => {
    const out = safetyCautions([{ item: "brakes", result: "advise", label: "Brakes" }, { item: "climate", result: "advise", label: "Heating and air conditioning" }], []);
    expect(out).toHaveLength(1);
    expect(out[0]).toMatchObject({ level: "advise", code: "check_advised_brakes" });
    expect(out[0].text).toMatch(/^Brakes: advised/);
    expect(out[0].text).toMatch(/licensed inspector/);
    expect(out[0].text).not.toMatch(/must/);
  });

  it("when a safety item failed, then it stays a blocking caution (unchanged)", () => {
    expect(safetyCautions([{ item: "seat_belts", result: "fail", label: "Seat belts" }], [])[0]).toMatchObject({ level: "block", code: "check_failed_seat_belts" });
  });
});

describe("cautions in words (feeds)", () => {
  it("when there are cautions, then the counts come in words with each sentence, safety first; none reads as such", () => {
    expect(cautionsInWords([])).toBe("No cautions.");
    const text = cautionsInWords([
      { level: "advise", code: "a", text: "Brakes: advised." },
      { level: "block", code: "b", text: "Item 3 affects safety." },
      { level: "block", code: "c", text: "Seat belts failed." },
    ]);
    expect(text).toBe("2 safety cautions and 1 advisory. Safety: Item 3 affects safety. Safety: Seat belts failed. Advisory: Brakes: advised.");
  });
});
