/**
 * Security checks generated from the route inventory (tests/support/routes.ts): who may call every route, CSRF on
 * every state-changing route, the session cookie, uploads and served media, and the security headers of each kind
 * of answer. The policy the matrix checks is tests/support/route-policy.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { pino } from "pino";
import { DEMO_PASSWORD, ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { routeInventory, samplePath, STATE_CHANGING, type RouteEntry } from "../support/routes.ts";
import { CALLERS, callersOf, ROUTE_POLICY, type Caller } from "../support/route-policy.ts";
import { changedTables, tableChecksums } from "../support/db-state.ts";
import { landscapeJpeg, SVG_WITH_SCRIPT } from "../support/images.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { dieselSuv } from "../support/vehicles.ts";
import { createTestDatabase } from "../support/database.ts";
import { createContext } from "../../server/lib/boot.ts";
import { createApp } from "../../server/app.ts";
import { seedDemo, DEMO_USERS } from "../../server/demo/demo.ts";
import { SESSION_COOKIE } from "../../server/modules/auth/lucia.ts";

type Agent = ReturnType<typeof request.agent>;

let t: TestApp;
let routes: RouteEntry[];
const agents = new Map<Caller, Agent>();

beforeAll(async () => {
  t = await startTestApp();
  routes = routeInventory(t.app);
  agents.set("public", t.agent());
  for (const c of CALLERS) if (c !== "public") agents.set(c, await t.signIn(c));
}, 120_000);
afterAll(() => t?.close());

/** Values for path parameters that pass validation but name nothing, so an admitted caller gets 400/404, never a change. */
const ABSENT: Record<string, string> = {
  id: "999999", photoId: "999998", defectId: "999997", number: "1", n: "1",
  slug: "no-such-vehicle", token: "no-such-token", file: "nosuchtoken.csv",
  key: `photos/ab/${"0".repeat(64)}.jpg`, splat: "stock",
};

const call = (agent: Agent | request.SuperTest<request.Test>, r: RouteEntry, values: Record<string, string> = ABSENT) =>
  (agent as unknown as Record<string, (url: string) => request.Test>)[r.method.toLowerCase()](samplePath(r.path, values));

const isApiNoRoute = (res: request.Response) => res.status === 404 && /^No API route/.test(String(res.body?.error?.message ?? ""));

describe("route inventory", () => {
  it("when the app is built, then the inventory lists the routes of every module with their schemas, /api and the public pages", () => {
    const keys = routes.map((r) => r.key);
    // A few anchors from different mounts, so a broken path join shows here first.
    for (const k of [
      "POST /api/auth/sign-in", "PATCH /api/vehicles/:id/photos/:photoId", "PUT /api/vehicles/:id/tyres", "POST /api/vehicles/:id/publish",
      "POST /api/public/vehicles/:slug/enquiries", "GET /api/leads/stats", "DELETE /api/feeds/:id", "GET /media/{*key}", "GET /vehicles/:slug",
      "GET /feeds/:file", "GET /sitemap.xml", "GET /robots.txt", "GET /{*splat}",
    ]) expect(keys).toContain(k);
    expect(routes.length).toBeGreaterThan(60);
    const photoPatch = routes.find((r) => r.key === "PATCH /api/vehicles/:id/photos/:photoId")!;
    expect(photoPatch.params).toEqual(["id", "photoId"]);
    expect(Object.keys(photoPatch.schemas).sort()).toEqual(["body", "params"]);
    expect(routes.find((r) => r.key === "POST /api/vehicles/:id/photos")!.multipart).toBe(true);
  });

  it("when a JSON body is taken by a state-changing API route, then a schema for it is known (from route() or the inline list)", () => {
    // Routes that take no body at all: sign-out, retrying the outbox, rotating a feed's token, deleting a feed; photo
    // uploads are multipart (multer, then sharp decides).
    const NO_BODY = new Set(["POST /api/auth/sign-out", "POST /api/mail/outbox/retry", "POST /api/feeds/:id/rotate", "DELETE /api/feeds/:id", "DELETE /api/vehicles/:id/photos/:photoId", "DELETE /api/vehicles/:id/defects/:defectId", "POST /api/vehicles/:id/photos"]);
    const missing = routes.filter((r) => STATE_CHANGING.has(r.method) && !r.schemas.body && !NO_BODY.has(r.key)).map((r) => r.key);
    expect(missing).toEqual([]);
  });
});

describe("route × role matrix", () => {
  it("when the inventory and the policy table are compared, then every route has a policy and every policy a route", () => {
    const keys = new Set(routes.map((r) => r.key));
    expect(routes.filter((r) => !ROUTE_POLICY[r.key]).map((r) => r.key), "routes without an entry in tests/support/route-policy.ts").toEqual([]);
    expect(Object.keys(ROUTE_POLICY).filter((k) => !keys.has(k)), "policy entries for routes the app no longer has").toEqual([]);
  });

  it("when the router is read, then each route's guard checks the action the policy table names", () => {
    // Routes outside /api (public pages, media, the feed files, the client) may have no guard at all: anyone.
    const wrong = routes
      .filter((r) => ROUTE_POLICY[r.key])
      .map((r) => ({ key: r.key, guard: r.allow ?? (r.path.startsWith("/api/") ? "no guard" : "anyone"), policy: ROUTE_POLICY[r.key] }))
      .filter((r) => r.guard !== r.policy)
      .map((r) => `${r.key}: the router checks ${r.guard}, the policy names ${r.policy}`);
    expect(wrong).toEqual([]);
    // Every /api route is guarded by route() itself, so none is open by accident.
    expect(routes.filter((r) => r.path.startsWith("/api/") && !r.allow).map((r) => r.key)).toEqual([]);
  });

  it("when every route is called by each role and by the public, then the admitted get past the guard, other staff get 403 and the public 401", async () => {
    const wrong: string[] = [];
    let requests = 0;
    for (const r of routes) {
      if (!ROUTE_POLICY[r.key]) continue;
      const allowed = callersOf(r.key);
      for (const caller of CALLERS) {
        // Signing out ends the agent's session, so that one call gets an agent of its own.
        const agent = r.key === "POST /api/auth/sign-out" && caller !== "public" ? await t.signIn(caller) : agents.get(caller)!;
        let req = call(agent, r);
        if (STATE_CHANGING.has(r.method)) req = req.send({});
        const res = await req;
        requests++;
        const got = res.status;
        const admitted = allowed.includes(caller);
        const expected = admitted ? "past the guard" : caller === "public" ? 401 : 403;
        const ok = got < 500 && !isApiNoRoute(res) && (admitted ? got !== 401 && got !== 403 : got === expected);
        if (!ok) wrong.push(`${r.key} as ${caller}: expected ${expected}, got ${got} ${JSON.stringify(res.body?.error ?? "")}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(requests).toBe(routes.length * CALLERS.length);
  }, 120_000);
});

describe("session cookie", () => {
  const parseCookie = (header: string) => {
    const [pair, ...attrs] = header.split(";").map((s) => s.trim());
    const [name, value] = pair.split("=");
    return { name, value, attrs: Object.fromEntries(attrs.map((a) => { const [k, v] = a.split("="); return [k.toLowerCase(), v ?? true]; })) };
  };
  const sessionCookie = (res: request.Response) => {
    const list = ([] as string[]).concat(res.headers["set-cookie"] ?? []);
    const found = list.find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    return found ? parseCookie(found) : undefined;
  };

  it("when staff sign in over http, then the cookie is HttpOnly, SameSite=Lax, Path=/, has no Domain and is not Secure", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "sales@demo.test", password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const c = sessionCookie(res)!;
    expect(c.value).toMatch(/^[a-z0-9]{20,}$/);
    expect(c.attrs.httponly).toBe(true);
    expect(String(c.attrs.samesite).toLowerCase()).toBe("lax");
    expect(c.attrs.path).toBe("/");
    // Without Domain the cookie is host-only: a sibling subdomain never receives it (RFC 6265 §5.3 step 6).
    expect(c.attrs.domain).toBeUndefined();
    // Over plain http a Secure cookie would never come back, so it must not be set here.
    expect(c.attrs.secure).toBeUndefined();
  });

  it("when PUBLIC_URL is https, then the session cookie is Secure and the answers carry HSTS", async () => {
    const publicUrl = "https://forthright.example";
    const database = createTestDatabase();
    const uploadsDir = mkdtempSync(path.join(tmpdir(), "forthright-test-uploads-"));
    const ctx = await createContext({ uploadsDir, env: { NODE_ENV: "test", DATABASE_URL: database.url, PUBLIC_URL: publicUrl, LOG_LEVEL: "silent" }, logger: pino({ level: "silent" }) });
    try {
      await seedDemo(ctx.database.db, { password: DEMO_PASSWORD });
      const res = await request(createApp(ctx))
        .post("/api/auth/sign-in")
        .set("Origin", publicUrl)
        .send({ email: DEMO_USERS[0].email, password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      const c = sessionCookie(res)!;
      expect(c.attrs.secure).toBe(true);
      expect(c.attrs.httponly).toBe(true);
      expect(c.attrs.domain).toBeUndefined();
      expect(res.headers["strict-transport-security"]).toMatch(/max-age=\d+/);
    } finally {
      await ctx.photoWorker.stop();
      await ctx.database.close();
      rmSync(uploadsDir, { recursive: true, force: true });
      database.drop();
    }
  }, 60_000);

  it("when staff sign out, then the cookie is cleared and the old session id no longer opens anything", async () => {
    const a = t.agent();
    const signIn = await a.post("/api/auth/sign-in").send({ email: "workshop@demo.test", password: DEMO_PASSWORD });
    const id = sessionCookie(signIn)!.value;
    const out = await a.post("/api/auth/sign-out");
    expect(out.status).toBe(200);
    const cleared = sessionCookie(out)!;
    expect(cleared.value).toBe("");
    expect(Number(cleared.attrs["max-age"] ?? 0) <= 0 || new Date(String(cleared.attrs.expires)).getTime() <= Date.now()).toBe(true);
    expect(cleared.attrs.path).toBe("/");
    // Replaying the old cookie by hand, as someone who copied it would.
    const replay = await request(t.app).get("/api/vehicles").set("Cookie", `${SESSION_COOKIE}=${id}`);
    expect(replay.status).toBe(401);
    expect((await request(t.app).get("/api/auth/session").set("Cookie", `${SESSION_COOKIE}=${id}`)).body.user).toBeNull();
  });
});

describe("CSRF", () => {
  it("when any state-changing route is called without Origin, with a foreign or null Origin, or with Sec-Fetch-Site: cross-site, then 403 cross_origin and nothing changes", async () => {
    // A signed-in admin's cookie, sent without our Origin: what a form or fetch on another site would send.
    const bare = request.agent(t.app);
    const signIn = await bare.post("/api/auth/sign-in").set("Origin", ORIGIN).send({ email: "admin@demo.test", password: DEMO_PASSWORD });
    expect(signIn.status).toBe(200);
    const vehicles = (await bare.get("/api/vehicles")).body;
    const vehicleId = String(vehicles.vehicles[0].id);
    const users = (await bare.get("/api/users")).body.users as Array<{ id: string }>;
    const real: Record<string, string> = { ...ABSENT, id: vehicleId, slug: "no-such-vehicle" };
    // Bodies that would succeed were the request let through, so a missing check would show as a change.
    const VALID: Record<string, unknown> = {
      "POST /api/vehicles": dieselSuv(),
      "POST /api/users/invite": { email: "new.person@fernhollow.demo.test", name: "New Person", role: "sales" },
      "POST /api/feeds": { name: "Portal", format: "csv", columns: [{ key: "make", header: "Make" }] },
      "PUT /api/vehicles/:id/walkaround/zones": { zone: "front", nothingFound: true },
      "POST /api/auth/sign-in": { email: "admin@demo.test", password: DEMO_PASSWORD },
    };
    const before = await tableChecksums(t.ctx.database.db);
    const wrong: string[] = [];
    let requests = 0;
    const variants: Array<[string, Record<string, string>]> = [
      ["no Origin", {}],
      ["a foreign Origin", { Origin: "https://attacker.example" }],
      ["a look-alike Origin", { Origin: `${ORIGIN}.attacker.example` }],
      ["Origin null", { Origin: "null" }],
      ["Sec-Fetch-Site: cross-site", { "Sec-Fetch-Site": "cross-site" }],
      ["Sec-Fetch-Site: same-site", { "Sec-Fetch-Site": "same-site" }],
    ];
    const mutating = routes.filter((r) => STATE_CHANGING.has(r.method));
    expect(mutating.length).toBeGreaterThan(25);
    for (const r of mutating) {
      const values = r.key.startsWith("PATCH /api/users/") ? { ...real, id: users[1].id } : real;
      for (const [what, headers] of variants) {
        let req = call(bare, r, values);
        for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
        const res = await req.send(VALID[r.key] ?? {});
        requests++;
        if (res.status !== 403 || res.body?.error?.code !== "cross_origin") wrong.push(`${r.key} with ${what}: ${res.status} ${JSON.stringify(res.body?.error ?? "")}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(changedTables(before, await tableChecksums(t.ctx.database.db))).toEqual([]);
    expect(requests).toBe(mutating.length * variants.length);

    // The same agent is let through with our Origin, or with Sec-Fetch-Site: same-origin when a browser sends no Origin.
    expect((await bare.post("/api/vehicles").set("Origin", ORIGIN).send(dieselSuv())).status).toBe(201);
    expect((await bare.post("/api/vehicles").set("Sec-Fetch-Site", "same-origin").send(dieselSuv())).status).toBe(201);
  }, 120_000);
});

describe("uploads and served media", () => {
  const storedKeys = async () => {
    const keys: string[] = [];
    for await (const f of t.ctx.storage.list()) keys.push(f.key);
    return keys;
  };
  let vehicleId: number;

  beforeAll(async () => {
    const sales = agents.get("sales")!;
    vehicleId = (await sales.post("/api/vehicles").send(dieselSuv())).body.vehicle.id;
  });

  it.each([
    ["HTML named .jpg", Buffer.from("<!doctype html><html><body><script>alert(document.cookie)</script></body></html>"), "photo.jpg", "image/jpeg"],
    ["JavaScript named .jpg", Buffer.from("fetch('/api/users').then(r=>r.text()).then(alert)"), "photo.jpg", "image/jpeg"],
    ["SVG with a script named .jpg", SVG_WITH_SCRIPT, "photo.jpg", "image/jpeg"],
    ["SVG with a script named .svg", SVG_WITH_SCRIPT, "photo.svg", "image/svg+xml"],
    ["HTML behind JPEG magic bytes", Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from("<html><script>alert(1)</script></html>")]), "photo.jpg", "image/jpeg"],
    ["HTML named .html", Buffer.from("<html><script>alert(1)</script></html>"), "page.html", "text/html"],
  ])("when %s is uploaded as a photo, then it is refused with 415 and nothing is stored", async (_what, bytes, filename, contentType) => {
    const w = agents.get("workshop")!;
    const before = (await w.get(`/api/vehicles/${vehicleId}/photos`)).body.photos.length;
    const filesBefore = await storedKeys();
    const res = await w.post(`/api/vehicles/${vehicleId}/photos`).attach("photos", bytes, { filename, contentType });
    expect(res.status).toBe(415);
    expect((await w.get(`/api/vehicles/${vehicleId}/photos`)).body.photos.length).toBe(before);
    expect(await storedKeys()).toEqual(filesBefore);
  });

  it("when a real photo is stored, then every stored file is served as an image type with nosniff and a sandboxing CSP", async () => {
    const w = agents.get("workshop")!;
    const up = await w.post(`/api/vehicles/${vehicleId}/photos`).attach("photos", await landscapeJpeg(900, 600), "real.jpg");
    expect(up.status).toBe(201);
    await t.ctx.photoWorker.settled();
    const keys = await storedKeys();
    expect(keys.length).toBeGreaterThan(1);
    const listed = JSON.stringify((await w.get(`/api/vehicles/${vehicleId}/photos`)).body);
    const urls = [...new Set([...listed.matchAll(/\/media\/[^"\s,]+/g)].map((m) => m[0]))];
    expect(urls.length).toBeGreaterThan(1);
    for (const url of [...urls, ...keys.map((k) => `/media/${k}`)]) {
      const res = await request(t.app).get(url);
      expect(res.status, url).toBe(200);
      expect(res.headers["content-type"], url).toMatch(/^image\/(jpeg|webp|avif)$/);
      expect(res.headers["x-content-type-options"]).toBe("nosniff");
      expect(res.headers["content-security-policy"]).toMatch(/sandbox/);
    }
  }, 60_000);

  it("when a media key falls outside the pattern (traversal, .html, .svg, a suffix), then 404 and never a file", async () => {
    const w = agents.get("workshop")!;
    const listed = JSON.stringify((await w.get(`/api/vehicles/${vehicleId}/photos`)).body);
    const real = [...listed.matchAll(/\/media\/(photos\/[a-f0-9]{2}\/[a-f0-9]{64})(-[a-z0-9]+)?\.(jpg|webp|avif)/g)][0];
    const stem = real[1];
    const bad = [
      "/media/../package.json", "/media/%2e%2e/%2e%2e/etc/passwd", "/media/..%2f..%2fpackage.json", "/media/photos/../../package.json",
      `/media/${stem}.html`, `/media/${stem}.svg`, `/media/${stem}.jpg.html`, `/media/${stem}.jpg%00.html`, `/media/${stem}.jpg.partial`,
      `/media/${stem.toUpperCase()}.jpg`, `/media/${stem}.JPG`, `/media/${stem}.jpg/`, `/media//etc/passwd`, "/media/", "/media/photos",
    ];
    for (const url of bad) {
      const res = await request(t.app).get(url);
      expect(res.status, url).toBe(404);
      expect(String(res.headers["content-type"] ?? ""), url).not.toMatch(/html|svg|javascript/);
    }
  });
});

describe("security headers", () => {
  let slug: string;
  let feedPath: string;

  beforeAll(async () => {
    ({ slug } = await publishReadyVehicle(t));
    const feed = await agents.get("marketing")!.post("/api/feeds").send({ name: "Headers", format: "csv", columns: [{ key: "make", header: "Make" }] });
    expect(feed.status, JSON.stringify(feed.body)).toBe(201);
    feedPath = new URL(feed.body.url).pathname;
  }, 180_000);

  const csp = (res: request.Response) => {
    const header = String(res.headers["content-security-policy"] ?? "");
    return Object.fromEntries(
      header.split(";").map((d) => d.trim()).filter(Boolean).map((d) => { const [name, ...values] = d.split(/\s+/); return [name.toLowerCase(), values]; }),
    ) as Record<string, string[]>;
  };

  const expectHardened = (res: request.Response, what: string) => {
    const policy = csp(res);
    expect(Object.keys(policy).length, `${what}: a CSP`).toBeGreaterThan(0);
    const scripts = policy["script-src"] ?? policy["default-src"];
    expect(scripts, `${what}: script-src or default-src`).toBeDefined();
    expect(scripts, what).not.toContain("'unsafe-inline'");
    expect(scripts, what).not.toContain("'unsafe-eval'");
    expect(policy["script-src-attr"] ?? ["'none'"], what).not.toContain("'unsafe-inline'");
    // Styles too: the one inline <style> the app had (the print footer) is a constructed stylesheet now.
    expect(policy["style-src"] ?? policy["default-src"] ?? [], what).not.toContain("'unsafe-inline'");
    expect(policy["frame-ancestors"], what).toEqual(["'none'"]);
    expect(policy["object-src"], what).toEqual(["'none'"]);
    expect(res.headers["x-content-type-options"], what).toBe("nosniff");
    // strict-origin-when-cross-origin or stricter: never the full URL to another site (W3C Referrer Policy §3).
    expect(["no-referrer", "same-origin", "strict-origin", "strict-origin-when-cross-origin"], what).toContain(res.headers["referrer-policy"]);
  };

  it("when the staff app, a condition page, API answers, a feed, media and robots are fetched, then each has a CSP without unsafe script sources, frame-ancestors 'none', nosniff and a referrer policy", async () => {
    const admin = agents.get("admin")!;
    const answers: Array<[string, request.Response]> = [
      ["the staff SPA", await admin.get("/app/vehicles")],
      ["the sign-in page", await request(t.app).get("/sign-in")],
      ["the storefront", await request(t.app).get("/")],
      ["a condition page", await request(t.app).get(`/vehicles/${slug}`)],
      ["a window card", await request(t.app).get(`/vehicles/${slug}/card`)],
      ["an unknown condition page", await request(t.app).get("/vehicles/no-such-vehicle")],
      ["an API answer", await admin.get("/api/vehicles")],
      ["a public API answer", await request(t.app).get("/api/public/vehicles")],
      ["an API error", await request(t.app).get("/api/vehicles")],
      ["an unknown API route", await request(t.app).get("/api/nothing-here")],
      ["a feed", await request(t.app).get(feedPath)],
      ["the sitemap", await request(t.app).get("/sitemap.xml")],
      ["robots.txt", await request(t.app).get("/robots.txt")],
      ["a QR code (SVG)", await request(t.app).get(`/api/public/vehicles/${slug}/qr.svg`)],
    ];
    for (const [what, res] of answers) {
      expect(res.status, what).toBeLessThan(500);
      expectHardened(res, what);
    }
    expect(answers.find(([w]) => w === "a condition page")![1].status).toBe(200);
    expect(answers.find(([w]) => w === "a feed")![1].status).toBe(200);
  }, 60_000);

  it("when a public condition page is fetched, then its HTML has no inline executable script, no event-handler attributes and no javascript: URLs", async () => {
    for (const url of [`/vehicles/${slug}`, `/vehicles/${slug}/card`, "/", "/vehicles/no-such-vehicle"]) {
      const res = await request(t.app).get(url);
      expect(res.headers["content-type"], url).toMatch(/^text\/html/);
      const html = res.text;
      const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script\s*>/gi)];
      expect(scripts.length, url).toBeGreaterThan(0);
      for (const [, attrs, body] of scripts) {
        const type = /\btype\s*=\s*["']?([^"'\s>]+)/i.exec(attrs)?.[1]?.toLowerCase();
        const external = /\bsrc\s*=/i.test(attrs);
        // A data block (a non-JavaScript MIME type) is never run (HTML Living Standard §4.12.1.1).
        const dataBlock = type === "application/json" || type === "application/ld+json";
        expect(external || dataBlock, `${url}: inline script ${attrs} ${body.slice(0, 80)}`).toBe(true);
        if (external) expect(body.trim(), `${url}: an external script with inline code`).toBe("");
        if (dataBlock) expect(body, `${url}: a data block that could close its own tag`).not.toMatch(/<\/script|<!--/i);
      }
      expect(html, url).not.toMatch(/\son[a-z]+\s*=/i);
      expect(html, url).not.toMatch(/javascript:/i);
    }
    // The page data and JSON-LD of the published vehicle are there, as data.
    const page = (await request(t.app).get(`/vehicles/${slug}`)).text;
    expect(page).toMatch(/<script type="application\/json" id="fr-page-data">/);
    expect(page).toMatch(/<script type="application\/ld\+json">/);
  });
});
