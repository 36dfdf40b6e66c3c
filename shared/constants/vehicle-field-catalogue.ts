// The vehicle field catalogue: every input field of a vehicle (shared/schemas/vehicles.ts) written once, with the
// words each screen uses for it. The editor, "what changed" between revisions, the public specification and the
// feed columns read their labels here; vehicle-fields.ts derives the groups and who may edit them.
import { ASPIRATIONS, BODY_TYPES, DISTANCE_UNITS_ENTERED, DRIVE_TYPES, FUEL_TYPES, LABELS, TEST_CYCLES, TRANSMISSIONS } from "./vehicle.ts";

/** The editor's sections; each is edited under the action `vehicle.<group>.edit` of shared/permissions.ts. */
export const FIELD_GROUP_NAMES = ["identity", "specification", "economy", "history", "listing", "price"] as const;
export type FieldGroup = (typeof FIELD_GROUP_NAMES)[number];

export type FieldKind = "text" | "integer" | "decimal" | "enum" | "date" | "money" | "list";

export interface FieldSpec {
  /** Staff words: the editor's label. */
  label: string;
  group: FieldGroup;
  kind: FieldKind;
  unit?: string;
  /** An enum's values with their words, in the order the editor offers them. */
  options?: ReadonlyArray<readonly [string, string]>;
  /** Buyers see it: it is frozen into each revision's snapshot and shown on the condition page. */
  public: boolean;
  /** Its row on the public specification, when it has one of its own. */
  spec?: string;
  /** The buyer's word for it in "Specification updated: …" between revisions; absent when a change is told its own way or not at all. */
  change?: string;
  /** The CSV/XML feed column that carries it (shared/schemas/feeds.ts keeps the catalogue order of columns). */
  feed?: { column: string; label: string };
}

const opts = <T extends string>(values: readonly T[], labels: Record<T, string>) => values.map((v) => [v, labels[v]] as const);

/**
 * In group order, and within a group in the order "what changed" lists them. Labels are the texts the screens
 * already showed; where two screens used different words for one field, both are kept (staff label, buyer's spec row).
 * `firstRegistrationDate`, `make`, `model` and `aspiration` have no `change` word: revisions never named them.
 */
export const VEHICLE_FIELDS = {
  vin: { label: "VIN", group: "identity", kind: "text", public: true, spec: "VIN", change: "VIN", feed: { column: "vin", label: "VIN" } },
  // The plate ties the car to its keeper's registration: staff only, never in a snapshot or feed.
  registrationPlate: { label: "Registration plate", group: "identity", kind: "text", public: false },
  make: { label: "Make", group: "identity", kind: "text", public: true, spec: "Make", feed: { column: "make", label: "Make" } },
  model: { label: "Model", group: "identity", kind: "text", public: true, spec: "Model", feed: { column: "model", label: "Model" } },
  buildYear: { label: "Build year", group: "identity", kind: "integer", public: true, spec: "Build year", change: "build year", feed: { column: "buildYear", label: "Build year" } },
  variant: { label: "Variant or trim", group: "identity", kind: "text", public: true, spec: "Variant", change: "variant", feed: { column: "variant", label: "Variant" } },
  firstRegistrationDate: {
    label: "First registered", group: "identity", kind: "date", public: true, spec: "First registered", feed: { column: "firstRegistrationDate", label: "First registered" },
  },
  colour: { label: "Colour", group: "identity", kind: "text", public: true, spec: "Colour", change: "colour", feed: { column: "colour", label: "Colour" } },

  bodyType: {
    label: "Body", group: "specification", kind: "enum", options: opts(BODY_TYPES, LABELS.bodyType),
    public: true, spec: "Body", change: "body", feed: { column: "bodyType", label: "Body type" },
  },
  doors: { label: "Doors", group: "specification", kind: "integer", public: true, spec: "Doors", change: "doors", feed: { column: "doors", label: "Doors" } },
  seats: { label: "Seats", group: "specification", kind: "integer", public: true, spec: "Seats", change: "seats", feed: { column: "seats", label: "Seats" } },
  driveType: {
    label: "Drive", group: "specification", kind: "enum", options: opts(DRIVE_TYPES, LABELS.driveType),
    public: true, spec: "Drive", change: "drive", feed: { column: "driveType", label: "Drive" },
  },
  fuelType: {
    label: "Fuel", group: "specification", kind: "enum", options: opts(FUEL_TYPES, LABELS.fuelType),
    public: true, spec: "Fuel", change: "fuel", feed: { column: "fuelType", label: "Fuel" },
  },
  engineCapacityCc: {
    label: "Engine capacity", group: "specification", kind: "integer", unit: "cc",
    public: true, spec: "Engine", change: "engine capacity", feed: { column: "engineCapacityCc", label: "Engine capacity (cc)" },
  },
  cylinders: { label: "Cylinders", group: "specification", kind: "integer", public: true, spec: "Cylinders", change: "cylinders", feed: { column: "cylinders", label: "Cylinders" } },
  aspiration: {
    label: "Aspiration", group: "specification", kind: "enum", options: opts(ASPIRATIONS, LABELS.aspiration),
    public: true, spec: "Aspiration", feed: { column: "aspiration", label: "Aspiration" },
  },
  powerKw: { label: "Power", group: "specification", kind: "decimal", unit: "kW", public: true, spec: "Power", change: "power", feed: { column: "powerKw", label: "Power (kW)" } },
  torqueNm: { label: "Torque", group: "specification", kind: "decimal", unit: "N·m", public: true, spec: "Torque", change: "torque", feed: { column: "torqueNm", label: "Torque (N·m)" } },
  transmission: {
    label: "Transmission", group: "specification", kind: "enum", options: opts(TRANSMISSIONS, LABELS.transmission),
    public: true, spec: "Gearbox", change: "transmission", feed: { column: "transmission", label: "Transmission" },
  },
  // Shown inside the spec's "Gearbox" row, not a row of its own.
  gears: { label: "Gears", group: "specification", kind: "integer", public: true, change: "gears", feed: { column: "gears", label: "Gears" } },
  kerbWeightKg: {
    label: "Kerb weight", group: "specification", kind: "decimal", unit: "kg",
    public: true, spec: "Kerb weight", change: "kerb weight", feed: { column: "kerbWeightKg", label: "Kerb weight (kg)" },
  },

  fuelTankLitres: {
    label: "Fuel tank", group: "economy", kind: "decimal", unit: "L", public: true, spec: "Fuel tank", change: "tank size", feed: { column: "fuelTankLitres", label: "Fuel tank (L)" },
  },
  fuelConsumptionL100km: {
    label: "Fuel consumption", group: "economy", kind: "decimal", unit: "L/100 km",
    public: true, spec: "Fuel use", change: "fuel consumption", feed: { column: "fuelConsumption", label: "Fuel consumption (in the feed's units)" },
  },
  // Shown inside the spec's "Fuel use" and range rows.
  consumptionTestCycle: {
    label: "Consumption measured on", group: "economy", kind: "enum", options: opts(TEST_CYCLES, LABELS.consumptionTestCycle), public: true, change: "test cycle",
  },
  batteryKwh: {
    label: "Battery (usable)", group: "economy", kind: "decimal", unit: "kWh", public: true, spec: "Battery", change: "battery", feed: { column: "batteryKwh", label: "Battery (kWh)" },
  },
  energyKwh100km: {
    label: "Energy consumption", group: "economy", kind: "decimal", unit: "kWh/100 km",
    public: true, spec: "Energy use", change: "energy use", feed: { column: "energyKwh100km", label: "Energy use (kWh/100 km)" },
  },

  // The odometer is stored as read; its change has a sentence of its own ("Odometer reading updated …").
  odometerReading: { label: "Odometer as read", group: "history", kind: "integer", public: true, spec: "Odometer, as read", feed: { column: "odometer", label: "Odometer (in the feed's units)" } },
  odometerUnit: { label: "Unit on the dash", group: "history", kind: "enum", options: opts(DISTANCE_UNITS_ENTERED, { km: "Kilometres", mi: "Miles" }), public: true },
  // The API's other way to send the odometer, in km; stored as the odometer_km_index, not edited in the editor.
  odometerKm: { label: "Odometer", group: "history", kind: "integer", unit: "km", public: true },
  keysCount: { label: "Keys", group: "history", kind: "integer", public: true, spec: "Keys", change: "keys", feed: { column: "keysCount", label: "Keys" } },
  previousOwners: {
    label: "Previous owners", group: "history", kind: "integer", public: true, spec: "Previous owners", change: "previous owners", feed: { column: "previousOwners", label: "Previous owners" },
  },
  // Service history, features, copy and price are told in sentences of their own between revisions.
  serviceHistory: { label: "Service history", group: "history", kind: "list", public: true },

  description: { label: "Listing copy", group: "listing", kind: "text", public: true, feed: { column: "descriptionHtml", label: "Description (HTML)" } },
  features: { label: "Features", group: "listing", kind: "list", public: true, spec: "Features", feed: { column: "features", label: "Features" } },

  priceCents: { label: "Price", group: "price", kind: "money", public: true, feed: { column: "priceCents", label: "Price in cents" } },
} as const satisfies Record<string, FieldSpec>;

export type VehicleFieldName = keyof typeof VEHICLE_FIELDS;

type Catalogue = typeof VEHICLE_FIELDS;
/** Every feed column name the catalogue gives a field. */
export type FieldFeedColumn = { [K in VehicleFieldName]: Catalogue[K] extends { feed: { column: infer C } } ? C : never }[VehicleFieldName];
