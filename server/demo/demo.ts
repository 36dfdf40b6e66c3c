/**
 * The demo scenario: an invented dealership in an invented town, with one user per role. Nothing here names a
 * real business, person, make or model. Never run when NODE_ENV=production.
 */
import { generateIdFromEntropySize } from "lucia";
import { sql } from "drizzle-orm";
import type { Db } from "../db/client.ts";
import { dealerships, users } from "../db/schema/index.ts";
import { hashPassword } from "../modules/auth/auth.service.ts";
import type { Role } from "../../shared/constants/roles.ts";
import { seedDemoExtensions } from "./extensions.ts";
import type { Storage } from "../lib/storage.ts";

export const DEMO_DEALERSHIP = {
  slug: "fernhollow-motors",
  name: "Fernhollow Motors",
  addressLine: "14 Quarry Lane",
  town: "Tallowbridge",
  region: "Eastern Downs",
  postcode: "4821",
  country: "AU",
  licenceNumber: "MD 0048213",
  phone: "+61 7 5550 1482",
  email: "yard@fernhollow.demo.test",
  website: "",
  market: "AU",
  locale: "en-AU",
  timeZone: "Australia/Brisbane",
  distanceUnit: "km",
  currency: "AUD",
  // WA Road Traffic (Vehicles) Regulations 2014 r 270(2): 1.5 mm (../shared/TRADE.md §2.5).
  legalMinTreadMm: 1.5,
  newTyreTreadMm: 8,
  vinCheckDigitMandatory: false,
  serviceIntervalKm: 15000,
  serviceIntervalMonths: 12,
  minPhotos: 4,
  disclaimerMarkdown:
    "This report records what our staff observed and measured on the date shown. It is **not** a roadworthiness or safety certificate and not a mechanical warranty. We encourage you to have the vehicle inspected independently before you buy; local law and licensed inspectors decide whether a vehicle is fit for the road.",
} as const;

export const DEMO_USERS: Array<{ email: string; name: string; role: Role }> = [
  { email: "admin@demo.test", name: "Ada Fernhollow", role: "admin" },
  { email: "sales@demo.test", name: "Sam Okonkwo-Reed", role: "sales" },
  { email: "workshop@demo.test", name: "Wren Tallis", role: "workshop" },
  { email: "marketing@demo.test", name: "Mika Arlow", role: "marketing" },
];

export interface SeedOptions {
  password: string;
  /** Where demo photos are stored; without it the demo has no photos or walk-around evidence. */
  storage?: Storage;
  /** The site's address, for the URLs published revisions record. */
  publicUrl?: string;
  /** Progress lines for a person waiting at the terminal. */
  log?: (line: string) => void;
}

export async function seedDemoIfEmpty(db: Db, options: SeedOptions): Promise<boolean> {
  const [row] = await db.select({ n: sql<number>`count(*)` }).from(dealerships);
  if (Number(row?.n) > 0) return false;
  await seedDemo(db, options);
  return true;
}

export async function seedDemo(db: Db, options: SeedOptions): Promise<void> {
  const passwordHash = await hashPassword(options.password);
  const dealershipId = await db.transaction(async (tx) => {
    const [result] = await tx.insert(dealerships).values({ ...DEMO_DEALERSHIP });
    const id = result.insertId;
    await tx.insert(users).values(
      DEMO_USERS.map((u) => ({ id: generateIdFromEntropySize(10), dealershipId: id, email: u.email, name: u.name, role: u.role, passwordHash })),
    );
    return id;
  });
  await seedDemoExtensions(db, dealershipId, options);
}

/** Empties every table (the migration journal excepted) and seeds the demo again. */
export async function resetDemo(db: Db, options: SeedOptions): Promise<void> {
  const [tables] = (await db.execute(
    sql`select table_name as name from information_schema.tables where table_schema = database() and table_type = 'BASE TABLE'`,
  )) as unknown as [Array<{ name: string }>];
  await db.transaction(async (tx) => {
    await tx.execute(sql`SET FOREIGN_KEY_CHECKS = 0`);
    for (const { name } of tables) {
      if (name === "__drizzle_migrations") continue;
      await tx.execute(sql.raw(`DELETE FROM \`${name}\``));
    }
    await tx.execute(sql`SET FOREIGN_KEY_CHECKS = 1`);
  });
  await seedDemo(db, options);
}
