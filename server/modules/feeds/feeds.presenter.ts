import type { Feed } from "../../db/schema/index.ts";
import { FORMATS_WITH_COLUMNS, effectiveColumns, type FeedColumn, type FeedFilter, type FeedFormat, type FeedUnits } from "../../../shared/schemas/feeds.ts";
import { DAY_MS } from "../../lib/clock.ts";

export interface FeedFetchView {
  id: number;
  at: string;
  ip: string | null;
  userAgent: string | null;
  rows: number;
  bytes: number;
  status: number;
  since: string | null;
}

export interface FeedView {
  id: number;
  name: string;
  format: FeedFormat;
  filter: FeedFilter;
  /** The columns written (the default set when none were chosen); null for JSON and JSON-LD. */
  columns: FeedColumn[] | null;
  defaultColumns: boolean;
  units: FeedUnits;
  /** The URL with the token hidden but for its last four characters, so staff can tell URLs apart. */
  urlHint: string;
  tokenHint: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  lastFetchedAt: string | null;
  /** True when no portal has fetched the feed for a day (or ever, once it is a day old). */
  notFetchedForADay: boolean;
  fetches: FeedFetchView[];
}

type FetchRow = { id: number; at: Date; ip: string | null; userAgent: string | null; rows: number; bytes: number; status: number; since: Date | null };

export const presentFetch = (f: FetchRow): FeedFetchView => ({
  id: f.id, at: f.at.toISOString(), ip: f.ip, userAgent: f.userAgent, rows: f.rows, bytes: f.bytes, status: f.status, since: f.since?.toISOString() ?? null,
});

export function presentFeed(f: Feed, publicUrl: string, now: Date, fetches: FetchRow[] = []): FeedView {
  const withColumns = FORMATS_WITH_COLUMNS.includes(f.format);
  const reference = f.lastFetchedAt ?? f.createdAt;
  return {
    id: f.id,
    name: f.name,
    format: f.format,
    filter: f.filter,
    columns: withColumns ? effectiveColumns(f.columns) : null,
    defaultColumns: withColumns && !f.columns?.length,
    units: f.units,
    urlHint: `${publicUrl}/feeds/…${f.tokenHint}.${f.format}`,
    tokenHint: f.tokenHint,
    version: f.version,
    createdAt: f.createdAt.toISOString(),
    updatedAt: f.updatedAt.toISOString(),
    lastFetchedAt: f.lastFetchedAt?.toISOString() ?? null,
    notFetchedForADay: now.getTime() - reference.getTime() > DAY_MS,
    fetches: fetches.map(presentFetch),
  };
}

export interface FeedPreview {
  columns: Array<{ key: string; header: string }>;
  rows: string[][];
  /** How many vehicles the feed carries now. */
  total: number;
  /** The feed's own text for the first rows, exactly as a portal would read it. */
  sample: string;
}
