import type { DistanceUnit, MarketCode } from "./market.ts";

export interface MarketPreset {
  label: string;
  distanceUnit: DistanceUnit;
  currency: string;
  legalMinTreadMm: number;
  treadSource: string;
  vinCheckDigitMandatory: boolean;
}

/**
 * Defaults applied when a dealership picks its market; every value stays editable. Tread minimums and sources
 * are those of ../shared/TRADE.md §2.5; the check digit is mandatory in the US and Canada (49 CFR 565.4(c); CMVSS 115).
 */
export const MARKET_PRESETS: Record<MarketCode, MarketPreset> = {
  AU: { label: "Australia", distanceUnit: "km", currency: "AUD", legalMinTreadMm: 1.5, treadSource: "WA Road Traffic (Vehicles) Regulations 2014 r 270(2)", vinCheckDigitMandatory: false },
  NZ: { label: "New Zealand", distanceUnit: "km", currency: "NZD", legalMinTreadMm: 1.5, treadSource: "Land Transport Rule: Tyres and Wheels 2001", vinCheckDigitMandatory: false },
  UK: { label: "United Kingdom", distanceUnit: "mi", currency: "GBP", legalMinTreadMm: 1.6, treadSource: "Road Vehicles (Construction and Use) Regulations 1986 reg 27", vinCheckDigitMandatory: false },
  EU: { label: "European Union", distanceUnit: "km", currency: "EUR", legalMinTreadMm: 1.6, treadSource: "Council Directive 89/459/EEC", vinCheckDigitMandatory: false },
  // 2/32 in = 1.5875 mm exactly (1 in = 25.4 mm).
  US: { label: "United States", distanceUnit: "mi", currency: "USD", legalMinTreadMm: 1.5875, treadSource: "COMAR 11.22.04.06 (2/32 in, most states)", vinCheckDigitMandatory: true },
  CA_ON: { label: "Canada: Ontario", distanceUnit: "km", currency: "CAD", legalMinTreadMm: 1.5, treadSource: "Ontario R.R.O. 1990, Reg. 625 s 3(1)", vinCheckDigitMandatory: true },
  CA_QC: { label: "Canada: Québec", distanceUnit: "km", currency: "CAD", legalMinTreadMm: 1.6, treadSource: "Québec C-24.2, r. 32, s 159(1)", vinCheckDigitMandatory: true },
};
