import type { Db } from "../client.ts";

/** Later capabilities (vehicles, photos, walk-arounds) add their demo records here. */
export async function seedDemoExtensions(_db: Db, _dealershipId: number): Promise<void> {}
