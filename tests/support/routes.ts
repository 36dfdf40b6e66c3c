/**
 * The route inventory: every route of the app as the router itself holds it, with the zod schemas that validate its
 * body, query and params. The security matrix and the fuzzer are generated from it, so a new route is covered (or
 * fails the policy check) without anyone adding it to a hand-written list.
 *
 * How the full paths are recovered. Express 5 uses router 2.x, whose Layer no longer keeps the matched path; but
 * router 2.3 keeps what was passed to `use()`/`route()` as `layer.rawPath` (the same field its public
 * `router.listRoutes()` reads). We walk the stacks recursively, joining each mounted router's rawPath to its children's,
 * and then do not trust the result blindly: for every segment we build a sample path from the pattern and ask the
 * layer's own matcher whether it matches (`verifyAgainstMatchers`), and we compare each router's `listRoutes()` with
 * what we read. A router upgrade that drops or renames these fields therefore fails loudly here, never silently
 * shrinks the inventory.
 *
 * Schemas and guards: route() in server/middleware/route.ts keeps {part, schema} on each validator it builds
 * (`validatorInfo()`, a schema of the dealership's day as its function) and the action on its guard (`guardInfo()`),
 * so a route's schemas and action are read from its handler stack. A handler that parses inline (the public feed's
 * query) is listed in INLINE_SCHEMAS below, and a stale entry there (a route that no longer exists) throws.
 */
import type { Express } from "express";
import type { z } from "zod";
import { validatorInfo, type Part } from "../../server/middleware/validate.ts";
import { guardInfo, type Allow } from "../../server/middleware/route.ts";
import { feedQuerySchema } from "../../shared/schemas/feeds.ts";
import { photoUpload } from "../../server/middleware/upload.ts";
import { dayIn } from "../../server/lib/clock.ts";
import { DEMO_DEALERSHIP } from "../../server/demo/demo.ts";

export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
export const STATE_CHANGING: ReadonlySet<Method> = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export interface RouteEntry {
  method: Method;
  /** The full Express pattern, e.g. /api/vehicles/:id/photos/:photoId. */
  path: string;
  /** "METHOD /path", the key of the policy table. */
  key: string;
  /** Names of the path parameters, in order. */
  params: string[];
  /** The schemas that check each part, from route()'s validators or INLINE_SCHEMAS. */
  schemas: Partial<Record<Part, z.ZodType>>;
  /** Where a schema came from, for messages. */
  schemaSource: Partial<Record<Part, "route" | "inline">>;
  /** The route takes multipart photo uploads (the multer middleware of server/middleware/upload.ts) rather than JSON. */
  multipart: boolean;
  /** The action its guard checks (server/middleware/route.ts), from the route's own stack or a router-wide guard; undefined without one. */
  allow: Allow | undefined;
}

// Schemas of the dealership's day are built with its calendar day (server/lib/clock.ts), not UTC's: the demo's is
// ten hours ahead.
const today = () => dayIn(DEMO_DEALERSHIP.timeZone, new Date());

/** Schemas a handler parses inline rather than through route(). */
export const INLINE_SCHEMAS: Record<string, Partial<Record<Part, () => z.ZodType>>> = {
  "GET /feeds/:file": { query: () => feedQuerySchema },
};

interface LayerLike {
  rawPath?: unknown;
  matchers?: Array<(path: string) => unknown>;
  route?: { path: unknown; methods: Record<string, boolean>; stack: LayerLike[] };
  handle: ((...args: unknown[]) => unknown) & { stack?: LayerLike[]; listRoutes?: () => Array<{ path: unknown; methods?: string[] }> };
  name?: string;
}

const joinPath = (prefix: string, p: string) => {
  const joined = (prefix.replace(/\/$/, "") + (p === "/" ? "" : p)).replace(/\/{2,}/g, "/");
  return joined === "" ? "/" : joined;
};

const asPaths = (raw: unknown, where: string): string[] => {
  const list = Array.isArray(raw) ? raw.flat(Infinity) : [raw];
  for (const p of list) {
    if (typeof p !== "string") {
      throw new Error(
        `route inventory: a layer under ${where || "/"} has no string path (got ${String(p)}). router no longer keeps ` +
          "layer.rawPath, or a route was registered with a RegExp; tests/support/routes.ts needs another way to read mount paths.",
      );
    }
  }
  return list as string[];
};

/** Parameter names of a path-to-regexp 8 pattern (`:id`, `*splat`, inside optional `{…}` groups too). */
export const paramNames = (path: string) => [...path.matchAll(/[:*]([A-Za-z_$][\w$]*)/g)].map((m) => m[1]);

/**
 * A concrete path for a pattern: each `:name` and `*name` replaced by values[name] (already URL-encoded by the
 * caller if needed) or "1"; optional groups `{…}` kept with their content.
 */
export function samplePath(path: string, values: Record<string, string> = {}): string {
  return path.replace(/[{}]/g, "").replace(/[:*]([A-Za-z_$][\w$]*)/g, (_m, name: string) => values[name] ?? (name === "splat" || name === "key" ? "a/b" : "1"));
}

function verifyAgainstMatchers(layer: LayerLike, paths: string[], where: string) {
  if (!layer.matchers) return;
  paths.forEach((p, i) => {
    const matcher = layer.matchers![i];
    const sample = samplePath(p);
    if (matcher && !matcher(sample)) {
      throw new Error(`route inventory: the path read for a layer under ${where || "/"} (${p}) does not match its own matcher with ${sample}`);
    }
  });
}

function walk(stack: LayerLike[], prefix: string, out: RouteEntry[], outer?: Allow) {
  // A guard mounted with router.use(allow(...)) covers the routes after it in the same router.
  let guarded = outer;
  for (const layer of stack) {
    if (!layer.route && !Array.isArray(layer.handle.stack)) {
      const g = guardInfo(layer.handle);
      if (g) guarded = g;
      continue;
    }
    if (layer.route) {
      const paths = asPaths(layer.rawPath ?? layer.route.path, prefix);
      verifyAgainstMatchers(layer, paths, prefix);
      const methods = Object.keys(layer.route.methods)
        .filter((m) => layer.route!.methods[m] && m !== "_all")
        .map((m) => m.toUpperCase())
        .filter((m): m is Method => ["GET", "POST", "PUT", "PATCH", "DELETE"].includes(m));
      const schemas: RouteEntry["schemas"] = {};
      const schemaSource: RouteEntry["schemaSource"] = {};
      let multipart = false;
      let allow = guarded;
      for (const h of layer.route.stack) {
        const info = validatorInfo(h.handle);
        if (info) {
          schemas[info.part] = typeof info.schema === "function" ? info.schema(today()) : info.schema;
          schemaSource[info.part] = "route";
        }
        if (h.handle === photoUpload) multipart = true;
        const guard = guardInfo(h.handle);
        if (guard) allow = guard;
      }
      for (const p of paths) {
        const path = joinPath(prefix, p);
        for (const method of methods) {
          out.push({ method, path, key: `${method} ${path}`, params: paramNames(path), schemas: { ...schemas }, schemaSource: { ...schemaSource }, multipart, allow });
        }
      }
    } else if (Array.isArray(layer.handle.stack)) {
      const paths = asPaths(layer.rawPath, prefix);
      verifyAgainstMatchers(layer, paths, prefix);
      const listed = layer.handle.listRoutes?.();
      const childStack = layer.handle.stack;
      if (listed) {
        // The public listing and our walk must agree on this router's own paths.
        const ours = childStack.filter((l) => l.route || Array.isArray(l.handle.stack)).flatMap((l) => asPaths(l.rawPath ?? l.route?.path, prefix));
        const theirs = listed.map((r) => r.path);
        if (JSON.stringify(ours) !== JSON.stringify(theirs)) {
          throw new Error(`route inventory: router.listRoutes() under ${prefix} lists ${JSON.stringify(theirs)} but the stack walk read ${JSON.stringify(ours)}`);
        }
      }
      for (const p of paths) walk(childStack, joinPath(prefix, p), out, guarded);
    }
  }
}

/** Every route of the app, in the order the router tries them. */
export function routeInventory(app: Express): RouteEntry[] {
  const root = (app as unknown as { router: { stack: LayerLike[] } }).router;
  const out: RouteEntry[] = [];
  walk(root.stack, "", out);
  const keys = new Set(out.map((r) => r.key));
  for (const [key, parts] of Object.entries(INLINE_SCHEMAS)) {
    if (!keys.has(key)) throw new Error(`route inventory: INLINE_SCHEMAS names ${key}, which the app no longer has`);
    const entry = out.find((r) => r.key === key)!;
    for (const [part, make] of Object.entries(parts) as Array<[Part, () => z.ZodType]>) {
      if (entry.schemas[part]) throw new Error(`route inventory: ${key} validates its ${part} through route() now; drop it from INLINE_SCHEMAS`);
      entry.schemas[part] = make();
      entry.schemaSource[part] = "inline";
    }
  }
  const dupes = out.map((r) => r.key).filter((k, i, all) => all.indexOf(k) !== i);
  if (dupes.length) throw new Error(`route inventory: the same route is registered twice: ${[...new Set(dupes)].join(", ")}`);
  return out;
}
