import { and, asc, desc, eq, gte, inArray, like, lte, or, sql, type SQL } from "drizzle-orm";
import type { DbOrTx } from "../../db/client.ts";
import { vehicleEvents, vehicles } from "../../db/schema/index.ts";
import type { VehicleListQuery, VehicleSort } from "../../../shared/schemas/vehicles.ts";

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => "\\" + c);

export function listConditions(dealershipId: number, q: VehicleListQuery): SQL | undefined {
  const where: Array<SQL | undefined> = [eq(vehicles.dealershipId, dealershipId)];
  if (q.q) {
    const text = escapeLike(q.q);
    const compact = escapeLike(q.q.replace(/\s+/g, "").toUpperCase());
    where.push(
      or(
        like(vehicles.stockNumber, `${text}%`),
        like(vehicles.vin, `%${compact}%`),
        like(sql`replace(${vehicles.registrationPlate}, ' ', '')`, `%${compact}%`),
        like(vehicles.make, `${text}%`),
        like(vehicles.model, `${text}%`),
        like(sql`concat(${vehicles.make}, ' ', ${vehicles.model})`, `${text}%`),
      ),
    );
  }
  if (q.status?.length) where.push(inArray(vehicles.status, q.status));
  if (q.make) where.push(eq(vehicles.make, q.make));
  if (q.fuelType?.length) where.push(inArray(vehicles.fuelType, q.fuelType));
  if (q.priceMin !== undefined) where.push(gte(vehicles.priceCents, q.priceMin));
  if (q.priceMax !== undefined) where.push(lte(vehicles.priceCents, q.priceMax));
  if (q.odometerMin !== undefined) where.push(gte(vehicles.odometerKmIndex, q.odometerMin));
  if (q.odometerMax !== undefined) where.push(lte(vehicles.odometerKmIndex, q.odometerMax));
  return and(...where);
}

/** Sorts, each with the id as a tie-break so pages never repeat or skip a row. Nulls sort last. */
export const SORT_SQL: Record<VehicleSort, SQL[]> = {
  days_desc: [asc(vehicles.stockedAt), asc(vehicles.id)],
  days_asc: [desc(vehicles.stockedAt), desc(vehicles.id)],
  price_asc: [sql`${vehicles.priceCents} is null`, asc(vehicles.priceCents), asc(vehicles.id)],
  price_desc: [sql`${vehicles.priceCents} is null`, desc(vehicles.priceCents), asc(vehicles.id)],
  odometer_asc: [sql`${vehicles.odometerKmIndex} is null`, asc(vehicles.odometerKmIndex), asc(vehicles.id)],
  odometer_desc: [sql`${vehicles.odometerKmIndex} is null`, desc(vehicles.odometerKmIndex), asc(vehicles.id)],
  year_desc: [sql`${vehicles.buildYear} is null`, desc(vehicles.buildYear), asc(vehicles.id)],
  year_asc: [sql`${vehicles.buildYear} is null`, asc(vehicles.buildYear), asc(vehicles.id)],
  updated_desc: [desc(vehicles.updatedAt), desc(vehicles.id)],
};

export async function listVehicles(db: DbOrTx, dealershipId: number, q: VehicleListQuery) {
  const where = listConditions(dealershipId, q);
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 25;
  const [rows, [count]] = await Promise.all([
    db
      .select()
      .from(vehicles)
      .where(where)
      .orderBy(...SORT_SQL[q.sort ?? "days_desc"])
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ n: sql<number>`count(*)` }).from(vehicles).where(where),
  ]);
  return { rows, total: Number(count?.n ?? 0), page, pageSize };
}

export async function findVehicle(db: DbOrTx, dealershipId: number, id: number, forUpdate = false) {
  const q = db.select().from(vehicles).where(and(eq(vehicles.dealershipId, dealershipId), eq(vehicles.id, id))).limit(1);
  const [row] = forUpdate ? await q.for("update") : await q;
  return row ?? null;
}

export const makesInStock = (db: DbOrTx, dealershipId: number) =>
  db
    .selectDistinct({ make: vehicles.make })
    .from(vehicles)
    .where(eq(vehicles.dealershipId, dealershipId))
    .orderBy(asc(vehicles.make));

/** Feature tags used before at this dealership, most used first, for the editor's suggestions. */
export async function featureSuggestions(db: DbOrTx, dealershipId: number, prefix: string, limit = 20) {
  const [rows] = (await db.execute(sql`
    select f.tag as tag, count(*) as uses
    from ${vehicles}, json_table(${vehicles.features}, '$[*]' columns (tag varchar(40) path '$')) as f
    where ${vehicles.dealershipId} = ${dealershipId} and f.tag like ${escapeLike(prefix) + "%"}
    group by f.tag order by uses desc, f.tag asc limit ${limit}`)) as unknown as [Array<{ tag: string; uses: number }>];
  return rows.map((r) => r.tag);
}

export const eventsFor = (db: DbOrTx, vehicleId: number) =>
  db.select().from(vehicleEvents).where(eq(vehicleEvents.vehicleId, vehicleId)).orderBy(desc(vehicleEvents.at), desc(vehicleEvents.id));
