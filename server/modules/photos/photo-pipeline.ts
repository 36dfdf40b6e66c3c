import sharp, { type Metadata, type OutputInfo } from "sharp";
import { createHash } from "node:crypto";
import { PHOTO_LIMITS, PHOTO_WIDTHS, type PhotoFormat } from "../../../shared/constants/evidence.ts";
import { AppError } from "../../lib/errors.ts";
import type { Storage } from "../../lib/storage.ts";
import type { PhotoVariant } from "../../db/schema/index.ts";

sharp.concurrency(2);

const ACCEPTED = new Set(["jpeg", "png", "webp", "avif", "heif", "tiff"]);
const MASTER_LONG_SIDE = 2400;

export interface Master {
  buffer: Buffer;
  hash: string;
  key: string;
  width: number;
  height: number;
  placeholder: string;
}

const shard = (hash: string) => hash.slice(0, 2);
export const photoKey = (hash: string, suffix: string, ext: "jpg" | "webp" | "avif") => `photos/${shard(hash)}/${hash}-${suffix}.${ext}`;
const EXT: Record<PhotoFormat, "jpg" | "webp" | "avif"> = { jpeg: "jpg", webp: "webp", avif: "avif" };

const refuse = (reason: string) => new AppError(415, "unsupported_file", reason);

/**
 * Decodes an upload with sharp (names and mimetypes are not trusted), applies the EXIF orientation, and makes the
 * upright, metadata-free master JPEG and a tiny placeholder. Throws 415 with the reason when the file is not a photo.
 */
/**
 * At most two photos are decoded at once per process: sharp runs on libuv's small thread pool, and more at once
 * only queues the file reads and media requests behind them (and raises peak memory, photos bench).
 */
let running = 0;
const waiting: Array<() => void> = [];
async function withSlot<T>(job: () => Promise<T>): Promise<T> {
  if (running >= 2) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  try {
    return await job();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

export const prepareMaster = (input: Buffer): Promise<Master> => withSlot(() => prepareMasterNow(input));

async function prepareMasterNow(input: Buffer): Promise<Master> {
  if (input.length === 0) throw refuse("The file is empty.");
  let meta: Metadata;
  try {
    // metadata() reads the header without decoding, so no pixel limit here: with one, a 64 MP photo threw before
    // the size check below could say why it is refused (issue 16). The decode further down keeps the limit.
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch {
    throw refuse("This file is not a photo Forthright can read. Use JPEG, PNG, WebP or AVIF.");
  }
  if (!meta.format || !ACCEPTED.has(meta.format)) {
    throw refuse(meta.format === "svg" ? "Drawings (SVG) are not accepted as photos." : `The ${meta.format ?? "unknown"} format is not accepted. Use JPEG, PNG, WebP or AVIF.`);
  }
  if (!meta.width || !meta.height) throw refuse("The photo's size could not be read.");
  if (meta.width * meta.height > PHOTO_LIMITS.maxInputPixels) {
    throw refuse(`The photo is ${meta.width}×${meta.height} pixels; the most accepted is ${PHOTO_LIMITS.maxInputPixels / 1e6} megapixels.`);
  }
  let buffer: Buffer;
  let info: OutputInfo;
  try {
    // failOn "truncated" refuses half-uploaded JPEGs instead of storing a grey band.
    ({ data: buffer, info } = await sharp(input, { limitInputPixels: PHOTO_LIMITS.maxInputPixels, failOn: "truncated" })
      .rotate()
      .resize({ width: MASTER_LONG_SIDE, height: MASTER_LONG_SIDE, fit: "inside", withoutEnlargement: true })
      // The master is an intermediate: the plain encoder is three times faster than mozjpeg here (photos bench).
      .jpeg({ quality: 88 })
      .toBuffer({ resolveWithObject: true }));
  } catch {
    throw refuse("The photo is damaged or incomplete (it may not have finished uploading).");
  }
  if (Math.min(info.width, info.height) < PHOTO_LIMITS.minShortSidePx) {
    throw refuse(`The photo is too small (${info.width}×${info.height}); the short side must be at least ${PHOTO_LIMITS.minShortSidePx} pixels.`);
  }
  const hash = createHash("sha256").update(buffer).digest("hex");
  const tiny = await sharp(buffer).resize({ width: 24 }).blur(1.2).webp({ quality: 40 }).toBuffer();
  return { buffer, hash, key: photoKey(hash, "master", "jpg"), width: info.width, height: info.height, placeholder: `data:image/webp;base64,${tiny.toString("base64")}` };
}

/** Every served width in AVIF, WebP and JPEG. Slow (AVIF), so it runs off the request path. */
export async function makeVariants(storage: Storage, hash: string, master: Buffer, masterWidth: number): Promise<PhotoVariant[]> {
  // The standard widths below the master's, plus the master's own width when it is under the largest.
  const largest = PHOTO_WIDTHS[PHOTO_WIDTHS.length - 1];
  const widths: number[] = PHOTO_WIDTHS.filter((w) => w < masterWidth);
  if (masterWidth < largest || !widths.includes(largest)) widths.push(Math.min(masterWidth, largest));
  const out: PhotoVariant[] = [];
  for (const width of widths) {
    // Decode and resize once per width, then encode the three formats from the same pixels.
    const { data: pixels, info: size } = await sharp(master).resize({ width, withoutEnlargement: true }).raw().toBuffer({ resolveWithObject: true });
    const from = () => sharp(pixels, { raw: { width: size.width, height: size.height, channels: size.channels } });
    for (const format of ["avif", "webp", "jpeg"] as const) {
      // Encoder efforts picked by measurement (tests/bench/photos.bench.ts): AVIF effort 1 and WebP effort 2 cost half
      // the time of the defaults for files about 5 % larger.
      const pipeline =
        format === "avif" ? from().avif({ quality: 50, effort: 1 }) : format === "webp" ? from().webp({ quality: 78, effort: 2 }) : from().jpeg({ quality: 80, mozjpeg: true });
      const { data, info } = await pipeline.toBuffer({ resolveWithObject: true });
      const key = photoKey(hash, String(width), EXT[format]);
      await storage.put(key, data);
      out.push({ width: info.width, height: info.height, format, key, bytes: data.length });
    }
  }
  return out;
}

/** A square close-up around a pin, cut from the master, for the public defect list. */
export async function makeCloseup(storage: Storage, master: Buffer, width: number, height: number, x: number, y: number): Promise<string> {
  const side = Math.max(64, Math.round(Math.min(width, height) * 0.3));
  const left = Math.min(Math.max(0, Math.round(x * width - side / 2)), width - side);
  const top = Math.min(Math.max(0, Math.round(y * height - side / 2)), height - side);
  const data = await sharp(master)
    .extract({ left, top, width: side, height: side })
    .resize({ width: 480, withoutEnlargement: true })
    .webp({ quality: 80 })
    .toBuffer();
  const hash = createHash("sha256").update(data).digest("hex");
  const key = `closeups/${shard(hash)}/${hash}.webp`;
  await storage.put(key, data);
  return key;
}
