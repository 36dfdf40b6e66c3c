import { z } from "zod";
import { DISTANCE_UNITS, MARKET_CODES } from "../constants/market.ts";
import { versionSchema } from "./common.ts";

const text = (max: number, label: string) => z.string().trim().max(max, `${label} is at most ${max} characters.`);

export const dealershipSettingsSchema = z.strictObject({
  version: versionSchema,
  name: text(160, "The name").min(1, "Enter the dealership's name."),
  addressLine: text(200, "The address"),
  town: text(120, "The town"),
  region: text(120, "The region"),
  postcode: text(20, "The postcode"),
  licenceNumber: text(60, "The licence number"),
  phone: text(40, "The phone number"),
  email: z.union([z.literal(""), z.email("Enter a valid e-mail address.")]),
  website: z.union([z.literal(""), z.url("Enter a full web address, starting https://.")]),
  market: z.enum(MARKET_CODES),
  distanceUnit: z.enum(DISTANCE_UNITS),
  currency: z.string().regex(/^[A-Z]{3}$/, "Use a three-letter ISO 4217 code, like AUD."),
  legalMinTreadMm: z.number().min(0.5, "At least 0.5 mm.").max(5, "At most 5 mm."),
  newTyreTreadMm: z.number().min(4, "At least 4 mm.").max(20, "At most 20 mm."),
  vinCheckDigitMandatory: z.boolean(),
  serviceIntervalKm: z.number().int().min(1000).max(100000),
  serviceIntervalMonths: z.number().int().min(1).max(48),
  minPhotos: z.number().int().min(1).max(60),
  disclaimerMarkdown: text(5000, "The disclaimer"),
}).partial().required({ version: true });
export type DealershipSettingsInput = z.infer<typeof dealershipSettingsSchema>;

/** What the public pages may show about the dealership. */
export interface PublicDealership {
  name: string;
  slug: string;
  addressLine: string;
  town: string;
  region: string;
  postcode: string;
  country: string;
  licenceNumber: string;
  phone: string;
  email: string;
  website: string;
  locale: string;
  currency: string;
  distanceUnit: (typeof DISTANCE_UNITS)[number];
  timeZone: string;
}
