import { createHash } from "node:crypto";
import { PassThrough, Transform, pipeline, type Readable } from "node:stream";
import { eq } from "drizzle-orm";
import type { User } from "lucia";
import type { AppContext } from "../../lib/context.ts";
import { feeds, type Dealership, type Feed } from "../../db/schema/index.ts";
import { notFound, staleVersion } from "../../lib/errors.ts";
import { actorOf, diffFields, recordAudit } from "../audit/audit.service.ts";
import { getDealership } from "../dealerships/dealerships.service.ts";
import {
  DEFAULT_STATUSES, FORMATS_WITH_COLUMNS, effectiveColumns, type CreateFeedInput, type FeedColumn, type FeedFormat, type PreviewFeedInput, type UpdateFeedInput,
} from "../../../shared/schemas/feeds.ts";
import type { PublicSnapshot, PublicStatus } from "../../../shared/schemas/public.ts";
import { ALL_COLUMNS, cellOf, dependsOnToday, unitsFor, type Cell, type CellContext, type FeedRow } from "./columns.ts";
import { CONTENT_TYPES, writerFor, type FeedItem } from "./writers.ts";
import { feedSelect, findFeed, findFeedByTokenHash, fingerprintSelect, listFeeds, logFetch, recentFetches, takeConnection } from "./feeds.queries.ts";
import { presentFeed, type FeedPreview } from "./feeds.presenter.ts";
import { hashFeedToken, newFeedToken, TOKEN_PATTERN } from "./token.ts";

export const feedUrl = (ctx: AppContext, token: string, format: FeedFormat) => `${ctx.config.publicUrl}/feeds/${token}.${format}`;

/** What the audit trail keeps of a feed: everything but the token. */
const auditView = (f: Pick<Feed, "name" | "format" | "filter" | "columns" | "units" | "tokenHint">) => ({
  name: f.name, format: f.format, filter: f.filter, columns: f.columns, units: f.units, tokenHint: f.tokenHint,
});

const normaliseFilter = (filter: CreateFeedInput["filter"]) => ({ ...(filter ?? {}), statuses: filter?.statuses?.length ? filter.statuses : DEFAULT_STATUSES });
const columnsFor = (format: FeedFormat, columns: FeedColumn[] | undefined) => (FORMATS_WITH_COLUMNS.includes(format) && columns?.length ? columns : null);

export async function list(ctx: AppContext, actor: User) {
  const { db } = ctx.database;
  const rows = await listFeeds(db, actor.dealershipId);
  const fetches = await recentFetches(db, rows.map((f) => f.id), 20);
  const now = ctx.now();
  return rows.map((f) => presentFeed(f, ctx.config.publicUrl, now, fetches.filter((x) => x.feedId === f.id)));
}

export async function get(ctx: AppContext, actor: User, id: number) {
  const f = await findFeed(ctx.database.db, actor.dealershipId, id);
  if (!f) throw notFound("That feed");
  return presentFeed(f, ctx.config.publicUrl, ctx.now(), await recentFetches(ctx.database.db, [f.id], 20));
}

export async function create(ctx: AppContext, actor: User, input: CreateFeedInput) {
  const { token, tokenHash, tokenHint } = newFeedToken();
  const values = {
    dealershipId: actor.dealershipId, name: input.name, format: input.format, filter: normaliseFilter(input.filter),
    columns: columnsFor(input.format, input.columns),
    units: input.units ?? ("market" as const), tokenHash, tokenHint, createdBy: actor.id,
  };
  return ctx.database.db.transaction(async (tx) => {
    const [result] = await tx.insert(feeds).values(values);
    const id = result.insertId;
    await recordAudit(tx, actorOf(actor), { action: "feed_created", entityType: "feed", entityId: id, after: auditView(values) });
    const f = await findFeed(tx, actor.dealershipId, id);
    const url = feedUrl(ctx, token, f.format);
    return { feed: { ...presentFeed(f, ctx.config.publicUrl, ctx.now()), url }, url };
  });
}

export async function update(ctx: AppContext, actor: User, id: number, input: UpdateFeedInput) {
  return ctx.database.db.transaction(async (tx) => {
    const current = await findFeed(tx, actor.dealershipId, id, true);
    if (!current) throw notFound("That feed");
    if (current.version !== input.version) throw staleVersion(presentFeed(current, ctx.config.publicUrl, ctx.now()));
    const set: Partial<Feed> = {};
    if (input.name !== undefined) set.name = input.name;
    if (input.filter !== undefined) set.filter = normaliseFilter(input.filter);
    if (input.units !== undefined) set.units = input.units;
    if (input.columns !== undefined) set.columns = columnsFor(current.format, input.columns);
    await tx.update(feeds).set({ ...set, version: current.version + 1 }).where(eq(feeds.id, id));
    const diff = diffFields(auditView(current), set);
    await recordAudit(tx, actorOf(actor), { action: "feed_updated", entityType: "feed", entityId: id, before: diff?.before ?? null, after: diff?.after ?? null });
    return presentFeed(await findFeed(tx, actor.dealershipId, id), ctx.config.publicUrl, ctx.now());
  });
}

/** A new secret URL; the old one answers 404 from this moment. */
export async function rotate(ctx: AppContext, actor: User, id: number) {
  return ctx.database.db.transaction(async (tx) => {
    const current = await findFeed(tx, actor.dealershipId, id, true);
    if (!current) throw notFound("That feed");
    const { token, tokenHash, tokenHint } = newFeedToken();
    await tx.update(feeds).set({ tokenHash, tokenHint, version: current.version + 1 }).where(eq(feeds.id, id));
    await recordAudit(tx, actorOf(actor), { action: "feed_token_rotated", entityType: "feed", entityId: id, before: { tokenHint: current.tokenHint }, after: { tokenHint } });
    const f = await findFeed(tx, actor.dealershipId, id);
    const url = feedUrl(ctx, token, f.format);
    return { feed: { ...presentFeed(f, ctx.config.publicUrl, ctx.now()), url }, url };
  });
}

/** Revoked for good: the URL answers 404 and the feed leaves the list; its fetch log stays. */
export async function revoke(ctx: AppContext, actor: User, id: number) {
  await ctx.database.db.transaction(async (tx) => {
    const current = await findFeed(tx, actor.dealershipId, id, true);
    if (!current) throw notFound("That feed");
    const at = ctx.now();
    await tx.update(feeds).set({ revokedAt: at, version: current.version + 1 }).where(eq(feeds.id, id));
    await recordAudit(tx, actorOf(actor), { action: "feed_revoked", entityType: "feed", entityId: id, before: auditView(current), after: { revokedAt: at.toISOString() } });
  });
}

// ---------------------------------------------------------------------------------------------------------------
// Reading a feed

export interface FeedSpec {
  id: number;
  dealershipId: number;
  name: string;
  format: FeedFormat;
  filter: Feed["filter"];
  columns: FeedColumn[] | null;
  units: Feed["units"];
  version: number;
  updatedAt: Date;
}

/** The feed behind a public URL: unknown, rotated-away, revoked, or the wrong extension all answer the same 404. */
export async function feedForToken(ctx: AppContext, token: string, ext: string): Promise<Feed> {
  if (!TOKEN_PATTERN.test(token)) throw notFound("That feed");
  const f = await findFeedByTokenHash(ctx.database.db, hashFeedToken(token));
  if (!f || f.revokedAt || f.format !== ext) throw notFound("That feed");
  return f;
}

export async function feedForDownload(ctx: AppContext, actor: User, id: number): Promise<Feed> {
  const f = await findFeed(ctx.database.db, actor.dealershipId, id);
  if (!f) throw notFound("That feed");
  return f;
}

/**
 * The columns a response writes: the chosen ones, then the stock number, status and URL when they are missing, so a
 * removal (with since) says which car. The same with and without since, so a parser reading by position never
 * finds a column that comes and goes (issue 16).
 */
function columnsOf(spec: Pick<FeedSpec, "format" | "columns">): FeedColumn[] {
  if (!FORMATS_WITH_COLUMNS.includes(spec.format)) return ALL_COLUMNS;
  const cols = effectiveColumns(spec.columns);
  const missing = (["stockNumber", "status", "url"] as const).filter((k) => !cols.some((c) => c.key === k));
  return [...cols, ...missing.map((key) => ({ key, header: cols.some((c) => c.header === key) ? `${key}_` : key }))];
}

export interface Validators {
  etag: string;
  lastModified: Date;
  count: number;
}

/** ETag and Last-Modified from one aggregate query, before any row is read, so an unchanged feed costs only that. */
export async function validators(ctx: AppContext, spec: FeedSpec, since?: Date): Promise<Validators> {
  const now = ctx.now();
  const fp = fingerprintSelect(spec.dealershipId, spec.filter, now);
  const [rows] = await ctx.database.pool.query(fp.sql, fp.params);
  const r = (rows as Array<{ n: number | string; x: number | string; m: Date | null }>)[0] ?? { n: 0, x: 0, m: null };
  const today = dependsOnToday(columnsOf(spec)) ? now.toISOString().slice(0, 10) : "";
  const key = [spec.id, spec.version, spec.updatedAt.getTime(), spec.format, r.n, r.x, r.m ? new Date(r.m).getTime() : 0, since?.getTime() ?? "", today, ctx.config.publicUrl].join(":");
  const etag = `W/"${createHash("sha256").update(key).digest("base64url").slice(0, 27)}"`;
  let last = Math.max(spec.updatedAt.getTime(), r.m ? new Date(r.m).getTime() : 0);
  if (today) last = Math.max(last, Date.parse(`${today}T00:00:00Z`));
  return { etag, lastModified: new Date(Math.floor(last / 1000) * 1000), count: Number(r.n) };
}

const toDate = (v: unknown) => (v instanceof Date ? v : new Date(`${String(v).replace(" ", "T")}Z`));

/** Array rows (ROW_FIELDS order) to feed items. */
function rowToItem(a: unknown[]): FeedItem {
  const inFeed = Number(a[10]) === 1;
  if (!inFeed) return { kind: "removed", row: { stockNumber: String(a[2]), slug: String(a[6]), removedAt: toDate(a[9]) } };
  const snapshot = (typeof a[7] === "string" ? JSON.parse(a[7]) : a[7]) as PublicSnapshot;
  const row: FeedRow = {
    vehicleId: Number(a[0]), status: a[1] as PublicStatus, stockNumber: String(a[2]), stockedAt: toDate(a[3]), revisionId: Number(a[4]), number: Number(a[5]),
    slug: String(a[6]), snapshot, publishedAt: toDate(a[8]), changedAt: toDate(a[9]),
  };
  return { kind: "row", row };
}

function cellContext(ctx: AppContext, spec: FeedSpec, d: Dealership): CellContext {
  return { publicUrl: ctx.config.publicUrl, units: unitsFor(spec.units, d), now: ctx.now() };
}

export interface FeedStream {
  body: Readable;
  contentType: string;
  /** Rows and bytes written so far (final once the body has ended). */
  counts: () => { rows: number; bytes: number };
}

/**
 * Streams the feed: a mysql2 query stream on a connection of its own → rows to items → the format's writer → bytes.
 * One pipeline, so back-pressure reaches the database (mysql2 pauses the socket) and memory stays flat; if the
 * client goes away the pipeline is torn down and the connection destroyed rather than returned mid-result.
 */
export async function openFeedStream(ctx: AppContext, spec: FeedSpec, since?: Date, options: { bom?: boolean } = {}): Promise<FeedStream> {
  const d = await getDealership(ctx.database.db, spec.dealershipId);
  const cells = cellContext(ctx, spec, d);
  const q = feedSelect(spec.dealershipId, spec.filter, cells.now, since);
  const conn = await takeConnection(ctx.database.pool.pool);
  let rows = 0;
  let bytes = 0;
  const source = conn.query({ sql: q.sql, values: q.params, rowsAsArray: true }).stream({ highWaterMark: 16 });
  const toItems = new Transform({
    objectMode: true,
    highWaterMark: 16,
    transform(a: unknown[], _enc, cb) {
      try {
        rows++;
        cb(null, rowToItem(a));
      } catch (e) {
        cb(e as Error);
      }
    },
  });
  const counter = new PassThrough({
    transform(chunk: Buffer, _enc, cb) {
      bytes += chunk.length;
      cb(null, chunk);
    },
  });
  const stages = writerFor({ format: spec.format, columns: columnsOf(spec), cells, name: spec.name, since, bom: options.bom });
  pipeline([source, toItems, ...stages, counter], (err) => {
    if (err) conn.destroy();
    else conn.release();
  });
  return { body: counter, contentType: CONTENT_TYPES[spec.format], counts: () => ({ rows, bytes }) };
}

type FetchEntry = { ip: string | null; userAgent: string | null; rows: number; bytes: number; status: number; since?: Date };

export async function recordFetch(ctx: AppContext, feedId: number, entry: FetchEntry) {
  await logFetch(ctx.database.db, {
    feedId, at: ctx.now(), ip: entry.ip?.slice(0, 64) ?? null, userAgent: entry.userAgent?.slice(0, 300) ?? null,
    rows: entry.rows, bytes: entry.bytes, status: entry.status, since: entry.since ?? null,
  });
}

/** The first rows as a table and as the feed's own text, for a feed not yet saved. */
export async function preview(ctx: AppContext, actor: User, input: PreviewFeedInput): Promise<FeedPreview> {
  const d = await getDealership(ctx.database.db, actor.dealershipId);
  const spec: FeedSpec = {
    id: 0, dealershipId: actor.dealershipId, name: input.name || "Preview", format: input.format, filter: normaliseFilter(input.filter),
    columns: columnsFor(input.format, input.columns), units: input.units ?? "market", version: 0, updatedAt: ctx.now(),
  };
  const cells = cellContext(ctx, spec, d);
  const limit = input.limit ?? 10;
  const q = feedSelect(spec.dealershipId, spec.filter, cells.now, undefined, limit);
  const [[result], fp] = await Promise.all([ctx.database.pool.query({ sql: q.sql, values: q.params, rowsAsArray: true }), validators(ctx, spec)]);
  const items = (result as unknown[][]).map(rowToItem);
  const tableColumns = FORMATS_WITH_COLUMNS.includes(spec.format) ? effectiveColumns(spec.columns) : effectiveColumns(null);
  const text = (v: Cell) => (v == null ? "" : Array.isArray(v) ? v.join(" | ") : String(v));
  const rows = items.flatMap((i) => (i.kind === "row" ? [tableColumns.map((c) => text(cellOf(i.row, cells, c)))] : []));
  const sample = await collect(writerFor({ format: spec.format, columns: columnsOf(spec), cells, name: spec.name }), items.slice(0, 3));
  return { columns: tableColumns.map((c) => ({ key: c.key, header: c.header })), rows, total: fp.count, sample };
}

function collect(stages: Transform[], items: FeedItem[]): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    const sink = new PassThrough();
    sink.on("data", (c: Buffer) => chunks.push(Buffer.from(c)));
    pipeline([...stages, sink], (err) => (err ? reject(err) : resolve(Buffer.concat(chunks).toString("utf8"))));
    const first = stages[0];
    for (const i of items) first.write(i);
    first.end();
  });
}
