import { double, index, int, mysqlTable, primaryKey, uniqueIndex, varchar, text } from "drizzle-orm/mysql-core";
import { instant, jsonText, parentId, serialId } from "./columns.ts";
import { vehicles } from "./vehicles.ts";
import type { PublicSnapshot } from "../../../shared/schemas/public.ts";

/**
 * A published revision: an immutable snapshot of everything the public page shows, written once in one transaction
 * and never updated. The public side reads only these. The columns beside the snapshot copy the figures the
 * storefront filters and sorts on.
 */
export const revisions = mysqlTable(
  "revisions",
  {
    id: serialId(),
    vehicleId: parentId(() => vehicles.id),
    number: int().notNull(),
    slug: varchar({ length: 120 }).notNull(),
    snapshot: jsonText<PublicSnapshot>().notNull(),
    changes: jsonText<string[]>().notNull(),
    publishedAt: instant().notNull(),
    publishedBy: varchar({ length: 255 }),
    publishedByName: varchar({ length: 120 }),
    overrideReason: text(),
    title: varchar({ length: 200 }).notNull(),
    make: varchar({ length: 60 }).notNull(),
    model: varchar({ length: 60 }).notNull(),
    bodyType: varchar({ length: 30 }),
    fuelType: varchar({ length: 30 }),
    priceCents: int(),
    odometerKm: double(),
    buildYear: int(),
    conditionIndex: double(),
  },
  (t) => [uniqueIndex("revisions_number_uq").on(t.vehicleId, t.number), index("revisions_slug_idx").on(t.slug, t.number), index("revisions_published_idx").on(t.publishedAt)],
);

/** Every stored file a revision shows, so the clean-up keeps them as long as the revision exists (forever). */
export const revisionMedia = mysqlTable(
  "revision_media",
  {
    revisionId: parentId(() => revisions.id),
    key: varchar({ length: 200 }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.revisionId, t.key] }), index("revision_media_key_idx").on(t.key)],
);

export type Revision = typeof revisions.$inferSelect;
