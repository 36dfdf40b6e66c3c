import { date, double, index, int, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from "drizzle-orm/mysql-core";
import {
  ASPIRATIONS, BODY_TYPES, DISTANCE_UNITS_ENTERED, DRIVE_TYPES, FUEL_TYPES, TEST_CYCLES, TRANSMISSIONS, VEHICLE_STATUSES,
} from "../../../shared/constants/vehicle.ts";
import type { ServiceEntryInput } from "../../../shared/schemas/vehicles.ts";
import type { Derived } from "../../../shared/domain/derived.ts";
import { editedRecord, instant, jsonText, parentId, serialId } from "./columns.ts";
import { dealerships } from "./dealerships.ts";

export const vehicles = mysqlTable(
  "vehicles",
  {
    id: serialId(),
    dealershipId: parentId(() => dealerships.id),
    stockNumber: varchar({ length: 20 }).notNull(),
    status: mysqlEnum(VEHICLE_STATUSES).notNull().default("intake"),
    vin: varchar({ length: 17 }),
    registrationPlate: varchar({ length: 12 }),
    make: varchar({ length: 60 }).notNull(),
    model: varchar({ length: 60 }).notNull(),
    variant: varchar({ length: 80 }),
    buildYear: int(),
    firstRegistrationDate: date({ mode: "string" }),
    bodyType: mysqlEnum(BODY_TYPES),
    colour: varchar({ length: 40 }),
    doors: int(),
    seats: int(),
    // The odometer exactly as read, in the unit it was read in; never converted in storage.
    odometerReading: int(),
    odometerUnit: mysqlEnum(DISTANCE_UNITS_ENTERED).notNull().default("km"),
    // Kilometres for sorting and filtering across units; derived from the reading on every save.
    odometerKmIndex: double(),
    driveType: mysqlEnum(DRIVE_TYPES),
    fuelType: mysqlEnum(FUEL_TYPES),
    engineCapacityCc: int(),
    cylinders: int(),
    aspiration: mysqlEnum(ASPIRATIONS),
    powerKw: double(),
    torqueNm: double(),
    transmission: mysqlEnum(TRANSMISSIONS),
    gears: int(),
    fuelTankLitres: double(),
    fuelConsumptionL100km: double(),
    consumptionTestCycle: mysqlEnum(TEST_CYCLES),
    batteryKwh: double(),
    energyKwh100km: double(),
    kerbWeightKg: double(),
    keysCount: int(),
    previousOwners: int(),
    features: jsonText<string[]>().notNull(),
    priceCents: int(),
    description: text(),
    serviceHistory: jsonText<ServiceEntryInput[]>().notNull(),
    /** The derived block as computed at the last save, for lists and feeds. */
    derived: jsonText<Derived>().notNull(),
    stockedAt: instant().notNull(),
    /** Versions of the evidence sets, apart from the record's own, so the workshop and sales do not collide. */
    tyresVersion: int().notNull().default(0),
    checksVersion: int().notNull().default(0),
    /** The salesperson who answers enquiries about this vehicle; the dealership's inbox when null. */
    salespersonId: varchar({ length: 255 }),
    /** The public address, fixed at the first publish; null until then. */
    publicSlug: varchar({ length: 120 }).unique(),
    /** The newest published revision (the public page); null until the first publish. */
    currentRevisionId: int(),
    lastRevisionNumber: int().notNull().default(0),
    /** The last defect number issued for this vehicle. */
    lastDefectNumber: int().notNull().default(0),
    ...editedRecord(),
  },
  (t) => [
    uniqueIndex("vehicles_stock_number_uq").on(t.dealershipId, t.stockNumber),
    index("vehicles_status_stocked_idx").on(t.dealershipId, t.status, t.stockedAt),
    index("vehicles_make_idx").on(t.dealershipId, t.make, t.model),
    index("vehicles_vin_idx").on(t.vin),
    index("vehicles_plate_idx").on(t.registrationPlate),
    index("vehicles_price_idx").on(t.dealershipId, t.priceCents),
    index("vehicles_odometer_idx").on(t.dealershipId, t.odometerKmIndex),
  ],
);

export type Vehicle = typeof vehicles.$inferSelect;
