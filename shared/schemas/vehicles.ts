import { z } from "zod";
import {
  ASPIRATIONS, BODY_TYPES, DISTANCE_UNITS_ENTERED, DRIVE_TYPES, FUEL_TYPES, SERVICE_KINDS, TEST_CYCLES, TRANSMISSIONS, VEHICLE_STATUSES,
} from "../constants/vehicle.ts";
import { validateVinStructure, normaliseVin } from "../domain/vin.ts";
import { versionSchema } from "./common.ts";

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** A number field: the message says the range, so a person can fix it without guessing. */
const num = (label: string, min: number, max: number, opts: { int?: boolean; unit?: string } = {}) => {
  const unit = opts.unit ? ` ${opts.unit}` : "";
  let s = z.number({ error: `${label} must be a number.` });
  if (opts.int) s = s.int(`${label} must be a whole number.`);
  return s.min(min, `${label} must be at least ${min}${unit}.`).max(max, `${label} must be at most ${max}${unit}.`).nullable().optional();
};

const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text.` }).trim().max(max, `${label} is at most ${max} characters.`).nullable().optional();

const choice = <T extends readonly [string, ...string[]]>(label: string, values: T) =>
  z.enum(values, { error: `Choose a ${label} from the list.` }).nullable().optional();

/** Dates are calendar days; `today` comes from the caller so the schema stays pure. */
const pastDate = (label: string, today: string) =>
  z
    .string({ error: `${label} must be a date.` })
    .regex(ISO_DATE, `${label} must be a date like 2024-03-01.`)
    .refine((d) => !Number.isNaN(Date.parse(d + "T00:00:00Z")) && new Date(d + "T00:00:00Z").toISOString().startsWith(d), `${label} is not a real date.`)
    .refine((d) => d <= today, `${label} cannot be in the future.`)
    .refine((d) => d >= "1900-01-01", `${label} is before 1900.`);

export const vinSchema = z
  .string({ error: "The VIN must be text." })
  .transform((v) => normaliseVin(v) ?? "")
  .superRefine((v, ctx) => {
    for (const issue of validateVinStructure(v)) ctx.addIssue({ code: "custom", message: issue.message });
  });

export const serviceEntrySchema = (today: string) =>
  z.strictObject({
    date: pastDate("The service date", today),
    odometerKm: z.number({ error: "The odometer must be a number." }).int("Whole kilometres only.").min(0, "The odometer cannot be negative.").max(2_000_000, "That odometer reading is beyond any road vehicle."),
    kind: z.enum(SERVICE_KINDS, { error: "Choose what kind of work it was." }),
    workshop: z.string().trim().max(120, "At most 120 characters.").default(""),
    notes: z.string().trim().max(1000, "At most 1000 characters.").default(""),
  });
export type ServiceEntryInput = z.infer<ReturnType<typeof serviceEntrySchema>>;

export const FEATURE_MAX = 60;

/** Every input field of a vehicle (../shared/API.md), optional and nullable so a record can be built in stages. */
export function vehicleFieldsSchema(today: string) {
  const year = Number(today.slice(0, 4));
  return z.strictObject({
    vin: vinSchema.nullable().optional(),
    registrationPlate: z
      .string({ error: "The plate must be text." })
      .trim()
      .toUpperCase()
      .max(12, "A plate is at most 12 characters.")
      .regex(/^[A-Z0-9 -]*$/, "A plate holds letters, digits, spaces and hyphens only.")
      .nullable()
      .optional(),
    make: text("The make", 60),
    model: text("The model", 60),
    variant: text("The variant", 80),
    buildYear: num("The build year", 1900, year + 1, { int: true }),
    firstRegistrationDate: pastDate("The first registration date", today).nullable().optional(),
    bodyType: choice("body type", BODY_TYPES),
    colour: text("The colour", 40),
    doors: num("Doors", 1, 7, { int: true }),
    seats: num("Seats", 1, 15, { int: true }),
    odometerReading: num("The odometer", 0, 2_000_000, { int: true }),
    odometerUnit: z.enum(DISTANCE_UNITS_ENTERED, { error: "The odometer unit is km or mi." }).optional(),
    odometerKm: num("The odometer", 0, 2_000_000, { int: true }),
    driveType: choice("drive type", DRIVE_TYPES),
    fuelType: choice("fuel type", FUEL_TYPES),
    engineCapacityCc: num("Engine capacity", 50, 10_000, { int: true, unit: "cc" }),
    cylinders: num("Cylinders", 0, 16, { int: true }),
    aspiration: choice("aspiration", ASPIRATIONS),
    powerKw: num("Power", 1, 1500, { unit: "kW" }),
    torqueNm: num("Torque", 1, 3000, { unit: "N·m" }),
    transmission: choice("transmission", TRANSMISSIONS),
    gears: num("Gears", 1, 12, { int: true }),
    fuelTankLitres: num("Tank size", 1, 400, { unit: "L" }),
    fuelConsumptionL100km: num("Fuel consumption", 0.5, 50, { unit: "L/100 km" }),
    consumptionTestCycle: choice("test cycle", TEST_CYCLES),
    batteryKwh: num("Battery capacity", 1, 250, { unit: "kWh" }),
    energyKwh100km: num("Energy consumption", 5, 60, { unit: "kWh/100 km" }),
    kerbWeightKg: num("Kerb weight", 300, 6000, { unit: "kg" }),
    keysCount: num("Keys", 0, 10, { int: true }),
    previousOwners: num("Previous owners", 0, 50, { int: true }),
    features: z
      .array(z.string().trim().min(1, "A feature cannot be empty.").max(40, "A feature is at most 40 characters."), { error: "Features must be a list." })
      .max(FEATURE_MAX, `At most ${FEATURE_MAX} features.`)
      .transform((list) => [...new Map(list.map((f) => [f.toLowerCase(), f])).values()])
      .optional(),
    priceCents: num("The price", 0, 100_000_000_00, { int: true }),
    description: text("The listing copy", 20_000),
    serviceHistory: z.array(serviceEntrySchema(today)).max(200, "At most 200 service entries.").optional(),
  });
}

const requireMakeModel = <T extends { make?: string | null; model?: string | null }>(v: T, ctx: z.RefinementCtx) => {
  if (!v.make) ctx.addIssue({ code: "custom", path: ["make"], message: "Enter the make." });
  if (!v.model) ctx.addIssue({ code: "custom", path: ["model"], message: "Enter the model." });
};

const odometerPairs = <T extends { odometerReading?: number | null; odometerKm?: number | null }>(v: T, ctx: z.RefinementCtx) => {
  if (v.odometerReading != null && v.odometerKm != null)
    ctx.addIssue({ code: "custom", path: ["odometerKm"], message: "Send the odometer once: either odometerKm or odometerReading with its unit." });
};

export const createVehicleSchema = (today: string) => vehicleFieldsSchema(today).superRefine(requireMakeModel).superRefine(odometerPairs);
export type CreateVehicleInput = z.infer<ReturnType<typeof createVehicleSchema>>;

export const updateVehicleSchema = (today: string) =>
  vehicleFieldsSchema(today)
    .extend({ version: versionSchema })
    .superRefine(odometerPairs)
    .superRefine((v, ctx) => {
      if ("make" in v && !v.make) ctx.addIssue({ code: "custom", path: ["make"], message: "The make cannot be empty." });
      if ("model" in v && !v.model) ctx.addIssue({ code: "custom", path: ["model"], message: "The model cannot be empty." });
    });
export type UpdateVehicleInput = z.infer<ReturnType<typeof updateVehicleSchema>>;

export const SORTS = ["days_desc", "days_asc", "price_asc", "price_desc", "odometer_asc", "odometer_desc", "year_desc", "year_asc", "updated_desc"] as const;
export type VehicleSort = (typeof SORTS)[number];

const csv = <T extends readonly [string, ...string[]]>(values: T) =>
  z
    .union([z.string(), z.array(z.string())])
    .transform((v) => (Array.isArray(v) ? v : v.split(",")).map((s) => s.trim()).filter(Boolean))
    .pipe(z.array(z.enum(values, { error: `Use one of: ${values.join(", ")}.` })))
    .optional();

const intParam = (label: string, min: number, max: number) =>
  z.coerce.number({ error: `${label} must be a number.` }).int(`${label} must be a whole number.`).min(min, `${label} must be at least ${min}.`).max(max, `${label} must be at most ${max}.`).optional();

export const vehicleListQuerySchema = z.strictObject({
  q: z.string().trim().max(80, "Search at most 80 characters.").optional(),
  status: csv(VEHICLE_STATUSES),
  make: z.string().trim().max(60).optional(),
  fuelType: csv(FUEL_TYPES),
  priceMin: intParam("The lowest price", 0, 10_000_000_000),
  priceMax: intParam("The highest price", 0, 10_000_000_000),
  odometerMin: intParam("The lowest odometer", 0, 5_000_000),
  odometerMax: intParam("The highest odometer", 0, 5_000_000),
  sort: z.enum(SORTS, { error: `Sort by one of: ${SORTS.join(", ")}.` }).optional(),
  page: intParam("The page", 1, 100_000),
  pageSize: intParam("The page size", 1, 100),
});
export type VehicleListQuery = z.infer<typeof vehicleListQuerySchema>;

export const statusMoveSchema = z.strictObject({
  version: versionSchema,
  to: z.enum(VEHICLE_STATUSES, { error: "Choose the status to move to." }),
  note: z.string().trim().max(500, "At most 500 characters.").optional(),
});
export type StatusMoveInput = z.infer<typeof statusMoveSchema>;

export { VEHICLE_STATUSES };

/** GET /api/vehicles/suggestions: features and makes starting with `q`, for the editor's pickers. */
export const vehicleSuggestionsQuerySchema = z.strictObject({ q: z.string().max(40).default("") });
