// Marketing feeds (issue 7): the contracts for creating, changing and previewing a feed, and the catalogue of
// columns a CSV or XML feed may carry. The server's writers (server/modules/feeds/columns.ts) fill these keys.
import { z } from "zod";
import { BODY_TYPES, FUEL_TYPES } from "../constants/vehicle.ts";
import { PHOTO_WIDTHS } from "../constants/evidence.ts";
import { feedColumnLabel, type FieldFeedColumn } from "../constants/vehicle-fields.ts";
import { versionSchema } from "./common.ts";

export const FEED_FORMATS = ["csv", "json", "jsonld", "xml"] as const;
export type FeedFormat = (typeof FEED_FORMATS)[number];
export const FEED_FORMAT_LABELS: Record<FeedFormat, string> = { csv: "CSV", json: "JSON", jsonld: "schema.org JSON-LD", xml: "XML" };
/** Formats whose columns the feed chooses; JSON and JSON-LD have a fixed shape. */
export const FORMATS_WITH_COLUMNS: readonly FeedFormat[] = ["csv", "xml"];

export const FEED_UNITS = ["market", "metric"] as const;
export type FeedUnits = (typeof FEED_UNITS)[number];

/** Statuses a feed may carry: only those with a public page. */
export const FEED_STATUSES = ["live", "reserved", "sold"] as const;
export type FeedStatus = (typeof FEED_STATUSES)[number];

export type ColumnGroup = "record" | "derived" | "condition" | "links";
export interface ColumnSpec {
  key: string;
  label: string;
  group: ColumnGroup;
  /** A column that takes a photo width. */
  width?: boolean;
}

/** A column that carries one vehicle field, under the field catalogue's label for it. */
const fieldColumn = <K extends FieldFeedColumn>(key: K) => ({ key, label: feedColumnLabel(key), group: "record" as const });

/** Every column a CSV or XML feed may carry, in catalogue order. */
export const FEED_COLUMNS = [
  { key: "stockNumber", label: "Stock number", group: "record" },
  { key: "status", label: "Status", group: "record" },
  { key: "title", label: "Title", group: "record" },
  fieldColumn("make"),
  fieldColumn("model"),
  fieldColumn("variant"),
  fieldColumn("buildYear"),
  fieldColumn("firstRegistrationDate"),
  fieldColumn("vin"),
  fieldColumn("bodyType"),
  fieldColumn("colour"),
  fieldColumn("doors"),
  fieldColumn("seats"),
  fieldColumn("driveType"),
  fieldColumn("fuelType"),
  fieldColumn("transmission"),
  fieldColumn("gears"),
  fieldColumn("engineCapacityCc"),
  fieldColumn("cylinders"),
  fieldColumn("aspiration"),
  fieldColumn("powerKw"),
  fieldColumn("torqueNm"),
  fieldColumn("kerbWeightKg"),
  fieldColumn("fuelTankLitres"),
  fieldColumn("fuelConsumption"),
  { key: "fuelConsumptionUnit", label: "Fuel consumption unit", group: "record" },
  fieldColumn("batteryKwh"),
  fieldColumn("energyKwh100km"),
  fieldColumn("odometer"),
  { key: "distanceUnit", label: "Distance unit", group: "record" },
  fieldColumn("keysCount"),
  fieldColumn("previousOwners"),
  fieldColumn("features"),
  fieldColumn("descriptionHtml"),
  { key: "price", label: "Price", group: "record" },
  fieldColumn("priceCents"),
  { key: "currency", label: "Currency", group: "record" },
  { key: "daysInStock", label: "Days in stock", group: "record" },
  { key: "publishedAt", label: "Published at", group: "record" },
  { key: "revision", label: "Revision number", group: "record" },
  { key: "range", label: "Range on a tank (in the feed's units)", group: "derived" },
  { key: "averagePerYear", label: "Average distance a year (in the feed's units)", group: "derived" },
  { key: "powerHp", label: "Power (hp)", group: "derived" },
  { key: "powerPs", label: "Power (PS)", group: "derived" },
  { key: "torqueLbft", label: "Torque (lbf·ft)", group: "derived" },
  { key: "powerToWeightKwPerTonne", label: "Power to weight (kW/t)", group: "derived" },
  { key: "co2GramsPerKmEstimate", label: "CO₂ estimate (g/km)", group: "derived" },
  { key: "vinCheck", label: "VIN check", group: "derived" },
  { key: "modelYearFromVin", label: "Model year from VIN", group: "derived" },
  { key: "nextServiceDueByDate", label: "Next service due by date", group: "derived" },
  { key: "nextServiceDueByKm", label: "Next service due by km", group: "derived" },
  { key: "conditionIndex", label: "Condition index", group: "condition" },
  { key: "conditionSentence", label: "Condition in a sentence", group: "condition" },
  { key: "defectCount", label: "Defects noted", group: "condition" },
  { key: "defectsMinor", label: "Minor defects", group: "condition" },
  { key: "defectsModerate", label: "Moderate defects", group: "condition" },
  { key: "defectsMajor", label: "Major defects", group: "condition" },
  { key: "cautionCount", label: "Cautions", group: "condition" },
  { key: "safetyCautionCount", label: "Safety cautions", group: "condition" },
  { key: "cautionsText", label: "Cautions in words", group: "condition" },
  { key: "photoCount", label: "Photos", group: "condition" },
  { key: "url", label: "Public page URL", group: "links" },
  { key: "coverPhotoUrl", label: "Cover photo URL", group: "links", width: true },
  { key: "photoUrls", label: "All photo URLs", group: "links", width: true },
] as const satisfies readonly ColumnSpec[];

export type FeedColumnKey = (typeof FEED_COLUMNS)[number]["key"];
const COLUMN_KEYS = FEED_COLUMNS.map((c) => c.key) as [FeedColumnKey, ...FeedColumnKey[]];
export const COLUMN_GROUP_LABELS: Record<ColumnGroup, string> = { record: "The record", derived: "Derived figures", condition: "Condition", links: "Page and photos" };
export const columnSpec = (key: string): ColumnSpec | undefined => (FEED_COLUMNS as readonly ColumnSpec[]).find((c) => c.key === key);
export const takesWidth = (key: string) => Boolean(columnSpec(key)?.width);

/** Without columns a feed carries these, under their own keys as headers. */
export const DEFAULT_COLUMNS: FeedColumnKey[] = [
  "stockNumber", "status", "make", "model", "variant", "buildYear", "bodyType", "fuelType", "transmission", "odometer", "distanceUnit",
  "price", "currency", "conditionIndex", "defectCount", "url", "coverPhotoUrl", "photoUrls",
];
export const DEFAULT_PHOTO_WIDTH = 1024;

/** XML element names: a letter or underscore, then letters, digits, dots, hyphens, underscores; never "xml…". */
export const XML_NAME = /^(?!xml)[A-Za-z_][A-Za-z0-9._-]{0,59}$/i;

export const feedColumnSchema = z.object({
  key: z.enum(COLUMN_KEYS, { error: "Choose a column from the list." }),
  header: z.string().trim().min(1, "Give the column a header.").max(60, "A header is at most 60 characters."),
  photoWidth: z
    .number()
    .int()
    .refine((w) => (PHOTO_WIDTHS as readonly number[]).includes(w), `Choose a width of ${PHOTO_WIDTHS.join(", ")} pixels.`)
    .optional(),
});
export type FeedColumn = z.infer<typeof feedColumnSchema>;

const money = z.number().int("Whole cents only.").min(0, "A price cannot be negative.").max(2_000_000_000);
const days = z.number().int("Whole days only.").min(0, "Days cannot be negative.").max(36_500);

export const feedFilterSchema = z
  .object({
    statuses: z.array(z.enum(FEED_STATUSES, { error: "Choose live, reserved or sold." })).min(1, "Choose at least one status.").optional(),
    makes: z.array(z.string().trim().min(1).max(60)).max(100).optional(),
    bodyTypes: z.array(z.enum(BODY_TYPES, { error: "Choose a body type from the list." })).optional(),
    fuelTypes: z.array(z.enum(FUEL_TYPES, { error: "Choose a fuel from the list." })).optional(),
    priceMinCents: money.optional(),
    priceMaxCents: money.optional(),
    daysInStockMin: days.optional(),
    daysInStockMax: days.optional(),
  })
  .strict()
  .superRefine((f, ctx) => {
    if (f.priceMinCents !== undefined && f.priceMaxCents !== undefined && f.priceMinCents > f.priceMaxCents)
      ctx.addIssue({ code: "custom", path: ["priceMaxCents"], message: "The highest price is below the lowest." });
    if (f.daysInStockMin !== undefined && f.daysInStockMax !== undefined && f.daysInStockMin > f.daysInStockMax)
      ctx.addIssue({ code: "custom", path: ["daysInStockMax"], message: "The most days in stock is below the fewest." });
  });
export type FeedFilter = z.infer<typeof feedFilterSchema>;
export const DEFAULT_STATUSES: FeedStatus[] = ["live", "reserved"];

type ColumnsCheck = { format?: FeedFormat; columns?: FeedColumn[] | undefined };
function checkColumns(v: ColumnsCheck, ctx: z.RefinementCtx) {
  if (!v.columns) return;
  if (v.format && !FORMATS_WITH_COLUMNS.includes(v.format)) {
    ctx.addIssue({ code: "custom", path: ["columns"], message: "Only CSV and XML feeds choose their columns; JSON and JSON-LD carry the whole record." });
    return;
  }
  const seen = new Set<string>();
  v.columns.forEach((c, i) => {
    const h = c.header.toLowerCase();
    if (seen.has(h)) ctx.addIssue({ code: "custom", path: ["columns", i, "header"], message: "Two columns have this header; give each its own." });
    seen.add(h);
    if (v.format === "xml" && !XML_NAME.test(c.header))
      ctx.addIssue({ code: "custom", path: ["columns", i, "header"], message: "In XML a header is an element name: letters, digits, - _ . and no spaces, starting with a letter." });
    if (c.photoWidth !== undefined && !takesWidth(c.key))
      ctx.addIssue({ code: "custom", path: ["columns", i, "photoWidth"], message: "Only photo columns take a width." });
  });
}

const feedFields = {
  name: z.string({ error: "Name the feed." }).trim().min(1, "Name the feed.").max(120, "A name is at most 120 characters."),
  format: z.enum(FEED_FORMATS, { error: "Choose CSV, JSON, JSON-LD or XML." }),
  filter: feedFilterSchema.optional(),
  units: z.enum(FEED_UNITS, { error: "Choose the market's units or metric." }).optional(),
  columns: z.array(feedColumnSchema).min(1, "Choose at least one column.").max(FEED_COLUMNS.length * 2, "Too many columns.").optional(),
};

export const createFeedSchema = z.object(feedFields).strict().superRefine(checkColumns);
export type CreateFeedInput = z.infer<typeof createFeedSchema>;

/** A preview runs the feed's query without saving it; the name may still be empty. */
export const previewFeedSchema = z
  .object({ ...feedFields, name: z.string().max(120).optional(), limit: z.number().int().min(1).max(50).optional() })
  .strict()
  .superRefine(checkColumns);
export type PreviewFeedInput = z.infer<typeof previewFeedSchema>;

/** The format is fixed at creation (the secret URL ends with it); the rest may change. */
export const updateFeedSchema = z
  .object({ version: versionSchema, name: feedFields.name.optional(), filter: feedFilterSchema.optional(), units: feedFields.units, columns: feedFields.columns })
  .strict();
export type UpdateFeedInput = z.infer<typeof updateFeedSchema>;

/** `?since=`: an ISO 8601 instant with a zone, e.g. 2026-11-30T00:00:00Z. */
export const feedQuerySchema = z.object({
  since: z.iso.datetime({ offset: true, error: "since must be an ISO 8601 time with a zone, like 2026-11-30T00:00:00Z." }).optional(),
});

/** Columns as the feed will write them: the chosen ones, or the default set under their own keys. */
export function effectiveColumns(columns: FeedColumn[] | null | undefined): FeedColumn[] {
  if (columns && columns.length) return columns;
  return DEFAULT_COLUMNS.map((key) => ({ key, header: key, ...(takesWidth(key) ? { photoWidth: DEFAULT_PHOTO_WIDTH } : {}) }));
}
