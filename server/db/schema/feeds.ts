import { bigint, index, int, mysqlEnum, mysqlTable, smallint, uniqueIndex, varchar } from "drizzle-orm/mysql-core";
import { FEED_FORMATS, FEED_UNITS, type FeedColumn, type FeedFilter } from "../../../shared/schemas/feeds.ts";
import { createdAt, editedRecord, instant, jsonText, logId, parentId, serialId } from "./columns.ts";
import { dealerships } from "./dealerships.ts";

/**
 * A marketing feed: what it carries (filter, columns, units) and how a portal reaches it. The token itself is never
 * stored: only its SHA-256 (to find the feed) and its last four characters (so staff can tell URLs apart).
 */
export const feeds = mysqlTable(
  "feeds",
  {
    id: serialId(),
    dealershipId: parentId(() => dealerships.id),
    name: varchar({ length: 120 }).notNull(),
    format: mysqlEnum(FEED_FORMATS).notNull(),
    filter: jsonText<FeedFilter>().notNull(),
    /** Null: the default set (CSV and XML); always null for JSON and JSON-LD. */
    columns: jsonText<FeedColumn[] | null>(),
    units: mysqlEnum(FEED_UNITS).notNull().default("market"),
    tokenHash: varchar({ length: 64 }).notNull(),
    tokenHint: varchar({ length: 4 }).notNull(),
    revokedAt: instant(),
    createdBy: varchar({ length: 255 }),
    ...editedRecord(),
    lastFetchedAt: instant(),
  },
  (t) => [uniqueIndex("feeds_token_hash_uq").on(t.tokenHash), index("feeds_dealership_idx").on(t.dealershipId, t.createdAt)],
);

/** Every fetch of a feed's URL, answered or not modified: who (address, user agent), how much, since when. */
export const feedFetches = mysqlTable(
  "feed_fetches",
  {
    id: logId(),
    feedId: parentId(() => feeds.id, { onDelete: "cascade" }),
    at: createdAt(),
    ip: varchar({ length: 64 }),
    userAgent: varchar({ length: 300 }),
    rows: int().notNull().default(0),
    bytes: bigint({ mode: "number" }).notNull().default(0),
    status: smallint().notNull(),
    since: instant(),
  },
  (t) => [index("feed_fetches_feed_idx").on(t.feedId, t.at)],
);

export type Feed = typeof feeds.$inferSelect;
export type FeedFetch = typeof feedFetches.$inferSelect;
