import { z } from "zod";
import { BODY_TYPES, FUEL_TYPES } from "../constants/vehicle.ts";

export const PUBLIC_SORTS = ["newest", "price_asc", "price_desc", "odometer_asc", "year_desc", "condition_desc"] as const;
export type PublicSort = (typeof PUBLIC_SORTS)[number];

const int = (label: string, max: number) =>
  z.coerce.number({ error: `${label} must be a number.` }).int(`${label} must be a whole number.`).min(0, `${label} cannot be negative.`).max(max, `${label} is too large.`).optional();

/** The storefront's search: every parameter optional, all in the URL. Prices in minor units, like the rest of the API. */
export const publicListQuerySchema = z.strictObject({
  q: z.string().trim().max(80).optional(),
  make: z.string().trim().max(60).optional(),
  bodyType: z.enum(BODY_TYPES, { error: "Unknown body type." }).optional(),
  fuelType: z.enum(FUEL_TYPES, { error: "Unknown fuel type." }).optional(),
  priceMin: int("The lowest price", 10_000_000_000),
  priceMax: int("The highest price", 10_000_000_000),
  odometerMax: int("The highest odometer", 5_000_000),
  yearMin: int("The earliest year", 2100),
  yearMax: int("The latest year", 2100),
  sort: z.enum(PUBLIC_SORTS, { error: `Sort by one of: ${PUBLIC_SORTS.join(", ")}.` }).optional(),
  page: z.coerce.number().int().min(1).max(10_000).optional(),
  pageSize: z.coerce.number().int().min(1).max(48).optional(),
});
export type PublicListQuery = z.infer<typeof publicListQuerySchema>;
