import { describe, expect, it } from "vitest";
import { dotWeekStart, parseDotDate, tyreAgeYears } from "../../../shared/domain/tyres.ts";

describe("parseDotDate (49 CFR 574.5)", () => {
  it("when the code is 2319, then week 23 of 2019", () => {
    expect(parseDotDate("2319")).toEqual({ kind: "wwyy", week: 23, year: 2019 }); // TRADE.md §2.4 test, S [S5]
  });

  it("when a whole TIN is given, then its last group is read as the date code", () => {
    expect(parseDotDate("DOT U2LL LMLR 2319")).toEqual({ kind: "wwyy", week: 23, year: 2019 });
  });

  it("when the code has three digits, 329, then week 32 of a year ending in 9, decade uncertain", () => {
    // TRADE.md §2.4 test, S [S5] (3-digit pre-2000 code)
    expect(parseDotDate("329")).toEqual({ kind: "pre2000", week: 32, yearLastDigit: 9, decadeUncertain: true });
  });

  it("when the week is 00 or above 53, then invalid", () => {
    // TRADE.md §2.4 test
    expect(parseDotDate("0019")).toEqual({ kind: "invalid", reason: "week_out_of_range" });
    expect(parseDotDate("5419")).toEqual({ kind: "invalid", reason: "week_out_of_range" });
    expect(parseDotDate("5319")).toEqual({ kind: "wwyy", week: 53, year: 2019 });
  });

  it("when the code is not 3 or 4 digits, then invalid format", () => {
    for (const code of ["", "23A9", "12345", "12", null]) expect(parseDotDate(code)).toEqual({ kind: "invalid", reason: "format" });
  });
});

describe("tyreAgeYears", () => {
  it("when 2319 is inspected on 2025-06-20, then 6 years (whole years, rounded down)", () => {
    // TRADE.md §2.4 test: 6 years, allowing ±1 week of slack
    expect(tyreAgeYears("2319", "2025-06-20")).toBe(6);
    expect(tyreAgeYears("2219", "2025-06-20")).toBe(6); // one week earlier
    expect(tyreAgeYears("2419", "2025-06-20")).toBe(6); // one week later
  });

  it("when week 01 is located, then it starts on the first Sunday of the year (574.5(b)(3) wording, M, from memory)", () => {
    expect(dotWeekStart(2019, 1)).toEqual({ year: 2019, month: 1, day: 6 });
    expect(dotWeekStart(2023, 1)).toEqual({ year: 2023, month: 1, day: 1 }); // 1 Jan 2023 was a Sunday
    expect(dotWeekStart(2019, 23)).toEqual({ year: 2019, month: 6, day: 9 });
  });

  it("when the inspection is one day before the sixth anniversary of the week start, then 5 years", () => {
    expect(tyreAgeYears("2319", "2025-06-08")).toBe(5);
    expect(tyreAgeYears("2319", "2025-06-09")).toBe(6);
  });

  it("when a pre-2000 code is given, then the minimum age assuming the 1990s", () => {
    expect(tyreAgeYears("329", "2025-06-20")).toBe(25); // week 32 of 1999 → at least 25 years
  });

  it("when the tyre is dated after the inspection or the inputs are invalid, then null", () => {
    expect(tyreAgeYears("2326", "2025-06-20")).toBeNull();
    expect(tyreAgeYears("0019", "2025-06-20")).toBeNull();
    expect(tyreAgeYears("2319", "20/06/2025")).toBeNull();
  });

  it("when the inspection falls within the manufacture week, then 0 years", () => {
    expect(tyreAgeYears("2525", "2025-06-16")).toBe(0);
  });
});
