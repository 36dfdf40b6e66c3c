// Service history analysis (TRADE.md §10, CP). Odometer decreases are flagged
// for a person to explain, never refused: the record is evidence as written.
import { addMonths, compareDates, formatIsoDate, parseIsoDate, type CalendarDate } from "./calendar.ts";
import { isNonNegative, isPositive } from "./guards.ts";

export const SERVICE_KINDS = ["scheduled", "intermediate", "repair", "recall", "inspection", "tyres", "other"] as const;
export type ServiceKind = (typeof SERVICE_KINDS)[number];

/**
 * Kinds that restart the service interval: the maker's scheduled service and
 * the intermediate oil-and-filter service. Repairs, recalls, inspections and
 * tyre work do not, because they say nothing about the oil or the schedule.
 */
export const INTERVAL_SERVICE_KINDS: readonly ServiceKind[] = ["scheduled", "intermediate"];

export interface ServiceEntry {
  date: string;
  odometerKm?: number | null;
  kind: ServiceKind | (string & {});
  workshop?: string | null;
  notes?: string | null;
}

export interface DatedEntry {
  entry: ServiceEntry;
  /** Position in the caller's array, so flags point at the caller's rows. */
  index: number;
  date: CalendarDate;
}

export interface OdometerFlag {
  code: "odometer_decreased";
  /** Input index of the entry holding the highest earlier reading. */
  earlierIndex: number;
  /** Input index of the entry with the lower, later reading. */
  laterIndex: number;
  earlierKm: number;
  laterKm: number;
  earlierDate: string;
  laterDate: string;
}

export interface ServiceHistoryAnalysis {
  /** Entries with a real date, oldest first. */
  sorted: DatedEntry[];
  /** Input indices of entries whose date is not a real YYYY-MM-DD date. */
  undatedIndices: number[];
  odometerFlags: OdometerFlag[];
}

/**
 * Sorts by date; on the same day by odometer, because the order of two visits
 * on one day is unknown and should not manufacture a decrease. Each reading is
 * compared with the highest reading before it, so a later reading still below
 * an old peak is flagged too.
 */
export function analyseServiceHistory(entries: readonly ServiceEntry[] | null | undefined): ServiceHistoryAnalysis {
  const sorted: DatedEntry[] = [];
  const undatedIndices: number[] = [];
  (entries ?? []).forEach((entry, index) => {
    const date = parseIsoDate(entry?.date);
    if (date) sorted.push({ entry, index, date });
    else undatedIndices.push(index);
  });
  const km = (e: DatedEntry) => (isNonNegative(e.entry.odometerKm) ? e.entry.odometerKm : -1);
  sorted.sort((a, b) => compareDates(a.date, b.date) || km(a) - km(b) || a.index - b.index);

  const odometerFlags: OdometerFlag[] = [];
  let peak: DatedEntry | null = null;
  for (const current of sorted) {
    const reading = current.entry.odometerKm;
    if (!isNonNegative(reading)) continue;
    if (peak && reading < (peak.entry.odometerKm as number)) {
      odometerFlags.push({
        code: "odometer_decreased",
        earlierIndex: peak.index,
        laterIndex: current.index,
        earlierKm: peak.entry.odometerKm as number,
        laterKm: reading,
        earlierDate: formatIsoDate(peak.date),
        laterDate: formatIsoDate(current.date),
      });
    } else {
      peak = current;
    }
  }
  return { sorted, undatedIndices, odometerFlags };
}

export interface NextService {
  dueByDate: string | null;
  dueByKm: number | null;
  /** Past the due date (strictly after it) or past the due distance (strictly more). */
  overdue: boolean;
  overdueReasons: ("date" | "distance")[];
  lastServiceDate: string;
  lastServiceKm: number | null;
}

/**
 * Next service from the latest interval service on or before today, whichever
 * of distance and time comes first. Null when today is not a date, when neither
 * interval is usable, or when there is no scheduled or intermediate service.
 * Entries dated after today are ignored: they cannot have happened yet.
 */
export function nextService(
  entries: readonly ServiceEntry[] | null | undefined,
  currentOdometerKm: number | null | undefined,
  intervalKm: number | null | undefined,
  intervalMonths: number | null | undefined,
  today: string,
): NextService | null {
  const now = parseIsoDate(today);
  const kmUsable = isPositive(intervalKm);
  const monthsUsable = isPositive(intervalMonths) && Number.isInteger(intervalMonths);
  if (!now || (!kmUsable && !monthsUsable)) return null;

  const services = analyseServiceHistory(entries).sorted.filter(
    (e) => INTERVAL_SERVICE_KINDS.includes(e.entry.kind as ServiceKind) && compareDates(e.date, now) <= 0,
  );
  const last = services.at(-1);
  if (!last) return null;

  const lastKm = isNonNegative(last.entry.odometerKm) ? last.entry.odometerKm : null;
  const dueDate = monthsUsable ? addMonths(last.date, intervalMonths) : null;
  const dueByKm = kmUsable && lastKm !== null ? lastKm + intervalKm : null;

  const overdueReasons: ("date" | "distance")[] = [];
  if (dueDate && compareDates(now, dueDate) > 0) overdueReasons.push("date");
  if (dueByKm !== null && isNonNegative(currentOdometerKm) && currentOdometerKm > dueByKm) overdueReasons.push("distance");

  return {
    dueByDate: dueDate ? formatIsoDate(dueDate) : null,
    dueByKm,
    overdue: overdueReasons.length > 0,
    overdueReasons,
    lastServiceDate: formatIsoDate(last.date),
    lastServiceKm: lastKm,
  };
}

export { averageKmPerYear, MINIMUM_AGE_MONTHS } from "./mileage.ts";
