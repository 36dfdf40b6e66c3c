import { VEHICLE_FIELDS, type FieldGroup, type FieldKind as CatalogueKind, type FieldSpec, type VehicleFieldName } from "../../../../shared/constants/vehicle-fields.ts";

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

const INPUT_KIND: Record<CatalogueKind, FieldKind> = { text: "text", integer: "int", decimal: "number", enum: "enum", date: "date", money: "money", list: "text" };

/** A catalogued field as the editor shows it: label, group, unit, kind and options come from the field catalogue. */
const field = (name: VehicleFieldName, look: Pick<FieldDef, "mono" | "hint" | "upper"> = {}): FieldDef => {
  const f: FieldSpec = VEHICLE_FIELDS[name];
  const { label, group, kind, options, unit } = f;
  return { name, label, group, kind: INPUT_KIND[kind], ...(options ? { options } : {}), ...(unit ? { unit } : {}), ...look };
};

/** The scalar inputs of the editor, section by section. Lists (features, service history) have their own editors. */
export const FIELDS: FieldDef[] = [
  field("vin", { mono: true, upper: true, hint: "17 characters, no I, O or Q." }),
  field("registrationPlate", { mono: true, upper: true }),
  field("make"),
  field("model"),
  field("variant"),
  field("buildYear"),
  field("firstRegistrationDate"),
  field("colour"),

  field("bodyType"),
  field("doors"),
  field("seats"),
  field("driveType"),
  field("fuelType"),
  field("engineCapacityCc"),
  field("cylinders"),
  field("aspiration"),
  field("powerKw"),
  field("torqueNm"),
  field("transmission"),
  field("gears"),
  field("kerbWeightKg"),

  field("fuelTankLitres"),
  field("fuelConsumptionL100km"),
  field("consumptionTestCycle"),
  field("batteryKwh"),
  field("energyKwh100km"),

  field("odometerReading"),
  field("odometerUnit"),
  field("keysCount"),
  field("previousOwners"),

  field("priceCents"),
];

export const SECTIONS: Array<{ group: FieldGroup; title: string; lead: string }> = [
  { group: "identity", title: "Identity", lead: "What the vehicle is. The VIN is checked as you type." },
  { group: "specification", title: "Specification", lead: "From the compliance plate, the handbook or the maker's data." },
  { group: "economy", title: "Economy and range", lead: "Range is worked out from these; it is theoretical, on the stated test cycle." },
  { group: "history", title: "Odometer, keys and service history", lead: "Enter the odometer exactly as the dash shows it, in its own unit." },
  { group: "listing", title: "Listing copy", lead: "What buyers read. Markdown: **bold**, lists with -, links." },
  { group: "price", title: "Price", lead: "The advertised drive-away price." },
];
