import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { addMonths, compareDates, formatIsoDate, monthsBetween, parseIsoDate, wholeYearsBetween } from "../../../shared/domain/calendar.ts";

const d = (s: string) => parseIsoDate(s)!;
const dateArb = fc
  .record({ year: fc.integer({ min: 1980, max: 2040 }), month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) })
  .map((x) => x);

describe("calendar", () => {
  it("when a date is not a real calendar day, then it does not parse", () => {
    expect(parseIsoDate("2024-02-30")).toBeNull();
    expect(parseIsoDate("2023-02-29")).toBeNull();
    expect(parseIsoDate("2024-2-1")).toBeNull();
    expect(parseIsoDate(20240201)).toBeNull();
    expect(parseIsoDate("2024-02-29")).toEqual({ year: 2024, month: 2, day: 29 });
  });

  it("when one month is added to 31 January 2024, then 29 February 2024 (clamped, leap year)", () => {
    expect(formatIsoDate(addMonths(d("2024-01-31"), 1))).toBe("2024-02-29");
    expect(formatIsoDate(addMonths(d("2023-01-31"), 1))).toBe("2023-02-28");
    expect(formatIsoDate(addMonths(d("2024-03-31"), 1))).toBe("2024-04-30");
    expect(formatIsoDate(addMonths(d("2024-11-15"), 3))).toBe("2025-02-15");
    expect(formatIsoDate(addMonths(d("2024-03-01"), 12))).toBe("2025-03-01");
  });

  it("when whole months separate two dates, then monthsBetween is exactly that number", () => {
    expect(monthsBetween(d("2020-07-01"), d("2025-07-01"))).toBe(60);
    expect(monthsBetween(d("2024-01-31"), d("2024-02-29"))).toBe(1);
  });

  it("when a birthday has not been reached, then wholeYearsBetween rounds down", () => {
    expect(wholeYearsBetween(d("2019-06-09"), d("2025-06-08"))).toBe(5);
    expect(wholeYearsBetween(d("2019-06-09"), d("2025-06-09"))).toBe(6);
  });

  it("when the end date moves later, then monthsBetween never decreases", () => {
    fc.assert(
      fc.property(dateArb, dateArb, dateArb, (a, b, c) => {
        const [x, y] = compareDates(b, c) <= 0 ? [b, c] : [c, b];
        expect(monthsBetween(a, y)).toBeGreaterThanOrEqual(monthsBetween(a, x));
      }),
    );
  });
});
