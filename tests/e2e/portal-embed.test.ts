/**
 * Photos for portals (issue 16), as a browser enforces Cross-Origin-Resource-Policy: a portal's page on another
 * origin and site (127.0.0.2 against the app on 127.0.0.1) hot-links a published vehicle's photo sizes, a defect's
 * close-up and the QR image, which must load; a photo of a vehicle never published must stay blocked.
 */
import { createServer, type Server } from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { e2eWorld } from "../support/e2e.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { landscapeJpeg } from "../support/images.ts";

const world = e2eWorld();

let portal: { server: Server; url: string; html: string };
beforeAll(async () => {
  const server = createServer((_req, res) => res.writeHead(200, { "Content-Type": "text/html; charset=utf-8" }).end(portal.html));
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.2", resolve));
  portal = { server, url: `http://127.0.0.2:${(server.address() as { port: number }).port}/listing`, html: "" };
});
afterAll(() => new Promise<void>((resolve) => (portal.server.closeAllConnections(), portal.server.close(() => resolve()))));

const mediaPaths = (json: unknown) => [...new Set([...JSON.stringify(json).matchAll(/\/media\/[^"\s,]+/g)].map((m) => m[0]))];

describe("a portal embedding published media", () => {
  it("when a page on another site shows a published photo, a close-up and the QR image, then they load; a staff-only photo does not", async () => {
    const { slug } = await publishReadyVehicle(world.t);
    const snapshot = (await request(world.url).get(`/api/public/vehicles/${slug}`)).body.vehicle.snapshot;
    const published = mediaPaths(snapshot);
    const closeup = published.find((p) => p.startsWith("/media/closeups/"))!;
    const photos = published.filter((p) => p.startsWith("/media/photos/"));
    expect(closeup).toBeTruthy();
    const embeddable = [...photos.filter((p) => /\.(jpg|webp|avif)$/.test(p)).slice(0, 6), closeup, `/api/public/vehicles/${slug}/qr.svg`];

    const workshop = await world.t.signIn("workshop");
    const sales = await world.t.signIn("sales");
    const other = (await sales.post("/api/vehicles").send(dieselSuv())).body.vehicle as { id: number };
    expect((await workshop.post(`/api/vehicles/${other.id}/photos`).attach("photos", await landscapeJpeg(900, 600), "staff.jpg")).status).toBe(201);
    await world.t.ctx.photoWorker.settled();
    const staffOnly = mediaPaths((await workshop.get(`/api/vehicles/${other.id}/photos`)).body).slice(0, 3);
    expect(staffOnly.length).toBeGreaterThan(0);

    const img = (src: string, i: number) => `<img id="i${i}" src="${world.url}${src}" alt="">`;
    portal.html = `<!doctype html><title>Portal listing</title>${[...embeddable, ...staffOnly].map(img).join("")}`;
    const page = await world.browser.newPage();
    try {
      await page.goto(portal.url);
      // Every image has either loaded or failed before it is measured.
      await page.waitForFunction(() => [...document.images].every((i) => i.complete));
      const widths = await page.evaluate(() => [...document.images].map((i) => i.naturalWidth));
      const named = [...embeddable, ...staffOnly].map((src, i) => [src, widths[i]] as const);
      for (const [src, w] of named.slice(0, embeddable.length)) expect(w, `${src} should load on the portal`).toBeGreaterThan(0);
      for (const [src, w] of named.slice(embeddable.length)) expect(w, `${src} should stay blocked`).toBe(0);
      // The same photo on the app's own origin: staff-only media still shows there.
      await page.goto(`${world.url}${staffOnly[0]}`);
      expect(await page.evaluate(() => document.images[0]?.naturalWidth ?? 0)).toBeGreaterThan(0);
    } finally {
      await page.close();
    }
  }, 120_000);
});
