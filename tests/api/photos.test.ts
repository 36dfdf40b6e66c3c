import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import http from "node:http";
import { readdirSync, renameSync, statSync, utimesSync } from "node:fs";
import path from "node:path";
import { ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { prepareReadyVehicle } from "../support/publishing.ts";
import { landscapeJpeg, pngDeclaring, SVG_WITH_SCRIPT } from "../support/images.ts";
import { removeOrphans } from "../../server/modules/photos/cleanup.ts";
import { removeIfOlder, returnIfNeeded } from "../../server/lib/storage.ts";
import { PHOTO_LIMITS } from "../../shared/constants/evidence.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ seed: true });
});
afterAll(() => t.close());

async function newVehicle() {
  const a = await t.signIn("sales");
  return (await a.post("/api/vehicles").send(dieselSuv())).body.vehicle as { id: number };
}

const filesUnder = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? filesUnder(path.join(dir, e.name)) : [path.join(dir, e.name)]));

async function countPhotos(vehicleId: number) {
  const [rows] = await t.ctx.database.pool.query("select count(*) as n from photos where vehicle_id = ?", [vehicleId]);
  return Number((rows as Array<{ n: number }>)[0].n);
}

describe("POST /api/vehicles/:id/photos", () => {
  it("when a photo with EXIF orientation 6 is uploaded, then every variant comes out upright, in AVIF, WebP and JPEG, with no metadata", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    // Stored landscape 1200×800 with Orientation=6 (rotate 90° clockwise to view): upright it is portrait 800×1200.
    const jpeg = await landscapeJpeg(1200, 800, { IFD0: { Copyright: "Test", Make: "TestCam" } }, 6);
    const res = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", jpeg, { filename: "side.jpg", contentType: "image/jpeg" });
    expect(res.status).toBe(201);
    const photo = res.body.photos[0];
    expect(photo).toMatchObject({ width: 800, height: 1200, status: "processing", isCover: true });
    expect(photo.placeholder).toMatch(/^data:image\/webp;base64,/);
    await t.ctx.photoWorker.settled();
    const list = await w.get(`/api/vehicles/${v.id}/photos`);
    const ready = list.body.photos[0];
    expect(ready.status).toBe("ready");
    for (const set of [ready.srcsetAvif, ready.srcsetWebp, ready.srcsetJpeg]) expect(set.split(", ").length).toBeGreaterThanOrEqual(3);
    const urls = [ready.src, ...[ready.srcsetAvif, ready.srcsetWebp, ready.srcsetJpeg].flatMap((s: string) => s.split(", ").map((x) => x.split(" ")[0]))];
    for (const url of urls) {
      const img = await request(t.app).get(url).buffer(true).parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => cb(null, Buffer.concat(chunks)));
      });
      expect(img.status).toBe(200);
      expect(img.headers["x-content-type-options"]).toBe("nosniff");
      expect(img.headers["content-type"]).toMatch(/^image\/(avif|webp|jpeg)$/);
      const meta = await sharp(img.body as Buffer).metadata();
      expect(meta.exif).toBeUndefined();
      expect(meta.orientation ?? 1).toBe(1);
      expect(meta.height).toBeGreaterThan(meta.width);
      // Upright: the red half (left when stored) is now on top.
      const { data } = await sharp(img.body as Buffer).resize(4, 4, { fit: "fill" }).raw().toBuffer({ resolveWithObject: true });
      expect(data[0]).toBeGreaterThan(data[2]);
      expect(data[data.length - 1]).toBeGreaterThan(data[data.length - 3]);
    }
  });

  it("when a JPEG carries GPS tags, then none of its variants does", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const jpeg = await landscapeJpeg(1000, 700, { IFD0: { Make: "TestCam" }, IFD3: { GPSLatitudeRef: "S", GPSLatitude: "27/1 28/1 0/1", GPSLongitudeRef: "E", GPSLongitude: "153/1 1/1 0/1" } });
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const res = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", jpeg, "gps.jpg");
    expect(res.status).toBe(201);
    await t.ctx.photoWorker.settled();
    const list = await w.get(`/api/vehicles/${v.id}/photos`);
    const keys = [list.body.photos[0].src, ...list.body.photos[0].srcsetJpeg.split(", ").map((s: string) => s.split(" ")[0])];
    for (const url of keys) {
      const file = path.join(t.ctx.uploadsDir, url.replace(/^\/media\//, ""));
      const bytes = (await import("node:fs")).readFileSync(file);
      expect(bytes.includes(Buffer.from("GPS"))).toBe(false);
      expect((await sharp(bytes).metadata()).exif).toBeUndefined();
    }
  });

  it("when several files are sent and one is bad, then the good ones are stored and the bad one is refused with its reason", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const good = await landscapeJpeg(900, 600);
    const res = await w
      .post(`/api/vehicles/${v.id}/photos`)
      .attach("photos", good, "one.jpg")
      .attach("photos", Buffer.from("this is not a photo"), { filename: "two.jpg", contentType: "image/jpeg" })
      .attach("photos", await landscapeJpeg(900, 600), "three.jpg");
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(2);
    expect(res.body.refused).toEqual([expect.objectContaining({ name: "two.jpg", status: 415 })]);
    expect(await countPhotos(v.id)).toBe(2);
  });

  const hostile: Array<[string, () => Promise<Buffer> | Buffer, number]> = [
    ["text named .jpg", () => Buffer.from("GIF89a? no, just text"), 415],
    ["a truncated JPEG", async () => (await landscapeJpeg(1200, 800)).subarray(0, 4000), 415],
    ["a small PNG declaring 20000×20000 pixels", () => pngDeclaring(20000, 20000), 415],
    ["an SVG with a script", () => SVG_WITH_SCRIPT, 415],
    ["zero bytes", () => Buffer.alloc(0), 415],
  ];
  it.each(hostile)("when the only file is %s, then it is refused with a reason and nothing is stored", async (_what, make, status) => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    await t.ctx.photoWorker.settled();
    const before = filesUnder(t.ctx.uploadsDir).length;
    const res = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", await make(), { filename: "x.jpg", contentType: "image/jpeg" });
    expect(res.status).toBe(status);
    expect(res.body.error.message.length).toBeGreaterThan(10);
    expect(await countPhotos(v.id)).toBe(0);
    expect(filesUnder(t.ctx.uploadsDir).length).toBe(before);
  });

  it("when a file is over the size limit, then 413", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const res = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", Buffer.alloc(26 * 1024 * 1024, 1), "huge.jpg");
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("too_large");
    expect(await countPhotos(v.id)).toBe(0);
  });

  it("when a real 64-megapixel PNG is sent, then it is refused with the megapixel limit, not as unreadable (issue 16)", async () => {
    // 8000×8000 of one colour: 64 MP, over PHOTO_LIMITS.maxInputPixels (50 MP), yet a few hundred kB as PNG.
    const png = await sharp({ create: { width: 8000, height: 8000, channels: 3, background: { r: 90, g: 120, b: 140 } } }).png({ compressionLevel: 9 }).toBuffer();
    expect(png.length).toBeLessThan(PHOTO_LIMITS.maxFileBytes);
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const res = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", png, { filename: "big.png", contentType: "image/png" });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toBe("The photo is 8000×8000 pixels; the most accepted is 50 megapixels.");
    expect(await countPhotos(v.id)).toBe(0);
  }, 30_000);

  it("when the field name is wrong or no file is sent, then 400", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const wrong = await w.post(`/api/vehicles/${v.id}/photos`).attach("image", await landscapeJpeg(), "a.jpg");
    expect(wrong.status).toBe(400);
    const none = await w.post(`/api/vehicles/${v.id}/photos`).field("caption", "x");
    expect(none.status).toBe(400);
  });

  it("when an upload is aborted halfway, then no row and no file is left", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    await t.ctx.photoWorker.settled();
    const cookie = (await w.get("/api/auth/session")).request.getHeader?.("cookie") as string | undefined;
    const server = http.createServer(t.app);
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as { port: number }).port;
    const before = filesUnder(t.ctx.uploadsDir).length;
    const boundary = "----forthrighttest";
    const body = await landscapeJpeg(1600, 1200);
    await new Promise<void>((resolve) => {
      const req = http.request({ port, method: "POST", path: `/api/vehicles/${v.id}/photos`, headers: { "Content-Type": `multipart/form-data; boundary=${boundary}`, "Content-Length": String(body.length + 500), Origin: ORIGIN, Cookie: cookie ?? "" } });
      req.on("error", () => resolve());
      req.write(`--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="a.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
      req.write(body.subarray(0, Math.floor(body.length / 2)));
      setTimeout(() => {
        req.destroy();
        setTimeout(resolve, 300);
      }, 100);
    });
    server.close();
    await t.ctx.photoWorker.settled();
    expect(await countPhotos(v.id)).toBe(0);
    expect(filesUnder(t.ctx.uploadsDir).length).toBe(before);
  });

  it.each(["marketing"] as const)("when %s uploads, then 403", async (role) => {
    const v = await newVehicle();
    const a = await t.signIn(role);
    expect((await a.post(`/api/vehicles/${v.id}/photos`).attach("photos", await landscapeJpeg(), "a.jpg")).status).toBe(403);
  });

  it("when signed out, then 401; for an unknown vehicle, then 404", async () => {
    expect((await request(t.app).post("/api/vehicles/1/photos").set("Origin", ORIGIN).attach("photos", Buffer.from("x"), "a.jpg")).status).toBe(401);
    const w = await t.signIn("workshop");
    expect((await w.post("/api/vehicles/999999/photos").attach("photos", await landscapeJpeg(), "a.jpg")).status).toBe(404);
  });
});

describe("arranging photos", () => {
  it("when photos are reordered, captioned, made cover and deleted, then each change sticks and is versioned", async () => {
    const v = await newVehicle();
    const w = await t.signIn("workshop");
    const up = await w.post(`/api/vehicles/${v.id}/photos`).attach("photos", await landscapeJpeg(900, 600), "a.jpg").attach("photos", await landscapeJpeg(800, 600), "b.jpg");
    const [a, b] = up.body.photos;
    const order = await w.put(`/api/vehicles/${v.id}/photos/order`).send({ order: [b.id, a.id] });
    expect(order.body.photos.map((p: { id: number }) => p.id)).toEqual([b.id, a.id]);
    const cap = await w.patch(`/api/vehicles/${v.id}/photos/${b.id}`).send({ version: b.version, caption: "Left side", zone: "left_side", isCover: true });
    expect(cap.status).toBe(200);
    expect(cap.body.photo).toMatchObject({ caption: "Left side", zone: "left_side", isCover: true });
    const stale = await w.patch(`/api/vehicles/${v.id}/photos/${b.id}`).send({ version: b.version, caption: "x" });
    expect(stale.status).toBe(409);
    const list = await w.get(`/api/vehicles/${v.id}/photos`);
    expect(list.body.photos.filter((p: { isCover: boolean }) => p.isCover)).toHaveLength(1);
    const del = await w.delete(`/api/vehicles/${v.id}/photos/${a.id}?version=${list.body.photos.find((p: { id: number }) => p.id === a.id).version}`);
    expect(del.status).toBe(204);
    expect(await countPhotos(v.id)).toBe(1);
    const badOrder = await w.put(`/api/vehicles/${v.id}/photos/order`).send({ order: [a.id, b.id] });
    expect(badOrder.status).toBe(409);
  });

  it("when the clean-up runs, then files of deleted photos go and files still referenced stay", async () => {
    await t.ctx.photoWorker.settled();
    const removed = await removeOrphans(t.ctx.database, t.ctx.storage, t.ctx.uploadsDir, { graceMs: 0 });
    expect(removed.length).toBeGreaterThan(0);
    const [rows] = await t.ctx.database.pool.query("select master_key as k from photos");
    for (const r of rows as Array<{ k: string }>) expect(statSync(path.join(t.ctx.uploadsDir, r.k)).isFile()).toBe(true);
  });

  it("when the same bytes are stored again while their old orphaned copy is being removed, then the fresh file stays", async () => {
    const key = `photos/ee/${"e".repeat(64)}.jpg`;
    const file = path.join(t.ctx.uploadsDir, key);
    await t.ctx.storage.put(key, Buffer.from("old copy"));
    const anHourAgo = new Date(Date.now() - 2 * 60 * 60 * 1000);
    utimesSync(file, anHourAgo, anHourAgo);
    const cutoff = Date.now() - 60 * 60 * 1000;
    // An upload writes the key afresh after the clean-up listed the old copy, then its row.
    await t.ctx.storage.put(key, Buffer.from("old copy"));
    expect(await removeIfOlder(t.ctx.uploadsDir, key, cutoff)).toBe(false);
    expect(statSync(file).isFile()).toBe(true);
    // Left alone, an old unreferenced copy is removed, and nothing is left beside it.
    utimesSync(file, anHourAgo, anHourAgo);
    expect(await removeIfOlder(t.ctx.uploadsDir, key, cutoff)).toBe(true);
    expect(readdirSync(path.dirname(file)).filter((n) => n.startsWith("e".repeat(64)))).toEqual([]);
  });

  it("when a clean-up died with a referenced file moved aside, then the next pass puts it back instead of deleting it", async () => {
    const key = `photos/ed/${"d".repeat(64)}.jpg`;
    const file = path.join(t.ctx.uploadsDir, key);
    await t.ctx.storage.put(key, Buffer.from("needed"));
    const aside = `${key}.0123456789ab.removing.partial`;
    renameSync(file, path.join(t.ctx.uploadsDir, aside));
    expect(await returnIfNeeded(t.ctx.uploadsDir, aside, new Set([key]))).toBe(true);
    expect(statSync(file).isFile()).toBe(true);
    // Not referenced (or the key already holds a file): left for the pass to remove as an unfinished write.
    renameSync(file, path.join(t.ctx.uploadsDir, aside));
    expect(await returnIfNeeded(t.ctx.uploadsDir, aside, new Set())).toBe(false);
  });
});

describe("media for portals (issue 16)", () => {
  const mediaUrls = (json: unknown) => [...new Set([...JSON.stringify(json).matchAll(/\/media\/[^"\s,]+/g)].map((m) => m[0]))];
  const corp = async (url: string) => {
    const res = await request(t.app).get(url);
    expect(res.status, url).toBe(200);
    return { policy: res.headers["cross-origin-resource-policy"], cache: res.headers["cache-control"] };
  };
  const PUBLISHED = { policy: "cross-origin", cache: "public, max-age=31536000, immutable" };
  const STAFF_ONLY = { policy: "same-origin", cache: "private, max-age=31536000, immutable" };

  it("when media is in a published revision, then it may be embedded anywhere (CORP cross-origin), the QR image too; staff-only media stays same-origin", async () => {
    const { vehicleId, sales, workshop } = await prepareReadyVehicle(t);
    const staffUrls = mediaUrls((await workshop.get(`/api/vehicles/${vehicleId}/photos`)).body);
    expect(staffUrls.length).toBeGreaterThan(3);
    // Not published yet: staff-only, and no shared cache may keep it.
    expect(await corp(staffUrls[0])).toEqual(STAFF_ONLY);

    const published = await sales.post(`/api/vehicles/${vehicleId}/publish`).send({});
    expect(published.status).toBe(201);
    const snapshot = (await request(t.app).get(`/api/public/vehicles/${published.body.slug}`)).body.vehicle.snapshot;
    const publicUrls = mediaUrls(snapshot);
    expect(publicUrls.some((u) => u.startsWith("/media/closeups/"))).toBe(true);
    for (const url of publicUrls) expect(await corp(url), url).toEqual(PUBLISHED);
    // The key seen before the publish is published now (nothing remembered it as staff-only), and stays so when asked again.
    expect(await corp(staffUrls[0])).toEqual(PUBLISHED);
    expect(await corp(staffUrls[0])).toEqual(PUBLISHED);

    const qr = await request(t.app).get(`/api/public/vehicles/${published.body.slug}/qr.svg`);
    expect(qr.status).toBe(200);
    expect(qr.headers["cross-origin-resource-policy"]).toBe("cross-origin");

    // A photo of a vehicle never published stays restricted.
    const other = await newVehicle();
    const up = await workshop.post(`/api/vehicles/${other.id}/photos`).attach("photos", await landscapeJpeg(900, 600), "other.jpg");
    expect(up.status).toBe(201);
    await t.ctx.photoWorker.settled();
    const otherUrls = mediaUrls((await workshop.get(`/api/vehicles/${other.id}/photos`)).body);
    for (const url of otherUrls) expect(await corp(url), url).toEqual(STAFF_ONLY);
    // Everything else keeps helmet's same-origin: the API and the pages.
    expect((await request(t.app).get(`/api/public/vehicles/${published.body.slug}`)).headers["cross-origin-resource-policy"]).toBe("same-origin");
  }, 120_000);
});
