import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { readFileSync } from "node:fs";
import { startTestApp, type TestApp } from "../support/app.ts";
import { publishReadyVehicle } from "../support/publishing.ts";
import { renderIndex } from "../../server/modules/client/client.routes.ts";

// Issue 16: unknown page paths answered 200 with the app shell (a soft 404 to search engines), and numeric ids were
// coerced ("0x0b", " 11" and "1e3" named vehicle 11 or 1000). Needs the client build (npx vite build).

let t: TestApp;
let slug: string;
let vehicleId: number;
beforeAll(async () => {
  if (!renderIndex()) throw new Error("Build the client first: npx vite build --logLevel warn");
  t = await startTestApp();
  ({ slug, vehicleId } = await publishReadyVehicle(t));
});
afterAll(() => t?.close());

const isShell = (res: request.Response) => {
  expect(res.headers["content-type"]).toMatch(/text\/html/);
  expect(res.text).toContain('<div id="root">');
};

describe("unknown page paths", () => {
  it.each(["/no-such-page", "/vehicles/NOT_A_SLUG", "/.env", "/app/no-such-screen", "/sign-in/extra", "/vehicles/a-slug/nothing"])(
    "when %s is asked for, then 404 with the not-found page (the app shell, noindex)",
    async (path) => {
      const res = await request(t.app).get(path);
      expect(res.status).toBe(404);
      isShell(res);
      expect(res.text).toContain('<meta name="robots" content="noindex" />');
      expect(res.text).toContain("<title>Not found</title>");
    },
  );

  it("when a slug that was never published is asked for, then 404 too", async () => {
    expect((await request(t.app).get("/vehicles/2001-never-published")).status).toBe(404);
  });

  it("when known pages are asked for, then 200 with the app shell", async () => {
    const pages = [
      "/", "/sign-in", "/forgot-password", "/reset-password?token=x", "/accept-invite?token=x",
      "/app", "/app/", "/app/vehicles", "/app/vehicles/new", `/app/vehicles/${vehicleId}`, `/app/vehicles/${vehicleId}/photos`,
      `/app/vehicles/${vehicleId}/walkaround`, `/app/vehicles/${vehicleId}/checks`, "/app/leads", "/app/leads/3", "/app/mail",
      "/app/feeds", "/app/users", "/app/settings", `/vehicles/${slug}`, `/vehicles/${slug}/card`, `/vehicles/${slug}/revisions/1`,
    ];
    const wrong: string[] = [];
    for (const path of pages) {
      const res = await request(t.app).get(path);
      if (res.status !== 200 || !res.text.includes('<div id="root">')) wrong.push(`${path}: ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });

  it("when the client router's paths are read, then each one is a page the server answers with 200", () => {
    // The server's list (client.routes.ts) and the client's (router.tsx) must not drift apart.
    const source = readFileSync(new URL("../../src/app/router.tsx", import.meta.url), "utf8");
    // Nesting by indentation: a `path:` on its own line opens a parent (its children sit deeper), `{ path: … }` is a leaf.
    const paths: string[] = [];
    const parents: Array<{ indent: number; path: string }> = [];
    for (const line of source.split("\n")) {
      const m = /^(\s*)(\{ )?path: "([^"]+)"/.exec(line);
      if (!m) continue;
      const indent = m[1].length;
      while (parents.length && parents[parents.length - 1].indent >= indent) parents.pop();
      const full = `${parents.at(-1)?.path ?? ""}/${m[3]}`.replace(/\/+/g, "/");
      if (!m[2]) parents.push({ indent, path: full });
      paths.push(full);
    }
    const pages = paths.filter((p) => !p.endsWith("*"));
    const sample = (p: string) => p.replace(":slug", slug).replace(/:(id|number)/g, "1");
    expect(pages.length).toBeGreaterThan(20);
    expect(pages).toContain("/app/vehicles/:id/photos");
    return Promise.all(pages.map(sample).map(async (p) => expect((await request(t.app).get(p)).status, p).toBe(200)));
  });

  it("when an API path or a missing asset is asked for, then their own 404s (JSON, plain), not the page", async () => {
    const api = await request(t.app).get("/api/no-such-thing");
    expect(api.status).toBe(404);
    expect(api.body.error.code).toBe("not_found");
    expect((await request(t.app).get("/assets/no-such-file.js")).status).toBe(404);
  });
});

describe("numeric ids are digits only", () => {
  it.each(["0x0b", "%2011", "11%20", "1e3", "1.0", "-1", "0", "+1", "99999999999999999999"])("when a vehicle id is %s, then 400", async (id) => {
    const sales = await t.signIn("sales");
    const res = await sales.get(`/api/vehicles/${id}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
  });

  it("when ids in other params are not digits, then 400 (photo, defect, lead)", async () => {
    const admin = await t.signIn("admin");
    expect((await admin.delete(`/api/vehicles/${vehicleId}/photos/0x1?version=1`)).status).toBe(400);
    expect((await admin.get("/api/leads/1e3")).status).toBe(400);
    expect((await admin.delete(`/api/vehicles/${vehicleId}/defects/1e0?version=1`)).status).toBe(400);
  });

  it("when a vehicle id is plain digits, then it is read", async () => {
    const sales = await t.signIn("sales");
    expect((await sales.get(`/api/vehicles/${vehicleId}`)).status).toBe(200);
    expect((await sales.get(`/api/vehicles/0${vehicleId}`)).status).toBe(200);
  });
});
