import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import express from "express";
import { DEMO_PASSWORD, HOST, ORIGIN, startTestApp, type TestApp } from "../support/app.ts";
import { listen } from "../support/http-server.ts";
import { originCheck } from "../../server/middleware/origin-check.ts";
import { errorHandler } from "../../server/middleware/error-handler.ts";
import { loadConfig } from "../../server/config/index.ts";

// The outside probe's findings (issue 16): the check fell back to "Origin host equals Host", which ignored the
// scheme and trusted a Host header the client chooses (DNS rebinding). The Origin is now compared with the configured
// origins only, and writes addressed to another Host are refused.

let t: TestApp;
let listed: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  listed = await startTestApp({ seed: true, env: { ALLOWED_ORIGINS: "https://cars.example.test, http://localhost:5173" } });
});
afterAll(async () => {
  await t?.close();
  await listed?.close();
});

const credentials = { email: "admin@demo.test", password: DEMO_PASSWORD };
const signIn = (app: TestApp["app"], headers: Record<string, string>) => {
  let req = request(app).post("/api/auth/sign-in");
  for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
  return req.send(credentials);
};
const refused = (res: request.Response) => {
  expect(res.status, res.text).toBe(403);
  expect(res.body.error.code).toBe("cross_origin");
  expect(res.headers["set-cookie"]).toBeUndefined();
};

describe("origin check: Origin against the configured origins only", () => {
  it("when Origin is the configured origin and Host the configured host, then the write goes through", async () => {
    expect((await signIn(t.app, { Origin: ORIGIN, Host: HOST })).status).toBe(200);
  });

  it("when Origin has the configured host but another scheme (https for an http site), then 403", async () => {
    refused(await signIn(t.app, { Origin: "https://127.0.0.1:3000", Host: HOST }));
  });

  it("when Origin has the configured host but another port, then 403", async () => {
    refused(await signIn(t.app, { Origin: "http://127.0.0.1:3001", Host: "127.0.0.1:3001" }));
  });

  it("when Host and Origin both name another site (DNS rebinding), then 403", async () => {
    refused(await signIn(t.app, { Origin: "http://evil.test:3000", Host: "evil.test:3000" }));
  });

  it("when Origin is ours but Host is another name, then the write is refused", async () => {
    refused(await signIn(t.app, { Origin: ORIGIN, Host: "evil.test:3000" }));
  });

  it("when Sec-Fetch-Site says same-origin without Origin, then it counts only for the configured Host", async () => {
    expect((await signIn(t.app, { "Sec-Fetch-Site": "same-origin", Host: HOST })).status).toBe(200);
    refused(await signIn(t.app, { "Sec-Fetch-Site": "same-origin", Host: "evil.test:3000" }));
  });

  it("when a safe method is addressed to another Host, then it is answered as usual", async () => {
    const res = await request(t.app).get("/api/auth/session").set("Host", "evil.test:3000");
    expect(res.status).toBe(200);
  });

  it("when the server is reached at its own listening address, then pages served from it can write (and https from it cannot)", async () => {
    // The address the connection arrived on is not the client's to choose, and no other site can serve pages
    // from it; a local reverse proxy sends it as Host by default.
    const server = await listen(t.app);
    try {
      const post = (origin: string) =>
        fetch(`${server.url}/api/auth/sign-in`, { method: "POST", headers: { Origin: origin, "Content-Type": "application/json" }, body: JSON.stringify(credentials) });
      expect((await post(server.url)).status).toBe(200);
      expect((await post(server.url.replace("http:", "https:"))).status).toBe(403);
    } finally {
      await server.close();
    }
  });
});

describe("ALLOWED_ORIGINS", () => {
  it("when an origin is listed, then writes from it are accepted with its own Host or the configured one", async () => {
    expect((await signIn(listed.app, { Origin: "https://cars.example.test", Host: "cars.example.test" })).status).toBe(200);
    expect((await signIn(listed.app, { Origin: "http://localhost:5173", Host: HOST })).status).toBe(200);
    expect((await signIn(listed.app, { Origin: ORIGIN, Host: "localhost:5173" })).status).toBe(200);
  });

  it("when an origin differs from a listed one in scheme or port, then 403", async () => {
    refused(await signIn(listed.app, { Origin: "http://cars.example.test", Host: "cars.example.test" }));
    refused(await signIn(listed.app, { Origin: "http://localhost:5174", Host: "localhost:5174" }));
  });

  it("when ALLOWED_ORIGINS holds something that is not an origin, then the boot stops naming it", () => {
    const env = (ALLOWED_ORIGINS: string) => ({ DATABASE_URL: "mysql://u@127.0.0.1/db", ALLOWED_ORIGINS });
    expect(() => loadConfig(env("cars.example.test"))).toThrow(/ALLOWED_ORIGINS/);
    expect(() => loadConfig(env("https://cars.example.test/path"))).toThrow(/ALLOWED_ORIGINS/);
    expect(loadConfig(env(" https://cars.example.test ,http://localhost:5173/")).ALLOWED_ORIGINS).toEqual(["https://cars.example.test", "http://localhost:5173"]);
  });
});

describe("exempt paths", () => {
  it("when a path is exempt (a signed webhook), then a write without Origin reaches it; other paths are still refused", async () => {
    const app = express();
    app.use(originCheck({ origins: [ORIGIN], exempt: ["/payments/webhook"] }));
    app.post("/payments/webhook", (_req, res) => void res.json({ ok: true }));
    app.post("/elsewhere", (_req, res) => void res.json({ ok: true }));
    app.use(errorHandler);
    expect((await request(app).post("/payments/webhook").set("Host", "payments.example")).status).toBe(200);
    expect((await request(app).post("/elsewhere")).status).toBe(403);
  });
});
