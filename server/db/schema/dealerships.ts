import { boolean, double, int, mysqlTable, varchar, text, mysqlEnum } from "drizzle-orm/mysql-core";
import { editedRecord, serialId } from "./columns.ts";
import { MARKET_CODES, DISTANCE_UNITS } from "../../../shared/constants/market.ts";

export const dealerships = mysqlTable("dealerships", {
  id: serialId(),
  slug: varchar({ length: 80 }).notNull().unique(),
  name: varchar({ length: 160 }).notNull(),
  addressLine: varchar({ length: 200 }).notNull().default(""),
  town: varchar({ length: 120 }).notNull().default(""),
  region: varchar({ length: 120 }).notNull().default(""),
  postcode: varchar({ length: 20 }).notNull().default(""),
  country: varchar({ length: 2 }).notNull(),
  licenceNumber: varchar({ length: 60 }).notNull().default(""),
  phone: varchar({ length: 40 }).notNull().default(""),
  email: varchar({ length: 254 }).notNull().default(""),
  website: varchar({ length: 300 }).notNull().default(""),
  logoPath: varchar({ length: 300 }),
  // Market settings (../shared/PRODUCT.md "Settings of a dealership").
  market: mysqlEnum(MARKET_CODES).notNull(),
  locale: varchar({ length: 20 }).notNull(),
  timeZone: varchar({ length: 60 }).notNull(),
  distanceUnit: mysqlEnum(DISTANCE_UNITS).notNull(),
  currency: varchar({ length: 3 }).notNull(),
  legalMinTreadMm: double().notNull(),
  newTyreTreadMm: double().notNull().default(8),
  vinCheckDigitMandatory: boolean().notNull(),
  serviceIntervalKm: int().notNull().default(15000),
  serviceIntervalMonths: int().notNull().default(12),
  minPhotos: int().notNull().default(6),
  // The last stock number issued; the next vehicle takes this plus one, under a row lock.
  lastStockNumber: int().notNull().default(10000),
  disclaimerMarkdown: text().notNull(),
  ...editedRecord(),
});

export type Dealership = typeof dealerships.$inferSelect;
