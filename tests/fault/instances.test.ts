import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdir } from "node:fs/promises";
import path from "node:path";
import { inArray } from "drizzle-orm";
import { photos } from "../../server/db/schema/index.ts";
import { defaultLimits } from "../../server/middleware/rate-limit.ts";
import { createServer } from "node:http";
import { Client, photoForm, releasePort, reservedPort, serverWorld, type ServerProcess, type ServerWorld } from "../support/server-process.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { landscapeJpeg } from "../support/images.ts";

/** Two real server processes on different ports, one database, one uploads folder: nothing a second instance needs lives in one process. */
let world: ServerWorld;
let a: ServerProcess;
let b: ServerProcess;
let slug: string;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

beforeAll(async () => {
  world = await serverWorld();
  ({ slug } = await publishReadyVehicle(world.app));
  [a, b] = await Promise.all([world.server(), world.server()]);
  await Promise.all([a.start(), b.start()]);
}, 240_000);

afterAll(async () => {
  await world?.close();
});

async function newVehicle() {
  const sales = await world.app.signIn("sales");
  const res = await sales.post("/api/vehicles").send(dieselSuv({ make: "Lumbrey", model: "Wend" }));
  if (res.status !== 201) throw new Error(`vehicle not created: ${res.status}`);
  return res.body.vehicle.id as number;
}

async function untilReady(client: Client, vehicleId: number, count: number) {
  const deadline = Date.now() + 120_000;
  for (;;) {
    const list = (await client.get(`/api/vehicles/${vehicleId}/photos`)).body.photos as Array<{ id: number; status: string; srcsetAvif: string; srcsetWebp: string; srcsetJpeg: string; version: number }>;
    if (list.length === count && list.every((p) => p.status !== "processing")) return list;
    if (Date.now() > deadline) throw new Error(`photos not processed: ${JSON.stringify(list.map((p) => p.status))}\nA:\n${a.log()}\nB:\n${b.log()}`);
    await sleep(300);
  }
}

const urlsOf = (srcset: string) => srcset.split(", ").filter(Boolean).map((s) => s.split(" ")[0]);

describe("a server process knows its own port", () => {
  it("when another process already answers /api/health on the port, then start() refuses instead of trusting that answer", async () => {
    const port = await reservedPort();
    const other = createServer((_req, res) => res.writeHead(200, { "content-type": "application/json" }).end('{"ok":true}'));
    await new Promise<void>((resolve) => other.listen(port, "127.0.0.1", resolve));
    try {
      const server = await world.server({ port });
      await expect(server.start(60_000)).rejects.toThrow(/exited before it answered .*another process answered on port/);
      expect(server.log()).toMatch(/EADDRINUSE/);
    } finally {
      await new Promise((resolve) => other.close(resolve));
      releasePort(port);
    }
  });
});

describe("two instances on one database and one uploads folder", () => {
  it("when a session is made on A, then the same cookie works on B; when it signs out on A, then B refuses it", async () => {
    const onA = await new Client(a.url).signIn("sales");
    const onB = onA.on(b.url);
    expect((await onB.get("/api/auth/session")).body.user.role).toBe("sales");
    expect((await onB.get("/api/vehicles")).status).toBe(200);
    expect((await onA.post("/api/auth/sign-out")).status).toBe(200);
    expect((await onB.get("/api/auth/session")).body.user).toBeNull();
    expect((await onB.get("/api/vehicles")).status).toBe(401);
  });

  it("when a photo is uploaded through A, then a worker processes it and B serves every size", async () => {
    const vehicleId = await newVehicle();
    const onA = await new Client(a.url).signIn("workshop");
    const onB = onA.on(b.url);
    const up = await onA.post(`/api/vehicles/${vehicleId}/photos`, photoForm([{ name: "front.jpg", data: await landscapeJpeg(1200, 800) }]));
    expect(up.status).toBe(201);
    const [photo] = await untilReady(onB, vehicleId, 1);
    expect(photo.status).toBe("ready");
    const types: Record<string, string> = { avif: "image/avif", webp: "image/webp", jpeg: "image/jpeg" };
    for (const [format, srcset] of [["avif", photo.srcsetAvif], ["webp", photo.srcsetWebp], ["jpeg", photo.srcsetJpeg]] as const) {
      const urls = urlsOf(srcset);
      // 1200 px wide: the 320, 640 and 1024 widths plus its own (PHOTO_WIDTHS in shared/constants/evidence.ts).
      expect(urls, format).toHaveLength(4);
      for (const url of urls) {
        const res = await fetch(`${b.url}${url}`);
        expect(res.status, url).toBe(200);
        expect(res.headers.get("content-type"), url).toBe(types[format]);
      }
    }
  });

  it("when photos are uploaded through both instances at once, then both workers drain the queue and no photo is processed twice", async () => {
    const vehicleId = await newVehicle();
    const onA = await new Client(a.url).signIn("workshop");
    const onB = onA.on(b.url);
    const sends = [];
    for (let i = 0; i < 10; i++) {
      const via = i % 2 === 0 ? onA : onB;
      sends.push(via.post(`/api/vehicles/${vehicleId}/photos`, photoForm([{ name: `p${i}.jpg`, data: await landscapeJpeg(700, 466) }])));
    }
    const answers = await Promise.all(sends);
    expect(answers.map((r) => r.status)).toEqual(Array(10).fill(201));
    const list = await untilReady(onA, vehicleId, 10);
    expect(list.every((p) => p.status === "ready")).toBe(true);
    const rows = await world.app.ctx.database.db.select().from(photos).where(inArray(photos.id, list.map((p) => p.id)));
    for (const row of rows) {
      // Uploaded at version 1; the one worker that made the variants moved it to 2. A second pass would make it 3.
      expect(row.version, `photo ${row.id}`).toBe(2);
      // 700 px wide: 320, 640 and its own 700, three formats each; no other file was written under its hash.
      expect(row.variants).toHaveLength(9);
      expect(new Set(row.variants.map((v) => v.key)).size).toBe(9);
      const dir = path.join(world.uploadsDir, "photos", row.hash.slice(0, 2));
      const files = (await readdir(dir)).filter((f) => f.startsWith(row.hash));
      expect(files.sort()).toEqual([...row.variants.map((v) => path.basename(v.key)), path.basename(row.masterKey)].sort());
    }
  });

  it("when a vehicle is published again through A, then B serves the new revision at once", async () => {
    const anyoneOnB = new Client(b.url);
    const before = (await anyoneOnB.get(`/api/public/vehicles/${slug}`)).body.vehicle.revision.number as number;
    const sales = await new Client(a.url).signIn("sales");
    const vehicleId = (await world.app.ctx.database.pool.query("select id from vehicles where public_slug = ?", [slug]).then(([r]) => (r as Array<{ id: number }>)[0].id));
    const res = await sales.post(`/api/vehicles/${vehicleId}/publish`, {});
    expect(res.status).toBe(201);
    expect(res.body.revision.number).toBe(before + 1);
    const after = (await anyoneOnB.get(`/api/public/vehicles/${slug}`)).body.vehicle;
    expect(after.revision.number).toBe(before + 1);
    expect(after.revisions.map((r: { number: number }) => r.number)).toEqual(Array.from({ length: before + 1 }, (_, i) => before + 1 - i));
    expect((await anyoneOnB.get(`/vehicles/${slug}`)).status).toBe(200);
  });

  it("when wrong passwords alternate between A and B, then the per-account limit counts them together and the next sign-in is refused on both", async () => {
    // The project's own setting (server/middleware/rate-limit.ts): 8 failed sign-ins per account in 15 minutes; common practice, no source.
    const limit = defaultLimits.signInPerAccount.points;
    const email = "marketing@demo.test";
    for (let i = 0; i < limit; i++) {
      const via = new Client(i % 2 === 0 ? a.url : b.url);
      const res = await via.post("/api/auth/sign-in", { email, password: `not-the-password-${i}` });
      expect(res.status, `attempt ${i + 1} on ${i % 2 === 0 ? "A" : "B"}`).toBe(401);
    }
    for (const url of [a.url, b.url]) {
      const res = await new Client(url).post("/api/auth/sign-in", { email, password: "forthright-test-password" });
      expect(res.status, url).toBe(429);
      expect(res.body.error.message).toMatch(/Too many failed sign-ins for this account/);
    }
  });

  it("when enquiries from one address alternate between A and B, then the per-address limit counts them together", async () => {
    // The project's own setting (server/middleware/rate-limit.ts): 5 enquiries per address in 10 minutes; common practice, no source.
    const limit = defaultLimits.enquiryPerAddress.points;
    const enquiry = (i: number) => ({
      name: "Jo Marlowe", email: `jo.marlowe+${i}@example.test`, phone: "", message: "Could I see it on Saturday morning?", preferredContact: "email",
      consent: true, website: "", startedAt: Date.now() - 20_000, revision: 1,
    });
    for (let i = 0; i < limit; i++) {
      const res = await new Client(i % 2 === 0 ? a.url : b.url).post(`/api/public/vehicles/${slug}/enquiries`, enquiry(i));
      expect(res.status, `enquiry ${i + 1}: ${res.text}`).toBe(201);
    }
    for (const url of [a.url, b.url]) expect((await new Client(url).post(`/api/public/vehicles/${slug}/enquiries`, enquiry(99))).status, url).toBe(429);
    const [rows] = await world.app.ctx.database.pool.query("select count(*) as n from leads");
    expect(Number((rows as Array<{ n: number }>)[0].n)).toBe(limit);
    console.log(`instances: A on ${a.url}, B on ${b.url}; session, sign-out, photo processing and serving, the named photo lock, the sign-in limit (${defaultLimits.signInPerAccount.points}) and the enquiry limit (${limit}) checked across both`);
  });
});
