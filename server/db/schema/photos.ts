import { boolean, index, int, mysqlEnum, mysqlTable, text, varchar } from "drizzle-orm/mysql-core";
import { ZONES } from "../../../shared/constants/evidence.ts";
import { editedRecord, jsonText, parentId, serialId } from "./columns.ts";
import { vehicles } from "./vehicles.ts";

export interface PhotoVariant {
  width: number;
  height: number;
  format: "avif" | "webp" | "jpeg";
  key: string;
  bytes: number;
}

/**
 * A photo exists as a row only once its master file is stored. Variants are made off the request path; until they
 * are, the status is "processing" and the master JPEG serves.
 */
export const photos = mysqlTable(
  "photos",
  {
    id: serialId(),
    vehicleId: parentId(() => vehicles.id, { onDelete: "cascade" }),
    status: mysqlEnum(["processing", "ready", "failed"]).notNull().default("processing"),
    position: int().notNull(),
    isCover: boolean().notNull().default(false),
    caption: varchar({ length: 200 }).notNull().default(""),
    zone: mysqlEnum(ZONES),
    /** SHA-256 of the upright, metadata-free master: the file names derive from it, never from the upload's name. */
    hash: varchar({ length: 64 }).notNull(),
    masterKey: varchar({ length: 200 }).notNull(),
    width: int().notNull(),
    height: int().notNull(),
    placeholder: text().notNull(),
    variants: jsonText<PhotoVariant[]>().notNull(),
    uploadedBy: varchar({ length: 255 }),
    ...editedRecord(),
  },
  (t) => [index("photos_vehicle_idx").on(t.vehicleId, t.position), index("photos_status_idx").on(t.status), index("photos_hash_idx").on(t.hash)],
);

export type Photo = typeof photos.$inferSelect;
