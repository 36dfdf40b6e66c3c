// Estimated tailpipe CO2 from fuel use (TRADE.md §5). It is an estimate from a
// carbon factor, not the type-approval figure, so the factor and its source
// travel with every result.
import { isPositive } from "./guards.ts";
import { isFuelType, type FuelType } from "./fuel.ts";
import { LITRES_PER_US_GALLON } from "./units.ts";

export interface Co2Factor {
  fuel: "petrol" | "diesel";
  value: number;
  unit: "g CO2/US gal";
  gramsPerLitre: number;
  source: string;
  status: "S";
}

function factor(fuel: Co2Factor["fuel"], gramsPerGallon: number, source: string): Co2Factor {
  return {
    fuel,
    value: gramsPerGallon,
    unit: "g CO2/US gal",
    gramsPerLitre: gramsPerGallon / LITRES_PER_US_GALLON,
    source,
    status: "S",
  };
}

export const CO2_FACTORS: Readonly<Record<Co2Factor["fuel"], Co2Factor>> = {
  petrol: factor("petrol", 8887, "US EPA EPA-420-F-11-041 (2011), gasoline 8,887 g CO2/gal (from 75 FR 25324)"),
  diesel: factor("diesel", 10180, "US EPA EPA-420-F-11-041 (2011), diesel 10,180 g CO2/gal (from 40 CFR 600.113)"),
};

// Hybrids burn petrol; electric has no tailpipe figure from fuel; LPG has no
// sourced factor in TRADE.md, and a guessed one would be presented as fact.
const FACTOR_FOR_FUEL: Readonly<Record<FuelType, Co2Factor | null>> = {
  petrol: CO2_FACTORS.petrol,
  hybrid: CO2_FACTORS.petrol,
  plug_in_hybrid: CO2_FACTORS.petrol,
  diesel: CO2_FACTORS.diesel,
  electric: null,
  lpg: null,
};

export function co2FactorFor(fuelType: unknown): Co2Factor | null {
  return isFuelType(fuelType) ? FACTOR_FOR_FUEL[fuelType] : null;
}

export interface Co2Estimate {
  gramsPerKm: number;
  factorGramsPerLitre: number;
  source: string;
}

/** g/km = (L/100 km) ÷ 100 × g/L, unrounded; null without a sourced factor. */
export function co2GramsPerKmEstimate(l100km: number | null | undefined, fuelType: unknown): Co2Estimate | null {
  const f = co2FactorFor(fuelType);
  if (!f || !isPositive(l100km)) return null;
  return { gramsPerKm: (l100km / 100) * f.gramsPerLitre, factorGramsPerLitre: f.gramsPerLitre, source: f.source };
}
