/**
 * The photo pipeline on one 12-megapixel JPEG (4000×3000, EXIF orientation 6, drawn here with sharp so it
 * compresses like a phone photo, ~3.7 MB):
 *  - the upload route (POST /api/vehicles/:id/photos, multipart, until 201) against bare sharp running the very same
 *    prepareMaster() from photo-pipeline.ts;
 *  - upload + background variants (until ctx.photoWorker has settled) against bare prepareMaster() + makeVariants()
 *    writing to a throwaway local storage, so both sides do byte-identical image work (checked: same master hash,
 *    same number of variants);
 *  - peak RSS, sampled every 20 ms, while 4 uploads run concurrently to 4 vehicles and their variants are made.
 * Timed samples alternate app / bare, so both see the same noise on this shared machine.
 *
 * Memory is measured first, before any timed work: glibc keeps what libvips' threads freed, so RSS never comes back
 * down and whatever runs second in a process looks free. For the same reason the bare-sharp memory baseline
 * (4 concurrent prepareMaster) runs in a fresh child process started from this file, once just before and once just
 * after the app's burst (figures use the mean); compare the growth figures (peak − before) between the two, since the
 * app process starts from a larger footprint. The app's burst includes the worker starting on the first photo's
 * variants while the other uploads are still being decoded, as it does in production.
 */
import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import v8 from "node:v8";
import vm from "node:vm";
import sharp from "sharp";
import { pino } from "pino";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import { seedDemo } from "../../server/demo/demo.ts";
import { localStorage } from "../../server/lib/storage.ts";
import { makeVariants, prepareMaster } from "../../server/modules/photos/photo-pipeline.ts";
import { listen } from "../support/http-server.ts";
import { percentile } from "./stats.ts";
import { seededRandom } from "../support/random.ts";
import type { BenchEnv, BenchResult } from "./types.ts";

export const name = "photos";

const ORIGIN = "http://127.0.0.1:3000";
const PASSWORD = "bench-photos-password-4821";
const WIDTH = 4000;
const HEIGHT = 3000;
const SAMPLES = 5;
const CONCURRENT = 4;
const SAMPLE_EVERY_MS = 20;
const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

const MB = 1024 * 1024;
const mb = (bytes: number) => bytes / MB;
const ms = (t0: number) => performance.now() - t0;
const pause = (msToWait: number) => new Promise((resolve) => setTimeout(resolve, msToWait));

// ---------------------------------------------------------------------------------------------------------------
// A photo-like picture: a sky-to-ground gradient, large soft blotches, mid-scale texture, a few hard-edged panels
// (the "car") and fine sensor noise. Pure noise would compress far worse than a photo; flat colour far better.

async function smoothNoise(rng: () => number, cellsX: number, cellsY: number): Promise<Buffer> {
  const coarse = Buffer.alloc(cellsX * cellsY * 3);
  for (let i = 0; i < coarse.length; i++) coarse[i] = Math.floor(rng() * 256);
  return sharp(coarse, { raw: { width: cellsX, height: cellsY, channels: 3 } })
    .resize(WIDTH, HEIGHT, { fit: "fill", kernel: "cubic" })
    .raw()
    .toBuffer();
}

export async function photoLikeJpeg(seed = 20_240_611): Promise<Buffer> {
  const rng = seededRandom(seed);
  const big = await smoothNoise(rng, 40, 30);
  const mid = await smoothNoise(rng, 400, 300);
  const fine = await smoothNoise(rng, 1600, 1200);
  const panels = Array.from({ length: 14 }, () => {
    const x0 = Math.floor(rng() * WIDTH * 0.8);
    const y0 = Math.floor(HEIGHT * 0.35 + rng() * HEIGHT * 0.45);
    return { x0, y0, x1: x0 + 150 + Math.floor(rng() * 900), y1: y0 + 60 + Math.floor(rng() * 400), shade: [rng() * 120 - 60, rng() * 120 - 60, rng() * 120 - 60] };
  });
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  const horizon = HEIGHT * 0.4;
  for (let y = 0; y < HEIGHT; y++) {
    const sky = y < horizon;
    const t = sky ? y / horizon : (y - horizon) / (HEIGHT - horizon);
    const base = sky ? [120 + 70 * t, 160 + 50 * t, 225 - 10 * t] : [110 - 40 * t, 100 - 35 * t, 85 - 30 * t];
    const rowPanels = panels.filter((p) => y >= p.y0 && y < p.y1);
    for (let x = 0; x < WIDTH; x++) {
      const i = (y * WIDTH + x) * 3;
      let dr = 0, dg = 0, db = 0;
      for (const p of rowPanels) {
        if (x >= p.x0 && x < p.x1) {
          dr += p.shade[0];
          dg += p.shade[1];
          db += p.shade[2];
        }
      }
      // Mostly luminance structure, as in a photo, with a little chroma from the large blotches.
      const lum = (big[i] - 128) * 0.5 + (mid[i] - 128) * 0.3 + (fine[i] - 128) * 0.2 + (rng() - 0.5) * 8;
      for (let c = 0; c < 3; c++) {
        const delta = c === 0 ? dr : c === 1 ? dg : db;
        const tint = c === 1 ? 0 : (big[i + c] - 128) * 0.15 + (mid[i + c] - 128) * 0.06;
        const v = base[c] + lum + tint + delta;
        px[i + c] = v < 0 ? 0 : v > 255 ? 255 : v;
      }
    }
  }
  return sharp(px, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } })
    .jpeg({ quality: 92 })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

// ---------------------------------------------------------------------------------------------------------------
// Memory: process RSS sampled on a timer, with the kernel's own high-water mark (reset through clear_refs) as a
// cross-check of what the 20 ms samples may miss between them.

function resetHighWater(): boolean {
  try {
    writeFileSync("/proc/self/clear_refs", "5");
    return true;
  } catch {
    return false;
  }
}

function highWater(): number | undefined {
  try {
    const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync("/proc/self/status", "utf8"));
    return m ? Number(m[1]) * 1024 : undefined;
  } catch {
    return undefined;
  }
}

function rssSampler() {
  let peak = process.memoryUsage.rss();
  let samples = 0;
  const timer = setInterval(() => {
    const r = process.memoryUsage.rss();
    if (r > peak) peak = r;
    samples++;
  }, SAMPLE_EVERY_MS);
  return {
    /** The peak so far, sampling on. */
    peek: () => Math.max(peak, process.memoryUsage.rss()),
    stop: () => {
      clearInterval(timer);
      peak = Math.max(peak, process.memoryUsage.rss());
      return { peak, samples };
    },
  };
}

/** A full collection, so buffers already dropped (the drawing's 36 MB rasters) do not count as "before". */
let collect: (() => void) | undefined;
async function settleHeap() {
  try {
    if (!collect) {
      v8.setFlagsFromString("--expose-gc");
      collect = vm.runInNewContext("gc") as () => void;
    }
    collect();
    await pause(100);
    collect();
  } catch {
    // no gc available: the pause alone
  }
  await pause(400);
}

export interface BareMemory {
  before: number;
  peak: number;
  hwm?: number;
  samples: number;
  wallMs: number;
}

/** Run in a fresh child process (see below): 4 prepareMaster at once on the JPEG in `file`, RSS sampled. */
export async function bareMemoryChild(file: string): Promise<BareMemory> {
  const jpeg = readFileSync(file);
  const inputs = Array.from({ length: CONCURRENT }, () => Buffer.from(jpeg));
  await settleHeap();
  const before = process.memoryUsage.rss();
  const canHwm = resetHighWater();
  const sampler = rssSampler();
  const t = performance.now();
  await Promise.all(inputs.map((input) => prepareMaster(input)));
  const wallMs = ms(t);
  const { peak, samples } = sampler.stop();
  return { before, peak, samples, wallMs, hwm: canHwm ? highWater() : undefined };
}

function bareMemoryInFreshProcess(file: string): Promise<BareMemory> {
  const script = `import(${JSON.stringify(pathToFileURL(fileURLToPath(import.meta.url)).href)}).then((m) => m.bareMemoryChild(${JSON.stringify(file)})).then((r) => console.log("RESULT " + JSON.stringify(r)))`;
  return new Promise((resolve, reject) => {
    execFile(process.execPath, ["--import", "tsx", "--input-type=module", "-e", script], { cwd: ROOT, maxBuffer: 1024 * 1024 }, (err, stdout, stderr) => {
      if (err) return reject(new Error(`the bare-sharp child failed: ${err.message}\n${stderr}`));
      const line = stdout.split("\n").find((l) => l.startsWith("RESULT "));
      if (!line) return reject(new Error(`the bare-sharp child printed no result:\n${stdout}\n${stderr}`));
      resolve(JSON.parse(line.slice("RESULT ".length)) as BareMemory);
    });
  });
}

// ---------------------------------------------------------------------------------------------------------------

interface UploadedPhoto {
  id: number;
  status: string;
  width: number;
  height: number;
  src: string;
  srcsetAvif: string;
  srcsetWebp: string;
  srcsetJpeg: string;
}

export async function run(env: BenchEnv): Promise<BenchResult[]> {
  const t0 = performance.now();
  const jpeg = await photoLikeJpeg();
  const meta = await sharp(jpeg).metadata();
  env.log(`drew a ${meta.width}×${meta.height} JPEG (orientation ${meta.orientation}), ${mb(jpeg.length).toFixed(2)} MB, in ${(ms(t0) / 1000).toFixed(1)} s`);
  if (meta.width !== WIDTH || meta.height !== HEIGHT || meta.orientation !== 6) throw new Error("the generated JPEG is not 4000×3000 with orientation 6");
  // One immutable Blob for every upload, made before any memory is measured.
  const blob = new Blob([new Uint8Array(jpeg)], { type: "image/jpeg" });

  const database = env.createDatabase();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-bench-uploads-"));
  const bareDir = mkdtempSync(path.join(tmpdir(), "forthright-bench-bare-"));
  const jpegFile = path.join(bareDir, "input.jpg");
  writeFileSync(jpegFile, jpeg);
  const bareStorage = localStorage(bareDir);
  const ctx = await createContext({
    uploadsDir,
    env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" },
    logger: pino({ level: "silent" }),
  });
  let server: Awaited<ReturnType<typeof listen>> | undefined;
  try {
    await seedDemo(ctx.database.db, { password: PASSWORD });
    server = await listen(createApp(ctx));
    const base = server.url;

    const signIn = async (email: string) => {
      const res = await fetch(`${base}/api/auth/sign-in`, {
        method: "POST",
        headers: { Origin: ORIGIN, "Content-Type": "application/json" },
        body: JSON.stringify({ email, password: PASSWORD }),
      });
      if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
      return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
    };
    const sales = await signIn("sales@demo.test");
    const workshop = await signIn("workshop@demo.test");

    let made = 0;
    const newVehicle = async (): Promise<number> => {
      made++;
      const res = await fetch(`${base}/api/vehicles`, {
        method: "POST",
        headers: { Origin: ORIGIN, Cookie: sales, "Content-Type": "application/json" },
        body: JSON.stringify({
          make: "Ambrel",
          model: "Loam",
          variant: `Trek ${made}`,
          buildYear: 2019,
          bodyType: "suv",
          colour: "Slate grey",
          odometerKm: 84_210 + made,
          fuelType: "diesel",
          transmission: "automatic",
          priceCents: 3_499_000,
        }),
      });
      const body = (await res.json()) as { vehicle?: { id: number } };
      if (res.status !== 201 || !body.vehicle) throw new Error(`POST /api/vehicles: ${res.status} ${JSON.stringify(body)}`);
      return body.vehicle.id;
    };

    const upload = async (vehicleId: number): Promise<UploadedPhoto> => {
      const form = new FormData();
      form.append("photos", blob, "rear-quarter.jpg");
      const res = await fetch(`${base}/api/vehicles/${vehicleId}/photos`, { method: "POST", headers: { Origin: ORIGIN, Cookie: workshop }, body: form });
      const body = (await res.json()) as { photos?: UploadedPhoto[]; refused?: unknown[] };
      if (res.status !== 201 || body.photos?.length !== 1) throw new Error(`upload to vehicle ${vehicleId}: ${res.status} ${JSON.stringify(body)}`);
      return body.photos[0];
    };
    const listed = async (vehicleId: number): Promise<UploadedPhoto[]> => {
      const res = await fetch(`${base}/api/vehicles/${vehicleId}/photos`, { headers: { Cookie: workshop } });
      const body = (await res.json()) as { photos: UploadedPhoto[] };
      if (res.status !== 200) throw new Error(`GET photos of ${vehicleId}: ${res.status} ${JSON.stringify(body)}`);
      return body.photos;
    };
    const variantCount = (p: UploadedPhoto) => [p.srcsetAvif, p.srcsetWebp, p.srcsetJpeg].flatMap((s) => s.split(", ")).filter(Boolean).length;

    // ---- peak memory first, while the process is cold: 4 concurrent uploads to 4 vehicles, then their variants.
    const memVehicles: number[] = [];
    for (let k = 0; k < CONCURRENT; k++) memVehicles.push(await newVehicle());
    // The bare baseline runs in a fresh process just before and just after the app's burst; the figures use the mean.
    const bareRuns: BareMemory[] = [await bareMemoryInFreshProcess(jpegFile)];
    await settleHeap();
    const before = process.memoryUsage.rss();
    const canHwm = resetHighWater();
    const sampler = rssSampler();
    const tm = performance.now();
    const memPhotos = await Promise.all(memVehicles.map((id) => upload(id)));
    const uploadsWall = ms(tm);
    const uploadPeak = sampler.peek();
    const uploadHwm = canHwm ? highWater() : undefined;
    await ctx.photoWorker.settled();
    const variantsWall = ms(tm);
    const { peak, samples } = sampler.stop();
    const hwm = canHwm ? highWater() : undefined;
    for (const [k, id] of memVehicles.entries()) {
      const [p] = await listed(id);
      if (p?.status !== "ready" || p.id !== memPhotos[k].id) throw new Error(`vehicle ${id}'s photo is ${p?.status ?? "missing"} after the worker settled`);
    }
    env.log(
      `app, ${CONCURRENT} concurrent uploads: all 201 after ${uploadsWall.toFixed(0)} ms, variants done after ${variantsWall.toFixed(0)} ms; ` +
        `RSS ${mb(before).toFixed(0)} → peak ${mb(uploadPeak).toFixed(0)} MB by the last 201, ${mb(peak).toFixed(0)} MB with the variants` +
        ` (${samples} samples${hwm && uploadHwm ? `; kernel high-water ${mb(uploadHwm).toFixed(0)} / ${mb(hwm).toFixed(0)} MB` : ""})`,
    );
    bareRuns.push(await bareMemoryInFreshProcess(jpegFile));
    for (const [k, r] of bareRuns.entries()) {
      env.log(
        `bare sharp in a fresh process (${k === 0 ? "before" : "after"} the app's burst), ${CONCURRENT}× prepareMaster at once: ${r.wallMs.toFixed(0)} ms; ` +
          `RSS ${mb(r.before).toFixed(0)} → peak ${mb(r.peak).toFixed(0)} MB (${r.samples} samples${r.hwm ? `; kernel high-water ${mb(r.hwm).toFixed(0)} MB` : ""})`,
      );
    }
    const mean = (f: (r: BareMemory) => number) => bareRuns.reduce((sum, r) => sum + f(r), 0) / bareRuns.length;
    const bareMem = { wallMs: mean((r) => r.wallMs), peak: mean((r) => r.peak), growth: mean((r) => r.peak - r.before) };

    // ---- timings: app and bare sharp alternating.
    let expectedMasterKey = "";
    let expectedVariants = 0;
    const viaApp = async () => {
      const vehicleId = await newVehicle();
      await ctx.photoWorker.settled();
      const start = performance.now();
      const photo = await upload(vehicleId);
      const uploadMs = ms(start);
      await ctx.photoWorker.settled();
      const totalMs = ms(start);
      const [ready] = await listed(vehicleId);
      if (!ready || ready.status !== "ready") throw new Error(`photo ${photo.id} is ${ready?.status ?? "missing"} after the worker settled`);
      if (photo.src !== `/media/${expectedMasterKey}`) throw new Error(`the app stored master ${photo.src}, bare sharp made ${expectedMasterKey}`);
      if (variantCount(ready) !== expectedVariants) throw new Error(`the app made ${variantCount(ready)} variants, bare sharp ${expectedVariants}`);
      return { uploadMs, totalMs };
    };
    const viaSharp = async () => {
      const input = Buffer.from(jpeg); // a fresh buffer, as multer hands the route
      const start = performance.now();
      const master = await prepareMaster(input);
      const masterMs = ms(start);
      const variants = await makeVariants(bareStorage, master.hash, master.buffer, master.width);
      const totalMs = ms(start);
      expectedMasterKey = master.key;
      expectedVariants = variants.length;
      return { masterMs, totalMs, master, variants };
    };

    // Warm-up, one each (not counted); bare first so the app's output can be checked against it.
    const warm = await viaSharp();
    env.log(
      `master ${warm.master.width}×${warm.master.height} ${(warm.master.buffer.length / 1024).toFixed(0)} KB; ${warm.variants.length} variants ` +
        `(${[...new Set(warm.variants.map((v) => v.width))].join("/")} px × avif/webp/jpeg), ${(warm.variants.reduce((s, v) => s + v.bytes, 0) / 1024).toFixed(0)} KB in all`,
    );
    if (memPhotos[0].src !== `/media/${expectedMasterKey}`) throw new Error(`the app stored master ${memPhotos[0].src}, bare sharp made ${expectedMasterKey}`);
    await viaApp();
    env.log(`warm-up done; ${SAMPLES} samples each way, app and bare sharp alternating`);

    const app = { upload: [] as number[], total: [] as number[] };
    const bare = { master: [] as number[], total: [] as number[] };
    for (let i = 0; i < SAMPLES; i++) {
      let a, b;
      if (i % 2 === 0) {
        a = await viaApp();
        b = await viaSharp();
      } else {
        b = await viaSharp();
        a = await viaApp();
      }
      app.upload.push(a.uploadMs);
      app.total.push(a.totalMs);
      bare.master.push(b.masterMs);
      bare.total.push(b.totalMs);
      env.log(`  #${i + 1}: app upload ${a.uploadMs.toFixed(0)} ms, +variants ${a.totalMs.toFixed(0)} ms · bare prepareMaster ${b.masterMs.toFixed(0)} ms, +variants ${b.totalMs.toFixed(0)} ms`);
    }
    env.log(`RSS after the timed runs: ${mb(process.memoryUsage.rss()).toFixed(0)} MB`);

    return [
      { figure: "upload 12 MP JPEG → 201, p50", unit: "ms", value: percentile(app.upload, 50), baseline: percentile(bare.master, 50), baselineLabel: "bare prepareMaster", samples: SAMPLES },
      { figure: "upload + variants ready, p50", unit: "ms", value: percentile(app.total, 50), baseline: percentile(bare.total, 50), baselineLabel: "bare prepareMaster + makeVariants", samples: SAMPLES },
      { figure: `${CONCURRENT} concurrent uploads, last 201`, unit: "ms", value: uploadsWall, baseline: bareMem.wallMs, baselineLabel: `bare ${CONCURRENT}× prepareMaster at once, mean of 2`, samples: 1 },
      { figure: `peak RSS, ${CONCURRENT} concurrent uploads + variants`, unit: "MB", value: mb(peak), baseline: mb(before), baselineLabel: "RSS before", samples },
      { figure: `peak RSS, ${CONCURRENT} concurrent uploads (to last 201)`, unit: "MB", value: mb(uploadPeak), baseline: mb(bareMem.peak), baselineLabel: `bare ${CONCURRENT}× prepareMaster, fresh process, mean of 2`, samples },
      {
        figure: `RSS growth, ${CONCURRENT} concurrent uploads (to last 201)`,
        unit: "MB",
        value: mb(uploadPeak - before),
        baseline: mb(bareMem.growth),
        baselineLabel: `bare ${CONCURRENT}× prepareMaster, fresh process, mean of 2`,
        samples,
      },
    ];
  } finally {
    await server?.close();
    await ctx.photoWorker.stop();
    await ctx.database.close();
    rmSync(uploadsDir, { recursive: true, force: true });
    rmSync(bareDir, { recursive: true, force: true });
    database.drop();
  }
}
