import type { Role } from "./roles.ts";

/**
 * The vehicle editor's sections, and which roles may change each (../shared/PRODUCT.md roles): admin and sales
 * edit everything; workshop edits the odometer, service history and specification but not price or copy;
 * marketing edits the listing copy only.
 */
export const FIELD_GROUPS = {
  identity: ["vin", "registrationPlate", "make", "model", "variant", "buildYear", "firstRegistrationDate", "colour"],
  specification: [
    "bodyType", "doors", "seats", "driveType", "fuelType", "engineCapacityCc", "cylinders", "aspiration", "powerKw", "torqueNm",
    "transmission", "gears", "kerbWeightKg",
  ],
  economy: ["fuelTankLitres", "fuelConsumptionL100km", "consumptionTestCycle", "batteryKwh", "energyKwh100km"],
  history: ["odometerReading", "odometerUnit", "odometerKm", "keysCount", "previousOwners", "serviceHistory"],
  listing: ["description", "features"],
  price: ["priceCents"],
} as const;

export type FieldGroup = keyof typeof FIELD_GROUPS;

export const GROUP_EDITORS: Record<FieldGroup, readonly Role[]> = {
  identity: ["admin", "sales"],
  specification: ["admin", "sales", "workshop"],
  economy: ["admin", "sales", "workshop"],
  history: ["admin", "sales", "workshop"],
  listing: ["admin", "sales", "marketing"],
  price: ["admin", "sales"],
};

const groupOf = new Map<string, FieldGroup>(
  (Object.entries(FIELD_GROUPS) as Array<[FieldGroup, readonly string[]]>).flatMap(([g, fields]) => fields.map((f) => [f, g] as const)),
);

export const fieldGroup = (field: string): FieldGroup | undefined => groupOf.get(field);

/** The fields of a change that the role may not make; empty when all are allowed. */
export function forbiddenFields(role: Role, fields: string[]): string[] {
  return fields.filter((f) => {
    const g = groupOf.get(f);
    return !g || !GROUP_EDITORS[g].includes(role);
  });
}

export const canEditGroup = (role: Role, group: FieldGroup) => GROUP_EDITORS[group].includes(role);
