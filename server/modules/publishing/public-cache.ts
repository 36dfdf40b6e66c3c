import { createHash } from "node:crypto";
import { promisify } from "node:util";
import { brotliCompress, constants as zlib, deflate, gzip } from "node:zlib";
import type { Request, Response } from "express";
import LRUCache from "lru-cache";

/**
 * Public responses made once per published revision and kept in memory.
 *
 * A revision never changes after publishing, so what the public API and the condition page answer is a function of
 * (vehicle, revision asked for, current revision, status) alone. The caller resolves those with one indexed query on
 * every request (so a withdrawal, a sale or a new revision shows at once, on every instance sharing the database)
 * and uses them as the key; nothing here is ever invalidated, entries only age out of the LRU.
 *
 * Each representation is stored serialised, with its gzip, deflate and brotli encodings made once, and a strong ETag
 * per encoding (a strong validator names exact bytes, so each coding has its own: `"<hash>"`, `"<hash>-br"`, …).
 */

type Coding = "br" | "gzip" | "deflate" | "identity";
const CODINGS: Coding[] = ["br", "gzip", "deflate"];
/** Below this a compressed answer saves nothing worth a header (compression's own default threshold is 1 kB). */
const MIN_COMPRESS = 1024;

export interface Representation {
  type: string;
  bodies: Record<Coding, Buffer | undefined>;
  etags: Record<Coding, string | undefined>;
  size: number;
}

const brotliAsync = promisify(brotliCompress);
const gzipAsync = promisify(gzip);
const deflateAsync = promisify(deflate);

/**
 * Serialises once and compresses on libuv's thread pool (never on the event loop: a cold cache after a deploy, or a
 * crawler walking every old revision, must not stall other requests). Brotli quality 6 is within a few per cent of 11
 * on these pages at a fraction of the time.
 */
export async function representation(type: string, text: string): Promise<Representation> {
  const identity = Buffer.from(text, "utf8");
  const hash = createHash("sha256").update(identity).digest("base64url").slice(0, 27);
  const bodies: Representation["bodies"] = { identity, br: undefined, gzip: undefined, deflate: undefined };
  const etags: Representation["etags"] = { identity: `"${hash}"`, br: undefined, gzip: undefined, deflate: undefined };
  if (identity.length >= MIN_COMPRESS) {
    [bodies.br, bodies.gzip, bodies.deflate] = await Promise.all([
      brotliAsync(identity, { params: { [zlib.BROTLI_PARAM_QUALITY]: 6, [zlib.BROTLI_PARAM_SIZE_HINT]: identity.length } }),
      gzipAsync(identity, { level: 6 }),
      deflateAsync(identity, { level: 6 }),
    ]);
    for (const c of CODINGS) etags[c] = `"${hash}-${c}"`;
  }
  const size = Object.values(bodies).reduce((s, b) => s + (b?.length ?? 0), 0) + 200;
  return { type, bodies, etags, size };
}

/** The coding to send: brotli, then gzip, then deflate, as far as the request accepts them (Express's negotiator). */
function codingFor(req: Request, rep: Representation): Coding {
  if (!req.headers["accept-encoding"]) return "identity";
  for (const c of CODINGS) if (rep.bodies[c] && req.acceptsEncodings(c) === c) return c;
  return "identity";
}

/**
 * Sends a cached representation with its ETag, or 304 when the request's If-None-Match names it. Content-Encoding is
 * set here, so the compression middleware leaves the bytes alone.
 */
export function sendRepresentation(req: Request, res: Response, rep: Representation, cacheControl: string): void {
  const coding = codingFor(req, rep);
  const body = rep.bodies[coding]!;
  res.setHeader("Cache-Control", cacheControl);
  res.setHeader("Vary", "Accept-Encoding");
  res.setHeader("ETag", rep.etags[coding]!);
  res.setHeader("Content-Type", rep.type);
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  if (coding !== "identity") res.setHeader("Content-Encoding", coding);
  res.setHeader("Content-Length", String(body.length));
  res.status(200).end(req.method === "HEAD" ? undefined : body);
}

/** About 50 MB: a few thousand revisions' JSON and pages with their encodings (≈30 kB each for a vehicle with photos). */
const MAX_BYTES = 50 * 1024 * 1024;

export interface CachedEntry<T> {
  value: T;
  size: number;
}

/** One bounded LRU per process for the public read path; sized by the bytes each entry holds. */
export class PublicCache {
  private readonly lru: LRUCache<string, CachedEntry<unknown>>;
  hits = 0;
  misses = 0;

  constructor(maxBytes = MAX_BYTES) {
    this.lru = new LRUCache<string, CachedEntry<unknown>>({ maxSize: maxBytes, sizeCalculation: (e) => Math.max(1, e.size) });
  }

  /** The cached value under key, or make() it (concurrent misses for one key share one make()). */
  async get<T>(key: string, make: () => Promise<CachedEntry<T>>): Promise<T> {
    const found = this.lru.get(key) as CachedEntry<T> | undefined;
    if (found) {
      this.hits++;
      return found.value;
    }
    this.misses++;
    let pending = this.pending.get(key) as Promise<CachedEntry<T>> | undefined;
    if (!pending) {
      pending = make();
      this.pending.set(key, pending);
      pending.then(
        (entry) => {
          this.pending.delete(key);
          this.lru.set(key, entry);
        },
        () => this.pending.delete(key),
      );
    }
    return (await pending).value;
  }

  get size() {
    return this.lru.size;
  }

  clear() {
    this.lru.clear();
  }

  private readonly pending = new Map<string, Promise<CachedEntry<unknown>>>();
}
