import { eq } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { leads, revisions, users, vehicles } from "../../db/schema/index.ts";

/** Leads with what the list and the detail show beside them: the vehicle's published title, stock number and slug, and the assignee. */
export const leadsWithVehicle = (db: DbOrTx) =>
  db
    .select({ lead: leads, title: revisions.title, stockNumber: vehicles.stockNumber, slug: vehicles.publicSlug, assigneeName: users.name })
    .from(leads)
    .innerJoin(vehicles, eq(vehicles.id, leads.vehicleId))
    .leftJoin(revisions, eq(revisions.id, vehicles.currentRevisionId))
    .leftJoin(users, eq(users.id, leads.assigneeId));
export type LeadWithVehicle = Awaited<ReturnType<typeof leadsWithVehicle>>[number];
