import { describe, expect, it } from "vitest";
import { MODEL_YEAR_CODES, modelYearFromVin } from "../../../shared/domain/vin.ts";

describe("modelYearFromVin", () => {
  it("when the VIN is 1G4AH59H45G118341, then position 10 '5' with numeric position 7 gives 2005", () => {
    // TRADE.md §1.3, S2 [S2] table; position-7 rule S [S3] 2008 NHTSA final rule
    const result = modelYearFromVin("1G4AH59H45G118341");
    expect(result).toMatchObject({ status: "decoded", code: "5", candidates: [2005, 2035], year: 2005, ambiguous: true, basis: "position_7_numeric" });
  });

  it("when today is given, then candidates that cannot exist yet are dropped and the year is no longer ambiguous", () => {
    const result = modelYearFromVin("1G4AH59H45G118341", { today: "2025-06-20" });
    expect(result).toMatchObject({ candidates: [2005], year: 2005, ambiguous: false, basis: "only_candidate" });
  });

  it("when position 7 is alphabetic, then the rule picks the 2010–2039 year", () => {
    // TRADE.md §1.3, S [S3]: alphabetic position 7 → 2010–2039 (our own VIN, check digit irrelevant here)
    const result = modelYearFromVin("1G4AH5AH4RG118341");
    expect(result).toMatchObject({ code: "R", candidates: [1994, 2024], year: 2024, basis: "position_7_alphabetic" });
  });

  it("when the table is read, then every code maps as TRADE.md §1.3 lists (S2 [S2])", () => {
    const expected: Record<string, number> = {
      A: 1980, B: 1981, C: 1982, D: 1983, E: 1984, F: 1985, G: 1986, H: 1987, J: 1988, K: 1989,
      L: 1990, M: 1991, N: 1992, P: 1993, R: 1994, S: 1995, T: 1996, V: 1997, W: 1998, X: 1999,
      Y: 2000, "1": 2001, "2": 2002, "3": 2003, "4": 2004, "5": 2005, "6": 2006, "7": 2007, "8": 2008, "9": 2009,
    };
    expect(MODEL_YEAR_CODES).toEqual(expected);
  });

  it("when position 10 is 0, U, Z, I, O or Q, then invalid year code", () => {
    // TRADE.md §1.3 test: 0, U or Z → "invalid year code"; I, O, Q never used
    for (const code of ["0", "U", "Z", "I", "O", "Q"]) {
      const vin = `1G4AH59H4${code}G118341`;
      const result = modelYearFromVin(vin);
      expect(result).toMatchObject({ status: "invalid_code", code, year: null, candidates: [] });
      expect(result?.status === "invalid_code" && result.message).toContain("Invalid year code");
    }
  });

  it("when there is no 17-character VIN, then null", () => {
    expect(modelYearFromVin(null)).toBeNull();
    expect(modelYearFromVin("1G4AH59H45")).toBeNull();
  });
});
