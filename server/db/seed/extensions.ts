import type { Db } from "../client.ts";
import type { Storage } from "../../lib/storage.ts";
import { seedDemoVehicles } from "./vehicles.ts";
import { seedDemoEvidence } from "./evidence.ts";

/** Capabilities beyond the foundation add their demo records here, in dependency order. */
export async function seedDemoExtensions(db: Db, dealershipId: number, options: { storage?: Storage }): Promise<void> {
  await seedDemoVehicles(db, dealershipId);
  // Photos need somewhere to live; tests that do not need them pass no storage and stay fast.
  if (options.storage) await seedDemoEvidence(db, options.storage, dealershipId);
}
