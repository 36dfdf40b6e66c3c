// Calendar arithmetic on ISO dates ("YYYY-MM-DD") without time zones: the
// product's dates are local calendar days, so UTC day numbers are used purely
// as a counting device and no clock is ever read.

export interface CalendarDate {
  year: number;
  month: number; // 1..12
  day: number; // 1..31
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const MS_PER_DAY = 86_400_000;

export function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** Parses a real calendar date; "2024-02-30" and "2024-2-1" are null. */
export function parseIsoDate(value: unknown): CalendarDate | null {
  if (typeof value !== "string") return null;
  const match = ISO_DATE.exec(value.trim());
  if (!match) return null;
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return { year, month, day };
}

export function formatIsoDate(date: CalendarDate): string {
  const pad = (n: number, width: number) => String(n).padStart(width, "0");
  return `${pad(date.year, 4)}-${pad(date.month, 2)}-${pad(date.day, 2)}`;
}

export function dayNumber(date: CalendarDate): number {
  return Date.UTC(date.year, date.month - 1, date.day) / MS_PER_DAY;
}

export function fromDayNumber(days: number): CalendarDate {
  const d = new Date(days * MS_PER_DAY);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

export function compareDates(a: CalendarDate, b: CalendarDate): number {
  return dayNumber(a) - dayNumber(b);
}

/**
 * Adds calendar months, clamping to the end of a shorter month
 * (2024-01-31 + 1 month = 2024-02-29), as service schedules and contracts do.
 */
export function addMonths(date: CalendarDate, months: number): CalendarDate {
  const index = date.year * 12 + (date.month - 1) + Math.trunc(months);
  const year = Math.floor(index / 12);
  const month = index - year * 12 + 1;
  return { year, month, day: Math.min(date.day, daysInMonth(year, month)) };
}

/**
 * Elapsed calendar months from start to end as a fraction: whole months
 * first (so 2020-07-01 → 2025-07-01 is exactly 60), then the part-month as a
 * share of the month in progress. Negative when end is before start.
 */
export function monthsBetween(start: CalendarDate, end: CalendarDate): number {
  if (compareDates(end, start) < 0) return -monthsBetween(end, start);
  let whole = (end.year - start.year) * 12 + (end.month - start.month);
  if (compareDates(addMonths(start, whole), end) > 0) whole -= 1;
  const from = dayNumber(addMonths(start, whole));
  const to = dayNumber(addMonths(start, whole + 1));
  return whole + (dayNumber(end) - from) / (to - from);
}

/** Whole years completed from start to end (birthday rule); negative when end is earlier. */
export function wholeYearsBetween(start: CalendarDate, end: CalendarDate): number {
  return Math.floor(monthsBetween(start, end) / 12);
}

/**
 * The calendar day at an instant in the dealership's time zone, as YYYY-MM-DD: the one "today" of the product, used by
 * the server (validation, derived figures) and by the client's live checks, so both judge a date against the same day.
 */
export function dealershipDay(timeZone: string, at: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(at);
  const get = (t: string) => parts.find((p) => p.type === t)!.value;
  return `${get("year")}-${get("month")}-${get("day")}`;
}
