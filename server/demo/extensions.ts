import type { Db } from "../db/client.ts";
import type { Storage } from "../lib/storage.ts";
import { seedDemoVehicles } from "./vehicles.ts";
import { seedDemoEvidence } from "./evidence.ts";
import { publishDemoVehicles } from "./publish.ts";

/** Capabilities beyond the foundation add their demo records here, in dependency order. */
export async function seedDemoExtensions(
  db: Db,
  dealershipId: number,
  options: { storage?: Storage; publicUrl?: string; log?: (line: string) => void },
): Promise<void> {
  const log = options.log ?? (() => undefined);
  await seedDemoVehicles(db, dealershipId);
  log("  30 demo vehicles in stock.");
  // Photos need somewhere to live; tests that do not need them pass no storage and stay fast.
  if (options.storage) {
    log("  Drawing their photos and recording walk-arounds, tyres and checks (about a minute)…");
    await seedDemoEvidence(db, options.storage, dealershipId);
    log("  Making photo sizes and publishing the vehicles on sale (about a minute)…");
    await publishDemoVehicles(db, options.storage, dealershipId, options.publicUrl ?? "http://127.0.0.1:3000");
  }
}
