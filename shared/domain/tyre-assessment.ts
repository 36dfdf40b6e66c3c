// One tyre reading turned into what staff and buyers read: size decoded, least tread against the market's
// minimum, remaining tread, age from the DOT code at the measuring date, and the advisory (TRADE.md §2).
import { parseTyreSize, type TyreSize } from "./tyres.ts";
import { ageAdvisory, remainingTreadPercent, treadVerdict, type TreadVerdict, type TyreAgeAdvisory } from "./tyre-tread.ts";
import { parseDotDate, tyreAgeYears } from "./tyre-dot.ts";

export interface TyreReading {
  position: string;
  treadInnerMm?: number | null;
  treadCentreMm?: number | null;
  treadOuterMm?: number | null;
  sizeDesignation?: string | null;
  dotCode?: string | null;
  pressureKpa?: number | null;
}

export interface TyreAssessment {
  position: string;
  tread: TreadVerdict | null;
  remainingPercent: number | null;
  size: TyreSize | null;
  sizeError: string | null;
  ageYears: number | null;
  ageUncertain: boolean;
  ageAdvisory: TyreAgeAdvisory | null;
}

export function assessTyre(reading: TyreReading, rules: { legalMinTreadMm: number; newTyreTreadMm: number; measuredOn: string }): TyreAssessment {
  const tread = treadVerdict({ inner: reading.treadInnerMm, centre: reading.treadCentreMm, outer: reading.treadOuterMm }, rules.legalMinTreadMm);
  const parsed = reading.sizeDesignation ? parseTyreSize(reading.sizeDesignation) : null;
  const dot = reading.dotCode ? parseDotDate(reading.dotCode) : null;
  const ageYears = dot ? tyreAgeYears(dot, rules.measuredOn) : null;
  return {
    position: reading.position,
    tread,
    remainingPercent: tread ? remainingTreadPercent(tread.leastMm, rules.legalMinTreadMm, rules.newTyreTreadMm) : null,
    size: parsed?.ok ? parsed.tyre : null,
    sizeError: parsed && !parsed.ok ? parsed.error.message : null,
    ageYears,
    ageUncertain: dot?.kind === "pre2000",
    ageAdvisory: ageAdvisory(ageYears),
  };
}

/** Four road wheels measured (the spare is recorded when there is one, but not required). */
export const ROAD_POSITIONS = ["front_left", "front_right", "rear_left", "rear_right"] as const;
