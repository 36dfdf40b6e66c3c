// US DOT tyre date code (49 CFR 574.5, TRADE.md §2.4): WWYY since the 1999
// rule [S5], WW + one year digit before it, so old codes leave the decade open.
import { dayNumber, fromDayNumber, parseIsoDate, wholeYearsBetween, type CalendarDate } from "./calendar.ts";

export type DotDate =
  | { kind: "wwyy"; week: number; year: number }
  | { kind: "pre2000"; week: number; yearLastDigit: number; decadeUncertain: true }
  | { kind: "invalid"; reason: "format" | "week_out_of_range" };

/**
 * Accepts the date code alone ("2319") or a whole TIN ending in it
 * ("DOT U2LL LMLR 2319"): the last group of characters is the date code.
 */
export function parseDotDate(code: string | null | undefined): DotDate {
  const token = (code ?? "").trim().split(/\s+/).at(-1) ?? "";
  if (!/^\d{3,4}$/.test(token)) return { kind: "invalid", reason: "format" };
  const week = Number(token.slice(0, 2));
  if (week < 1 || week > 53) return { kind: "invalid", reason: "week_out_of_range" };
  if (token.length === 4) return { kind: "wwyy", week, year: 2000 + Number(token.slice(2)) };
  return { kind: "pre2000", week, yearLastDigit: Number(token.slice(2)), decadeUncertain: true };
}

/**
 * First day (Sunday) of DOT week `week`: week 01 is the first full
 * Sunday–Saturday week of the year (574.5(b)(3) wording, M).
 */
export function dotWeekStart(year: number, week: number): CalendarDate {
  const jan1 = { year, month: 1, day: 1 };
  const weekday = new Date(Date.UTC(year, 0, 1)).getUTCDay(); // 0 = Sunday
  const firstSunday = dayNumber(jan1) + ((7 - weekday) % 7);
  return fromDayNumber(firstSunday + (week - 1) * 7);
}

/** How far a made-after-inspection date may run before it counts as impossible (week definitions vary by maker). */
const WEEK_SLACK_DAYS = 7;

/**
 * Whole years from the start of the manufacture week to the inspection date,
 * rounded down. A pre-2000 code gives the minimum age: the latest decade that
 * used 3-digit codes (the 1990s) is assumed, which never understates age.
 * Null for an invalid code or date, or a tyre dated after the inspection.
 */
export function tyreAgeYears(dot: string | DotDate | null | undefined, inspectionDate: string): number | null {
  const parsed = typeof dot === "object" && dot !== null ? dot : parseDotDate(dot);
  const inspected = parseIsoDate(inspectionDate);
  if (!inspected || parsed.kind === "invalid") return null;
  const year = parsed.kind === "wwyy" ? parsed.year : 1990 + parsed.yearLastDigit;
  const made = dotWeekStart(year, parsed.week);
  const daysAfterInspection = dayNumber(made) - dayNumber(inspected);
  if (daysAfterInspection > WEEK_SLACK_DAYS) return null;
  if (daysAfterInspection > 0) return 0;
  return wholeYearsBetween(made, inspected);
}
