import type { Dealership } from "../../db/schema/index.ts";
import { vehicles } from "../../db/schema/index.ts";
import { computeDerived, type Derived } from "../../../shared/domain/derived.ts";
import { derivedInputOf, odometerKmOf, type DerivedSource } from "../../../shared/domain/derived-input.ts";

export { odometerKmOf };

export type Stored = Omit<typeof vehicles.$inferInsert, "id" | "dealershipId" | "stockNumber" | "stockedAt" | "derived">;

/** The derived figures of a vehicle as stored, or of a row about to be stored (any object with the fields it reads). */
export function deriveFor(v: DerivedSource, d: Dealership, today: string): Derived {
  return computeDerived(derivedInputOf(v), {
    today,
    checkDigitMandatory: d.vinCheckDigitMandatory,
    serviceIntervalKm: d.serviceIntervalKm,
    serviceIntervalMonths: d.serviceIntervalMonths,
  });
}
