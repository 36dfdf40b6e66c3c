import {
  ASPIRATIONS, BODY_TYPES, DRIVE_TYPES, FUEL_TYPES, LABELS, TEST_CYCLES, TRANSMISSIONS,
} from "../../../../shared/constants/vehicle.ts";
import type { FieldGroup } from "../../../../shared/constants/vehicle-fields.ts";

export type FieldKind = "text" | "int" | "number" | "enum" | "date" | "money";

export interface FieldDef {
  name: string;
  label: string;
  group: FieldGroup;
  kind: FieldKind;
  options?: ReadonlyArray<readonly [string, string]>;
  unit?: string;
  mono?: boolean;
  hint?: string;
  upper?: boolean;
}

const opts = <T extends string>(values: readonly T[], labels: Record<T, string>) => values.map((v) => [v, labels[v]] as const);

/** The scalar inputs of the editor, section by section. Lists (features, service history) have their own editors. */
export const FIELDS: FieldDef[] = [
  { name: "vin", label: "VIN", group: "identity", kind: "text", mono: true, upper: true, hint: "17 characters, no I, O or Q." },
  { name: "registrationPlate", label: "Registration plate", group: "identity", kind: "text", mono: true, upper: true },
  { name: "make", label: "Make", group: "identity", kind: "text" },
  { name: "model", label: "Model", group: "identity", kind: "text" },
  { name: "variant", label: "Variant or trim", group: "identity", kind: "text" },
  { name: "buildYear", label: "Build year", group: "identity", kind: "int" },
  { name: "firstRegistrationDate", label: "First registered", group: "identity", kind: "date" },
  { name: "colour", label: "Colour", group: "identity", kind: "text" },

  { name: "bodyType", label: "Body", group: "specification", kind: "enum", options: opts(BODY_TYPES, LABELS.bodyType) },
  { name: "doors", label: "Doors", group: "specification", kind: "int" },
  { name: "seats", label: "Seats", group: "specification", kind: "int" },
  { name: "driveType", label: "Drive", group: "specification", kind: "enum", options: opts(DRIVE_TYPES, LABELS.driveType) },
  { name: "fuelType", label: "Fuel", group: "specification", kind: "enum", options: opts(FUEL_TYPES, LABELS.fuelType) },
  { name: "engineCapacityCc", label: "Engine capacity", group: "specification", kind: "int", unit: "cc" },
  { name: "cylinders", label: "Cylinders", group: "specification", kind: "int" },
  { name: "aspiration", label: "Aspiration", group: "specification", kind: "enum", options: opts(ASPIRATIONS, LABELS.aspiration) },
  { name: "powerKw", label: "Power", group: "specification", kind: "number", unit: "kW" },
  { name: "torqueNm", label: "Torque", group: "specification", kind: "number", unit: "N·m" },
  { name: "transmission", label: "Transmission", group: "specification", kind: "enum", options: opts(TRANSMISSIONS, LABELS.transmission) },
  { name: "gears", label: "Gears", group: "specification", kind: "int" },
  { name: "kerbWeightKg", label: "Kerb weight", group: "specification", kind: "number", unit: "kg" },

  { name: "fuelTankLitres", label: "Fuel tank", group: "economy", kind: "number", unit: "L" },
  { name: "fuelConsumptionL100km", label: "Fuel consumption", group: "economy", kind: "number", unit: "L/100 km" },
  { name: "consumptionTestCycle", label: "Consumption measured on", group: "economy", kind: "enum", options: opts(TEST_CYCLES, LABELS.consumptionTestCycle) },
  { name: "batteryKwh", label: "Battery (usable)", group: "economy", kind: "number", unit: "kWh" },
  { name: "energyKwh100km", label: "Energy consumption", group: "economy", kind: "number", unit: "kWh/100 km" },

  { name: "odometerReading", label: "Odometer as read", group: "history", kind: "int" },
  { name: "odometerUnit", label: "Unit on the dash", group: "history", kind: "enum", options: [["km", "Kilometres"], ["mi", "Miles"]] },
  { name: "keysCount", label: "Keys", group: "history", kind: "int" },
  { name: "previousOwners", label: "Previous owners", group: "history", kind: "int" },

  { name: "priceCents", label: "Price", group: "price", kind: "money" },
];

export const SECTIONS: Array<{ group: FieldGroup; title: string; lead: string }> = [
  { group: "identity", title: "Identity", lead: "What the vehicle is. The VIN is checked as you type." },
  { group: "specification", title: "Specification", lead: "From the compliance plate, the handbook or the maker's data." },
  { group: "economy", title: "Economy and range", lead: "Range is worked out from these; it is theoretical, on the stated test cycle." },
  { group: "history", title: "Odometer, keys and service history", lead: "Enter the odometer exactly as the dash shows it, in its own unit." },
  { group: "listing", title: "Listing copy", lead: "What buyers read. Markdown: **bold**, lists with -, links." },
  { group: "price", title: "Price", lead: "The advertised drive-away price." },
];
