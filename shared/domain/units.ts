// Exact unit definitions (TRADE.md §3). Every conversion derives from these,
// so no rounded factor (235.2, 0.621…) ever enters a computation.
import { isNonNegative, isPositive } from "./guards.ts";

/** 231 in³, exact since 1 in = 25.4 mm (TRADE.md §3, S2 [S19a]). */
export const LITRES_PER_US_GALLON = 3.785411784;
/** Exact by UK Weights and Measures Act 1985 (TRADE.md §3, M). */
export const LITRES_PER_IMPERIAL_GALLON = 4.54609;
/** International mile, 5280 × 0.3048 m (TRADE.md §3, S2 [S19a]). */
export const KM_PER_MILE = 1.609344;
/** Avoirdupois pound, 1959 agreement (TRADE.md §3, S2 [S19a]). */
export const KG_PER_POUND = 0.45359237;
/** 0.45359237 kg × 9.80665 m/s² × 0.3048 m (TRADE.md §3, computed). */
export const NEWTON_METRES_PER_LBF_FT = 1.3558179483314003;
/** 550 ft·lbf/s (TRADE.md §3, S [S30]). */
export const WATTS_PER_MECHANICAL_HP = 745.6998715822702;
/** 75 kgf·m/s (TRADE.md §3, S [S23]). */
export const WATTS_PER_PS = 735.49875;
export const MM_PER_INCH = 25.4;

/** 100 × L/US gal ÷ km/mi = 235.214583… (TRADE.md §3). */
export const MPG_US_TIMES_L100KM = (100 * LITRES_PER_US_GALLON) / KM_PER_MILE;
/** 100 × L/imp gal ÷ km/mi = 282.480936… (TRADE.md §3). */
export const MPG_IMPERIAL_TIMES_L100KM = (100 * LITRES_PER_IMPERIAL_GALLON) / KM_PER_MILE;

type Input = number | null | undefined;

// Fuel economy is a reciprocal relation: zero or negative has no meaning and
// would divide by zero, so it is null rather than Infinity.
export function l100kmToMpgUs(l100km: Input): number | null {
  return isPositive(l100km) ? MPG_US_TIMES_L100KM / l100km : null;
}

export function l100kmToMpgImperial(l100km: Input): number | null {
  return isPositive(l100km) ? MPG_IMPERIAL_TIMES_L100KM / l100km : null;
}

export function mpgUsToL100km(mpg: Input): number | null {
  return isPositive(mpg) ? MPG_US_TIMES_L100KM / mpg : null;
}

export function mpgImperialToL100km(mpg: Input): number | null {
  return isPositive(mpg) ? MPG_IMPERIAL_TIMES_L100KM / mpg : null;
}

export function l100kmToKmPerL(l100km: Input): number | null {
  return isPositive(l100km) ? 100 / l100km : null;
}

// Power, torque and mass of a vehicle are never zero, so zero is treated as
// "not recorded" and gives null.
export function kwToHp(kw: Input): number | null {
  return isPositive(kw) ? (kw * 1000) / WATTS_PER_MECHANICAL_HP : null;
}

export function kwToPs(kw: Input): number | null {
  return isPositive(kw) ? (kw * 1000) / WATTS_PER_PS : null;
}

export function psToKw(ps: Input): number | null {
  return isPositive(ps) ? (ps * WATTS_PER_PS) / 1000 : null;
}

export function nmToLbft(nm: Input): number | null {
  return isPositive(nm) ? nm / NEWTON_METRES_PER_LBF_FT : null;
}

export function kgToLb(kg: Input): number | null {
  return isPositive(kg) ? kg / KG_PER_POUND : null;
}

// Distances may legitimately be zero (a new odometer), so only negatives are refused.
export function kmToMiles(km: Input): number | null {
  return isNonNegative(km) ? km / KM_PER_MILE : null;
}

export function milesToKm(miles: Input): number | null {
  return isNonNegative(miles) ? miles * KM_PER_MILE : null;
}

export function mmToInches(mm: Input): number | null {
  return isNonNegative(mm) ? mm / MM_PER_INCH : null;
}
