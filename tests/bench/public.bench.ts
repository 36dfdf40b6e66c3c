/**
 * What a buyer's phone gets from a public condition page:
 *  - throughput of GET /api/public/vehicles/:slug through the whole app (autocannon, 10 connections, in its own
 *    process), against a plain node:http server in this same process answering from memory the very bytes the app
 *    sent (compressed as the app compressed them) with the same content type and encoding. Runs alternate app / plain
 *    / app / plain, so both share the machine's noise;
 *  - the JavaScript the condition page /vehicles/:slug loads in headless Chromium (playwright-core): raw and gzip
 *    size of every script response, against the 120 kB aim and against the entry chunk alone; throws if any staff
 *    chunk is loaded;
 *  - Lighthouse 12 (default config: mobile, simulated throttling; performance only) on that page: score, LCP, CLS
 *    and TBT against the aims (95, 2 s, 0.05, 200 ms), plus the audits that cost the most, printed.
 *
 * Data: by default the demo dealership seeded without photos, plus one vehicle taken to ready and published through
 * the API exactly as tests/support/publishing.ts does (four photos, a pinned defect, tyres, checks). With
 * BENCH_PUBLIC_DEMO=full the whole demo is seeded with its photos and published revisions instead (2–3 minutes
 * more) and the newest live demo vehicle is measured.
 *
 * Knobs: BENCH_PUBLIC_LIGHTHOUSE_RUNS (default 3; the median run by score is reported), BENCH_PUBLIC_SECONDS (autocannon
 * seconds per run, default 5), BENCH_PUBLIC_LHR=<path> to keep the median run's full Lighthouse JSON.
 * The client is built (vite build) only when dist/client/index.html is missing; a stale build is reported, not rebuilt.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createServer, type IncomingHttpHeaders, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { pino } from "pino";
import request from "supertest";
import { chromium, type Browser } from "playwright-core";
import * as chromeLauncher from "chrome-launcher";
import type { Result as LighthouseResult } from "lighthouse";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import type { AppContext } from "../../server/lib/context.ts";
import { DEMO_USERS, seedDemo } from "../../server/demo/demo.ts";
import { getPublic } from "../../server/modules/publishing/public.service.ts";
import { defaultLimits, type LimitSettings } from "../../server/middleware/rate-limit.ts";
import type { TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { percentile } from "./stats.ts";
import type { BenchEnv, BenchResult } from "./types.ts";
import { rawGet } from "./http.ts";

export const name = "public";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const CLIENT_DIR = path.join(ROOT, "dist/client");
const PASSWORD = "bench-public-password-7734";
const CHROMIUM = "/usr/bin/chromium";
/** ../shared/STACK.md's flags for Debian's Chromium. */
const CHROMIUM_FLAGS = [
  "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync",
];
const CONNECTIONS = 10;
const SECONDS = Number(process.env.BENCH_PUBLIC_SECONDS ?? 5);
const WARMUP_SECONDS = 2;
const LIGHTHOUSE_RUNS = Math.max(1, Number(process.env.BENCH_PUBLIC_LIGHTHOUSE_RUNS ?? 3));
const LIGHTHOUSE_TIMEOUT_MS = 150_000;
/** Browser-like; what autocannon sends to both servers, so compression (if the app did it) is part of the figure. */
const ACCEPT_ENCODING = "gzip, deflate, br";

const AIM = { jsGzipKb: 120, score: 95, lcpMs: 2000, cls: 0.05, tbtMs: 200 };
/** Chunk names that belong to the staff area; none may load on a public page. */
const STAFF_CHUNKS = ["StaffShell", "VehicleEditor", "users-", "settings-", "vehicle-detail", "vehicle-photos", "vehicle-walkaround", "vehicle-checks"];

const generous: LimitSettings = {
  ...defaultLimits,
  signInPerAddress: { points: 1000, durationSeconds: 900 },
  signInPerAccount: { points: 1000, durationSeconds: 900 },
};

const kB = (bytes: number) => bytes / 1000;
const fmtKb = (bytes: number) => `${kB(bytes).toFixed(1)} kB`;
const median = (xs: number[]) => percentile(xs, 50);

// ---------------------------------------------------------------------------------------------------------------
// Small process and server helpers.

function listenOn(server: Server): Promise<string> {
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}`));
  });
}

function closeServer(server: Server | undefined): Promise<void> {
  if (!server?.listening) return Promise.resolve();
  return new Promise((resolve) => {
    server.closeAllConnections();
    server.close(() => resolve());
  });
}

/** Runs `node <args>` to completion, collecting output; killed (by its own pid) after timeoutMs. */
function runNode(args: string[], timeoutMs: number, children: Set<ChildProcess>): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"], env: { ...process.env, NO_COLOR: "1", FORCE_COLOR: "0" } });
    children.add(child);
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (d) => (stdout += d));
    child.stderr.on("data", (d) => (stderr += d));
    const timer = setTimeout(() => child.kill("SIGKILL"), timeoutMs);
    child.on("error", (err) => {
      clearTimeout(timer);
      children.delete(child);
      reject(err);
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      children.delete(child);
      resolve({ code, stdout, stderr });
    });
  });
}


/** CPU time (ms) a process has used, from /proc (Linux); undefined where that cannot be read. */
function procCpuMs(pid: number): number | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100; // utime + stime, in USER_HZ (100 on Linux)
  } catch {
    return undefined;
  }
}

/** The pid of this run's MariaDB (the one listening on the database URL's port), to see where the CPU goes. */
function mariadbPid(databaseUrl: string): number | undefined {
  const port = new URL(databaseUrl).port;
  try {
    for (const entry of readdirSync("/proc")) {
      if (!/^\d+$/.test(entry)) continue;
      try {
        const cmd = readFileSync(`/proc/${entry}/cmdline`, "utf8");
        if (cmd.includes("mariadbd") && cmd.includes(`--port=${port}`)) return Number(entry);
      } catch {
        /* gone */
      }
    }
  } catch {
    /* no /proc */
  }
  return undefined;
}

/** Runs fn and reports the CPU this process and MariaDB used during it, as % of one core. */
async function withCpu<T>(dbPid: number | undefined, fn: () => Promise<T>): Promise<{ result: T; nodePct: number; dbPct: number | undefined }> {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const d0 = dbPid ? procCpuMs(dbPid) : undefined;
  const result = await fn();
  const wall = performance.now() - t0;
  const c = process.cpuUsage(c0);
  const d1 = dbPid ? procCpuMs(dbPid) : undefined;
  return { result, nodePct: ((c.user + c.system) / 1000 / wall) * 100, dbPct: d0 !== undefined && d1 !== undefined ? ((d1 - d0) / wall) * 100 : undefined };
}

// ---------------------------------------------------------------------------------------------------------------
// The client build.

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return newest;
}

async function ensureClientBuilt(env: BenchEnv) {
  const index = path.join(CLIENT_DIR, "index.html");
  if (!existsSync(index)) {
    env.log("dist/client/index.html is missing: building the client (vite build)…");
    const t0 = performance.now();
    const { build } = await import("vite");
    await build({ configFile: path.join(ROOT, "vite.config.ts"), logLevel: "warn" });
    env.log(`client built in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    return;
  }
  const built = statSync(index).mtimeMs;
  const sources = Math.max(newestMtime(path.join(ROOT, "src")), newestMtime(path.join(ROOT, "shared")));
  const age = (Date.now() - built) / 60_000;
  env.log(
    `using the existing client build (dist/client, built ${age.toFixed(0)} min ago)` +
      (sources > built ? `; NOTE: src/ or shared/ changed ${((sources - built) / 60_000).toFixed(0)} min after it — run \`npx vite build\` to measure the current code` : ""),
  );
}

// ---------------------------------------------------------------------------------------------------------------
// Data: one published vehicle through the API (default) or the full demo.

function testAppShim(app: ReturnType<typeof createApp>, ctx: AppContext, base: string): TestApp {
  const agent = () => request.agent(base).set("Origin", base);
  return {
    app,
    ctx,
    agent,
    async signIn(role) {
      const a = agent();
      const email = DEMO_USERS.find((u) => u.role === role)!.email;
      const res = await a.post("/api/auth/sign-in").send({ email, password: PASSWORD });
      if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return a;
    },
    close: () => Promise.resolve(),
  };
}

async function publishedSlug(env: BenchEnv, ctx: AppContext, app: ReturnType<typeof createApp>, base: string): Promise<string> {
  const full = process.env.BENCH_PUBLIC_DEMO === "full";
  const t0 = performance.now();
  if (full) {
    env.log("seeding the full demo with photos and published revisions (2–3 minutes)…");
    await seedDemo(ctx.database.db, { password: PASSWORD, storage: ctx.storage, publicUrl: base, log: (line) => env.log(line.trim()) });
    const res = await fetch(`${base}/api/public/vehicles?sort=newest`);
    const list = (await res.json()) as { vehicles: Array<{ slug: string; status: string; title: string }> };
    const pick = list.vehicles.find((v) => v.status === "live") ?? list.vehicles[0];
    if (!pick) throw new Error("the demo published no vehicle");
    env.log(`demo seeded in ${((performance.now() - t0) / 1000).toFixed(0)} s; measuring ${pick.title} (/vehicles/${pick.slug})`);
    return pick.slug;
  }
  await seedDemo(ctx.database.db, { password: PASSWORD });
  const { slug } = await publishReadyVehicle(testAppShim(app, ctx, base));
  env.log(`demo dealership seeded and one ready vehicle published (publishReadyVehicle) in ${((performance.now() - t0) / 1000).toFixed(1)} s: /vehicles/${slug}`);
  return slug;
}

// ---------------------------------------------------------------------------------------------------------------
// 1. Throughput.

interface CannonRun {
  requests: { average: number; mean: number; total: number };
  latency: { p99: number; average: number; p50: number };
  throughput: { total: number };
  non2xx: number;
  errors: number;
  timeouts: number;
  duration: number;
}

async function cannon(url: string, seconds: number, children: Set<ChildProcess>): Promise<CannonRun> {
  const bin = path.join(ROOT, "node_modules/autocannon/autocannon.js");
  const { code, stdout, stderr } = await runNode(
    [bin, "--json", "-c", String(CONNECTIONS), "-d", String(seconds), "-H", `accept-encoding=${ACCEPT_ENCODING}`, url],
    (seconds + 30) * 1000,
    children,
  );
  const line = stdout.trim().split("\n").filter(Boolean).pop();
  if (code !== 0 || !line) throw new Error(`autocannon exited ${code}: ${stderr.slice(-2000)}`);
  const r = JSON.parse(line) as CannonRun;
  if (r.non2xx || r.errors || r.timeouts) throw new Error(`autocannon against ${url}: ${r.non2xx} non-2xx, ${r.errors} errors, ${r.timeouts} timeouts`);
  return r;
}

/** Where one request's time goes, one request at a time (diagnostic lines only): statements issued, service vs HTTP. */
async function breakdown(env: BenchEnv, ctx: AppContext, route: string, slug: string) {
  const pool = ctx.database.pool as unknown as Record<"query" | "execute", (...args: unknown[]) => unknown>;
  const statements: string[] = [];
  const real = { query: pool.query, execute: pool.execute };
  for (const k of ["query", "execute"] as const) {
    pool[k] = function (this: unknown, ...args: unknown[]) {
      const first = args[0] as string | { sql: string };
      statements.push(typeof first === "string" ? first : first.sql);
      return real[k].apply(this, args);
    };
  }
  try {
    await (await fetch(route)).arrayBuffer();
  } finally {
    pool.query = real.query;
    pool.execute = real.execute;
  }
  const N = 200;
  const service: number[] = [];
  const http: number[] = [];
  for (let i = 0; i < N; i++) {
    let t0 = performance.now();
    JSON.stringify({ vehicle: await getPublic(ctx, slug) });
    service.push(performance.now() - t0);
    t0 = performance.now();
    await (await fetch(route)).arrayBuffer();
    http.push(performance.now() - t0);
  }
  env.log(
    `one request at a time (${N} each): getPublic() + JSON.stringify in-process p50 ${median(service).toFixed(2)} ms, the route over HTTP p50 ${median(http).toFixed(2)} ms; ` +
      `${statements.length} SQL statements per request:`,
  );
  for (const q of statements) env.log(`    ${q.length > 160 ? q.slice(0, 157) + "…" : q}`);
}

async function throughput(env: BenchEnv, ctx: AppContext, base: string, slug: string, databaseUrl: string, children: Set<ChildProcess>, servers: Server[]): Promise<BenchResult[]> {
  const route = `${base}/api/public/vehicles/${slug}`;
  const plain = await rawGet(route, {});
  if (plain.status !== 200) throw new Error(`GET ${route}: ${plain.status} ${plain.body.toString().slice(0, 300)}`);
  const contentType = String(plain.headers["content-type"]);
  const body = plain.body;
  const asked = await rawGet(route, { "Accept-Encoding": ACCEPT_ENCODING });
  const encoding = asked.headers["content-encoding"];
  env.log(
    `public vehicle JSON: ${body.length} bytes (${fmtKb(gzipSync(body).length)} if gzipped), ${contentType}; ` +
      (encoding
        ? `the app compresses it (${encoding}, ${asked.body.length} bytes on the wire) when asked`
        : `the app does NOT compress it even when asked (Accept-Encoding: ${ACCEPT_ENCODING}) — autocannon measures the ${body.length} raw bytes`),
  );

  // The very bytes the app puts on the wire for autocannon's Accept-Encoding (compressed, when the app compresses).
  const wire = asked.body;
  const wireHeaders: Record<string, string | number> = { "Content-Type": contentType, "Content-Length": wire.length, ...(encoding ? { "Content-Encoding": String(encoding), Vary: "Accept-Encoding" } : {}) };
  const reference = createServer((_req, res) => {
    res.writeHead(200, wireHeaders);
    res.end(wire);
  });
  servers.push(reference);
  const refBase = await listenOn(reference);
  const check = await rawGet(refBase, {});
  if (!check.body.equals(wire) || check.headers["content-type"] !== contentType) throw new Error("the plain server does not answer the app's bytes");
  const headerBytes = (h: IncomingHttpHeaders) => Object.entries(h).reduce((s, [k, v]) => s + k.length + String(v).length + 4, 0);
  env.log(`response headers: app ≈ ${headerBytes(plain.headers)} bytes (helmet, request id, cache-control…), plain ≈ ${headerBytes(check.headers)} bytes`);

  env.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(" ")} on ${cpus().length} cores (the machine is shared; the interleaving is what keeps the ratio fair)`);
  env.log(`autocannon: ${CONNECTIONS} connections; warm-up ${WARMUP_SECONDS} s each, then app / plain / app / plain, ${SECONDS} s each`);
  await cannon(route, WARMUP_SECONDS, children);
  await cannon(refBase, WARMUP_SECONDS, children);
  const app: CannonRun[] = [];
  const ref: CannonRun[] = [];
  const dbPid = mariadbPid(databaseUrl);
  const cpu = (r: { nodePct: number; dbPct: number | undefined }) => `; CPU: this process ${r.nodePct.toFixed(0)}%${r.dbPct !== undefined ? `, MariaDB ${r.dbPct.toFixed(0)}%` : ""} of a core`;
  for (let i = 0; i < 2; i++) {
    const ra = await withCpu(dbPid, () => cannon(route, SECONDS, children));
    const a = ra.result;
    app.push(a);
    env.log(`  app   run ${i + 1}: ${a.requests.average.toFixed(0)} req/s, p50 ${a.latency.p50} ms, p99 ${a.latency.p99} ms, ${(a.throughput.total / a.requests.total).toFixed(0)} bytes/response${cpu(ra)}`);
    const rb = await withCpu(dbPid, () => cannon(refBase, SECONDS, children));
    const b = rb.result;
    ref.push(b);
    env.log(`  plain run ${i + 1}: ${b.requests.average.toFixed(0)} req/s, p50 ${b.latency.p50} ms, p99 ${b.latency.p99} ms, ${(b.throughput.total / b.requests.total).toFixed(0)} bytes/response${cpu(rb)}`);
  }
  await breakdown(env, ctx, route, slug);
  const mean = (runs: CannonRun[], f: (r: CannonRun) => number) => runs.reduce((s, r) => s + f(r), 0) / runs.length;
  const seconds = SECONDS * 2;
  return [
    { figure: "public vehicle API, requests/s (mean)", unit: "req/s", value: mean(app, (r) => r.requests.average), baseline: mean(ref, (r) => r.requests.average), baselineLabel: "same bytes, plain node:http", higherIsBetter: true, samples: seconds },
    {
      figure: "public vehicle API, p99 latency",
      unit: "ms",
      value: mean(app, (r) => r.latency.p99),
      // autocannon's histogram counts whole milliseconds: a sub-millisecond p99 reads 0, shown as 1 (the ratio is then a lower bound).
      baseline: Math.max(1, mean(ref, (r) => r.latency.p99)),
      baselineLabel: mean(ref, (r) => r.latency.p99) < 1 ? "plain node:http, under 1 ms: autocannon's resolution, ratio ≥" : "same bytes, plain node:http",
      samples: app.reduce((s, r) => s + r.requests.total, 0),
    },
  ];
}

// ---------------------------------------------------------------------------------------------------------------
// 2. The JavaScript the condition page loads.

async function pageJavaScript(env: BenchEnv, base: string, slug: string, title: string, browsers: Browser[]): Promise<BenchResult[]> {
  // Playwright's own signal handlers would call process.exit(130) before the harness has stopped MariaDB; its exit
  // handler still kills the browser if the run is interrupted.
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROMIUM_FLAGS, handleSIGINT: false, handleSIGTERM: false, handleSIGHUP: false });
  browsers.push(browser);
  const context = await browser.newContext({ viewport: { width: 412, height: 823 }, deviceScaleFactor: 1.75, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  const scripts = new Map<string, { raw: number; gzip: number; encoding: string | undefined; wire: number }>();
  const other = new Map<string, { type: string; bytes: number }>();
  const pending: Promise<void>[] = [];
  page.on("response", (res) => {
    const type = res.request().resourceType();
    const url = res.url();
    if (!url.startsWith(base)) return;
    pending.push(
      (async () => {
        const bodyBuf = await res.body().catch(() => null);
        if (!bodyBuf) return;
        if (type === "script") {
          const sizes = await res.request().sizes().catch(() => null);
          scripts.set(url, { raw: bodyBuf.length, gzip: gzipSync(bodyBuf).length, encoding: (await res.allHeaders())["content-encoding"], wire: sizes?.responseBodySize ?? bodyBuf.length });
        } else {
          other.set(url, { type, bytes: bodyBuf.length });
        }
      })(),
    );
  });
  const errors: string[] = [];
  page.on("pageerror", (err) => errors.push(err.message));
  const html = await (await fetch(`${base}/vehicles/${slug}`)).text();
  const entrySrc = /<script[^>]+type="module"[^>]*src="([^"]+)"/.exec(html)?.[1];
  if (!entrySrc) throw new Error("no module entry script in the condition page's HTML");
  const entryUrl = new URL(entrySrc, base).href;

  await page.goto(`${base}/vehicles/${slug}`, { waitUntil: "networkidle" });
  await page.waitForFunction((t) => document.querySelector("main")?.textContent?.includes(t) ?? false, title, { timeout: 15_000 });
  await page.waitForLoadState("networkidle");
  await Promise.all(pending);
  await context.close();
  if (errors.length) env.log(`page errors: ${errors.join(" | ")}`);

  const chunkName = (url: string) => new URL(url).pathname.split("/").pop()!;
  const rows = [...scripts.entries()].sort((a, b) => b[1].raw - a[1].raw);
  env.log(`condition page loads ${rows.length} scripts (gzip = zlib.gzipSync default level, per file):`);
  for (const [url, s] of rows) {
    env.log(`  ${chunkName(url).padEnd(34)} ${fmtKb(s.raw).padStart(9)} raw  ${fmtKb(s.gzip).padStart(8)} gzip  served ${s.encoding ?? "uncompressed"}${url === entryUrl ? "  (entry)" : ""}`);
  }
  const byType = new Map<string, { n: number; bytes: number }>();
  for (const o of other.values()) {
    const t = byType.get(o.type) ?? { n: 0, bytes: 0 };
    t.n++;
    t.bytes += o.bytes;
    byType.set(o.type, t);
  }
  env.log(`other responses: ${[...byType.entries()].map(([t, v]) => `${t} ${v.n} (${fmtKb(v.bytes)})`).join(", ")}`);

  const staff = rows.map(([url]) => chunkName(url)).filter((n) => STAFF_CHUNKS.some((s) => n.includes(s)));
  if (staff.length) throw new Error(`the public condition page loaded staff code: ${staff.join(", ")}`);
  const entry = scripts.get(entryUrl);
  if (!entry) throw new Error(`the entry chunk ${entrySrc} was not among the scripts loaded`);
  const raw = rows.reduce((s, [, v]) => s + v.raw, 0);
  const gzip = rows.reduce((s, [, v]) => s + v.gzip, 0);
  const wire = rows.reduce((s, [, v]) => s + v.wire, 0);
  env.log(`no staff chunk loaded. JS total ${fmtKb(raw)} raw, ${fmtKb(gzip)} gzipped, ${fmtKb(wire)} on the wire as served`);
  return [
    { figure: "condition page JS, gzip (all scripts)", unit: "kB", value: kB(gzip), baseline: AIM.jsGzipKb, baselineLabel: "aim", samples: rows.length },
    { figure: "condition page JS, gzip (all scripts)", unit: "kB", value: kB(gzip), baseline: kB(entry.gzip), baselineLabel: "entry chunk alone", samples: rows.length },
    { figure: "condition page JS, raw (as served)", unit: "kB", value: kB(raw), baseline: kB(entry.raw), baselineLabel: "entry chunk alone", samples: rows.length },
  ];
}

// ---------------------------------------------------------------------------------------------------------------
// 3. Lighthouse.

type Lhr = LighthouseResult;

const AUDITS_TO_PRINT = [
  "largest-contentful-paint-element", "render-blocking-resources", "unused-javascript", "unused-css-rules", "uses-text-compression", "font-display",
  "uses-responsive-images", "modern-image-formats", "offscreen-images", "efficient-animated-content", "prioritize-lcp-image", "lcp-lazy-loaded",
  "unsized-images", "layout-shifts", "server-response-time", "redirects", "uses-rel-preconnect", "critical-request-chains", "total-byte-weight",
  "bootup-time", "mainthread-work-breakdown", "long-tasks", "dom-size", "uses-long-cache-ttl", "unminified-javascript", "legacy-javascript", "duplicated-javascript",
];

function short(value: unknown, base: string): string {
  if (typeof value === "string") return value.startsWith(base) ? value.slice(base.length) || "/" : value.length > 90 ? value.slice(0, 87) + "…" : value;
  if (typeof value === "number") return Number.isInteger(value) ? String(value) : value.toFixed(value < 1 ? 3 : 0);
  if (value && typeof value === "object") {
    const o = value as Record<string, unknown>;
    if (typeof o.url === "string") return short(o.url, base);
    if (typeof o.snippet === "string") return short(o.snippet, base);
    if (typeof o.nodeLabel === "string") return short(o.nodeLabel, base);
    if (typeof o.text === "string") return short(o.text, base);
  }
  return "";
}

function printAudits(env: BenchEnv, lhr: Lhr, base: string) {
  const perf = lhr.categories.performance;
  env.log(
    `Lighthouse ${lhr.lighthouseVersion}, ${lhr.environment.hostUserAgent.match(/Chrome\/[\d.]+/)?.[0] ?? "?"}, ${lhr.configSettings.formFactor}, throttling ${lhr.configSettings.throttlingMethod} ` +
      `(RTT ${lhr.configSettings.throttling.rttMs} ms, ${lhr.configSettings.throttling.throughputKbps} kbps, CPU ×${lhr.configSettings.throttling.cpuSlowdownMultiplier}); ` +
      `this machine's benchmarkIndex ${lhr.environment.benchmarkIndex} (Lighthouse calibrates its CPU slowdown for ~1000–2000; lower means a slower host and inflated TBT)`,
  );
  for (const id of ["first-contentful-paint", "largest-contentful-paint", "speed-index", "total-blocking-time", "cumulative-layout-shift", "interactive", "max-potential-fid"]) {
    const a = lhr.audits[id];
    if (a) env.log(`  ${a.title.padEnd(28)} ${String(a.displayValue ?? "").padStart(10)}  score ${a.score ?? "-"}`);
  }
  const ids = new Set([...perf.auditRefs.map((r) => r.id).filter((id) => { const a = lhr.audits[id]; return a && a.score !== null && a.score < 0.9 && a.scoreDisplayMode !== "informative" && !a.id.match(/^(first-contentful-paint|largest-contentful-paint|speed-index|total-blocking-time|cumulative-layout-shift|interactive)$/); }), ...AUDITS_TO_PRINT]);
  env.log("audits (failing first, then the ones asked about):");
  for (const id of ids) {
    const a = lhr.audits[id];
    if (!a || a.scoreDisplayMode === "notApplicable") continue;
    const savings = a.metricSavings ? Object.entries(a.metricSavings).filter(([, v]) => v).map(([k, v]) => `${k} −${Math.round(v as number)}`).join(", ") : "";
    const details = a.details as { type?: string; items?: Array<Record<string, unknown>>; overallSavingsMs?: number; overallSavingsBytes?: number } | undefined;
    const extra = [details?.overallSavingsMs ? `saves ~${Math.round(details.overallSavingsMs)} ms` : "", details?.overallSavingsBytes ? `~${fmtKb(details.overallSavingsBytes)}` : "", savings].filter(Boolean).join("; ");
    env.log(`  [${a.score === null ? a.scoreDisplayMode : a.score.toFixed(2)}] ${a.id}: ${a.title}${a.displayValue ? ` — ${a.displayValue}` : ""}${extra ? ` (${extra})` : ""}${a.errorMessage ? ` — ${a.errorMessage.split("\n")[0]}` : ""}`);
    const items = (details?.items ?? []).slice(0, 5);
    for (const item of items) {
      if (details?.type === "list" || details?.type === "criticalrequestchain") continue;
      const label = short(item.url, base) || short(item.node, base) || short(item.source, base) || short(item.group, base) || short(item.groupLabel, base) || short(item.phase, base) || short(item.label, base) || short(item.statistic, base);
      const nums = Object.entries(item)
        .filter(([k, v]) => typeof v === "number" && /bytes|ms|time|size|score|duration|timing|percent|value|wasted|total|scripting|compile/i.test(k))
        .map(([k, v]) => `${k} ${/bytes|size/i.test(k) ? fmtKb(v as number) : short(v, base)}`)
        .join(", ");
      if (label || nums) env.log(`      · ${label}${nums ? `  ${nums}` : ""}`);
    }
    if (details?.type === "list") {
      for (const sub of (details as { items: Array<{ type?: string; items?: Array<Record<string, unknown>> }> }).items) {
        for (const item of (sub.items ?? []).slice(0, 5)) {
          const label = short(item.node, base) || short(item.phase, base) || short(item.url, base) || short(item.label, base);
          const nums = Object.entries(item).filter(([, v]) => typeof v === "number").map(([k, v]) => `${k} ${short(v, base)}`).join(", ");
          if (label || nums) env.log(`      · ${label}${nums ? `  ${nums}` : ""}`);
        }
      }
    }
  }
}

async function lighthouseFigures(env: BenchEnv, url: string, base: string, children: Set<ChildProcess>, tmp: string): Promise<BenchResult[]> {
  const lhPkg = path.join(ROOT, "node_modules/lighthouse/package.json");
  if (!existsSync(lhPkg)) {
    env.log("Lighthouse is not installed (npm i -D -E lighthouse@12.2.3); skipping its figures");
    return [];
  }
  const { engines } = JSON.parse(readFileSync(lhPkg, "utf8")) as { engines?: { node?: string } };
  const needs = engines?.node?.match(/>=\s*(\d+)/)?.[1];
  if (needs && Number(process.versions.node.split(".")[0]) < Number(needs)) {
    env.log(`Lighthouse needs Node ${engines.node}, this is ${process.version}; skipping its figures`);
    return [];
  }
  const chrome = await chromeLauncher.launch({
    chromePath: CHROMIUM,
    chromeFlags: ["--headless=new", ...CHROMIUM_FLAGS],
    handleSIGINT: false,
    logLevel: "silent",
  });
  // If the run is interrupted (the harness exits on a signal), the detached Chromium must not outlive it.
  const killOnExit = () => {
    try {
      if (chrome.pid) process.kill(-chrome.pid, "SIGKILL");
    } catch {
      /* already gone */
    }
  };
  process.once("exit", killOnExit);
  const runs: Lhr[] = [];
  try {
    const script = path.join(ROOT, "tests/bench/lighthouse-run.mjs");
    for (let i = 0; i < LIGHTHOUSE_RUNS; i++) {
      const out = path.join(tmp, `lhr-${i}.json`);
      const t0 = performance.now();
      const { code, stdout, stderr } = await runNode([script, url, String(chrome.port), out], LIGHTHOUSE_TIMEOUT_MS, children);
      if (code !== 0 || !existsSync(out)) throw new Error(`lighthouse run ${i + 1} exited ${code}: ${stderr.slice(-2000)}`);
      if (i === 0) {
        const patched = (JSON.parse(stdout.trim().split("\n").pop() || "{}") as { patchedTraceEvents?: number }).patchedTraceEvents ?? 0;
        env.log(`trace shim (lighthouse-run.mjs): ${patched} PipelineReporter events renamed frame_reporter → chrome_frame_reporter for Lighthouse 12.2.3's trace engine`);
      }
      const lhr = JSON.parse(readFileSync(out, "utf8")) as Lhr;
      runs.push(lhr);
      const m = (id: string) => lhr.audits[id]?.numericValue ?? Number.NaN;
      env.log(
        `lighthouse run ${i + 1}/${LIGHTHOUSE_RUNS} (${((performance.now() - t0) / 1000).toFixed(0)} s): score ${Math.round((lhr.categories.performance?.score ?? 0) * 100)}, ` +
          `FCP ${m("first-contentful-paint").toFixed(0)} ms, LCP ${m("largest-contentful-paint").toFixed(0)} ms, TBT ${m("total-blocking-time").toFixed(0)} ms, CLS ${m("cumulative-layout-shift").toFixed(3)}` +
          (lhr.runWarnings.length ? `; warnings: ${lhr.runWarnings.join(" | ")}` : ""),
      );
    }
  } finally {
    process.removeListener("exit", killOnExit);
    chrome.kill();
  }
  const score = (l: Lhr) => (l.categories.performance?.score ?? 0) * 100;
  const sorted = [...runs].sort((a, b) => score(a) - score(b));
  const mid = sorted[Math.floor((sorted.length - 1) / 2)];
  printAudits(env, mid, base);
  if (process.env.BENCH_PUBLIC_LHR) {
    writeFileSync(process.env.BENCH_PUBLIC_LHR, JSON.stringify(mid, null, 1));
    env.log(`median run's Lighthouse JSON written to ${process.env.BENCH_PUBLIC_LHR}`);
  }
  const metric = (id: string) => median(runs.map((l) => l.audits[id]?.numericValue ?? Number.NaN));
  const n = runs.length;
  return [
    { figure: `Lighthouse performance score (median of ${n})`, unit: "", value: median(runs.map(score)), baseline: AIM.score, baselineLabel: "aim", higherIsBetter: true, samples: n },
    { figure: `Lighthouse LCP (median of ${n})`, unit: "ms", value: metric("largest-contentful-paint"), baseline: AIM.lcpMs, baselineLabel: "aim", samples: n },
    { figure: `Lighthouse CLS (median of ${n})`, unit: "", value: metric("cumulative-layout-shift"), baseline: AIM.cls, baselineLabel: "aim", samples: n },
    { figure: `Lighthouse TBT (median of ${n})`, unit: "ms", value: metric("total-blocking-time"), baseline: AIM.tbtMs, baselineLabel: "aim", samples: n },
  ];
}

// ---------------------------------------------------------------------------------------------------------------

export async function run(env: BenchEnv): Promise<BenchResult[]> {
  await ensureClientBuilt(env);
  const database = env.createDatabase();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-bench-public-uploads-"));
  const tmp = mkdtempSync(path.join(tmpdir(), "forthright-bench-public-"));
  const children = new Set<ChildProcess>();
  const browsers: Browser[] = [];
  const servers: Server[] = [];
  let ctx: AppContext | undefined;
  // The harness exits straight away on SIGINT/SIGTERM, without waiting for this finally: leave nothing behind then either.
  const onExit = () => {
    for (const child of children) child.kill("SIGKILL");
    rmSync(uploadsDir, { recursive: true, force: true });
    rmSync(tmp, { recursive: true, force: true });
  };
  process.once("exit", onExit);
  try {
    // Listen first, so the app is configured with the address it is really served on (canonical URLs, Origin checks).
    const server = createServer();
    servers.push(server);
    const base = await listenOn(server);
    ctx = await createContext({
      uploadsDir,
      env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: base, LOG_LEVEL: "silent" },
      logger: pino({ level: "silent" }),
      limits: generous,
    });
    const app = createApp(ctx);
    server.on("request", app);
    env.log(`app on ${base}`);

    const slug = await publishedSlug(env, ctx, app, base);
    const json = (await (await fetch(`${base}/api/public/vehicles/${slug}`)).json()) as { vehicle: { snapshot: { title: string; photos: unknown[] } } };
    const title = json.vehicle.snapshot.title;
    env.log(`"${title}", ${json.vehicle.snapshot.photos.length} photos`);

    const results: BenchResult[] = [];
    results.push(...(await throughput(env, ctx, base, slug, database.url, children, servers)));
    results.push(...(await pageJavaScript(env, base, slug, title, browsers)));
    results.push(...(await lighthouseFigures(env, `${base}/vehicles/${slug}`, base, children, tmp)));
    return results;
  } finally {
    process.removeListener("exit", onExit);
    for (const child of children) child.kill("SIGKILL");
    for (const b of browsers) await b.close().catch(() => undefined);
    for (const s of servers) await closeServer(s);
    if (ctx) {
      await ctx.photoWorker.stop();
      await ctx.database.close();
    }
    rmSync(uploadsDir, { recursive: true, force: true });
    rmSync(tmp, { recursive: true, force: true });
    database.drop();
  }
}
