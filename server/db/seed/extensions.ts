import type { Db } from "../client.ts";
import { seedDemoVehicles } from "./vehicles.ts";

/** Capabilities beyond the foundation add their demo records here, in dependency order. */
export async function seedDemoExtensions(db: Db, dealershipId: number): Promise<void> {
  await seedDemoVehicles(db, dealershipId);
}
