// Average distance per year of age. The build month is rarely known, so a
// build year is taken to mean 1 July of that year (mid-year), and the age is
// never taken as less than one month, so a nearly new car does not show an
// absurd yearly figure.
import { monthsBetween, parseIsoDate, type CalendarDate } from "./calendar.ts";
import { isNonNegative } from "./guards.ts";

export const MINIMUM_AGE_MONTHS = 1;

function startDate(buildYearOrFirstRegistration: number | string | null | undefined): CalendarDate | null {
  if (typeof buildYearOrFirstRegistration === "string") return parseIsoDate(buildYearOrFirstRegistration);
  if (typeof buildYearOrFirstRegistration === "number" && Number.isInteger(buildYearOrFirstRegistration) && buildYearOrFirstRegistration > 0) {
    return { year: buildYearOrFirstRegistration, month: 7, day: 1 };
  }
  return null;
}

/**
 * km ÷ (age in months ÷ 12). Age runs from 1 July of the build year, or from the
 * first-registration date ("YYYY-MM-DD") when one is given. Null when an input
 * is missing, the odometer is negative, or the vehicle would not exist yet
 * (a build year after today's year, or a registration date after today).
 */
export function averageKmPerYear(
  odometerKm: number | null | undefined,
  buildYearOrFirstRegistration: number | string | null | undefined,
  today: string,
): number | null {
  const now = parseIsoDate(today);
  const start = startDate(buildYearOrFirstRegistration);
  if (!now || !start || !isNonNegative(odometerKm)) return null;
  if (typeof buildYearOrFirstRegistration === "number" ? start.year > now.year : monthsBetween(start, now) < 0) return null;
  const months = Math.max(monthsBetween(start, now), MINIMUM_AGE_MONTHS);
  return odometerKm / (months / 12);
}
