import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  computeCheckDigit,
  normaliseVin,
  validateVinStructure,
  vinCheck,
  vinWeightedSum,
} from "../../../shared/domain/vin.ts";

const VIN_CHARS = "0123456789ABCDEFGHJKLMNPRSTUVWXYZ".split("");
const vinBody = fc.array(fc.constantFrom(...VIN_CHARS), { minLength: 17, maxLength: 17 }).map((a) => a.join(""));

describe("VIN check digit (49 CFR 565.15(c))", () => {
  it("when the CFR Table V sample 1G4AH59H?5G118341 is summed, then 411, remainder 4, check digit 4", () => {
    // TRADE.md §1.2, S [S1]: 49 CFR 565.15(c) Table V sample
    expect(vinWeightedSum("1G4AH59H?5G118341")).toBe(411);
    expect(411 % 11).toBe(4);
    expect(computeCheckDigit("1G4AH59H?5G118341")).toBe("4");
    expect(vinCheck("1G4AH59H45G118341", { checkDigitMandatory: true }).status).toBe("valid");
  });

  it("when the hypothetical 1M8GDM9A?KP042788 is summed, then 351, remainder 10, check digit X", () => {
    // TRADE.md §1.2, S2 [S2]
    expect(vinWeightedSum("1M8GDM9A?KP042788")).toBe(351);
    expect(computeCheckDigit("1M8GDM9A?KP042788")).toBe("X");
    expect(vinCheck("1M8GDM9AXKP042788", { checkDigitMandatory: true }).status).toBe("valid");
  });

  it("when S is transliterated, then it is 2, not 1 (TRADE.md §1.2 note, S [S1])", () => {
    // Only position 1 differs (weight 8): S = 2 versus A = 1, so the sums differ by 8.
    expect(vinWeightedSum("S0000000?00000000")! - vinWeightedSum("A0000000?00000000")!).toBe(8);
  });

  it("when a check digit is computed and written in, then the VIN always checks valid", () => {
    fc.assert(
      fc.property(vinBody, (body) => {
        const digit = computeCheckDigit(body)!;
        const vin = body.slice(0, 8) + digit + body.slice(9);
        expect(vinCheck(vin, { checkDigitMandatory: true }).status).toBe("valid");
      }),
    );
  });

  it("when the check digit is changed, then the VIN is invalid", () => {
    fc.assert(
      fc.property(vinBody, fc.constantFrom(..."0123456789X".split("")), (body, wrong) => {
        const right = computeCheckDigit(body)!;
        fc.pre(wrong !== right);
        const vin = body.slice(0, 8) + wrong + body.slice(9);
        expect(vinCheck(vin, { checkDigitMandatory: true }).status).toBe("invalid");
      }),
    );
  });
});

describe("VIN structure", () => {
  it("when the VIN has spaces around it and lower case, then it is trimmed and upper-cased", () => {
    expect(normaliseVin("  1g4ah59h45g118341 ")).toBe("1G4AH59H45G118341");
    expect(normaliseVin("   ")).toBeNull();
    expect(normaliseVin(null)).toBeNull();
  });

  it("when the VIN contains I, O or Q, then it is rejected with vin_forbidden_letter (TRADE.md §1.1, S)", () => {
    const issues = validateVinStructure("1G4AH59H45G11834O");
    expect(issues.map((i) => i.code)).toEqual(["vin_forbidden_letter"]);
    expect(issues[0].positions).toEqual([17]);
    expect(issues[0].severity).toBe("error");
  });

  it("when the length is not 17, then it is rejected with vin_length (TRADE.md §1.1, S [S1] 565.4(b))", () => {
    expect(validateVinStructure("1G4AH59H45G11834").map((i) => i.code)).toEqual(["vin_length"]);
    expect(validateVinStructure("1G4AH59H45G1183411").map((i) => i.code)).toEqual(["vin_length"]);
  });

  it("when the VIN has punctuation, then it is rejected with vin_invalid_character", () => {
    expect(validateVinStructure("1G4AH59H45G1183-1").map((i) => i.code)).toEqual(["vin_invalid_character"]);
  });

  it("when the VIN is structurally broken, then no check digit is computed", () => {
    expect(computeCheckDigit("1G4AH59H45G11834O")).toBeNull();
    expect(computeCheckDigit("SHORT")).toBeNull();
  });
});

describe("vinCheck status and severity", () => {
  const wrongDigit = "1G4AH59H55G118341";

  it("when there is no VIN, then not_applicable with no issues", () => {
    for (const vin of [null, undefined, "", "  "]) {
      expect(vinCheck(vin, { checkDigitMandatory: true })).toEqual({ status: "not_applicable", vin: null, issues: [], blocking: false });
    }
  });

  it("when the check digit fails where it is mandatory (US/Canada), then invalid with an error that blocks", () => {
    const result = vinCheck(wrongDigit, { checkDigitMandatory: true });
    expect(result.status).toBe("invalid");
    expect(result.issues).toMatchObject([{ code: "vin_check_digit", severity: "error", positions: [9] }]);
    expect(result.blocking).toBe(true);
  });

  it("when the check digit fails where it is not mandatory, then invalid with a warning that does not block", () => {
    // TRADE.md §1.1, S2 [S2]: do not reject a non-US VIN for a failed check digit; warn instead
    const result = vinCheck(wrongDigit, { checkDigitMandatory: false });
    expect(result.status).toBe("invalid");
    expect(result.issues).toMatchObject([{ code: "vin_check_digit", severity: "warning" }]);
    expect(result.blocking).toBe(false);
  });

  it("when the structure is broken, then invalid with error severity in every market", () => {
    const result = vinCheck("1G4AH59H45G11834Q", { checkDigitMandatory: false });
    expect(result.status).toBe("invalid");
    expect(result.blocking).toBe(true);
  });
});
