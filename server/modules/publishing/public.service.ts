import { and, asc, desc, eq, gte, inArray, like, lte, or, sql, type SQL } from "drizzle-orm";
import type { AppContext } from "../../lib/context.ts";
import { revisions, vehicles } from "../../db/schema/index.ts";
import { AppError, notFound } from "../../lib/errors.ts";
import { primaryDealership } from "../dealerships/dealerships.service.ts";
import { presentPublicDealership } from "../dealerships/dealerships.presenter.ts";
import type { PublicListQuery, PublicSort } from "../../../shared/schemas/public-query.ts";
import type { PublicStatus, PublicVehicle, PublicVehicleCard, RevisionSummary } from "../../../shared/schemas/public.ts";
import type { Revision } from "../../db/schema/index.ts";
import type { Db } from "../../db/client.ts";
import { PublicCache, representation, type Representation } from "./public-cache.ts";

/** Statuses whose newest revision the public may read. Withdrawn answers 410; anything else has never been public. */
const PUBLIC: PublicStatus[] = ["live", "reserved", "sold"];
const ON_SALE: PublicStatus[] = ["live", "reserved"];

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => "\\" + c);

const ORDER: Record<PublicSort, SQL[]> = {
  newest: [desc(revisions.publishedAt)],
  price_asc: [sql`${revisions.priceCents} is null`, asc(revisions.priceCents)],
  price_desc: [sql`${revisions.priceCents} is null`, desc(revisions.priceCents)],
  odometer_asc: [sql`${revisions.odometerKm} is null`, asc(revisions.odometerKm)],
  year_desc: [sql`${revisions.buildYear} is null`, desc(revisions.buildYear)],
  condition_desc: [sql`${revisions.conditionIndex} is null`, desc(revisions.conditionIndex)],
};

export function urlFor(ctx: AppContext, slug: string) {
  return `${ctx.config.publicUrl}/vehicles/${slug}`;
}

function card(ctx: AppContext, r: Revision, status: PublicStatus): PublicVehicleCard {
  const s = r.snapshot;
  return {
    slug: r.slug,
    url: urlFor(ctx, r.slug),
    status,
    title: s.title,
    variant: s.variant,
    priceCents: s.priceCents,
    currency: s.currency,
    odometer: { reading: s.odometer.reading, unit: s.odometer.unit },
    buildYear: s.buildYear,
    bodyType: s.bodyType,
    fuelType: s.fuelType,
    transmission: s.transmission,
    rangeKm: s.derived.rangeKm,
    conditionIndex: s.condition.index,
    defectCount: s.defects.length,
    cover: s.photos.find((p) => p.isCover) ?? s.photos[0] ?? null,
    publishedAt: r.publishedAt.toISOString(),
  };
}

/** The storefront: the newest revision of every vehicle on sale, filtered and sorted on the revision's own copy. */
export async function listPublic(ctx: AppContext, q: PublicListQuery) {
  const { db } = ctx.database;
  const d = await primaryDealership(db);
  if (!d) throw notFound("The dealership");
  const where: Array<SQL | undefined> = [eq(vehicles.dealershipId, d.id), inArray(vehicles.status, ON_SALE)];
  if (q.q) {
    const t = escapeLike(q.q);
    where.push(or(like(revisions.title, `%${t}%`), like(revisions.make, `${t}%`), like(revisions.model, `${t}%`)));
  }
  if (q.make) where.push(eq(revisions.make, q.make));
  if (q.bodyType) where.push(eq(revisions.bodyType, q.bodyType));
  if (q.fuelType) where.push(eq(revisions.fuelType, q.fuelType));
  if (q.priceMin !== undefined) where.push(gte(revisions.priceCents, q.priceMin));
  if (q.priceMax !== undefined) where.push(lte(revisions.priceCents, q.priceMax));
  if (q.odometerMax !== undefined) where.push(lte(revisions.odometerKm, q.odometerMax));
  if (q.yearMin !== undefined) where.push(gte(revisions.buildYear, q.yearMin));
  if (q.yearMax !== undefined) where.push(lte(revisions.buildYear, q.yearMax));
  const cond = and(...where);
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 24;
  const base = () => db.select().from(vehicles).innerJoin(revisions, eq(revisions.id, vehicles.currentRevisionId));
  const [rows, [count], facets] = await Promise.all([
    base()
      .where(cond)
      .orderBy(...ORDER[q.sort ?? "newest"], asc(revisions.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ n: sql<number>`count(*)` }).from(vehicles).innerJoin(revisions, eq(revisions.id, vehicles.currentRevisionId)).where(cond),
    db
      .select({ make: revisions.make, bodyType: revisions.bodyType, fuelType: revisions.fuelType })
      .from(vehicles)
      .innerJoin(revisions, eq(revisions.id, vehicles.currentRevisionId))
      .where(and(eq(vehicles.dealershipId, d.id), inArray(vehicles.status, ON_SALE))),
  ]);
  const uniq = (xs: Array<string | null>) => [...new Set(xs.filter((x): x is string => Boolean(x)))].sort();
  const total = Number(count?.n ?? 0);
  return {
    vehicles: rows.map((r) => card(ctx, r.revisions, r.vehicles.status as PublicStatus)),
    total,
    page,
    pageCount: Math.max(1, Math.ceil(total / pageSize)),
    facets: { makes: uniq(facets.map((f) => f.make)), bodyTypes: uniq(facets.map((f) => f.bodyType)), fuelTypes: uniq(facets.map((f) => f.fuelType)) },
    dealership: presentPublicDealership(d),
  };
}

const summary = (r: Pick<Revision, "number" | "publishedAt" | "changes">): RevisionSummary => ({ number: r.number, publishedAt: r.publishedAt.toISOString(), changes: r.changes });

const locateStatements = new WeakMap<Db, ReturnType<typeof prepareLocate>>();
const prepareLocate = (db: Db) =>
  db
    .select({ id: vehicles.id, status: vehicles.status, currentRevisionId: vehicles.currentRevisionId })
    .from(vehicles)
    .where(eq(vehicles.publicSlug, sql.placeholder("slug")))
    .limit(1)
    .prepare();
/** Built once per database handle: the statement runs on every public read, so drizzle need not rebuild its SQL each time. */
function locateStatement(db: Db) {
  let s = locateStatements.get(db);
  if (!s) locateStatements.set(db, (s = prepareLocate(db)));
  return s;
}

interface Located {
  id: number;
  status: PublicStatus;
  currentRevisionId: number;
}

/**
 * The one query every public read makes: slug → vehicle, status and current revision, by the unique slug index.
 * 404 for never published, 410 for withdrawn or archived. Because it runs on every request and reads the shared
 * database, a withdrawal, a sale or a new revision is seen at once by every instance.
 */
async function locate(ctx: AppContext, slug: string): Promise<Located> {
  const { db } = ctx.database;
  const [v] = await locateStatement(db).execute({ slug });
  if (!v || !v.currentRevisionId) throw notFound("That vehicle");
  if (v.status === "withdrawn" || v.status === "archived") {
    const d = await primaryDealership(db);
    throw new AppError(410, "withdrawn", "This vehicle is no longer advertised.", undefined, d ? { dealership: presentPublicDealership(d) } : {});
  }
  if (!PUBLIC.includes(v.status as PublicStatus)) throw notFound("That vehicle");
  return { id: v.id, status: v.status as PublicStatus, currentRevisionId: v.currentRevisionId };
}

/** Whether the address may be shown to the public at all (404 / 410 otherwise), with no revision read. */
export async function assertPublic(ctx: AppContext, slug: string): Promise<void> {
  await locate(ctx, slug);
}

/** Everything the public sees of a located vehicle: its current (or numbered) revision and the list of revisions. */
async function readPublic(ctx: AppContext, slug: string, v: Located, number?: number): Promise<PublicVehicle> {
  const { db } = ctx.database;
  const all = await db
    .select({ id: revisions.id, number: revisions.number, publishedAt: revisions.publishedAt, changes: revisions.changes })
    .from(revisions)
    .where(eq(revisions.vehicleId, v.id))
    .orderBy(desc(revisions.number));
  const wanted = number === undefined ? all.find((r) => r.id === v.currentRevisionId) : all.find((r) => r.number === number);
  if (!wanted) throw notFound("That revision");
  const [full] = await db.select().from(revisions).where(eq(revisions.id, wanted.id));
  return { slug, url: urlFor(ctx, slug), status: v.status, revision: summary(full), snapshot: full.snapshot, revisions: all.map(summary) };
}

/** A vehicle by its public address: the newest revision, or a given older one. Never the working record. */
export async function getPublic(ctx: AppContext, slug: string, number?: number): Promise<PublicVehicle> {
  return readPublic(ctx, slug, await locate(ctx, slug), number);
}

const caches = new WeakMap<AppContext, PublicCache>();
/** The app's cache of public responses (one per context, so test apps on different databases never share one). */
export function publicCacheOf(ctx: AppContext): PublicCache {
  let cache = caches.get(ctx);
  if (!cache) caches.set(ctx, (cache = new PublicCache()));
  return cache;
}

/**
 * A public response made from the vehicle's revisions, cached by what it depends on: revisions never change, so
 * (vehicle, revision asked for, current revision, status) fixes the bytes; the slug → those lookup runs every time.
 */
export async function publicRepresentation(
  ctx: AppContext,
  kind: string,
  slug: string,
  number: number | undefined,
  render: (v: PublicVehicle) => Promise<Representation>,
): Promise<Representation> {
  const v = await locate(ctx, slug);
  const key = `${kind}|${slug}|${v.id}|${number ?? "current"}|${v.currentRevisionId}|${v.status}`;
  return publicCacheOf(ctx).get(key, async () => {
    const rep = await render(await readPublic(ctx, slug, v, number));
    return { value: rep, size: rep.size + key.length };
  });
}

/** GET /api/public/vehicles/:slug[/revisions/:n], serialised once per revision. */
export function publicVehicleJson(ctx: AppContext, slug: string, number?: number): Promise<Representation> {
  return publicRepresentation(ctx, "api", slug, number, (vehicle) => representation("application/json; charset=utf-8", JSON.stringify({ vehicle })));
}

/** Every page a search engine should know: the storefront and each vehicle on sale. */
export async function sitemapEntries(ctx: AppContext) {
  const d = await primaryDealership(ctx.database.db);
  if (!d) return [];
  const rows = await ctx.database.db
    .select({ slug: revisions.slug, publishedAt: revisions.publishedAt })
    .from(vehicles)
    .innerJoin(revisions, eq(revisions.id, vehicles.currentRevisionId))
    .where(and(eq(vehicles.dealershipId, d.id), inArray(vehicles.status, ON_SALE)));
  return rows.map((r) => ({ loc: urlFor(ctx, r.slug), lastmod: r.publishedAt.toISOString() }));
}
