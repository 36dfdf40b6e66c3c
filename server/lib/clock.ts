import type { Dealership } from "../db/schema/index.ts";
import { dealershipDay } from "../../shared/domain/calendar.ts";

/** The calendar day at an instant in a time zone, as YYYY-MM-DD: shared/domain/calendar.ts's `dealershipDay`. */
export const dayIn = (timeZone: string, at: Date): string => dealershipDay(timeZone, at);

export const DAY_MS = 86_400_000;
export const wholeDaysBetween = (from: Date, to: Date) => Math.max(0, Math.floor((to.getTime() - from.getTime()) / DAY_MS));

/** The dealership of the signed-in user and its calendar day ("YYYY-MM-DD"), read once per request (middleware/route.ts). */
export interface DealershipDay {
  dealership: Dealership;
  today: string;
}
