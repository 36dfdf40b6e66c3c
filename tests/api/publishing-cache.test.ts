import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { pino } from "pino";
import { gunzipSync, brotliDecompressSync } from "node:zlib";
import type { Express } from "express";
import { startTestApp, ORIGIN, type TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import type { AppContext } from "../../server/lib/context.ts";
import { publicCacheOf } from "../../server/modules/publishing/public.service.ts";

/**
 * The public API and condition page are served from a per-revision cache (server/modules/publishing/public-cache.ts).
 * A second app on the same database stands for a second server instance: what one instance changes, the other must
 * show at once, without any message between them.
 */
let t: TestApp;
let second: { app: Express; ctx: AppContext; uploadsDir: string };
beforeAll(async () => {
  t = await startTestApp();
  const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-test-uploads-"));
  const url = t.ctx.config.DATABASE_URL;
  const ctx = await createContext({ uploadsDir, env: { NODE_ENV: "test", DATABASE_URL: url, PUBLIC_URL: ORIGIN, LOG_LEVEL: "silent" }, logger: pino({ level: "silent" }) });
  second = { app: createApp(ctx), ctx, uploadsDir };
});
afterAll(async () => {
  await second.ctx.photoWorker.stop();
  await second.ctx.database.close();
  rmSync(second.uploadsDir, { recursive: true, force: true });
  await t.close();
});

const api = (app: Express, slug: string) => request(app).get(`/api/public/vehicles/${slug}`);
const page = (app: Express, slug: string) => request(app).get(`/vehicles/${slug}`);

describe("public cache and ETags", () => {
  it("when the public API is read twice, then the second answer comes from the cache with the same strong ETag, and If-None-Match gets 304 with no body", async () => {
    const { slug } = await publishReadyVehicle(t);
    const before = publicCacheOf(t.ctx).hits;
    const first = await api(t.app, slug);
    const again = await api(t.app, slug);
    expect(first.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(first.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/); // strong: no W/ prefix
    expect(again.headers.etag).toBe(first.headers.etag);
    expect(publicCacheOf(t.ctx).hits).toBeGreaterThan(before);
    const revalidated = await api(t.app, slug).set("If-None-Match", first.headers.etag);
    expect(revalidated.status).toBe(304);
    expect(revalidated.text ?? "").toBe("");
    expect(revalidated.headers.etag).toBe(first.headers.etag);
    const html = await page(t.app, slug);
    expect(html.status).toBe(200);
    expect(html.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(html.text).toContain('id="fr-page-data"');
    expect((await page(t.app, slug).set("If-None-Match", html.headers.etag)).status).toBe(304);
  });

  it("when a client accepts brotli or gzip, then each encoding has its own strong ETag and decodes to the same JSON", async () => {
    const { slug } = await publishReadyVehicle(t);
    const plain = await api(t.app, slug).set("Accept-Encoding", "identity");
    const raw = (res: request.Response) => res.body as Buffer;
    const br = await api(t.app, slug).set("Accept-Encoding", "br").buffer(true).parse((res, cb) => { const c: Buffer[] = []; res.on("data", (d: Buffer) => c.push(d)); res.on("end", () => cb(null, Buffer.concat(c))); });
    const gz = await api(t.app, slug).set("Accept-Encoding", "gzip").buffer(true).parse((res, cb) => { const c: Buffer[] = []; res.on("data", (d: Buffer) => c.push(d)); res.on("end", () => cb(null, Buffer.concat(c))); });
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(br.headers["content-encoding"]).toBe("br");
    expect(gz.headers["content-encoding"]).toBe("gzip");
    expect(new Set([plain.headers.etag, br.headers.etag, gz.headers.etag]).size).toBe(3);
    expect(br.headers.vary).toMatch(/Accept-Encoding/i);
    // supertest may or may not have decoded already; compare the JSON either way.
    const decode = (res: request.Response, f: (b: Buffer) => Buffer) => { const b = raw(res); try { return JSON.parse(f(b).toString()); } catch { return JSON.parse(b.toString()); } };
    expect(decode(br, brotliDecompressSync)).toEqual(plain.body);
    expect(decode(gz, gunzipSync)).toEqual(plain.body);
  });

  it("when the vehicle is withdrawn on one instance, then the other instance's cached API and page answer 410 at once", async () => {
    const { slug, vehicleId, sales } = await publishReadyVehicle(t);
    expect((await api(second.app, slug)).status).toBe(200);
    expect((await page(second.app, slug)).status).toBe(200); // both now cached on the second instance
    const v = (await sales.get(`/api/vehicles/${vehicleId}`)).body.vehicle;
    expect((await sales.post(`/api/vehicles/${vehicleId}/status`).send({ version: v.version, to: "withdrawn" })).status).toBe(200);
    expect((await api(second.app, slug)).status).toBe(410);
    expect((await page(second.app, slug)).status).toBe(410);
  });

  it("when the vehicle is marked sold, then the cached answer shows it sold at once, with a new ETag", async () => {
    const { slug, vehicleId, sales } = await publishReadyVehicle(t);
    const live = await api(second.app, slug);
    expect(live.body.vehicle.status).toBe("live");
    const v = (await sales.get(`/api/vehicles/${vehicleId}`)).body.vehicle;
    await sales.post(`/api/vehicles/${vehicleId}/status`).send({ version: v.version, to: "sold" });
    const sold = await api(second.app, slug);
    expect(sold.status).toBe(200);
    expect(sold.body.vehicle.status).toBe("sold");
    expect(sold.headers.etag).not.toBe(live.headers.etag);
    // A client holding the old ETag gets the new answer, not 304.
    expect((await api(second.app, slug).set("If-None-Match", live.headers.etag)).status).toBe(200);
    expect((await page(second.app, slug)).text).toContain("(sold)");
  });

  it("when a new revision is published, then the API and page carry it with new ETags, and the older revision still answers", async () => {
    const { slug, vehicleId, sales } = await publishReadyVehicle(t);
    const r1 = await api(second.app, slug);
    const p1 = await page(second.app, slug);
    const v = (await sales.get(`/api/vehicles/${vehicleId}`)).body.vehicle;
    expect((await sales.patch(`/api/vehicles/${vehicleId}`).send({ version: v.version, priceCents: 3_299_000 })).status).toBe(200);
    expect((await sales.post(`/api/vehicles/${vehicleId}/publish`).send({})).status).toBe(201);
    const r2 = await api(second.app, slug);
    expect(r2.body.vehicle.revision.number).toBe(2);
    expect(r2.body.vehicle.snapshot.priceCents).toBe(3_299_000);
    expect(r2.headers.etag).not.toBe(r1.headers.etag);
    const p2 = await page(second.app, slug);
    expect(p2.headers.etag).not.toBe(p1.headers.etag);
    expect(p2.text).toContain('"number":2');
    const old = await request(second.app).get(`/api/public/vehicles/${slug}/revisions/1`);
    expect(old.status).toBe(200);
    expect(old.body.vehicle.revision.number).toBe(1);
    expect(old.body.vehicle.revisions).toHaveLength(2);
  });
});
