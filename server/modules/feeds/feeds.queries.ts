// Plain queries of the feeds module. The feed's own select is written as SQL text with placeholders, because it is
// streamed straight off a mysql2 connection (rows as arrays) rather than collected by drizzle.
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import type { Pool as CorePool, PoolConnection as CoreConnection } from "mysql2";
import type { DbOrTx } from "../../db/client.ts";
import { feedFetches, feeds } from "../../db/schema/index.ts";
import { DEFAULT_STATUSES, type FeedFilter } from "../../../shared/schemas/feeds.ts";
import { DAY_MS } from "../../lib/clock.ts";

export interface Fragment {
  sql: string;
  params: unknown[];
}

const list = (xs: readonly unknown[]) => xs.map(() => "?").join(", ");

/**
 * Does the vehicle match the feed now? Reads the revision's copied columns (the published figures) and the vehicle's
 * status and stock date. Days in stock counts whole days, as the stock list does.
 */
export function matchFragment(filter: FeedFilter, now: Date): Fragment {
  const parts: string[] = [];
  const params: unknown[] = [];
  const statuses = filter.statuses?.length ? filter.statuses : DEFAULT_STATUSES;
  parts.push(`v.status IN (${list(statuses)})`);
  params.push(...statuses);
  if (filter.makes?.length) {
    parts.push(`r.make IN (${list(filter.makes)})`);
    params.push(...filter.makes);
  }
  if (filter.bodyTypes?.length) {
    parts.push(`r.body_type IN (${list(filter.bodyTypes)})`);
    params.push(...filter.bodyTypes);
  }
  if (filter.fuelTypes?.length) {
    parts.push(`r.fuel_type IN (${list(filter.fuelTypes)})`);
    params.push(...filter.fuelTypes);
  }
  if (filter.priceMinCents !== undefined) {
    parts.push("r.price_cents >= ?");
    params.push(filter.priceMinCents);
  }
  if (filter.priceMaxCents !== undefined) {
    parts.push("r.price_cents <= ?");
    params.push(filter.priceMaxCents);
  }
  if (filter.daysInStockMin !== undefined) {
    parts.push("v.stocked_at <= ?");
    params.push(new Date(now.getTime() - filter.daysInStockMin * DAY_MS));
  }
  if (filter.daysInStockMax !== undefined) {
    parts.push("v.stocked_at > ?");
    params.push(new Date(now.getTime() - (filter.daysInStockMax + 1) * DAY_MS));
  }
  return { sql: `COALESCE((${parts.join(" AND ")}), FALSE)`, params };
}

/**
 * When the vehicle last changed as far as this feed is concerned: its newest publish, its last status move, and the
 * moments it crossed the feed's days-in-stock bounds (when those are already past).
 */
export function changedFragment(filter: FeedFilter, now: Date): Fragment {
  const terms = ["r.published_at", "COALESCE((SELECT MAX(e.at) FROM vehicle_events e WHERE e.vehicle_id = v.id), r.published_at)"];
  const params: unknown[] = [];
  const crossing = (days: number) => {
    terms.push("CASE WHEN v.stocked_at + INTERVAL ? DAY <= ? THEN v.stocked_at + INTERVAL ? DAY ELSE r.published_at END");
    params.push(days, now, days);
  };
  if (filter.daysInStockMin !== undefined) crossing(filter.daysInStockMin);
  if (filter.daysInStockMax !== undefined) crossing(filter.daysInStockMax + 1);
  return { sql: `GREATEST(${terms.join(", ")})`, params };
}

const FROM = "FROM vehicles v JOIN revisions r ON r.id = v.current_revision_id WHERE v.dealership_id = ?";

/** The columns of a streamed row, in order (rowsAsArray). */
export const ROW_FIELDS = ["vehicleId", "status", "stockNumber", "stockedAt", "revisionId", "number", "slug", "snapshot", "publishedAt", "changedAt", "inFeed"] as const;

/**
 * The feed's rows. Without since: every matching vehicle. With since: every vehicle that changed after it, marked
 * in the feed (sent whole) or not (sent as a removal: it left the feed's statuses or filter).
 */
export function feedSelect(dealershipId: number, filter: FeedFilter, now: Date, since?: Date, limit?: number): Fragment {
  const match = matchFragment(filter, now);
  const changed = changedFragment(filter, now);
  const select = `SELECT v.id, v.status, v.stock_number, v.stocked_at, r.id, r.number, r.slug, IF(${match.sql}, r.snapshot, NULL), r.published_at, ${changed.sql}, ${match.sql}`;
  const head = [...match.params, ...changed.params, ...match.params];
  const where = since ? `AND ${changed.sql} > ?` : `AND ${match.sql}`;
  const whereParams = since ? [...changed.params, since] : match.params;
  return {
    sql: `${select} ${FROM} ${where} ORDER BY v.id${limit ? ` LIMIT ${Math.floor(limit)}` : ""}`,
    params: [...head, dealershipId, ...whereParams],
  };
}

/**
 * One small aggregate that changes whenever the feed's output would: how many match, which revisions (XOR of ids),
 * and the latest change of any published vehicle of the dealership (which covers removals too).
 */
export function fingerprintSelect(dealershipId: number, filter: FeedFilter, now: Date): Fragment {
  const match = matchFragment(filter, now);
  const changed = changedFragment(filter, now);
  return {
    sql: `SELECT COUNT(CASE WHEN ${match.sql} THEN 1 END) AS n, COALESCE(BIT_XOR(CASE WHEN ${match.sql} THEN r.id ELSE 0 END), 0) AS x, MAX(${changed.sql}) AS m ${FROM}`,
    params: [...match.params, ...match.params, ...changed.params, dealershipId],
  };
}

/** A dedicated connection off the core pool for one streamed query; released when done, destroyed if cut short. */
export function takeConnection(pool: CorePool): Promise<CoreConnection> {
  return new Promise((resolve, reject) => pool.getConnection((err, conn) => (err ? reject(err) : resolve(conn))));
}

export const findFeed = (db: DbOrTx, dealershipId: number, id: number, lock = false) => {
  const q = db.select().from(feeds).where(and(eq(feeds.id, id), eq(feeds.dealershipId, dealershipId), isNull(feeds.revokedAt)));
  return (lock ? q.for("update") : q).then((rows) => rows[0] ?? null);
};

export const findFeedByTokenHash = (db: DbOrTx, tokenHash: string) =>
  db.select().from(feeds).where(eq(feeds.tokenHash, tokenHash)).limit(1).then((rows) => rows[0] ?? null);

export const listFeeds = (db: DbOrTx, dealershipId: number) =>
  db.select().from(feeds).where(and(eq(feeds.dealershipId, dealershipId), isNull(feeds.revokedAt))).orderBy(desc(feeds.createdAt), desc(feeds.id));

/** The last fetches of each of the given feeds (at most `per` each), newest first. */
export async function recentFetches(db: DbOrTx, feedIds: number[], per = 20) {
  if (!feedIds.length) return [];
  const rows = await db.execute(
    sql`SELECT id, feed_id, at, ip, user_agent, \`rows\`, bytes, status, since FROM (
          SELECT f.*, ROW_NUMBER() OVER (PARTITION BY f.feed_id ORDER BY f.at DESC, f.id DESC) AS k FROM feed_fetches f
          WHERE f.feed_id IN (${sql.join(feedIds.map((id) => sql`${id}`), sql`, `)})
        ) t WHERE t.k <= ${per} ORDER BY at DESC, id DESC`,
  );
  const list = (rows as unknown as [Array<Record<string, unknown>>])[0];
  // drizzle reads DATETIME through mysql2 as text in UTC.
  const date = (v: string | Date | null) => (v == null ? null : v instanceof Date ? v : new Date(`${v.replace(" ", "T")}Z`));
  return list.map((r) => ({
    id: Number(r.id),
    feedId: Number(r.feed_id),
    at: date(r.at as string | Date)!,
    ip: (r.ip as string | null) ?? null,
    userAgent: (r.user_agent as string | null) ?? null,
    rows: Number(r.rows),
    bytes: Number(r.bytes),
    status: Number(r.status),
    since: date(r.since as string | Date | null),
  }));
}

export async function logFetch(db: DbOrTx, entry: typeof feedFetches.$inferInsert) {
  await db.insert(feedFetches).values(entry);
  await db.update(feeds).set({ lastFetchedAt: entry.at, updatedAt: sql`${feeds.updatedAt}` }).where(eq(feeds.id, entry.feedId));
}
