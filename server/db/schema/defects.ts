import { boolean, double, index, int, mysqlEnum, mysqlTable, uniqueIndex, varchar } from "drizzle-orm/mysql-core";
import { DEFECT_KINDS, REPAIR_PLANS, SEVERITIES, ZONES } from "../../../shared/constants/evidence.ts";
import { editedRecord, parentId, serialId } from "./columns.ts";
import { vehicles } from "./vehicles.ts";
import { photos } from "./photos.ts";

export const defects = mysqlTable(
  "defects",
  {
    id: serialId(),
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    /** Numbered per vehicle; the number on the pin and in the list. Never reused. */
    number: int().notNull(),
    zone: mysqlEnum(ZONES).notNull(),
    kind: mysqlEnum(DEFECT_KINDS).notNull(),
    severity: mysqlEnum(SEVERITIES).notNull(),
    sizeMm: int(),
    note: varchar({ length: 1000 }).notNull().default(""),
    repairPlan: mysqlEnum(REPAIR_PLANS).notNull(),
    /** Internal only: never in a public response or a revision. */
    repairCostCents: int(),
    safetyRelevant: boolean().notNull().default(false),
    photoId: int().references(() => photos.id, { onDelete: "set null" }),
    /** The pin as fractions of the photo's width and height, so it survives every resize. */
    pinX: double(),
    pinY: double(),
    closeupKey: varchar({ length: 200 }),
    recordedBy: varchar({ length: 255 }),
    ...editedRecord(),
  },
  (t) => [uniqueIndex("defects_number_uq").on(t.vehicleId, t.number), index("defects_photo_idx").on(t.photoId)],
);

export type Defect = typeof defects.$inferSelect;
