// The textual form of a VIN, shared by the structure and model-year modules.
import { isNonEmptyString } from "./guards.ts";

export const VIN_LENGTH = 17;

/** Trims and upper-cases; an empty or missing VIN is null. */
export function normaliseVin(vin: unknown): string | null {
  return isNonEmptyString(vin) ? vin.trim().toUpperCase() : null;
}
