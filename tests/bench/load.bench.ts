/**
 * Load on the public read path, against the server as deployed:
 *  - the condition page HTML (GET /vehicles/:slug) and its public API (GET /api/public/vehicles/:slug), each at
 *    BENCH_LOAD_CONNECTIONS (200) connections for BENCH_LOAD_SECONDS (30) seconds with autocannon; requests/s and
 *    p50/p97.5/p99 latency against a plain node:http server that answers the very bytes the app put on the wire
 *    (same status, content type and content encoding, read back once before the run); every error, timeout and
 *    non-2xx is counted and fails the figure;
 *  - a mixed load: 4 signed-in sales and 4 workshop agents, each editing its own vehicle with the version the last
 *    save returned (so no 409 is expected; every answer must be 2xx), the workshop agents also uploading a few small
 *    photos, while autocannon reads the public API at the same connections. Public p99 under that load against public
 *    p99 alone (the run above), and the staff saves' p50/p99 against the same agents writing alone.
 *
 * Why a child process: the app runs as `node --import tsx server/index.ts` (what `npm start` runs after its set-up),
 * NODE_ENV=production, LOG_LEVEL=info (request logs to /dev/null), its own photo worker and mail sender, so nothing
 * of the bench shares its event loop. autocannon runs in a process of its own; the plain baseline server and the
 * staff agents live in this (otherwise idle) process. On a 2-core machine the load generator still competes with the
 * server for CPU, and so it does for the baseline: compare the ratios, not the absolute figures.
 *
 * Data is set up before the child starts, in this process: the demo dealership (no photos), one vehicle taken to
 * ready and published through the API as tests/support/publishing.ts does, the agents' vehicles, and the agents'
 * sessions (sessions live in MariaDB, so the cookies work on the child).
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { createServer, type IncomingHttpHeaders, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { pino } from "pino";
import request from "supertest";
import sharp from "sharp";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import type { AppContext } from "../../server/lib/context.ts";
import { DEMO_USERS, seedDemo } from "../../server/demo/demo.ts";
import { renderDemoPhoto } from "../../server/demo/art/index.ts";
import { defaultLimits, type LimitSettings } from "../../server/middleware/rate-limit.ts";
import type { Role } from "../../shared/constants/roles.ts";
import type { TestApp } from "../support/app.ts";
import { listen } from "../support/http-server.ts";
import { freePort } from "../support/ports.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { percentile } from "./stats.ts";
import type { BenchEnv, BenchResult } from "./types.ts";
import { rawGet } from "./http.ts";

export const name = "load";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const PASSWORD = "bench-load-password-5521";
const CONNECTIONS = Number(process.env.BENCH_LOAD_CONNECTIONS ?? 200);
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 30);
const WARMUP_SECONDS = 3;
/** Staff agents in the mixed load: half sales (price and copy), half workshop (history, photos). */
const AGENTS_PER_ROLE = 4;
/** A person at a keyboard does not save twice in a millisecond; this is still far more than a dealership's day. */
const AGENT_PAUSE_MS = 100;
/** Each workshop agent uploads a photo every this many saves, at most PHOTOS_PER_AGENT. */
const PHOTO_EVERY = 15;
const PHOTOS_PER_AGENT = 3;
/** The writers-alone baseline run. */
const WRITERS_ALONE_SECONDS = Math.max(5, Math.round(SECONDS / 3));
/** Browser-like, so compression (the app's and the baseline's bytes) is part of the figure. */
const ACCEPT_ENCODING = "gzip, deflate, br";

const generous: LimitSettings = {
  ...defaultLimits,
  signInPerAddress: { points: 1000, durationSeconds: 900 },
  signInPerAccount: { points: 1000, durationSeconds: 900 },
};

// ---------------------------------------------------------------------------------------------------------------
// Process and HTTP helpers.


function closeServer(server: Server | undefined): Promise<void> {
  if (!server?.listening) return Promise.resolve();
  return new Promise((resolve) => {
    server.closeAllConnections();
    server.close(() => resolve());
  });
}

/** A plain node:http server answering `body` with the same status and entity headers as the app's response. */
async function plainServer(status: number, headers: IncomingHttpHeaders, body: Buffer): Promise<{ server: Server; url: string }> {
  const copied: Record<string, string> = { "Content-Length": String(body.length) };
  for (const h of ["content-type", "content-encoding", "vary", "etag", "cache-control"]) if (headers[h]) copied[h] = String(headers[h]);
  const server = createServer((_req, res) => {
    res.writeHead(status, copied);
    res.end(body);
  });
  server.keepAliveTimeout = 65_000;
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

interface CannonRun {
  requests: { average: number; total: number };
  latency: { p50: number; p97_5: number; p99: number; max: number; average: number };
  throughput: { total: number };
  non2xx: number;
  errors: number;
  timeouts: number;
  duration: number;
  statusCodeStats?: Record<string, { count: number }>;
}

/** autocannon in its own process, so it never shares an event loop with either server. */
function cannon(url: string, seconds: number, children: Set<ChildProcess>): Promise<CannonRun> {
  const bin = path.join(ROOT, "node_modules/autocannon/autocannon.js");
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [bin, "--json", "-c", String(CONNECTIONS), "-d", String(seconds), "-t", "10", "-H", `accept-encoding=${ACCEPT_ENCODING}`, url], {
      cwd: ROOT,
      stdio: ["ignore", "pipe", "pipe"],
      env: { ...process.env, NO_COLOR: "1", FORCE_COLOR: "0" },
    });
    children.add(child);
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (d) => (stdout += d));
    child.stderr.on("data", (d) => (stderr += d));
    const timer = setTimeout(() => child.kill("SIGKILL"), (seconds + 60) * 1000);
    child.on("error", (err) => (clearTimeout(timer), children.delete(child), reject(err)));
    child.on("close", (code) => {
      clearTimeout(timer);
      children.delete(child);
      const line = stdout.trim().split("\n").filter(Boolean).pop();
      if (code !== 0 || !line) return reject(new Error(`autocannon exited ${code}: ${stderr.slice(-2000)}`));
      resolve(JSON.parse(line) as CannonRun);
    });
  });
}

/** CPU time (ms) a process has used, from /proc/<pid>/stat (utime + stime, USER_HZ 100); undefined off Linux. */
function procCpuMs(pid: number | undefined): number | undefined {
  if (!pid) return undefined;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
  } catch {
    return undefined;
  }
}

/** The pid of this run's mariadbd (the one on the database URL's port). */
function mariadbPid(databaseUrl: string): number | undefined {
  const port = new URL(databaseUrl).port;
  for (const entry of readdirSync("/proc").filter((e) => /^\d+$/.test(e))) {
    try {
      const cmd = readFileSync(`/proc/${entry}/cmdline`, "utf8");
      if (cmd.includes("mariadbd") && cmd.includes(`--port=${port}`)) return Number(entry);
    } catch {
      /* gone */
    }
  }
  return undefined;
}

/** Runs fn and says how much CPU the server, MariaDB and this process used meanwhile, in % of one core. */
async function cpuDuring<T>(pids: { server?: number; db?: number }, fn: () => Promise<T>): Promise<{ result: T; line: string }> {
  const t0 = performance.now();
  const s0 = procCpuMs(pids.server);
  const d0 = procCpuMs(pids.db);
  const c0 = process.cpuUsage();
  const result = await fn();
  const wall = performance.now() - t0;
  const pct = (a: number | undefined, b: number | undefined) => (a === undefined || b === undefined ? "?" : `${(((b - a) / wall) * 100).toFixed(0)}%`);
  const c = process.cpuUsage(c0);
  const line = `CPU: server ${pct(s0, procCpuMs(pids.server))}, MariaDB ${pct(d0, procCpuMs(pids.db))}, bench process ${(((c.user + c.system) / 1000 / wall) * 100).toFixed(0)}% of a core`;
  return { result, line };
}

/** autocannon counts a timeout among its errors too. */
const failures = (r: CannonRun) => r.errors + r.non2xx;
const describe = (r: CannonRun) =>
  `${r.requests.average.toFixed(0)} req/s, p50 ${r.latency.p50} ms, p97.5 ${r.latency.p97_5} ms, p99 ${r.latency.p99} ms, max ${r.latency.max} ms, ` +
  `${(r.throughput.total / Math.max(1, r.requests.total)).toFixed(0)} bytes/response, ${r.requests.total} requests` +
  (failures(r) ? `; ${r.errors} errors (${r.timeouts} of them timeouts), ${r.non2xx} non-2xx` : "; no errors");

// ---------------------------------------------------------------------------------------------------------------
// The server as deployed, in a child process.

async function startServer(env: BenchEnv, port: number, databaseUrl: string, uploadsDir: string, children: Set<ChildProcess>): Promise<{ child: ChildProcess; stderr: () => string }> {
  const smtpPort = await freePort(); // nothing listens there; the bench sends no mail, and the sender retries quietly
  // BENCH_LOAD_CPU_PROF=<dir>: the server writes a V8 CPU profile there when it stops (open it in Chrome DevTools).
  const prof = process.env.BENCH_LOAD_CPU_PROF ? ["--cpu-prof", "--cpu-prof-dir", path.resolve(process.env.BENCH_LOAD_CPU_PROF)] : [];
  const child = spawn(process.execPath, [...prof, "--import", "tsx", "server/index.ts"], {
    cwd: ROOT,
    stdio: ["ignore", "ignore", "pipe"],
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: "production",
      HOST: "127.0.0.1",
      PORT: String(port),
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      DATABASE_URL: databaseUrl,
      UPLOADS_DIR: uploadsDir,
      LOG_LEVEL: "info",
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
    },
  });
  children.add(child);
  let stderr = "";
  child.stderr.on("data", (d) => (stderr = (stderr + d).slice(-4000)));
  child.on("exit", () => children.delete(child));
  const t0 = performance.now();
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server/index.ts exited ${child.exitCode}: ${stderr}`);
    try {
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      if (res.ok) break;
    } catch {
      /* not listening yet */
    }
    if (performance.now() - t0 > 60_000) throw new Error(`server/index.ts did not answer /api/health within 60 s: ${stderr}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  env.log(`server/index.ts (pid ${child.pid}, NODE_ENV=production) answered /api/health after ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  return { child, stderr: () => stderr };
}

async function stopServer(child: ChildProcess | undefined) {
  if (!child || child.exitCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  child.kill("SIGTERM");
  const timer = setTimeout(() => child.kill("SIGKILL"), 12_000);
  await exited;
  clearTimeout(timer);
}

// ---------------------------------------------------------------------------------------------------------------
// Set-up, in this process, before the child starts.

interface Agent {
  role: Role;
  cookie: string;
  vehicleId: number;
  version: number;
}

async function signInCookie(base: string, role: Role): Promise<string> {
  const email = DEMO_USERS.find((u) => u.role === role)!.email;
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: base },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${role}: ${res.status} ${await res.text()}`);
  const cookies = res.headers.getSetCookie().map((c) => c.split(";")[0]);
  if (!cookies.length) throw new Error(`sign-in as ${role} set no cookie`);
  return cookies.join("; ");
}

async function setUp(env: BenchEnv, ctx: AppContext, base: string): Promise<{ slug: string; agents: Agent[] }> {
  const t0 = performance.now();
  await seedDemo(ctx.database.db, { password: PASSWORD });
  const app = createApp(ctx);
  const served = await listen(app);
  try {
    const shim: TestApp = {
      app,
      ctx,
      agent: () => request.agent(served.url).set("Origin", served.url),
      async signIn(role) {
        const a = request.agent(served.url).set("Origin", served.url);
        const res = await a.post("/api/auth/sign-in").send({ email: DEMO_USERS.find((u) => u.role === role)!.email, password: PASSWORD });
        if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status}`);
        return a;
      },
      close: () => Promise.resolve(),
    };
    const { slug } = await publishReadyVehicle(shim);
    const agents: Agent[] = [];
    const salesCookie = await signInCookie(served.url, "sales");
    for (const role of ["sales", "workshop"] as const) {
      for (let i = 0; i < AGENTS_PER_ROLE; i++) {
        const res = await fetch(`${served.url}/api/vehicles`, {
          method: "POST",
          headers: { "Content-Type": "application/json", Origin: served.url, Cookie: salesCookie },
          body: JSON.stringify(dieselSuv({ variant: `2.2 diesel, load agent ${role} ${i + 1}` })),
        });
        if (res.status !== 201) throw new Error(`creating an agent's vehicle: ${res.status} ${await res.text()}`);
        const { vehicle } = (await res.json()) as { vehicle: { id: number; version: number } };
        agents.push({ role, cookie: await signInCookie(served.url, role), vehicleId: vehicle.id, version: vehicle.version });
      }
    }
    await ctx.photoWorker.settled();
    env.log(
      `demo dealership, one vehicle published (/vehicles/${slug}), ${agents.length} agents with their own vehicles and sessions, in ${((performance.now() - t0) / 1000).toFixed(1)} s; ` +
        `the child will answer on ${base}`,
    );
    return { slug, agents };
  } finally {
    await served.close();
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Staff agents.

interface AgentStats {
  saves: number[];
  uploads: number[];
  statuses: Map<number | string, number>;
  failures: string[];
}

function newStats(): AgentStats {
  return { saves: [], uploads: [], statuses: new Map(), failures: [] };
}

/** Each agent saves its own vehicle with the version its last save returned, until `until`. */
async function runAgents(base: string, agents: Agent[], until: number, photo: Buffer, stats: AgentStats, withPhotos: boolean) {
  const count = (k: number | string) => stats.statuses.set(k, (stats.statuses.get(k) ?? 0) + 1);
  await Promise.all(
    agents.map(async (agent, index) => {
      let n = 0;
      let photos = 0;
      const headers = { "Content-Type": "application/json", Origin: base, Cookie: agent.cookie };
      while (performance.now() < until) {
        n++;
        if (withPhotos && agent.role === "workshop" && n % PHOTO_EVERY === 0 && photos < PHOTOS_PER_AGENT) {
          photos++;
          const form = new FormData();
          form.append("photos", new Blob([new Uint8Array(photo)], { type: "image/jpeg" }), `agent-${index}-${photos}.jpg`);
          const t0 = performance.now();
          try {
            const res = await fetch(`${base}/api/vehicles/${agent.vehicleId}/photos`, { method: "POST", headers: { Origin: base, Cookie: agent.cookie }, body: form });
            await res.arrayBuffer();
            stats.uploads.push(performance.now() - t0);
            count(res.status);
            if (res.status < 200 || res.status > 299) stats.failures.push(`photo upload ${res.status}`);
          } catch (err) {
            count("error");
            stats.failures.push(`photo upload: ${(err as Error).message}`);
          }
        } else {
          // Sales reprice and reword; the workshop records keys and power (the groups each may edit).
          const body =
            agent.role === "sales"
              ? { version: agent.version, priceCents: 3_400_000 + (n % 50) * 1000, description: `One owner. Full service history. Save ${n}.` }
              : { version: agent.version, keysCount: 1 + (n % 2), powerKw: 140 + (n % 10) };
          const t0 = performance.now();
          try {
            const res = await fetch(`${base}/api/vehicles/${agent.vehicleId}`, { method: "PATCH", headers, body: JSON.stringify(body) });
            const json = (await res.json()) as { vehicle?: { version: number } };
            stats.saves.push(performance.now() - t0);
            count(res.status);
            if (res.status === 200 && json.vehicle) agent.version = json.vehicle.version;
            else stats.failures.push(`save ${res.status}: ${JSON.stringify(json).slice(0, 200)}`);
          } catch (err) {
            count("error");
            stats.failures.push(`save: ${(err as Error).message}`);
          }
        }
        await new Promise((r) => setTimeout(r, AGENT_PAUSE_MS));
      }
    }),
  );
}

const statusLine = (s: AgentStats) => [...s.statuses.entries()].map(([k, v]) => `${k}×${v}`).join(", ");

// ---------------------------------------------------------------------------------------------------------------

export async function run(env: BenchEnv): Promise<BenchResult[]> {
  const database = env.createDatabase();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-bench-load-uploads-"));
  const children = new Set<ChildProcess>();
  const servers: Server[] = [];
  let server: ChildProcess | undefined;
  const onExit = () => {
    for (const child of children) child.kill("SIGKILL");
    rmSync(uploadsDir, { recursive: true, force: true });
  };
  process.once("exit", onExit);
  try {
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    const ctx = await createContext({
      uploadsDir,
      env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: base, LOG_LEVEL: "silent" },
      logger: pino({ level: "silent" }),
      limits: generous,
    });
    let setup: { slug: string; agents: Agent[] };
    try {
      setup = await setUp(env, ctx, base);
    } finally {
      await ctx.photoWorker.stop();
      await ctx.mail.stop().catch(() => undefined);
      await ctx.database.close();
    }
    const { slug, agents } = setup;
    const photo = await sharp(await renderDemoPhoto({ bodyType: "suv", colour: "Slate grey", angle: "front_left", seed: 7 })).resize(640).jpeg({ quality: 80 }).toBuffer();

    const started = await startServer(env, port, database.url, uploadsDir, children);
    server = started.child;

    const targets = [
      { key: "page", label: "condition page HTML", url: `${base}/vehicles/${slug}` },
      { key: "api", label: "public vehicle API", url: `${base}/api/public/vehicles/${slug}` },
    ];
    env.log(`load average ${loadavg().map((l) => l.toFixed(2)).join(" ")} on ${cpus().length} cores (shared machine)`);
    env.log(`autocannon: ${CONNECTIONS} connections, warm-up ${WARMUP_SECONDS} s, then ${SECONDS} s ours and ${SECONDS} s plain, per target`);

    const results: BenchResult[] = [];
    const alone = new Map<string, CannonRun>();
    const pids = { server: server.pid, db: mariadbPid(database.url) };
    for (const t of targets) {
      const wire = await rawGet(t.url, { "Accept-Encoding": ACCEPT_ENCODING });
      if (wire.status !== 200) throw new Error(`GET ${t.url}: ${wire.status} ${wire.body.toString().slice(0, 300)}`);
      const plain = await plainServer(wire.status, wire.headers, wire.body);
      servers.push(plain.server);
      env.log(
        `${t.label}: ${wire.body.length} bytes on the wire (${wire.headers["content-type"]}, ${wire.headers["content-encoding"] ?? "identity"}` +
          `${wire.headers.etag ? `, ETag ${wire.headers.etag}` : ", no ETag"}); the plain server answers these bytes`,
      );
      await cannon(t.url, WARMUP_SECONDS, children);
      await cannon(plain.url, WARMUP_SECONDS, children);
      const o = await cpuDuring(pids, () => cannon(t.url, SECONDS, children));
      const ours = o.result;
      env.log(`  ours : ${describe(ours)}; ${o.line}`);
      const r = await cpuDuring(pids, () => cannon(plain.url, SECONDS, children));
      const ref = r.result;
      env.log(`  plain: ${describe(ref)}; ${r.line} (the plain server lives in the bench process)`);
      alone.set(t.key, ours);
      await closeServer(plain.server);
      const base1 = (x: number) => Math.max(1, x); // autocannon counts whole ms; a 0 reads as "under 1 ms"
      const lat = (label: string, k: "p50" | "p97_5" | "p99"): BenchResult => ({
        figure: `${t.label}, ${CONNECTIONS} conn, ${label}`,
        unit: "ms",
        value: ours.latency[k],
        baseline: base1(ref.latency[k]),
        baselineLabel: ref.latency[k] < 1 ? "plain node:http, <1 ms shown as 1" : "plain node:http",
        samples: ours.requests.total,
      });
      results.push(
        { figure: `${t.label}, ${CONNECTIONS} conn, requests/s`, unit: "req/s", value: ours.requests.average, baseline: ref.requests.average, baselineLabel: "plain node:http", higherIsBetter: true, samples: SECONDS },
        lat("p50", "p50"),
        lat("p97.5", "p97_5"),
        lat("p99", "p99"),
        {
          figure: `${t.label}, ${CONNECTIONS} conn, errors (incl. timeouts) + non-2xx`,
          unit: "",
          value: failures(ours),
          samples: ours.requests.total,
          failed: failures(ours) ? `${ours.errors} errors (${ours.timeouts} timeouts), ${ours.non2xx} non-2xx of ${ours.requests.total}` : undefined,
        },
      );
    }

    // Staff agents alone, then with the public reads.
    const aloneStats = newStats();
    await runAgents(base, agents, performance.now() + WRITERS_ALONE_SECONDS * 1000, photo, aloneStats, false);
    env.log(`agents alone, ${WRITERS_ALONE_SECONDS} s (saves only): ${aloneStats.saves.length} saves, p50 ${percentile(aloneStats.saves, 50).toFixed(1)} ms, p99 ${percentile(aloneStats.saves, 99).toFixed(1)} ms; ${statusLine(aloneStats)}`);

    const mixedStats = newStats();
    const apiUrl = targets[1].url;
    const m = await cpuDuring(pids, () =>
      Promise.all([
        cannon(apiUrl, SECONDS, children),
        // autocannon takes a moment to start its connections; the agents run for the whole of its window.
        runAgents(base, agents, performance.now() + SECONDS * 1000, photo, mixedStats, true),
      ]),
    );
    const [mixed] = m.result;
    env.log(`mixed, public API: ${describe(mixed)}; ${m.line}`);
    env.log(
      `mixed, agents: ${mixedStats.saves.length} saves, p50 ${percentile(mixedStats.saves, 50).toFixed(1)} ms, p99 ${percentile(mixedStats.saves, 99).toFixed(1)} ms; ` +
        `${mixedStats.uploads.length} photo uploads (640 px JPEG, ${(photo.length / 1000).toFixed(0)} kB), p50 ${percentile(mixedStats.uploads, 50).toFixed(0)} ms; ${statusLine(mixedStats)}`,
    );
    for (const f of [...new Set([...aloneStats.failures, ...mixedStats.failures])].slice(0, 10)) env.log(`  agent failure: ${f}`);
    const apiAlone = alone.get("api")!;
    const staffFailures = aloneStats.failures.length + mixedStats.failures.length;
    results.push(
      { figure: `mixed: public API p99 with ${agents.length} staff agents saving`, unit: "ms", value: mixed.latency.p99, baseline: Math.max(1, apiAlone.latency.p99), baselineLabel: "public API alone", samples: mixed.requests.total },
      { figure: `mixed: public API requests/s with staff saving`, unit: "req/s", value: mixed.requests.average, baseline: apiAlone.requests.average, baselineLabel: "public API alone", higherIsBetter: true, samples: SECONDS },
      {
        figure: "mixed: public API errors (incl. timeouts) + non-2xx",
        unit: "",
        value: failures(mixed),
        samples: mixed.requests.total,
        failed: failures(mixed) ? `${mixed.errors} errors (${mixed.timeouts} timeouts), ${mixed.non2xx} non-2xx of ${mixed.requests.total}` : undefined,
      },
      { figure: "mixed: staff save p50", unit: "ms", value: percentile(mixedStats.saves, 50), baseline: percentile(aloneStats.saves, 50), baselineLabel: "agents saving alone", samples: mixedStats.saves.length },
      { figure: "mixed: staff save p99", unit: "ms", value: percentile(mixedStats.saves, 99), baseline: percentile(aloneStats.saves, 99), baselineLabel: "agents saving alone", samples: mixedStats.saves.length },
      {
        figure: "mixed: staff saves and uploads not 2xx",
        unit: "",
        value: staffFailures,
        samples: aloneStats.saves.length + mixedStats.saves.length + mixedStats.uploads.length,
        failed: staffFailures ? `${staffFailures} failed (${statusLine(mixedStats)})` : undefined,
      },
    );
    if (server.exitCode !== null) throw new Error(`the server exited during the run: ${started.stderr()}`);
    return results;
  } finally {
    process.removeListener("exit", onExit);
    for (const s of servers) await closeServer(s);
    await stopServer(server);
    for (const child of children) child.kill("SIGKILL");
    rmSync(uploadsDir, { recursive: true, force: true });
    database.drop();
  }
}
