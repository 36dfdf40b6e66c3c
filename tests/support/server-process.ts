import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { pino } from "pino";
import { createApp } from "../../server/app.ts";
import { createContext } from "../../server/lib/boot.ts";
import { seedDemo, DEMO_USERS } from "../../server/demo/demo.ts";
import type { Role } from "../../shared/constants/roles.ts";
import { agentsFor, DEMO_PASSWORD, ORIGIN, type TestApp } from "./app.ts";
import { createTestDatabase } from "./database.ts";
import { SESSION_COOKIE } from "../../server/modules/auth/lucia.ts";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/*
 * Ports for server processes. freePort() (an ephemeral port the OS picks, then closes) is not safe here: the child binds
 * it a moment later, and again at every crash-test restart, and meanwhile the OS may hand the same port to any other
 * socket — a supertest listener in another test file, for instance, which also answers /api/health with 200, so start()
 * would "succeed" against another process and another database. Two things together make that impossible:
 *  1. reservedPort() picks below the kernel's ephemeral range (/proc/sys/net/ipv4/ip_local_port_range, 32768 on this
 *     machine), in 20000–32000, so no listen(0) or outgoing connection is ever given it; and it claims the port with a
 *     lock file (created exclusively, holding our pid) so two test processes using this helper never pick the same one.
 *     The claim is held until the world closes (or releasePort()), so a server keeps its port across restarts.
 *  2. start() counts /api/health only once the listening socket on the port belongs to the child itself (its inode in
 *     /proc/net/tcp is among the child's file descriptors). Anything else on the port is ignored; the child then fails
 *     to bind and exits, and start() reports that with its output.
 */
const PORT_LOCKS = path.join(tmpdir(), "forthright-test-ports");
const claimed = new Set<number>();
process.once("exit", () => {
  for (const port of claimed) rmSync(path.join(PORT_LOCKS, String(port)), { force: true });
});

function ephemeralStart() {
  try {
    return Number(readFileSync("/proc/sys/net/ipv4/ip_local_port_range", "utf8").trim().split(/\s+/)[0]) || 32768;
  } catch {
    return 32768; // Linux's default start of the range
  }
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
};

function claim(port: number, retry = true): boolean {
  const file = path.join(PORT_LOCKS, String(port));
  try {
    writeFileSync(file, String(process.pid), { flag: "wx" });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "EEXIST") throw err;
    // Left by a test process that ended without releasing (vitest's workers are stopped without an "exit" event)?
    // Take it over. Two processes doing so at once for the same port is the one gap; start()'s check still catches it.
    let owner = 0;
    try {
      owner = Number(readFileSync(file, "utf8"));
    } catch {
      // removed meanwhile
    }
    if (!retry || (owner && alive(owner))) return false;
    rmSync(file, { force: true });
    return claim(port, false);
  }
  claimed.add(port);
  return true;
}

/** Gives back a port from reservedPort() (a world gives back its own when it closes). */
export function releasePort(port: number) {
  if (claimed.delete(port)) rmSync(path.join(PORT_LOCKS, String(port)), { force: true });
}

const canBind = (port: number) =>
  new Promise<boolean>((resolve) => {
    const probe = createServer();
    probe.unref();
    probe.once("error", () => resolve(false));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve(true)));
  });

/** A loopback port below the ephemeral range, free now and claimed for this process until release (see above). */
export async function reservedPort(): Promise<number> {
  mkdirSync(PORT_LOCKS, { recursive: true });
  const low = 20_000;
  const high = Math.min(32_000, ephemeralStart() - 1);
  for (let attempt = 0; attempt < 500; attempt++) {
    const port = low + Math.floor(Math.random() * (high - low + 1));
    if (!claim(port)) continue;
    if (await canBind(port)) return port;
    releasePort(port);
  }
  throw new Error(`no free port between ${low} and ${high}`);
}

/**
 * Whether process `pid` holds the listening TCP socket on `port`: the socket's inode from /proc/net/tcp(6), looked for
 * among /proc/<pid>/fd. Undefined where /proc cannot tell (not Linux); then start() trusts the answer as before.
 */
function listensOn(pid: number, port: number): boolean | undefined {
  const inodes = new Set<string>();
  let readable = false;
  for (const table of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    let text: string;
    try {
      text = readFileSync(table, "utf8");
    } catch {
      continue;
    }
    readable = true;
    for (const line of text.split("\n").slice(1)) {
      // sl local_address rem_address st tx:rx tr:when retrnsmt uid timeout inode
      const f = line.trim().split(/\s+/);
      if (f.length > 9 && f[3] === "0A" && parseInt(f[1].split(":")[1], 16) === port) inodes.add(f[9]);
    }
  }
  if (!readable) return undefined;
  if (!inodes.size) return false;
  let fds: string[];
  try {
    fds = readdirSync(`/proc/${pid}/fd`);
  } catch {
    return false;
  }
  for (const fd of fds) {
    try {
      const socket = /^socket:\[(\d+)\]$/.exec(readlinkSync(`/proc/${pid}/fd/${fd}`));
      if (socket && inodes.has(socket[1])) return true;
    } catch {
      // the descriptor closed meanwhile
    }
  }
  return false;
}

/**
 * The real server (`node --import tsx server/index.ts`) as a child process, so a test can SIGKILL it in the middle
 * of a write and start it again with the same settings. Its output is kept (the last 200 lines) for failure messages.
 */
export class ServerProcess {
  readonly url: string;
  private child: ChildProcess | null = null;
  private exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }> = Promise.resolve({ code: null, signal: null });
  private lines: string[] = [];
  /** How many times this server was started. */
  starts = 0;

  constructor(
    readonly port: number,
    private readonly env: NodeJS.ProcessEnv,
  ) {
    this.url = `http://127.0.0.1:${port}`;
  }

  get running() {
    return this.child !== null;
  }

  /** The server's own output, most recent last. */
  log(last = 40) {
    return this.lines.slice(-last).join("\n");
  }

  /**
   * Spawns the process; resolves once /api/health answers 200 on a socket the child itself listens on (see reservedPort),
   * rejects (with the output) if it exits first.
   */
  async start(timeoutMs = 90_000): Promise<void> {
    if (this.child) throw new Error("server already running");
    const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], { cwd: ROOT, env: this.env, stdio: ["ignore", "pipe", "pipe"] });
    this.child = child;
    this.starts++;
    // Never leave a server behind if the test process itself ends first.
    const reap = () => child.kill("SIGKILL");
    process.once("exit", reap);
    child.once("exit", () => process.off("exit", reap));
    const keep = (chunk: Buffer) => {
      for (const line of chunk.toString("utf8").split("\n")) if (line.trim()) this.lines.push(line);
      if (this.lines.length > 200) this.lines.splice(0, this.lines.length - 200);
    };
    child.stdout.on("data", keep);
    child.stderr.on("data", keep);
    this.exited = new Promise((resolve) =>
      child.once("exit", (code, signal) => {
        if (this.child === child) this.child = null;
        resolve({ code, signal });
      }),
    );
    const deadline = Date.now() + timeoutMs;
    let gone = false;
    let impostor = false;
    void this.exited.then(() => (gone = true));
    while (Date.now() < deadline) {
      const other = impostor ? ` (meanwhile another process answered on port ${this.port})` : "";
      if (gone) throw new Error(`the server exited before it answered /api/health${other}:\n${this.log()}`);
      try {
        const res = await fetch(`${this.url}/api/health`, { signal: AbortSignal.timeout(2000) });
        if (res.status === 200) {
          if (!gone && listensOn(child.pid!, this.port) !== false) return;
          impostor = true;
        }
      } catch {
        // not listening yet
      }
      await sleep(100);
    }
    throw new Error(`the server did not answer /api/health within ${timeoutMs} ms:\n${this.log()}`);
  }

  /** Sends the signal and waits for the process to end. */
  async kill(signal: NodeJS.Signals = "SIGKILL") {
    const child = this.child;
    if (!child) return { code: null, signal: null };
    child.kill(signal);
    return this.exited;
  }

  /** Resolves when the process ends by itself (a refused boot, for instance). */
  waitForExit() {
    return this.exited;
  }

  async restart(signal: NodeJS.Signals = "SIGKILL") {
    await this.kill(signal);
    await this.start();
  }
}

export interface ServerWorld {
  databaseUrl: string;
  uploadsDir: string;
  /**
   * The app in this process on the same database and uploads folder: for preparing data with the helpers made for
   * startTestApp (prepareReadyVehicle and friends), for reading rows and files, and for running the clean-up.
   */
  app: TestApp;
  /** A server process on its own port (a free one unless given), sharing the database and uploads folder. */
  server: (options?: { port?: number; env?: NodeJS.ProcessEnv }) => Promise<ServerProcess>;
  close: () => Promise<void>;
}

/**
 * One database (created on the run's MariaDB and seeded with the demo dealership and staff, password DEMO_PASSWORD)
 * and one uploads folder, with as many real server processes on them as a test asks for.
 */
export async function serverWorld(): Promise<ServerWorld> {
  const database = createTestDatabase();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-fault-uploads-"));
  const ctx = await createContext({
    uploadsDir,
    env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" },
    logger: pino({ level: "silent" }),
    // The in-process app is for preparing data; keep its limits out of the way (the servers use the defaults).
    limits: Object.fromEntries(
      ["signInPerAddress", "signInPerAccount", "enquiryPerAddress", "enquiryPerVehicle", "resetPerAddress", "resetPerAccount"].map((k) => [k, { points: 1000, durationSeconds: 900 }]),
    ) as never,
  });
  await seedDemo(ctx.database.db, { password: DEMO_PASSWORD });
  const app = createApp(ctx);
  const servers: ServerProcess[] = [];
  const ports: number[] = [];
  const t: TestApp = { app, ctx, ...agentsFor(app), close: () => Promise.resolve() };
  const port = async () => {
    const p = await reservedPort();
    ports.push(p);
    return p;
  };
  return {
    databaseUrl: database.url,
    uploadsDir,
    app: t,
    async server(options = {}) {
      // Claimed for the whole world, so the server keeps it across restarts (see reservedPort).
      const serverPort = options.port ?? (await port());
      const env: NodeJS.ProcessEnv = {
        ...process.env,
        NODE_ENV: "test",
        HOST: "127.0.0.1",
        PORT: String(serverPort),
        PUBLIC_URL: `http://127.0.0.1:${serverPort}`,
        DATABASE_URL: database.url,
        UPLOADS_DIR: uploadsDir,
        LOG_LEVEL: "warn",
        // Each process its own demo mail catcher, so instances never fight over a port.
        FAKE_SMTP_PORT: String(await port()),
        SMTP_HOST: "",
        // sharp's memory is glibc's arenas; keep the children small on a shared machine (see DEVELOPERS.md).
        MALLOC_ARENA_MAX: "2",
        ...options.env,
      };
      for (const k of Object.keys(env)) if (env[k] === "") delete env[k];
      const server = new ServerProcess(serverPort, env);
      servers.push(server);
      return server;
    },
    async close() {
      for (const s of servers) await s.kill("SIGKILL");
      for (const p of ports) releasePort(p);
      await ctx.photoWorker.stop();
      await ctx.mail.stop();
      await ctx.database.close();
      rmSync(uploadsDir, { recursive: true, force: true });
      database.drop();
    },
  };
}

/** The body as JSON (typed `any`, like supertest's `res.body`), or null when it is empty or not JSON (a crash page). */
function jsonOrNull(text: string) {
  try {
    return text ? JSON.parse(text) : null;
  } catch {
    return null;
  }
}

/** A minimal HTTP client for a server process: fetch with our Origin and the session cookie carried by hand. */
export class Client {
  cookie = "";
  constructor(public baseUrl: string) {}

  /** The same session against another instance. */
  on(baseUrl: string) {
    const c = new Client(baseUrl);
    c.cookie = this.cookie;
    return c;
  }

  async send(method: string, url: string, body?: unknown, init: { signal?: AbortSignal } = {}) {
    const headers: Record<string, string> = { Origin: this.baseUrl };
    if (this.cookie) headers.Cookie = this.cookie;
    let payload: BodyInit | undefined;
    if (body instanceof FormData) payload = body;
    else if (body !== undefined) {
      headers["Content-Type"] = "application/json";
      payload = JSON.stringify(body);
    }
    const res = await fetch(`${this.baseUrl}${url}`, { method, headers, body: payload, signal: init.signal, redirect: "manual" });
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(";")[0];
      const [name, value] = [pair.slice(0, pair.indexOf("=")), pair.slice(pair.indexOf("=") + 1)];
      if (name === SESSION_COOKIE) this.cookie = value ? pair : "";
    }
    const text = await res.text();
    return { status: res.status, body: jsonOrNull(text), text, headers: res.headers };
  }

  get = (url: string) => this.send("GET", url);
  post = (url: string, body?: unknown, init?: { signal?: AbortSignal }) => this.send("POST", url, body, init);

  async signIn(role: Role, password = DEMO_PASSWORD) {
    const email = DEMO_USERS.find((u) => u.role === role)!.email;
    const res = await this.post("/api/auth/sign-in", { email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${res.text}`);
    return this;
  }
}

/** multipart/form-data with the files in the field "photos", as the upload screen sends them. */
export function photoForm(files: Array<{ name: string; data: Buffer }>) {
  const form = new FormData();
  for (const f of files) form.append("photos", new Blob([new Uint8Array(f.data)], { type: "image/jpeg" }), f.name);
  return form;
}
