// The fuel types of API.md, shared by the CO2, range and derived modules.
export const FUEL_TYPES = ["petrol", "diesel", "hybrid", "plug_in_hybrid", "electric", "lpg"] as const;
export type FuelType = (typeof FUEL_TYPES)[number];

export function isFuelType(value: unknown): value is FuelType {
  return typeof value === "string" && (FUEL_TYPES as readonly string[]).includes(value);
}
