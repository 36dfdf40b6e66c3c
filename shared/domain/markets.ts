// Market presets for a dealership (TRADE.md §1.1, §2.5). Codes match
// shared/constants/market.ts ("CA_ON"); the hyphenated "CA-ON" is accepted too.
import { MM_PER_INCH } from "./units.ts";

export type MarketCode = "EU" | "UK" | "AU" | "NZ" | "US" | "CA_ON" | "CA_QC";
export type DistanceUnit = "km" | "mi";

export interface MarketPreset {
  code: MarketCode;
  name: string;
  legalMinimumTreadMm: number;
  treadSource: string;
  distanceUnit: DistanceUnit;
  /** ISO 4217. */
  currency: string;
  vinCheckDigitMandatory: boolean;
  vinSource: string;
  /** Traffic keeps left, so "nearside/offside" may be shown (TRADE.md §9.2, CP). */
  drivesOnLeft: boolean;
}

/** 2/32 in, exact from 1 in = 25.4 mm (TRADE.md §2.5). */
export const US_MINIMUM_TREAD_MM = (2 / 32) * MM_PER_INCH;

const VIN_NOT_MANDATORY = "ISO 3779 does not require a check digit; warn, do not reject (TRADE.md §1.1, S2 [S2])";

export const MARKETS: Readonly<Record<MarketCode, MarketPreset>> = {
  EU: {
    code: "EU",
    name: "European Union",
    legalMinimumTreadMm: 1.6,
    treadSource: "Council Directive 89/459/EEC (OJ L 226, 3.8.1989), main grooves, M1/N1/O1/O2 (TRADE.md §2.5, S [S7])",
    distanceUnit: "km",
    currency: "EUR",
    vinCheckDigitMandatory: false,
    vinSource: VIN_NOT_MANDATORY,
    drivesOnLeft: false,
  },
  UK: {
    code: "UK",
    name: "United Kingdom",
    legalMinimumTreadMm: 1.6,
    treadSource: "Road Vehicles (Construction and Use) Regulations 1986 reg 27, central ¾ of the breadth (TRADE.md §2.5, S2 [S8])",
    distanceUnit: "mi",
    currency: "GBP",
    vinCheckDigitMandatory: false,
    vinSource: VIN_NOT_MANDATORY,
    drivesOnLeft: true,
  },
  AU: {
    code: "AU",
    name: "Australia",
    legalMinimumTreadMm: 1.5,
    treadSource: "WA Road Traffic (Vehicles) Regulations 2014 r 270(2), all principal grooves (TRADE.md §2.5, S [S9])",
    distanceUnit: "km",
    currency: "AUD",
    vinCheckDigitMandatory: false,
    vinSource: VIN_NOT_MANDATORY,
    drivesOnLeft: true,
  },
  NZ: {
    code: "NZ",
    name: "New Zealand",
    legalMinimumTreadMm: 1.5,
    treadSource: "Land Transport Rule: Tyres and Wheels 2001, NZTA info sheet (TRADE.md §2.5, S2 [S10])",
    distanceUnit: "km",
    currency: "NZD",
    vinCheckDigitMandatory: false,
    vinSource: VIN_NOT_MANDATORY,
    drivesOnLeft: true,
  },
  US: {
    code: "US",
    name: "United States",
    legalMinimumTreadMm: US_MINIMUM_TREAD_MM,
    treadSource: "2/32 in, most states, e.g. Maryland COMAR 11.22.04.06 (TRADE.md §2.5, S [S12]); California 1/32 in (M)",
    distanceUnit: "mi",
    currency: "USD",
    vinCheckDigitMandatory: true,
    vinSource: "49 CFR 565.4(c): check digit mandatory (TRADE.md §1.1, S [S1])",
    drivesOnLeft: false,
  },
  CA_ON: {
    code: "CA_ON",
    name: "Canada — Ontario",
    legalMinimumTreadMm: 1.5,
    treadSource: "R.R.O. 1990, Reg. 625 s 3(1), two adjacent major grooves (TRADE.md §2.5, S [S11])",
    distanceUnit: "km",
    currency: "CAD",
    vinCheckDigitMandatory: true,
    vinSource: "CMVSS 115 mirrors 49 CFR Part 565 (TRADE.md §1.1, S [S1][S3])",
    drivesOnLeft: false,
  },
  CA_QC: {
    code: "CA_QC",
    name: "Canada — Québec",
    legalMinimumTreadMm: 1.6,
    treadSource: "C-24.2, r. 32, ss 159(1) and 178(2), main groove (TRADE.md §2.5, S [S11])",
    distanceUnit: "km",
    currency: "CAD",
    vinCheckDigitMandatory: true,
    vinSource: "CMVSS 115 mirrors 49 CFR Part 565 (TRADE.md §1.1, S [S1][S3])",
    drivesOnLeft: false,
  },
};

export const MARKET_CODES = Object.keys(MARKETS) as MarketCode[];

/** Looks a preset up by "CA_ON" or "CA-ON" (any case); null for an unknown code. */
export function marketPreset(code: string | null | undefined): MarketPreset | null {
  if (typeof code !== "string") return null;
  const key = code.trim().toUpperCase().replace("-", "_");
  return Object.hasOwn(MARKETS, key) ? MARKETS[key as MarketCode] : null;
}
