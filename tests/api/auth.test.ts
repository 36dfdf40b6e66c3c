import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { DEMO_PASSWORD, ORIGIN, ROLES_ALL, startTestApp, type TestApp } from "../support/app.ts";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe("GET /api/health", () => {
  it("when the database answers, then it reports ok and db up", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: "up" });
  });
});

describe("POST /api/auth/sign-in", () => {
  it("when the credentials are right, then it sets an HttpOnly SameSite=Lax session cookie and returns the user", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "Admin@Demo.test ", password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: "admin@demo.test", role: "admin" });
    expect(Object.keys(res.body.user).sort()).toEqual(["email", "id", "name", "role"]);
    const cookie = String(res.headers["set-cookie"]);
    expect(cookie).toMatch(/forthright_session=[a-z0-9]+/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).toMatch(/Path=\//);
    // Served over plain http in tests, so the cookie must not be Secure (it would never be sent back).
    expect(cookie).not.toMatch(/Secure/);
  });

  it("when the password is wrong, then 401 with a message that does not say which part was wrong", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "admin@demo.test", password: "wrong-password-123" });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("unauthorized");
    const unknown = await t.agent().post("/api/auth/sign-in").send({ email: "nobody@demo.test", password: "wrong-password-123" });
    expect(unknown.status).toBe(401);
    expect(unknown.body.error.message).toBe(res.body.error.message);
  });

  it("when fields are missing or malformed, then 400 with a message for every field", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "not-an-email" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["email", "password"]);
  });

  it("when unknown fields are sent, then 400 names them", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "admin@demo.test", password: "x", role: "admin" });
    expect(res.status).toBe(400);
  });

  it("when the body is not JSON, then 400 malformed_body, never 500", async () => {
    const res = await t.agent().post("/api/auth/sign-in").set("Content-Type", "application/json").send("{nope");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("malformed_body");
  });

  it("when the request comes from another origin, then 403 and no cookie", async () => {
    const res = await request(t.app).post("/api/auth/sign-in").set("Origin", "https://evil.example").send({ email: "admin@demo.test", password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
    expect(res.headers["set-cookie"]).toBeUndefined();
  });

  it("when a request carries neither Origin nor Sec-Fetch-Site, then it is refused", async () => {
    const res = await request(t.app).post("/api/auth/sign-in").send({ email: "admin@demo.test", password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
  });

  it("when Sec-Fetch-Site says same-origin and no Origin is sent, then it is accepted", async () => {
    const res = await request(t.app).post("/api/auth/sign-in").set("Sec-Fetch-Site", "same-origin").send({ email: "admin@demo.test", password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });
});

describe("GET /api/auth/session and sign-out", () => {
  it("when nobody is signed in, then user is null", async () => {
    const res = await request(t.app).get("/api/auth/session");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null });
  });

  it.each(ROLES_ALL)("when signed in as %s, then the session names that role; after sign-out it is gone", async (role) => {
    const a = await t.signIn(role);
    const res = await a.get("/api/auth/session");
    expect(res.body.user.role).toBe(role);
    const out = await a.post("/api/auth/sign-out");
    expect(out.status).toBe(200);
    expect((await a.get("/api/auth/session")).body).toEqual({ user: null });
  });

  it("when not signed in, then sign-out is 401", async () => {
    const res = await request(t.app).post("/api/auth/sign-out").set("Origin", ORIGIN);
    expect(res.status).toBe(401);
  });

  it("when a forged session id is sent, then it counts as signed out and the cookie is cleared", async () => {
    const res = await request(t.app).get("/api/auth/session").set("Cookie", "forthright_session=forged");
    expect(res.body).toEqual({ user: null });
    expect(String(res.headers["set-cookie"])).toMatch(/forthright_session=;/);
  });
});

describe("unknown API routes", () => {
  it("when the route does not exist, then 404 in the error shape", async () => {
    const res = await request(t.app).get("/api/nothing-here");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_found");
  });
});

describe("security headers", () => {
  it("when any page is served, then CSP forbids inline scripts and framing, and nosniff is set", async () => {
    const res = await request(t.app).get("/api/health");
    const csp = res.headers["content-security-policy"];
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["x-powered-by"]).toBeUndefined();
  });
});

describe("private answers", () => {
  it("when a signed-in request is answered under /api, then Cache-Control is no-store, errors included", async () => {
    const sales = await t.signIn("sales");
    const wrong: string[] = [];
    for (const path of ["/api/vehicles", "/api/vehicles/1", "/api/leads", "/api/dealership", "/api/auth/session", "/api/vehicles/999999", "/api/nothing-here", "/api/public/vehicles"]) {
      const res = await sales.get(path);
      if (res.headers["cache-control"] !== "no-store") wrong.push(`${path}: ${res.status} ${String(res.headers["cache-control"])}`);
    }
    const saved = await sales.post("/api/vehicles").send({});
    if (saved.headers["cache-control"] !== "no-store") wrong.push(`POST /api/vehicles: ${saved.status} ${String(saved.headers["cache-control"])}`);
    expect(wrong).toEqual([]);
  });

  it("when nobody is signed in, then public answers keep their caching", async () => {
    expect((await request(t.app).get("/api/public/vehicles")).headers["cache-control"]).toBe("public, max-age=30");
    expect((await request(t.app).get("/api/public/dealership")).headers["cache-control"]).toBe("public, max-age=60");
  });
});
