import { eq, inArray } from "drizzle-orm";
import type { Db } from "../db/client.ts";
import { photos, users, vehicleEvents, vehicles } from "../db/schema/index.ts";
import type { Storage } from "../lib/storage.ts";
import type { AppContext } from "../lib/context.ts";
import { makeSizesNow } from "../modules/photos/photos.service.ts";
import { publish } from "../modules/publishing/publishing.service.ts";
import type { VehicleStatus } from "../../shared/constants/vehicle.ts";

const PUBLISHED: VehicleStatus[] = ["live", "reserved", "sold", "withdrawn"];

/** Runs jobs two at a time: the machine's two cores. */
async function twoAtATime<T>(items: T[], job: (item: T) => Promise<void>) {
  let next = 0;
  await Promise.all([0, 1].map(async () => {
    while (next < items.length) await job(items[next++]);
  }));
}

/**
 * Publishes the demo vehicles that buyers would see (live, reserved, sold, withdrawn), through the real publishing
 * service, after making their photos' served sizes (a revision only shows finished photos).
 */
export async function publishDemoVehicles(db: Db, storage: Storage, dealershipId: number, publicUrl: string) {
  const targets = await db.select().from(vehicles).where(inArray(vehicles.status, PUBLISHED));
  const ids = targets.filter((v) => v.dealershipId === dealershipId).map((v) => v.id);
  if (!ids.length) return;
  const pending = await db.select().from(photos).where(inArray(photos.vehicleId, ids));
  await twoAtATime(pending, (p) => makeSizesNow(db, storage, p));
  const [seller] = await db.select().from(users).where(eq(users.email, "sales@demo.test"));
  const actor = { id: seller.id, email: seller.email, name: seller.name, role: seller.role, active: true, dealershipId };
  const ctx = { database: { db }, now: () => new Date(), config: { publicUrl } } as unknown as AppContext;
  for (const v of targets.filter((t) => ids.includes(t.id))) {
    // Publishing starts from "preparing"; afterwards the vehicle returns to the status the scenario gives it.
    await db.update(vehicles).set({ status: "preparing" }).where(eq(vehicles.id, v.id));
    await publish(ctx, actor, v.id, {});
    if (v.status !== "live") {
      await db.update(vehicles).set({ status: v.status }).where(eq(vehicles.id, v.id));
      await db.insert(vehicleEvents).values({ vehicleId: v.id, fromStatus: "live", toStatus: v.status, note: "", userId: seller.id, userName: seller.name });
    }
  }
}
