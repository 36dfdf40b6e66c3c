import { z } from "zod";
import { CHECK_ITEMS, CHECK_RESULTS, DEFECT_KINDS, REPAIR_PLANS, SEVERITIES, TYRE_POSITIONS, ZONES } from "../constants/evidence.ts";
import { versionSchema } from "./common.ts";

const fraction = (label: string) => z.number({ error: `${label} must be a number.` }).min(0, `${label} must be between 0 and 1.`).max(1, `${label} must be between 0 and 1.`);

export const pinSchema = z.strictObject({ photoId: z.number().int().positive(), x: fraction("The pin's x"), y: fraction("The pin's y") });

const defectFields = {
  zone: z.enum(ZONES, { error: "Choose the zone." }),
  kind: z.enum(DEFECT_KINDS, { error: "Choose what kind of defect it is." }),
  severity: z.enum(SEVERITIES, { error: "Choose minor, moderate or major." }),
  sizeMm: z.number({ error: "The size must be a number of millimetres." }).int("Whole millimetres.").min(1, "At least 1 mm.").max(5000, "At most 5000 mm.").nullable().optional(),
  note: z.string().trim().max(1000, "At most 1000 characters.").default(""),
  repairPlan: z.enum(REPAIR_PLANS, { error: "Choose the repair plan." }),
  repairCostCents: z.number({ error: "The cost must be a number." }).int().min(0, "The cost cannot be negative.").max(10_000_000_00, "That cost is too large.").nullable().optional(),
  safetyRelevant: z.boolean({ error: "Say whether it affects safety." }).default(false),
  pin: pinSchema.nullable().optional(),
};

export const createDefectSchema = z.strictObject(defectFields);
export type CreateDefectInput = z.infer<typeof createDefectSchema>;

export const updateDefectSchema = z
  .strictObject({ ...defectFields, note: z.string().trim().max(1000).optional(), safetyRelevant: z.boolean().optional() })
  .partial()
  .extend({ version: versionSchema });
export type UpdateDefectInput = z.infer<typeof updateDefectSchema>;

export const zoneMarkSchema = z.strictObject({
  zone: z.enum(ZONES, { error: "Choose the zone." }),
  nothingFound: z.boolean({ error: "Say whether the zone was checked with nothing found." }),
});

// Tread is recorded to 0.1 mm (../shared/TRADE.md §2.5).
const depth = (label: string) =>
  z
    .number({ error: `${label} must be a number of millimetres.` })
    .min(0, `${label} cannot be negative.`)
    .max(30, `${label} is at most 30 mm.`)
    .refine((v) => Math.abs(v * 10 - Math.round(v * 10)) < 1e-9, `${label} to 1 decimal place, like 4.9.`)
    .nullable()
    .optional();

export const tyreReadingSchema = z.strictObject({
  position: z.enum(TYRE_POSITIONS, { error: "Unknown tyre position." }),
  treadInnerMm: depth("Inner tread"),
  treadCentreMm: depth("Centre tread"),
  treadOuterMm: depth("Outer tread"),
  sizeDesignation: z.string().trim().max(40, "At most 40 characters.").nullable().optional(),
  dotCode: z
    .string()
    .trim()
    .regex(/^(\d{3,4})?$/, "The date code is the last 3 or 4 digits of the DOT number, like 2319.")
    .refine((c) => c === "" || (Number(c.slice(0, 2)) >= 1 && Number(c.slice(0, 2)) <= 53), "The first two digits are the week: 01 to 53.")
    .nullable()
    .optional(),
  pressureKpa: z.number({ error: "Pressure must be a number of kPa." }).min(0, "Pressure cannot be negative.").max(1000, "At most 1000 kPa.").nullable().optional(),
}).refine((r) => [r.treadInnerMm, r.treadCentreMm, r.treadOuterMm, r.sizeDesignation, r.dotCode, r.pressureKpa].some((v) => v !== null && v !== undefined && v !== ""), "Enter at least one reading for this tyre, or leave the tyre out.");
export type TyreReadingInput = z.infer<typeof tyreReadingSchema>;

export const tyresSchema = (today: string) =>
  z.strictObject({
    version: z.number().int().min(0),
    measuredOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "A date like 2026-03-01.").refine((d) => d <= today, "The measuring date cannot be in the future."),
    readings: z
      .array(tyreReadingSchema)
      .max(5)
      .refine((r) => new Set(r.map((x) => x.position)).size === r.length, "Each position at most once."),
  });
export type TyresInput = z.infer<ReturnType<typeof tyresSchema>>;

export const checksSchema = z.strictObject({
  version: z.number().int().min(0),
  results: z
    .array(
      z.strictObject({
        item: z.enum(CHECK_ITEMS, { error: "Unknown check item." }),
        result: z.enum(CHECK_RESULTS, { error: "Choose pass, advise or fail." }),
        note: z.string().trim().max(500, "At most 500 characters.").default(""),
      }),
    )
    .max(CHECK_ITEMS.length)
    .refine((r) => new Set(r.map((x) => x.item)).size === r.length, "Each item at most once."),
});
export type ChecksInput = z.infer<typeof checksSchema>;

export const photoUpdateSchema = z.strictObject({
  version: versionSchema,
  caption: z.string().trim().max(200, "At most 200 characters.").optional(),
  zone: z.enum(ZONES).nullable().optional(),
  isCover: z.literal(true).optional(),
});

export type PhotoUpdateInput = z.infer<typeof photoUpdateSchema>;

export const photoOrderSchema = z.strictObject({ order: z.array(z.number().int().positive()).min(1).max(100) });
