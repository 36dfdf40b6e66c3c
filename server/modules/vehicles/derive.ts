import type { Dealership, Vehicle } from "../../db/schema/index.ts";
import { vehicles } from "../../db/schema/index.ts";
import { computeDerived, type Derived } from "../../../shared/domain/derived.ts";
import { derivedInputOf, odometerKmOf } from "../../../shared/domain/derived-input.ts";

export { odometerKmOf };

export type Stored = Omit<typeof vehicles.$inferInsert, "id" | "dealershipId" | "stockNumber" | "stockedAt" | "derived">;

export function deriveFor(v: Pick<Vehicle, keyof Stored> & { odometerKmIndex?: number | null }, d: Dealership, today: string): Derived {
  return computeDerived(derivedInputOf(v), {
    today,
    checkDigitMandatory: d.vinCheckDigitMandatory,
    serviceIntervalKm: d.serviceIntervalKm,
    serviceIntervalMonths: d.serviceIntervalMonths,
  });
}
