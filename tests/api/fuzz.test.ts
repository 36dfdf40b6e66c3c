/**
 * Property tests over every route of the inventory (tests/support/routes.ts): requests built from each route's zod
 * schema (through z.toJSONSchema) and then broken: wrong types, missing and extra fields, huge and empty strings,
 * astral, RTL and NUL characters, lone surrogates, negative, enormous and fractional numbers, malformed JSON, wrong
 * content types and encodings, bad path parameters. Each is sent by a caller the route admits (and some by the
 * public). Properties: no answer is ever a 5xx, and nothing in the database changes (CHECKSUM TABLE of every table
 * but the volatile ones named in tests/support/db-state.ts).
 *
 * Requests that could legitimately change something are never sent: a body the route's schema accepts goes only to
 * path parameters that name nothing (id 999999, an unknown slug), and routes without parameters only get bodies the
 * schema refuses. Signing out is fuzzed as the public (a signed-in fuzz would end the session it uses).
 *
 * Bounded: FUZZ_RUNS requests per route and caller kind (default 24) plus a fixed list of raw-body cases per route,
 * a few thousand in all; FUZZ_SEED repeats a run; FUZZ_TRACE=<file> appends each route and answer to that file.
 *
 * A second property sends bodies the schema accepts, pushed to their edges (maximum lengths in multi-byte and astral
 * characters, numbers at their bounds), to records the fuzzer made for itself: those may change data, and only
 * "no 5xx" is asserted there.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import request from "supertest";
import { z } from "zod";
import { appendFileSync } from "node:fs";
import { startTestApp, type TestApp } from "../support/app.ts";
import { routeInventory, samplePath, STATE_CHANGING, type RouteEntry } from "../support/routes.ts";
import { callerFor, callersOf, type Caller } from "../support/route-policy.ts";
import { changedTables, tableChecksums } from "../support/db-state.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { READY_TYRES } from "../support/publishing.ts";
import { dayIn } from "../../server/lib/clock.ts";
import { DEMO_DEALERSHIP } from "../../server/demo/demo.ts";

type Agent = ReturnType<typeof request.agent>;
type Json = Record<string, unknown>;

const RUNS = Number(process.env.FUZZ_RUNS ?? 24);
const SEED = Number(process.env.FUZZ_SEED ?? 20_260_108);

let t: TestApp;
let routes: RouteEntry[];
const agents = new Map<Caller, Agent>();
/** Real record ids, used only by requests that cannot change anything (GETs, and bodies the schema refuses). */
const real: Record<string, string> = {};

beforeAll(async () => {
  t = await startTestApp();
  // Routes that change data by design (a feed fetch is logged, after its answer) go last, so a late write of theirs
  // can never be blamed on the route after them.
  routes = routeInventory(t.app).sort((a, b) => Number(a.key in EXPECTED_CHANGES) - Number(b.key in EXPECTED_CHANGES));
  agents.set("public", t.agent());
  for (const role of ["admin", "sales", "workshop", "marketing"] as const) agents.set(role, await t.signIn(role));
  const admin = agents.get("admin")!;
  const vehicle = (await admin.post("/api/vehicles").send(dieselSuv())).body.vehicle;
  const feed = (await admin.post("/api/feeds").send({ name: "Fuzz", format: "csv", columns: [{ key: "make", header: "Make" }] })).body;
  real.id = String(vehicle.id);
  real.feedId = String(feed.feed.id);
  real.file = `${new URL(feed.url).pathname.split("/").pop()}`;
}, 120_000);
afterAll(() => t?.close());

// ---------------------------------------------------------------------------------------------------------------
// Values

const MB = 1024 * 1024;
/** Strings that have broken parsers, databases and renderers before. */
const NASTY_STRINGS = [
  "", " ", "\t\n", "\u0000", "a\u0000b", "\uD800", "\uDFFF", "a\uD800b", "𝒜𝓁𝓅𝒽𝒶", "😀👍🏽👨‍👩‍👧", "\u202Eevil\u202C", "مرحبا بالعالم", "\uFEFF", "\u200B",
  "<script>alert(1)</script>", "\"'><img src=x onerror=alert(1)>", "' OR 1=1 --", "\\", "%", "%00", "%E0%A4%A", "../../etc/passwd", "..\\..\\",
  "NaN", "Infinity", "-0", "1e309", "0x1F", "9007199254740993", "-1", "0", "true", "null", "undefined", "{}", "[]", "__proto__", "constructor",
  "2024-02-30", "0000-00-00", "9999-12-31", "2024-13-01T25:61:61Z", "1970-01-01T00:00:00Z", "ø".repeat(300), "x".repeat(10_000),
];
const NASTY_NUMBERS = [
  -1, 0, -0, 1, 0.5, -0.5, 1e-308, 5e-324, 2 ** 31, 2 ** 31 - 1, -(2 ** 31), 2 ** 32, 2 ** 53, 2 ** 53 + 2, Number.MAX_SAFE_INTEGER, -Number.MAX_SAFE_INTEGER,
  1e21, 1e300, 1.7976931348623157e308, -1.7976931348623157e308,
];

const nastyString = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...NASTY_STRINGS) },
  { weight: 3, arbitrary: fc.string({ unit: "binary", maxLength: 40 }) },
  { weight: 2, arbitrary: fc.string({ unit: "grapheme", maxLength: 40 }) },
  // Big, but under the 512 kB JSON limit, so it reaches the schema and anything after it.
  { weight: 1, arbitrary: fc.constantFrom("y".repeat(300_000), "é".repeat(100_000)) },
);
const nastyNumber = fc.oneof(fc.constantFrom(...NASTY_NUMBERS), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer());

/** Anything JSON can carry, weighted towards the nasty. */
const nastyValue: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  value: fc.oneof(
    { weight: 4, arbitrary: nastyString },
    { weight: 4, arbitrary: nastyNumber },
    { weight: 1, arbitrary: fc.constantFrom(null, true, false) },
    { weight: 1, arbitrary: fc.array(tie("value"), { maxLength: 4 }) },
    { weight: 1, arbitrary: fc.dictionary(fc.oneof(fc.constantFrom("__proto__", "constructor", "toString", "", "id", "version"), fc.string({ maxLength: 8 })), tie("value"), { maxKeys: 4 }) },
    { weight: 1, arbitrary: fc.constantFrom({}, [], [[[[[[[[[[[]]]]]]]]]]], { a: { b: { c: { d: {} } } } }) },
  ),
})).value;

type JsonSchema = {
  type?: string | string[]; properties?: Record<string, JsonSchema>; required?: string[]; additionalProperties?: boolean | JsonSchema;
  items?: JsonSchema; minItems?: number; maxItems?: number; minLength?: number; maxLength?: number; pattern?: string; format?: string;
  minimum?: number; maximum?: number; exclusiveMinimum?: number; exclusiveMaximum?: number; enum?: unknown[]; const?: unknown;
  anyOf?: JsonSchema[]; oneOf?: JsonSchema[]; allOf?: JsonSchema[]; default?: unknown;
};

/**
 * A value shaped by the schema (what a careful client would send), with each leaf sometimes replaced by a nasty value
 * and objects sometimes missing required fields or carrying extra ones.
 */
function shaped(js: JsonSchema, depth = 0): fc.Arbitrary<unknown> {
  const leaf = (arb: fc.Arbitrary<unknown>) => fc.oneof({ weight: 3, arbitrary: arb }, { weight: 1, arbitrary: nastyValue });
  if (depth > 6) return nastyValue;
  if (js.const !== undefined) return leaf(fc.constant(js.const));
  if (js.enum) return leaf(fc.constantFrom(...js.enum));
  const alternatives = js.anyOf ?? js.oneOf;
  if (alternatives?.length) return fc.oneof(...alternatives.map((a) => shaped(a, depth + 1)));
  if (js.allOf?.length) return shaped(js.allOf[0], depth + 1);
  const type = Array.isArray(js.type) ? js.type[0] : js.type;
  switch (type) {
    case "object": {
      const props = Object.entries(js.properties ?? {});
      if (!props.length) return leaf(fc.dictionary(fc.string({ maxLength: 10 }), nastyValue, { maxKeys: 3 }));
      const record: Record<string, fc.Arbitrary<unknown>> = Object.fromEntries(props.map(([k, v]) => [k, shaped(v, depth + 1)]));
      const required = new Set(js.required ?? []);
      return fc
        .tuple(
          fc.record(record, { requiredKeys: props.map(([k]) => k).filter((k) => required.has(k)) }),
          fc.subarray(props.map(([k]) => k)),
          fc.option(fc.tuple(fc.constantFrom("extra", "derived", "__proto__", "id", "dealershipId", "createdAt", "role", ""), nastyValue), { freq: 4 }),
          fc.nat(9),
        )
        .map(([value, drop, extra, dice]) => {
          const out: Json = { ...(value) };
          if (dice === 0) for (const k of drop) delete out[k];
          if (extra) Object.defineProperty(out, extra[0], { value: extra[1], enumerable: true, writable: true, configurable: true });
          return out;
        });
    }
    case "array": {
      const min = js.minItems ?? 0;
      const max = Math.min(js.maxItems ?? 5, 8);
      return leaf(fc.oneof(
        { weight: 4, arbitrary: fc.array(js.items ? shaped(js.items, depth + 1) : nastyValue, { minLength: Math.min(min, max), maxLength: max }) },
        { weight: 1, arbitrary: fc.constant([]) },
        { weight: 1, arbitrary: fc.array(js.items ? shaped(js.items, depth + 1) : nastyValue, { minLength: max + 1, maxLength: max + 3 }) },
      ));
    }
    case "string": {
      let arb: fc.Arbitrary<string>;
      if (js.format === "email") arb = fc.emailAddress();
      else if (js.format === "date-time") arb = fc.date({ noInvalidDate: true }).map((d) => d.toISOString());
      else if (js.pattern) arb = fc.stringMatching(new RegExp(js.pattern)).filter((s) => s.length <= (js.maxLength ?? 1000));
      else arb = fc.string({ minLength: js.minLength ?? 0, maxLength: Math.min(js.maxLength ?? 40, 60) });
      const max = js.maxLength;
      return leaf(fc.oneof(
        { weight: 5, arbitrary: arb },
        { weight: 1, arbitrary: fc.constant(max !== undefined ? "m".repeat(max + 1) : "m".repeat(70_000)) },
        { weight: 1, arbitrary: fc.constant(max !== undefined ? "😀".repeat(max) : "😀".repeat(20_000)) },
      ));
    }
    case "integer":
    case "number": {
      const lo = js.minimum ?? (js.exclusiveMinimum !== undefined ? js.exclusiveMinimum + 1 : -1_000_000);
      const hi = Math.min(js.maximum ?? (js.exclusiveMaximum !== undefined ? js.exclusiveMaximum - 1 : 1_000_000), Number.MAX_SAFE_INTEGER);
      const inRange = type === "integer" ? fc.integer({ min: Math.max(lo, Number.MIN_SAFE_INTEGER), max: hi }) : fc.double({ min: lo, max: hi, noNaN: true });
      // The bounds themselves and just past them: where range checks and database columns disagree.
      return leaf(fc.oneof({ weight: 3, arbitrary: inRange }, { weight: 2, arbitrary: fc.constantFrom(lo, hi, lo - 1, hi + 1, hi + 0.5) }));
    }
    case "boolean":
      return leaf(fc.boolean());
    case "null":
      return leaf(fc.constant(null));
    default:
      return nastyValue;
  }
}

const jsonSchemaOf = (schema: z.ZodType) => z.toJSONSchema(schema, { io: "input", unrepresentable: "any" }) as JsonSchema;

/** Path parameter values: absent (valid, naming nothing), real (only for requests that cannot change anything), or bad. */
const ABSENT: Record<string, string> = {
  id: "999999", photoId: "999998", defectId: "999997", number: "987", n: "987", slug: "no-such-vehicle", token: "no-such-token-0000000000",
  file: "nosuchtoken.csv", key: `photos/ab/${"0".repeat(64)}.jpg`, splat: "no/such/page",
};
const BAD_PARAMS = [
  "0", "-1", "1.5", "1e3", "1e309", "NaN", "Infinity", "0x10", "9007199254740993", "99999999999999999999999", " 1", "1 ", "true", "null",
  "%00", "%E0%A4%A", "%", "%2e%2e%2f%2e%2e", "..", "%2F", "x".repeat(2000), encodeURIComponent("😀"), encodeURIComponent("\u202E1"),
  encodeURIComponent("<svg onload=alert(1)>"), encodeURIComponent("' OR 1=1 --"), "Ab-UPPER", "a.b", "-", "%C0%AE%C0%AE", "%ED%A0%80", "%FF%FE",
];

/** encodeURIComponent, but a lone surrogate (which it refuses) goes as its raw UTF-8-ish bytes, as a careless client would send. */
const enc = (s: string) => {
  try {
    return encodeURIComponent(s);
  } catch {
    return s.replace(/[\uD800-\uDFFF]/g, "%ED%A0%80").split("%").map((part, i) => (i === 0 ? encodeURIComponent(part) : part.slice(0, 2) + encodeURIComponent(part.slice(2)))).join("%");
  }
};

const encodeQuery = (q: unknown): string => {
  if (q === null || typeof q !== "object" || Array.isArray(q)) return `q=${enc(String(q))}`;
  const parts: string[] = [];
  for (const [k, v] of Object.entries(q as Json)) {
    const values = Array.isArray(v) ? v : [v];
    for (const one of values) parts.push(`${enc(k)}=${enc(typeof one === "object" ? JSON.stringify(one) : String(one))}`);
  }
  return parts.join("&");
};

/**
 * Values the schema should accept, pushed to its edges: strings at their maximum length in multi-byte and astral
 * characters, NUL and RTL marks inside, numbers at their bounds. Where the database column is narrower than the
 * schema, or a number wider than the column, this is what finds it.
 */
function accepted(js: JsonSchema, depth = 0, name = ""): fc.Arbitrary<unknown> {
  if (depth > 6) return fc.constant(null);
  // z.email() behind a pipe is not in the input's JSON Schema, so the field's name says it is an address.
  if (/email/i.test(name) && (js.type === "string" || js.anyOf)) return accepted({ type: "string", format: "email" });
  if (js.const !== undefined) return fc.constant(js.const);
  if (js.enum) return fc.constantFrom(...js.enum);
  const alternatives = js.anyOf ?? js.oneOf;
  if (alternatives?.length) return fc.oneof(...alternatives.map((a) => accepted(a, depth + 1)));
  if (js.allOf?.length) return accepted(js.allOf[0], depth + 1);
  const type = Array.isArray(js.type) ? js.type[0] : js.type;
  switch (type) {
    case "object": {
      const props = Object.entries(js.properties ?? {});
      const required = new Set(js.required ?? []);
      return fc.record(Object.fromEntries(props.map(([k, v]) => [k, accepted(v, depth + 1, k)])), { requiredKeys: props.map(([k]) => k).filter((k) => required.has(k)) });
    }
    case "array": {
      const max = Math.min(js.maxItems ?? 4, 12);
      return fc.array(js.items ? accepted(js.items, depth + 1) : fc.constant(null), { minLength: Math.min(js.minItems ?? 0, max), maxLength: max });
    }
    case "string": {
      if (js.format === "email") return fc.constantFrom("a@b.co", `${"l".repeat(64)}@${"d".repeat(60)}.example`, "o'neil+tag@fernhollow.demo.test");
      if (js.format === "date-time") return fc.constantFrom("1970-01-01T00:00:00Z", "2038-01-19T03:14:08Z", "9999-12-31T23:59:59Z", "2000-02-29T12:00:00.123Z");
      if (js.pattern) return fc.stringMatching(new RegExp(js.pattern)).filter((x) => x.length <= (js.maxLength ?? 1000) && x.length >= (js.minLength ?? 0));
      const min = js.minLength ?? 0;
      const max = js.maxLength ?? 200_000;
      const fill = (unit: string) => unit.repeat(Math.max(1, Math.floor(max / unit.length))).slice(0, max);
      return fc.constantFrom(
        "x".repeat(Math.max(min, 1)), fill("ø"), fill("𝒜"), fill("😀"), fill("\u202Eabc"), fill("a\u0000"), fill("'\\\""), fill("ā"),
        "\uFEFF".repeat(Math.max(min, 1)), "x".repeat(Math.max(min, 1)) + "\uD800",
      ).filter((x) => x.length >= min);
    }
    case "integer":
    case "number": {
      const lo = js.minimum ?? (js.exclusiveMinimum !== undefined ? js.exclusiveMinimum + (type === "integer" ? 1 : 1e-9) : -Number.MAX_SAFE_INTEGER);
      const hi = js.maximum ?? (js.exclusiveMaximum !== undefined ? js.exclusiveMaximum - (type === "integer" ? 1 : 1e-9) : Number.MAX_SAFE_INTEGER);
      const picks = [lo, hi, Math.min(hi, Math.max(lo, 0)), Math.min(hi, Math.max(lo, 2 ** 31)), Math.min(hi, Math.max(lo, 2 ** 32 + 1)), Math.min(hi, Math.max(lo, 65_536))];
      if (type === "number") picks.push(Math.min(hi, Math.max(lo, 1e-7)), Math.min(hi, Math.max(lo, 123456.789)));
      return fc.constantFrom(...picks);
    }
    case "boolean":
      return fc.boolean();
    case "null":
      return fc.constant(null);
    default:
      return fc.constant(null);
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Requests

interface FuzzRequest {
  caller: Caller;
  params: Record<string, string>;
  /** Where the params came from: only "absent" may carry a body the schema accepts. */
  paramsKind: "absent" | "real" | "bad";
  query: string;
  body: { kind: "json"; value: unknown } | { kind: "raw"; text: string; contentType: string; encoding?: string } | { kind: "none" };
}

/** Raw bodies that never were JSON, or claim an encoding they do not have. */
const RAW_CASES: Array<{ text: string; contentType: string; encoding?: string }> = [
  { text: "{", contentType: "application/json" },
  { text: '{"a":', contentType: "application/json" },
  { text: "[1,2", contentType: "application/json" },
  { text: "\u0000", contentType: "application/json" },
  { text: "null", contentType: "application/json" },
  { text: "1", contentType: "application/json" },
  { text: '"a string"', contentType: "application/json" },
  { text: "[]", contentType: "application/json" },
  { text: '{"__proto__":{"admin":true},"constructor":{"prototype":{"admin":true}}}', contentType: "application/json" },
  { text: '{"a":1,"a":2}', contentType: "application/json" },
  { text: "[".repeat(20_000) + "]".repeat(20_000), contentType: "application/json" },
  { text: JSON.stringify({ big: "z".repeat(MB) }), contentType: "application/json" },
  { text: "{}", contentType: "application/json; charset=utf-16" },
  { text: "{}", contentType: "application/json; charset=koi8-r" },
  { text: "{}", contentType: "application/json", encoding: "gzip" },
  { text: "{}", contentType: "application/json", encoding: "br" },
  { text: "{}", contentType: "application/json", encoding: "x-unknown" },
  { text: "email=a%40b.c&password=x", contentType: "application/x-www-form-urlencoded" },
  { text: "<xml/>", contentType: "application/xml" },
  { text: "plain words", contentType: "text/plain" },
  { text: "--b\r\nContent-Disposition: form-data; name=\"photos\"; filename=\"a.jpg\"\r\n\r\nnot a photo\r\n--b--\r\n", contentType: "multipart/form-data; boundary=b" },
  { text: "--b\r\nbroken", contentType: "multipart/form-data; boundary=b" },
  { text: "", contentType: "multipart/form-data" },
];

function requestsFor(r: RouteEntry, admitted: Caller): fc.Arbitrary<FuzzRequest> {
  const bodySchema = r.schemas.body ? jsonSchemaOf(r.schemas.body) : undefined;
  const querySchema = r.schemas.query ? jsonSchemaOf(r.schemas.query) : undefined;
  const paramsSchema = r.schemas.params ? jsonSchemaOf(r.schemas.params) : undefined;
  const realFor = (name: string) => (r.path.startsWith("/api/feeds/") && name === "id" ? real.feedId : real[name]);

  const paramValue = (name: string) =>
    fc.oneof(
      { weight: 3, arbitrary: fc.constant(ABSENT[name] ?? "999999") },
      { weight: 3, arbitrary: fc.constantFrom(...BAD_PARAMS) },
      { weight: 2, arbitrary: paramsSchema?.properties?.[name] ? shaped(paramsSchema.properties[name]).map((v) => enc(typeof v === "string" ? v : JSON.stringify(v) ?? "")) : fc.constant("1") },
    );
  const params = r.params.length
    ? fc.oneof(
        { weight: 3, arbitrary: fc.record(Object.fromEntries(r.params.map((p) => [p, fc.constant(ABSENT[p] ?? "999999")]))).map((p) => ({ p, kind: "absent" as const })) },
        { weight: 3, arbitrary: fc.record(Object.fromEntries(r.params.map((p) => [p, paramValue(p)]))).map((p) => ({ p, kind: "bad" as const })) },
        { weight: 2, arbitrary: fc.constant({ p: Object.fromEntries(r.params.map((p) => [p, realFor(p) ?? ABSENT[p] ?? "1"])), kind: "real" as const }) },
      )
    : fc.constant({ p: {}, kind: "absent" as const });
  const query = fc.oneof(
    { weight: 3, arbitrary: querySchema ? shaped(querySchema).map(encodeQuery) : fc.constant("") },
    { weight: 1, arbitrary: fc.dictionary(fc.constantFrom("page", "pageSize", "q", "sort", "status", "since", "version", "__proto__", "x[y]"), nastyString.map((s) => s.slice(0, 2000)), { maxKeys: 3 }).map(encodeQuery) },
    { weight: 1, arbitrary: fc.constantFrom("", "a&&b", "=x", "%", "%zz=1", "q=%E0%A4%A", "page=1&page=2", "since=not-a-date", "version=1e309", "pageSize=-1") },
  );
  const body = STATE_CHANGING.has(r.method)
    ? fc.oneof(
        { weight: 6, arbitrary: (bodySchema ? shaped(bodySchema) : nastyValue).map((value) => ({ kind: "json" as const, value })) },
        { weight: 1, arbitrary: nastyValue.map((value) => ({ kind: "json" as const, value })) },
        { weight: 1, arbitrary: fc.constantFrom(...RAW_CASES).map((c) => ({ kind: "raw" as const, ...c })) },
      )
    : fc.oneof({ weight: 5, arbitrary: fc.constant({ kind: "none" as const }) }, { weight: 1, arbitrary: fc.constantFrom(...RAW_CASES).map((c) => ({ kind: "raw" as const, ...c })) });

  // Signing out as staff would end the fuzzer's own session, so that route is fuzzed as the public.
  const callers: Caller[] = r.key === "POST /api/auth/sign-out" ? ["public"] : admitted === "public" ? ["public", "admin"] : [admitted, admitted, admitted, "public"];
  return fc
    .record({ caller: fc.constantFrom(...callers), params, query, body })
    .map(({ caller, params: { p, kind }, query: q, body: b }) => ({ caller, params: p, paramsKind: kind, query: q, body: b }))
    .filter((req) => !mayChange(r, req));
}

/**
 * True when the request might legitimately change something: a state-changing request whose body the schema
 * accepts, sent to parameters that name a record (or to a route without parameters). Those are left out.
 */
function mayChange(r: RouteEntry, req: FuzzRequest): boolean {
  if (!STATE_CHANGING.has(r.method)) return false;
  // Refused at the guard (401/403) before anything runs.
  if (!callersOf(r.key).includes(req.caller)) return false;
  // Parameters that name nothing, or fail their schema: 400/404 before any write. (A "bad" value drawn from the
  // schema can be a small integer that names a real record, so the values are checked, not their origin.)
  if (r.params.length && namesNothing(r, req.params)) return false;
  if (r.key === "POST /api/mail/outbox/retry") return false;
  const schema = r.schemas.body;
  if (!schema) return true;
  return schema.safeParse(bodyValue(req) ?? {}).success;
}

function namesNothing(r: RouteEntry, params: Record<string, string>): boolean {
  if (r.params.every((p) => params[p] === (ABSENT[p] ?? "999999"))) return true;
  let decoded: Record<string, string>;
  try {
    decoded = Object.fromEntries(r.params.map((p) => [p, decodeURIComponent(params[p] ?? "")]));
  } catch {
    return true; // the router answers 400 to a malformed escape
  }
  return Boolean(r.schemas.params && !r.schemas.params.safeParse(decoded).success);
}

/** What the handler would see as req.body: parsed JSON for a JSON body express.json can read, otherwise nothing. */
function bodyValue(req: FuzzRequest): unknown {
  if (req.body.kind === "json") return req.body.value;
  if (req.body.kind === "none") return undefined;
  if (req.body.encoding || !/^application\/json(;\s*charset=utf-8)?$/i.test(req.body.contentType)) return undefined;
  try {
    return JSON.parse(req.body.text);
  } catch {
    return undefined;
  }
}

async function send(r: RouteEntry, req: FuzzRequest): Promise<request.Response> {
  const url = samplePath(r.path, req.params) + (req.query ? `?${req.query}` : "");
  const agent = agents.get(req.caller)!;
  let test = (agent as unknown as Record<string, (u: string) => request.Test>)[r.method.toLowerCase()](url);
  if (req.body.kind === "json") test = test.set("Content-Type", "application/json").send(JSON.stringify(req.body.value) ?? "null");
  else if (req.body.kind === "raw") {
    test = test.set("Content-Type", req.body.contentType);
    if (req.body.encoding) test = test.set("Content-Encoding", req.body.encoding);
    test = test.send(req.body.text);
  }
  return test.timeout({ response: 30_000 });
}

const describeRequest = (r: RouteEntry, req: FuzzRequest) => {
  const body = req.body.kind === "json" ? JSON.stringify(req.body.value) : req.body.kind === "raw" ? `${req.body.contentType} ${req.body.encoding ?? ""} ${req.body.text}` : "";
  return `${r.method} ${samplePath(r.path, req.params)}${req.query ? `?${req.query}` : ""} as ${req.caller}: ${(body ?? "").slice(0, 300)}`;
};

/**
 * Tables a route changes by design on any request it answers: a portal's fetch of a feed by its real token is logged
 * (a feed_fetches row, and feeds.last_fetched_at), whatever the query (feeds.service.ts recordFetch).
 */
const EXPECTED_CHANGES: Record<string, string[]> = { "GET /feeds/:file": ["feed_fetches", "feeds"] };

// ---------------------------------------------------------------------------------------------------------------

/** Waits until the database's checksums hold still for half a second (at most 20 s), for writes made after an answer. */
async function settled() {
  let last = JSON.stringify(await tableChecksums(t.ctx.database.db));
  for (const deadline = Date.now() + 20_000; Date.now() < deadline; ) {
    await new Promise((r) => setTimeout(r, 500));
    const now = JSON.stringify(await tableChecksums(t.ctx.database.db));
    if (now === last) return;
    last = now;
  }
}

describe("fuzzing every route", () => {
  it("when invalid and edge-case requests are sent to every route, then no answer is a 5xx and nothing in the database changes", async () => {
    const serverErrors: string[] = [];
    const changes: string[] = [];
    let total = 0;
    for (const [i, r] of routes.entries()) {
      const admitted = callerFor(r.key);
      const before = await tableChecksums(t.ctx.database.db);
      await fc.assert(
        fc.asyncProperty(requestsFor(r, admitted), async (req) => {
          const res = await send(r, req);
          total++;
          if (res.status >= 500) serverErrors.push(`${res.status} ${describeRequest(r, req)} → ${JSON.stringify(res.body?.error ?? res.text?.slice(0, 200))}`);
          return true;
        }),
        { numRuns: RUNS, seed: SEED + i, endOnFailure: true },
      );
      // The fixed raw-body cases, every one, as the admitted caller.
      for (const raw of RAW_CASES) {
        const req: FuzzRequest = { caller: r.key === "POST /api/auth/sign-out" ? "public" : admitted, params: ABSENT, paramsKind: "absent", query: "", body: { kind: "raw", ...raw } };
        if (mayChange(r, req)) continue;
        const res = await send(r, req);
        total++;
        if (res.status >= 500) serverErrors.push(`${res.status} ${describeRequest(r, req)} → ${JSON.stringify(res.body?.error ?? "")}`);
      }
      // A feed fetch is logged after its answer has gone (feeds.public.routes.ts); let those writes land, or the next
      // route would be blamed for them.
      if (EXPECTED_CHANGES[r.key]) await settled();
      const changed = changedTables(before, await tableChecksums(t.ctx.database.db)).filter((table) => !(EXPECTED_CHANGES[r.key] ?? []).includes(table));
      if (changed.length) changes.push(`${r.key} changed ${changed.join(", ")}`);
    }
    console.log(`fuzz: ${total} requests over ${routes.length} routes, ${serverErrors.length} server errors (seed ${SEED}, ${RUNS} generated per route)`);
    expect(serverErrors.slice(0, 20)).toEqual([]);
    expect(changes).toEqual([]);
    expect(total).toBeGreaterThan(routes.length * RUNS);
  }, 600_000);

  it("when bodies the schema accepts, pushed to their edges, are saved on real records, then no answer is a 5xx", async () => {
    // These do change data, on records the fuzzer made for itself (a vehicle, a feed, a spare user), so they run
    // after the property above. Signing in with a valid body would only count against the limiter.
    const admin = agents.get("admin")!;
    const spare = (await admin.post("/api/users").send({ email: "spare.fuzz@fernhollow.demo.test", name: "Spare", role: "workshop", password: "a long enough spare password" })).body.user;
    if (process.env.FUZZ_TRACE) appendFileSync(process.env.FUZZ_TRACE, ["spare user:", JSON.stringify(spare)].join(" ") + "\n");
    const defect = (await admin.post(`/api/vehicles/${real.id}/defects`).send({ zone: "front", kind: "scratch", severity: "minor", repairPlan: "disclosed_as_is" })).body.defect;
    const values = (r: RouteEntry): Record<string, string> => ({
      ...ABSENT, defectId: String(defect.id), id: r.path.startsWith("/api/feeds/") ? real.feedId : r.path.startsWith("/api/users/") ? spare.id : real.id,
    });
    // Valid bodies to start from where cross-field rules make a random draw unlikely to pass (make with model, VIN
    // check digit, odometer pairs, four tyres, columns for the format): a subset of fields is replaced by edge values.
    const today = dayIn(DEMO_DEALERSHIP.timeZone, new Date());
    const BASES: Record<string, () => Json> = {
      "POST /api/vehicles": () => dieselSuv(),
      "PATCH /api/vehicles/:id": () => ({ ...dieselSuv(), version: 1 }),
      "PUT /api/vehicles/:id/tyres": () => ({ version: 0, measuredOn: today, readings: READY_TYRES }),
      "POST /api/feeds": () => ({ name: "Edge", format: "csv", columns: [{ key: "make", header: "Make" }] }),
      "PATCH /api/feeds/:id": () => ({ version: 1, name: "Edge" }),
      "POST /api/feeds/preview": () => ({ format: "csv", columns: [{ key: "make", header: "Make" }] }),
    };
    const draw = (r: RouteEntry, js: JsonSchema): fc.Arbitrary<unknown> => {
      const base = BASES[r.key];
      if (!base) return accepted(js);
      const keys = Object.keys(js.properties ?? {});
      return fc.tuple(accepted(js), fc.subarray(keys, { minLength: Math.min(1, keys.length), maxLength: Math.min(4, keys.length) }))
        .map(([edge, keys]) => ({ ...base(), ...Object.fromEntries(keys.filter((k) => k in (edge as Json)).map((k) => [k, (edge as Json)[k]])) }));
    };
    const targets = routes.filter((r) => STATE_CHANGING.has(r.method) && r.schemas.body && r.path.startsWith("/api/") && r.key !== "POST /api/auth/sign-in");
    const serverErrors: string[] = [];
    let total = 0;
    let skipped = 0;
    for (const [i, r] of targets.entries()) {
      const schema = r.schemas.body!;
      const caller: Caller = callersOf(r.key).includes("admin") ? "admin" : "public";
      if (process.env.FUZZ_TRACE) appendFileSync(process.env.FUZZ_TRACE, ["accepted edges:", r.key].join(" ") + "\n");
      await fc.assert(
        fc.asyncProperty(draw(r, jsonSchemaOf(schema)), async (value) => {
          // Cross-field rules (make and model together, ranges in order) refuse some draws; those are not sent.
          if (!schema.safeParse(value).success) {
            skipped++;
            return true;
          }
          const req: FuzzRequest = { caller, params: values(r), paramsKind: "real", query: "", body: { kind: "json", value } };
          let res = await send(r, req);
          total++;
          // A stale version is answered with the record as it is now: try once more with its version, so the edge
          // values reach the save rather than stopping at the version check.
          const current = res.body?.error?.current as { version?: number; tyresVersion?: number; checksVersion?: number } | undefined;
          if (res.status === 409 && res.body?.error?.code === "stale_version" && current && value && typeof value === "object") {
            const version = current.version ?? current.tyresVersion ?? current.checksVersion;
            if (typeof version === "number") {
              res = await send(r, { ...req, body: { kind: "json", value: { ...(value as Json), version } } });
              total++;
            }
          }
          if (process.env.FUZZ_TRACE) appendFileSync(process.env.FUZZ_TRACE, `  ${res.status} ${res.body?.error?.code ?? ""} ${JSON.stringify(res.body?.error?.fields ?? "").slice(0, 200)}\n`);
          if (res.status >= 500) serverErrors.push(`${res.status} ${describeRequest(r, req)} → ${JSON.stringify(res.body?.error ?? "")}`);
          return true;
        }),
        { numRuns: Math.ceil(RUNS / 2), seed: SEED + 1000 + i, endOnFailure: true },
      );
    }
    console.log(`fuzz (accepted edges): ${total} requests over ${targets.length} routes, ${serverErrors.length} server errors (${skipped} draws the schema refused, not sent)`);
    expect(serverErrors.slice(0, 20)).toEqual([]);
  }, 600_000);
});

describe("cases the fuzzer found", () => {
  it("when a photo upload's multipart body is cut off after the boundary, then 400 bad_upload, not 500", async () => {
    const res = await agents.get("workshop")!.post(`/api/vehicles/${real.id}/photos`).set("Content-Type", "multipart/form-data; boundary=b").send("--b\r\nbroken");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_upload");
  });

  it("when a photo upload says multipart/form-data without a boundary, then 400 bad_upload, not 500", async () => {
    const res = await agents.get("workshop")!.post(`/api/vehicles/${real.id}/photos`).set("Content-Type", "multipart/form-data").send("");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_upload");
  });
});
